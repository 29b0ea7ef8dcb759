import { z } from 'zod';
import { SampledSpectrumJson } from './dot';

// Response schemas: used only to describe responses in the OpenAPI document (the spectral library's types are the
// source of truth for what the handlers return); fields beyond the contract are allowed (z.looseObject).

/** The contract's error body. */
export const ErrorBody = z.object({
  error: z.object({
    code: z.string(),
    message: z.string(),
    path: z.array(z.union([z.string(), z.number()])),
  }),
});

/** GET /api/v1/health. */
export const Health = z.object({ ok: z.literal(true), version: z.string() });

/** POST /api/v1/panels: where the stored panel lives. */
export const ShareCreated = z.object({ id: z.string(), url: z.string() });

const range = z.tuple([z.number(), z.number()]);

/** One material of GET /api/v1/materials. */
export const Material = z.looseObject({
  id: z.string(),
  name: z.string(),
  family: z.enum(['II-VI', 'III-V', 'perovskite', 'carbon', 'other']),
  elements: z.array(z.string()),
  sizeMeaning: z.string(),
  diameterRangeNm: range.nullable(),
  emissionRangeNm: range.nullable(),
  toxicity: z.looseObject({
    level: z.enum(['high', 'moderate', 'low']),
    notes: z.array(z.string()),
    cautions: z.array(z.string()),
  }),
  sources: z.array(z.string()),
});

/** One detector class of GET /api/v1/detectors. */
export const Detector = z.looseObject({ id: z.string(), name: z.string(), notes: z.string() });

/** POST /api/v1/dots/resolve. */
export const ResolvedDotJson = z.looseObject({
  material: z.string(),
  diameterNm: z.number().nullable(),
  firstExcitonNm: z.number().nullable(),
  emissionPeakNm: z.number().nullable(),
  fwhmNm: z.number().nullable(),
  extinctionFirstExciton: z.number().nullable(),
  extinctionAtExcitation: z.number().nullable(),
  model: z.string(),
  warnings: z.array(z.string()),
  spectrum: SampledSpectrumJson,
});

const matrix = z.array(z.array(z.number().nullable()));

/** POST /api/v1/panels/evaluate. */
export const Evaluation = z.looseObject({
  probes: z.array(z.looseObject({})),
  collected: matrix,
  spillover: matrix,
  primaryChannel: z.array(z.number()),
  conditionNumber: z.number().nullable(),
  noiseAmplification: z.array(z.number().nullable()),
  signalToBackground: z.array(z.number().nullable()).optional(),
  worst: z.looseObject({ from: z.string(), into: z.string(), interference: z.number().nullable() }).nullable(),
  warnings: z.array(z.string()),
});
