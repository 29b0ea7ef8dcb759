import { Hono } from 'hono';
import { DEFAULT_GRID, evaluatePanel } from '../../spectra/index';
import { ID_PATH, shareIdKeyOf } from '../share-id';
import { resolvePanelRequest } from '../instruments';
import type { AppEnv } from '../env';
import { finiteJsonResponse } from '../json';
import { jsonBody } from '../middleware/json-body';
import { ApiError, EvaluateRequest, PanelRequest } from '../schemas/index';
import { spendShareBudget } from '../share-budget';
import { loadSharedText, saveShared } from '../store';
import { validJson } from '../validation';

/**
 * Panels: POST /api/v1/panels/evaluate computes a panel's figures (the lot-shift check unless `sensitivity: false`);
 * POST /api/v1/panels stores a panel behind a share link (201 and the same body on every share of it) and
 * GET /api/v1/panels/:id returns it as it was sent. A panel
 * naming an instrument is resolved against it (one storage read) before it is evaluated or stored, so a stored panel
 * always names a profile that exists.
 */
export const panels = new Hono<AppEnv>()
  .post('/evaluate', jsonBody(), validJson(EvaluateRequest), async (c) => {
    const { sensitivity, ...request } = c.req.valid('json');
    const panel = await resolvePanelRequest(c.env.PANELS, request);
    return finiteJsonResponse(evaluatePanel(panel, { grid: DEFAULT_GRID, sensitivity: sensitivity ?? true }));
  })
  .post('/', jsonBody(), validJson(PanelRequest), async (c) => {
    const sent = c.req.valid('json');
    await resolvePanelRequest(c.env.PANELS, sent);
    const key = shareIdKeyOf(c.env.SHARE_ID_KEY);
    await spendShareBudget(c);
    const id = await saveShared(c.env.PANELS, 'panel', sent, key);
    // 201 whether or not the panel was stored before: the answer must not tell whether someone else shared it.
    return c.json({ id, url: `/p/${id}` }, 201);
  })
  .get(ID_PATH, async (c) => {
    const text = await loadSharedText(c.env.PANELS, 'panel', c.req.param('id') ?? '');
    if (text === null) throw new ApiError(404, 'not_found', 'no panel is stored under this id', ['id']);
    // A stored panel never changes, so any cache may keep it.
    return c.body(text, 200, {
      'content-type': 'application/json; charset=utf-8',
      'cache-control': 'public, max-age=31536000, immutable',
    });
  });
