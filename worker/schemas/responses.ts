import { z } from 'zod';
import { SampledSpectrumJson } from './dot';
import { MaterialIdSchema } from './probe';

// Response schemas: they describe, field for field, what the handlers return (the OpenAPI document's responses), and
// test/worker/response-schemas.test.ts parses real responses with them, so the description cannot drift from the
// code. Strict objects: a field added to a response must be added here too.

const path = z.array(z.union([z.string(), z.number()]));

/** The contract's error body; `issues` lists up to eleven validation issues (the first is `error` itself). */
export const ErrorBody = z.strictObject({
  error: z.strictObject({
    code: z.string(),
    message: z.string(),
    path,
    issues: z.array(z.strictObject({ code: z.string(), message: z.string(), path })).optional(),
  }),
});

/** GET /api/v1/health. */
export const Health = z.strictObject({ ok: z.literal(true), version: z.string() });

/** POST /api/v1/panels: where the stored panel lives. */
export const ShareCreated = z.strictObject({ id: z.string(), url: z.string() });

const range = z.tuple([z.number(), z.number()]);

/** A hazard summary: a coarse level, notes and cautions (a material's, or a dye's). */
export const ToxicityJson = z.strictObject({
  level: z.enum(['high', 'moderate', 'low']),
  notes: z.array(z.string()),
  cautions: z.array(z.string()),
});

/** One material of GET /api/v1/materials (null where a material has no such quantity, e.g. carbon dots' size). */
export const Material = z.strictObject({
  id: MaterialIdSchema,
  name: z.string(),
  family: z.enum(['II-VI', 'III-V', 'perovskite', 'carbon', 'other']),
  elements: z.array(z.string()),
  sizeMeaning: z.string(),
  diameterRangeNm: range.nullable(),
  emissionRangeNm: range.nullable(),
  bulkBandGapEv: z.number().nullable(),
  electronMassRel: z.number().nullable(),
  holeMassRel: z.number().nullable(),
  dielectricConstant: z.number().nullable(),
  bohrRadiusNm: z.number().nullable(),
  typicalFwhmNm: z.number(),
  typicalQuantumYield: z.number(),
  typicalSizeDispersionPct: z.number().nullable(),
  typicalHydrodynamicDiameterNm: z.number().nullable(),
  sizingModel: z.string(),
  toxicity: ToxicityJson,
  warnings: z.array(z.string()),
  sources: z.array(z.string()),
});

/** GET /api/v1/materials. */
export const MaterialList = z.strictObject({ materials: z.array(Material) });

/** One detector class of GET /api/v1/detectors. */
export const Detector = z.strictObject({ id: z.string(), name: z.string(), notes: z.string() });

/** GET /api/v1/detectors. */
export const DetectorList = z.strictObject({ detectors: z.array(Detector) });

/** Which parts of a resolved probe come from measured data rather than the model. */
export const MeasuredParts = z.strictObject({ emission: z.boolean(), extinction: z.boolean() });

/** The scalar fields of a resolved dot, shared by POST /dots/resolve and each probe of an evaluation. */
export const resolvedDotFields = {
  material: MaterialIdSchema,
  diameterNm: z.number().nullable(),
  firstExcitonNm: z.number().nullable(),
  emissionPeakNm: z.number(),
  fwhmNm: z.number(),
  quantumYield: z.number(),
  extinctionFirstExciton: z.number().nullable(),
  model: z.string(),
  measured: MeasuredParts,
  warnings: z.array(z.string()),
};

/**
 * POST /api/v1/dots/resolve: `spectrum` is the emission (unit area on the grid), `absorption` the molar extinction
 * (M⁻¹ cm⁻¹) on the same grid; `extinctionAtExcitation` is null without `excitationNm`.
 */
export const ResolvedDotJson = z.strictObject({
  ...resolvedDotFields,
  extinctionAtExcitation: z.number().nullable(),
  spectrum: SampledSpectrumJson,
  absorption: SampledSpectrumJson,
});
