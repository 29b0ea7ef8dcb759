import { z } from 'zod';
import { RANGES } from './limits';
import { ranged, wavelengthNm } from './fields';
import { pointsTable } from './spectrum';

/** Options shared by the modelled filters (defaults documented in spectra/panel.ts: EdgeFilterOptions). */
const edgeOptions = {
  // Above 0: a filter that passes nothing is no filter (invalid_input, like the other ill-formed filters).
  peakTransmission: ranged(0, 1)
    .superRefine((value, ctx) => {
      if (value === 0)
        ctx.addIssue({
          code: 'custom',
          message: 'must be greater than 0 and at most 1',
          params: { apiCode: 'invalid_input' },
        });
    })
    .optional(),
  edgeWidthNm: ranged(RANGES.edgeWidthNm[0], RANGES.edgeWidthNm[1], 'nm').optional(),
  blockingOD: ranged(RANGES.blockingOD[0], RANGES.blockingOD[1]).optional(),
};

/** A bandpass filter: centre and FWHM of the passband (e.g. 605/20). */
export const BandpassFilter = z.strictObject({
  type: z.literal('bandpass'),
  centerNm: wavelengthNm(),
  widthNm: ranged(RANGES.filterWidthNm[0], RANGES.filterWidthNm[1], 'nm'),
  ...edgeOptions,
});

/** A longpass or shortpass edge filter. */
export const EdgeFilter = z.strictObject({
  type: z.enum(['longpass', 'shortpass']),
  edgeNm: wavelengthNm(),
  ...edgeOptions,
});

/** A dichroic mirror in the emission path: passes light above or below its edge. */
export const DichroicFilter = z.strictObject({
  type: z.literal('dichroic'),
  edgeNm: wavelengthNm(),
  passes: z.enum(['above', 'below'], { error: "must be 'above' or 'below'" }),
  ...edgeOptions,
});

/** A measured transmission curve, transmission 0–1. */
export const TableFilter = z.strictObject({
  type: z.literal('table'),
  points: pointsTable(1, 'transmission').shape.points,
});

/** Any emission filter, discriminated on `type` (mirrors spectra's FilterSpec). */
export const Filter = z.discriminatedUnion('type', [BandpassFilter, EdgeFilter, DichroicFilter, TableFilter]);
