import { Hono } from 'hono';
import { DEFAULT_GRID, evaluatePanel } from '../../spectra/index';
import { SHARE_ID_PATTERN } from '../share-id';
import type { AppEnv } from '../env';
import { finiteJsonResponse } from '../json';
import { jsonBody } from '../middleware/json-body';
import { ApiError, Panel } from '../schemas/index';
import { spendShareBudget } from '../share-budget';
import { loadPanelText, savePanel } from '../store';
import { validJson } from '../validation';

// Only well-formed share ids reach the id route, so a malformed id is a plain 404 that never reads KV, and fixed
// sub-paths such as /panels/evaluate or /panels/design are never taken for an id.
const ID_PATH = `/:id{${SHARE_ID_PATTERN.source.slice(1, -1)}}`;

/**
 * Panels: POST /api/v1/panels/evaluate computes a panel's figures; POST /api/v1/panels stores a panel behind a share
 * link and GET /api/v1/panels/:id returns it as it was sent.
 */
export const panels = new Hono<AppEnv>()
  .post('/evaluate', jsonBody(), validJson(Panel), (c) =>
    finiteJsonResponse(evaluatePanel(c.req.valid('json'), { grid: DEFAULT_GRID })),
  )
  .post('/', jsonBody(), validJson(Panel), async (c) => {
    const { id, created } = await savePanel(c.env.PANELS, c.req.valid('json'), () => spendShareBudget(c));
    return c.json({ id, url: `/p/${id}` }, created ? 201 : 200);
  })
  .get(ID_PATH, async (c) => {
    const text = await loadPanelText(c.env.PANELS, c.req.param('id') ?? '');
    if (text === null) throw new ApiError(404, 'not_found', 'no panel is stored under this id', ['id']);
    // A stored panel never changes, so any cache may keep it.
    return c.body(text, 200, {
      'content-type': 'application/json; charset=utf-8',
      'cache-control': 'public, max-age=31536000, immutable',
    });
  });
