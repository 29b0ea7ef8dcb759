import { Hono } from 'hono';
import { listBackgroundPresets } from '../../spectra/index';
import type { AppEnv } from '../env';
import { finiteJsonResponse } from '../json';

/** GET /api/v1/backgrounds: the autofluorescence presets by sample type, with their bands, sources and caution. */
export const backgrounds = new Hono<AppEnv>().get('/', () => finiteJsonResponse(listBackgroundPresets()));
