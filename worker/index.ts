/**
 * The qdpanel worker: API v1 (docs/api.md) and the page routes of links on the Workers runtime. Everything else
 * (the built front end in dist/) is served by the asset layer; wrangler.toml sends /api/*, /p/* and /i/* here first.
 */
import { Hono } from 'hono';
import { cors } from 'hono/cors';
import type { AppEnv } from './env';
import { errorResponse, onApiError } from './errors';
import { securityHeaders } from './middleware/security-headers';
import { wrongMethod } from './middleware/wrong-method';
import { backgrounds } from './routes/backgrounds';
import { controls } from './routes/controls';
import { design } from './routes/design';
import { detectors } from './routes/detectors';
import { dots } from './routes/dots';
import { dyes } from './routes/dyes';
import { filters } from './routes/filters';
import { health } from './routes/health';
import { materials } from './routes/materials';
import { openapi } from './routes/openapi';
import { instrumentPages, notFoundPage, pages } from './routes/pages';
import { instruments } from './routes/instruments';
import { panels } from './routes/panels';

const app = new Hono<AppEnv>();

app.use('*', securityHeaders());
// Any origin may call the API (scripts, notebooks, other pages) with plain GET/POST and no credentials: nothing in
// it depends on cookies or identity, and stored panels are public by their link anyway.
app.use('/api/*', cors({ origin: '*', allowMethods: ['GET', 'POST'], allowHeaders: ['Content-Type'], maxAge: 86400 }));
// A known path asked with another method: 405 with the allowed methods (every route below is known to it).
app.use('*', wrongMethod(app));

// routes (one small app per resource; mount new resources here)
app.route('/api/v1/health', health);
app.route('/api/v1/openapi.json', openapi);
app.route('/api/v1/materials', materials);
app.route('/api/v1/detectors', detectors);
app.route('/api/v1/backgrounds', backgrounds);
app.route('/api/v1/dots', dots);
app.route('/api/v1/dyes', dyes);
app.route('/api/v1/filters', filters);
app.route('/api/v1/panels/design', design);
app.route('/api/v1/panels', panels);
app.route('/api/v1/instruments', instruments);
app.route('/api/v1/controls', controls);
app.route('/p', pages);
app.route('/i', instrumentPages);

app.notFound((c) =>
  c.req.path.startsWith('/api/')
    ? errorResponse(404, 'not_found', `no route ${c.req.method} ${c.req.path}`)
    : notFoundPage(),
);
app.onError(onApiError);

export default app;
