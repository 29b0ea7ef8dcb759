import { z } from 'zod';
import { resolvedDotFields } from './responses';

// POST /api/v1/panels/evaluate's answer, field for field as spectra's evaluatePanel returns it (PanelEvaluation).

const nullableNumber = z.number().nullable();
const matrix = z.array(z.array(z.number()));
const nullableMatrix = z.array(z.array(nullableNumber));

/** The wavelength grid the panel was evaluated on. */
export const GridJson = z.strictObject({ startNm: z.number(), stepNm: z.number(), count: z.number().int() });

/** One probe of an evaluation: the resolved dot's fields (ε at the first line) plus ε at each panel line and its
 * brightness. */
export const ProbeEvaluationJson = z.strictObject({
  id: z.string(),
  label: z.string().optional(),
  ...resolvedDotFields,
  extinctionAtExcitation: z.number(),
  extinctionAtLines: z.array(z.number()),
  brightness: z.number(),
  brightnessPerAbundance: z.number(),
  emissionCutAtLines: z.array(z.number()),
  emissionPeakNmByLine: z.array(z.number()).optional(),
});

/** The worst interference pair; all three null when there is no pair (one probe, or no signal). */
export const WorstJson = z.strictObject({
  from: z.string().nullable(),
  into: z.string().nullable(),
  interference: nullableNumber,
});

/** The ±shiftNm lot-to-lot check (null when the evaluation ran without it). */
export const LotShiftJson = z.strictObject({
  shiftNm: z.number(),
  baseline: z.strictObject({ worstInterference: nullableNumber, worstSpillover: nullableNumber }),
  worstInterference: z
    .strictObject({
      interference: z.number(),
      from: z.string(),
      into: z.string(),
      shiftedProbe: z.string(),
      shiftNm: z.number(),
    })
    .nullable(),
  worstSpillover: z
    .strictObject({
      spillover: z.number(),
      probe: z.string(),
      channel: z.string(),
      shiftedProbe: z.string(),
      shiftNm: z.number(),
    })
    .nullable(),
});

/**
 * POST /api/v1/panels/evaluate (docs/api.md, "The signal model"): collected[c][p]; spillover and purity null
 * where the reference signal is zero; primaryChannel null for a probe that gives no signal anywhere; the background
 * fields only when the panel has a background or water Raman.
 */
export const Evaluation = z.strictObject({
  grid: GridJson,
  probes: z.array(ProbeEvaluationJson),
  collected: matrix,
  referenceColumns: z.array(z.enum(['model', 'measured'])),
  spillover: nullableMatrix,
  primaryChannel: z.array(z.number().int().nullable()),
  purity: z.array(nullableNumber),
  belowResolution: z.array(z.array(z.boolean())),
  conditionNumber: nullableNumber,
  noiseAmplification: z.array(nullableNumber),
  backgroundCollected: z.array(z.number()).optional(),
  signalToBackground: z.array(nullableNumber).optional(),
  waterRamanCollected: matrix.optional(),
  lineLeak: matrix,
  worst: WorstJson,
  lotShiftSensitivity: LotShiftJson.nullable(),
  warnings: z.array(z.string()),
});
