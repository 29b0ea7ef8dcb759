import { Hono } from 'hono';
import type { InstrumentSpec } from '../../spectra/index';
import { runBoundedDesign } from '../design-run';
import { DesignRequest, withInstrument } from '../schemas/index';
import type { AppEnv } from '../env';
import { loadInstrumentProfile } from '../instruments';
import { finiteJsonResponse } from '../json';
import { jsonBody } from '../middleware/json-body';
import { validJson } from '../validation';

/**
 * POST /api/v1/panels/design: proposes a panel for the targets (exact over `candidates` when given, else free mode)
 * under a node budget shortened to the API's work limit (design-run.ts: a request too large for it is refused before
 * any work, and a running one pauses between chunks and stops at a time limit); when the budget ends first the
 * answer is the best found, with `exact: false` and the bound in `stats.bound`. A request naming an
 * instrument reads the profile (one storage read) and chooses among its channels, as a panel on it is evaluated.
 */
export const design = new Hono<AppEnv>().post('/', jsonBody(), validJson(DesignRequest), async (c) => {
  const request = c.req.valid('json');
  let instrument: InstrumentSpec | undefined;
  if (request.instrument !== undefined) instrument = await loadInstrumentProfile(c.env.PANELS, request.instrument);
  return finiteJsonResponse(await runBoundedDesign(withInstrument(request, instrument), c.req.raw.signal));
});
