import { z } from 'zod';
import { DYE_KINDS, VALUE_STATUSES } from '../../spectra/index';
import { ToxicityJson } from './responses';

/** One number of a dye's record: the value, its status mark and the source it is cited from. */
export const SourcedValueJson = z.strictObject({
  value: z.number(),
  status: z.enum(VALUE_STATUSES),
  source: z.string(),
});

/** One dye, counterstain or fluorescent protein of GET /api/v1/dyes. */
export const Dye = z.strictObject({
  id: z.string(),
  name: z.string(),
  kind: z.enum(DYE_KINDS),
  conditions: z.string(),
  absorptionPeakNm: SourcedValueJson,
  emissionPeakNm: SourcedValueJson,
  extinctionPeak: SourcedValueJson,
  quantumYield: SourcedValueJson,
  absorptionFwhmNm: SourcedValueJson,
  emissionFwhmNm: SourcedValueJson,
  absorptionAsymmetry: SourcedValueJson,
  emissionAsymmetry: SourcedValueJson,
  toxicity: ToxicityJson,
  notes: z.array(z.string()),
});

/** GET /api/v1/dyes. */
export const DyeList = z.strictObject({ dyes: z.array(Dye) });
