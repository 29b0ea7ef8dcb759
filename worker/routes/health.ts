import { Hono } from 'hono';
import packageJson from '../../package.json';
import type { AppEnv } from '../env';

/** GET /api/v1/health: liveness and the package version (bundled from package.json at build time). */
export const health = new Hono<AppEnv>().get('/', (c) => c.json({ ok: true as const, version: packageJson.version }));
