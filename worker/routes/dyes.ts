import { Hono } from 'hono';
import { listDyes } from '../../spectra/index';
import type { AppEnv } from '../env';
import { finiteJsonResponse } from '../json';

/** GET /api/v1/dyes: the dye library, each number with its source and status, and each dye's hazard notes. */
export const dyes = new Hono<AppEnv>().get('/', () => finiteJsonResponse({ dyes: listDyes() }));
