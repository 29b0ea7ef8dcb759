import { z } from 'zod';
import { gridPointCount } from '../../spectra/index';
import { LIMITS } from './limits';
import { ranged, wavelengthNm } from './fields';
import { checkDotFields, dotFields } from './probe';

/** A wavelength grid for a returned spectrum: at most LIMITS.gridPoints samples. */
export const Grid = z
  .strictObject({
    startNm: wavelengthNm(),
    endNm: wavelengthNm(),
    stepNm: ranged(0.01, 100, 'nm'),
  })
  .superRefine((grid, ctx) => {
    if (!(grid.endNm > grid.startNm)) {
      ctx.addIssue({ code: 'custom', message: 'must be greater than startNm', path: ['endNm'] });
    } else if (gridPointCount(grid.startNm, grid.endNm, grid.stepNm) > LIMITS.gridPoints) {
      ctx.addIssue({
        code: 'custom',
        message:
          `gives ${gridPointCount(grid.startNm, grid.endNm, grid.stepNm)} points; at most ` +
          `${LIMITS.gridPoints} are allowed`,
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
  .superRefine(checkDotFields);

/** A sampled spectrum in a response: values at startNm + i × stepNm. */
export const SampledSpectrumJson = z.strictObject({
  startNm: z.number(),
  stepNm: z.number(),
  values: z.array(z.number()),
});
