import { Hono } from 'hono';
import { listMaterials } from '../../spectra/index';
import type { AppEnv } from '../env';
import { finiteJsonResponse } from '../json';

/** GET /api/v1/materials: every material with its size meaning, ranges, toxicity cautions and sources. */
export const materials = new Hono<AppEnv>().get('/', () => finiteJsonResponse({ materials: listMaterials() }));
