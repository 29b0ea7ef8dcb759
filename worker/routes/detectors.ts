import { Hono } from 'hono';
import { listDetectors } from '../../spectra/index';
import type { AppEnv } from '../env';

/** GET /api/v1/detectors: the generic detector classes a channel may name. */
export const detectors = new Hono<AppEnv>().get('/', (c) => c.json({ detectors: listDetectors() }));
