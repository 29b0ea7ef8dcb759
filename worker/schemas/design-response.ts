import { z } from 'zod';
import { Evaluation } from './evaluation';
import { Panel } from './panel';

// POST /api/v1/panels/design's answer, field for field as spectra's runDesign returns it (DesignResult).

const nullableNumber = z.number().nullable();

/**
 * The design objective: the weakest target's signal-to-noise (maximised), the interference ceiling it was kept under,
 * the spreading that breaks ties, a sentence saying so, and the worst interference with its pair (probe ids, target
 * names; null when no pair exists).
 */
export const DesignObjectiveJson = z.strictObject({
  // A number from the search; null only if it had no finite value (a target with no own signal).
  worstInterference: nullableNumber,
  from: z.string().nullable(),
  into: z.string().nullable(),
  fromTarget: z.string().nullable(),
  intoTarget: z.string().nullable(),
  worstSignalToNoise: z.number(),
  weakestTarget: z.string(),
  totalSpreading: nullableNumber,
  interferenceCeiling: z.number(),
  statement: z.string(),
});

const searchStats = {
  nodesVisited: z.number(),
  fullEnumeration: z.number(),
  bound: nullableNumber,
  greedyWorst: nullableNumber,
  signalToNoiseBound: nullableNumber,
  gap: nullableNumber,
  candidateProbes: z.number(),
  candidateChannels: z.number(),
};

/** Catalog mode's search figures: the channels dropped by the line-clearance floor are listed by id. */
export const CatalogStatsJson = z.strictObject({
  ...searchStats,
  channelsDropped: z.array(z.string()),
  probesDropped: z.array(z.string()),
});

/** Free mode's search figures: the grid catalog searched, its best before refinement, the refinement moves. */
export const FreeStatsJson = z.strictObject({
  ...searchStats,
  gridWorst: z.number(),
  gridSignalToNoise: z.number(),
  grid: z.strictObject({
    peakStepNm: z.number(),
    bandStepNm: z.number(),
    bandwidthsNm: z.array(z.number()),
    windowNm: z.tuple([z.number(), z.number()]),
  }),
  refineMoves: z.number(),
});

/** Predicted unmixing noise of the proposal (least squares under shot, background, read and excess noise). */
export const NoisePredictionJson = z.strictObject({
  covariance: z.array(z.array(nullableNumber)),
  sd: z.array(nullableNumber),
  signalToNoise: z.array(nullableNumber),
  spreading: z.array(z.array(nullableNumber)),
  primaryChannel: z.array(z.number().int()),
  channelVariance: z.array(z.number()),
  photons: z.array(z.number()),
  warnings: z.array(z.string()),
});

/** POST /api/v1/panels/design: the proposal as a panel (valid input to evaluate and share), its figures and search. */
export const DesignResponse = z.strictObject({
  mode: z.enum(['catalog', 'free']),
  panel: Panel.nullable(),
  evaluation: Evaluation.nullable(),
  objective: DesignObjectiveJson.nullable(),
  exact: z.boolean(),
  stats: z.union([CatalogStatsJson, FreeStatsJson]).nullable(),
  noise: NoisePredictionJson.nullable(),
  verdict: z.enum(['usable', 'no_usable_panel']),
  verdictReason: z.string(),
  largestUsableTargets: z.number().int().nullable(),
  warnings: z.array(z.string()),
});
