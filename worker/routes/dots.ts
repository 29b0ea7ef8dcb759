import { Hono } from 'hono';
import { DEFAULT_GRID, makeGrid, resolveDot, sampleExtinction, spectrumOnGrid } from '../../spectra/index';
import type { AppEnv } from '../env';
import { finiteJsonResponse } from '../json';
import { jsonBody } from '../middleware/json-body';
import { DotRequest } from '../schemas/index';
import { validJson } from '../validation';

/**
 * POST /api/v1/dots/resolve: one dot's size, peaks, extinction and spectra on the requested grid. The emission is
 * `spectrum` (unit area on the grid) and the molar extinction (M⁻¹ cm⁻¹) `absorption`, both on every grid point.
 */
export const dots = new Hono<AppEnv>().post('/resolve', jsonBody(), validJson(DotRequest), (c) => {
  const { grid: asked, ...input } = c.req.valid('json');
  const grid = asked ? makeGrid(asked.startNm, asked.endNm, asked.stepNm) : DEFAULT_GRID;
  const { emission, emissionFrom: _from, absorption, grid: _grid, ...fields } = resolveDot(input, { grid });
  const onGrid = (values: number[]) => ({ startNm: grid.startNm, stepNm: grid.stepNm, values });
  return finiteJsonResponse({
    ...fields,
    spectrum: onGrid(spectrumOnGrid(emission, grid)),
    absorption: onGrid(sampleExtinction(absorption, grid).values),
  });
});
