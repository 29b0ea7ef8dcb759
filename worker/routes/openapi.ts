import { Hono } from 'hono';
import type { AppEnv } from '../env';
import { openApiDocument } from '../openapi';

/** GET /api/v1/openapi.json: the OpenAPI 3.1 description generated from the schemas in worker/schemas/. */
export const openapi = new Hono<AppEnv>().get('/', (c) => c.json(openApiDocument()));
