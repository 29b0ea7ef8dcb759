import { Hono } from 'hono';
import { runDesign } from '../../spectra/index';
import { DesignRequest } from '../schemas/index';
import type { AppEnv } from '../env';
import { finiteJsonResponse } from '../json';
import { jsonBody } from '../middleware/json-body';
import { validJson } from '../validation';

/**
 * POST /api/v1/panels/design: proposes a panel for the targets (exact over `candidates` when given, else free mode)
 * under a node budget, since the Workers runtime's clock does not advance during synchronous work; when the budget
 * ends first the answer is the best found, with `exact: false` and the bound in `stats.bound`.
 */
export const design = new Hono<AppEnv>().post('/', jsonBody(), validJson(DesignRequest), (c) =>
  finiteJsonResponse(runDesign(c.req.valid('json'))),
);
