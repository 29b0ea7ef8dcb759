import { z } from 'zod';
import { BACKGROUND_PRESET_IDS, SOURCE_STATUSES } from '../../spectra/index';
import { SampledSpectrumJson } from './dot';
import { MaterialIdSchema } from './probe';
import { SHELL_MATERIAL_IDS } from '../../spectra/index';

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

const ShellMaterialIdSchema = z.enum(SHELL_MATERIAL_IDS);

/** A hazard summary: a coarse level, notes and cautions (a material's, a shell's or a dye's). */
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
  sizingModels: z.array(z.string()),
  illustrative: z.boolean(),
  typicalShell: z.array(z.strictObject({ material: ShellMaterialIdSchema, thicknessNm: z.number() })).nullable(),
  typicalShellEmissionRangeNm: range.nullable(),
  toxicity: ToxicityJson,
  warnings: z.array(z.string()),
  sources: z.array(z.string()),
});

/** One shell material of GET /api/v1/materials. */
export const ShellMaterialJson = z.strictObject({
  id: ShellMaterialIdSchema,
  name: z.string(),
  elements: z.array(z.string()),
  bandGapEv: z.number(),
  electronMassRel: z.number(),
  holeMassRel: z.number(),
  valenceBandEv: z.number(),
  monolayerNm: z.number(),
  epitaxial: z.boolean(),
  maxThicknessNm: z.number(),
  intrinsicHalfEvPerCm: z.number(),
  toxicity: ToxicityJson,
  sources: z.array(z.string()),
});

/** GET /api/v1/materials: the core materials and the shell materials. */
export const MaterialList = z.strictObject({
  materials: z.array(Material),
  shellMaterials: z.array(ShellMaterialJson),
});

/** One detector class of GET /api/v1/detectors. */
export const Detector = z.strictObject({ id: z.string(), name: z.string(), notes: z.string() });

/** GET /api/v1/detectors. */
export const DetectorList = z.strictObject({ detectors: z.array(Detector) });

/** A source, how sure the tool is of it (P, T or M: see `statusMarks`), and what the tool takes from it. */
export const CitationJson = z.strictObject({ cite: z.string(), status: z.enum(SOURCE_STATUSES), says: z.string() });

/** One autofluorescence band of a preset: its emission, its excitation bands and the source of its positions. */
export const BackgroundBandJson = z.strictObject({
  fluorophore: z.string(),
  emissionNm: z.number(),
  emissionFwhmNm: z.number(),
  excitation: z.array(z.strictObject({ peakNm: z.number(), fwhmNm: z.number(), weight: z.number() })),
  brightness: z.number(),
  source: CitationJson,
});

/** GET /api/v1/backgrounds: the autofluorescence presets by sample type, what `level` means, and the caution. */
export const BackgroundPresetList = z.strictObject({
  presets: z.array(
    z.strictObject({
      id: z.enum(BACKGROUND_PRESET_IDS),
      name: z.string(),
      description: z.string(),
      bands: z.array(BackgroundBandJson),
      basis: z.array(CitationJson),
    }),
  ),
  level: z.string(),
  caution: z.string(),
  statusMarks: z.strictObject({ P: z.string(), T: z.string(), M: z.string() }),
});

/** Which parts of a resolved probe come from measured data rather than the model. */
export const MeasuredParts = z.strictObject({ emission: z.boolean(), extinction: z.boolean() });

/** The scalar fields of a resolved dot, shared by POST /dots/resolve and each probe of an evaluation. */
export const resolvedDotFields = {
  material: MaterialIdSchema,
  diameterNm: z.number().nullable(),
  coreDiameterNm: z.number().nullable(),
  overallDiameterNm: z.number().nullable(),
  hydrodynamicDiameterNm: z.number().nullable(),
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
  emissionCutFraction: z.number().nullable(),
  spectrum: SampledSpectrumJson,
  absorption: SampledSpectrumJson,
});

/** GET /api/v1/filters/stock: the stock bandpass rule, every stock size and what the list is. */
export const StockFilterList = z.strictObject({
  rule: z.strictObject({
    centerStepNm: z.number(),
    centerRangeNm: z.tuple([z.number(), z.number()]),
    widthsNm: z.array(z.number()),
  }),
  bandpasses: z.array(z.strictObject({ centerNm: z.number(), widthNm: z.number() })),
  note: z.string(),
});
