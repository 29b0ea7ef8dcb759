import { Hono } from 'hono';
import { DEFAULT_GRID, makeGrid, resolveDot } from '../../spectra/index';
import { dotJson } from '../dot-json';
import type { AppEnv } from '../env';
import { finiteJsonResponse } from '../json';
import { jsonBody } from '../middleware/json-body';
import { methodNotAllowed } from '../middleware/method-not-allowed';
import { DotRequest } from '../schemas';
import { validJson } from '../validation';

/** POST /api/v1/dots/resolve: one dot's size, peaks, extinction and emission spectrum on the requested grid. */
export const dots = new Hono<AppEnv>()
  .post('/resolve', jsonBody(), validJson(DotRequest), (c) => {
    const { grid, ...dot } = c.req.valid('json');
    const onGrid = grid ? makeGrid(grid.startNm, grid.endNm, grid.stepNm) : DEFAULT_GRID;
    return finiteJsonResponse(dotJson(resolveDot(dot, { grid: onGrid })));
  })
  .all('/resolve', methodNotAllowed('POST'));
