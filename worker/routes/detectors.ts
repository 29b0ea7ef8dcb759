import { Hono } from 'hono';
import { listDetectors } from '../../spectra/index';
import type { AppEnv } from '../env';
import { methodNotAllowed } from '../middleware/method-not-allowed';

/** GET /api/v1/detectors: the generic detector classes a channel may name. */
export const detectors = new Hono<AppEnv>()
  .get('/', (c) => c.json({ detectors: listDetectors() }))
  .all('/', methodNotAllowed('GET'));
