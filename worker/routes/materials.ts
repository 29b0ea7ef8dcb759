import { Hono } from 'hono';
import { SHELL_MATERIALS, listMaterials } from '../../spectra/index';
import type { AppEnv } from '../env';
import { finiteJsonResponse } from '../json';

/**
 * GET /api/v1/materials: every core material with its size meaning, ranges, typical shell, toxicity cautions and
 * sources, and every shell material.
 */
export const materials = new Hono<AppEnv>().get('/', () =>
  finiteJsonResponse({ materials: listMaterials(), shellMaterials: Object.values(SHELL_MATERIALS) }),
);
