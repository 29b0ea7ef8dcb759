import { z } from 'zod';
import { LIMITS, ranged, wavelengthNm } from './fields';
import { checkDotSize, dotFields } from './probe';

/** Number of samples of a grid from startNm to endNm in steps of stepNm (both ends included). */
export function gridPointCount(grid: { startNm: number; endNm: number; stepNm: number }): number {
  // The small tolerance keeps 300..1000 step 0.1 at 7,001 points despite binary rounding of the step.
  return Math.floor((grid.endNm - grid.startNm) / grid.stepNm + 1e-9) + 1;
}

/** A wavelength grid for a returned spectrum: at most LIMITS.maxGridPoints samples. */
export const Grid = z
  .strictObject({
    startNm: wavelengthNm(),
    endNm: wavelengthNm(),
    stepNm: ranged(0.01, 100, 'nm'),
  })
  .superRefine((grid, ctx) => {
    if (!(grid.endNm > grid.startNm)) {
      ctx.addIssue({ code: 'custom', message: 'must be greater than startNm', path: ['endNm'] });
    } else if (gridPointCount(grid) > LIMITS.maxGridPoints) {
      ctx.addIssue({
        code: 'custom',
        message: `gives ${gridPointCount(grid)} points; at most ${LIMITS.maxGridPoints} are allowed`,
        path: ['stepNm'],
        params: { apiCode: 'out_of_range' },
      });
    }
  });

/** POST /api/v1/dots/resolve: one dot, optionally an excitation line and an output grid. */
export const DotRequest = z
  .strictObject({
    ...dotFields,
    excitationNm: wavelengthNm().optional(),
    grid: Grid.optional(),
  })
  .superRefine(checkDotSize);

/** A sampled spectrum in a response: values at startNm + i × stepNm. */
export const SampledSpectrumJson = z.strictObject({
  startNm: z.number(),
  stepNm: z.number(),
  values: z.array(z.number()),
});
