import { Hono } from 'hono';
import type { AppEnv } from '../env';
import { exampleIdOf, exampleInstruments, loadInstrumentText } from '../instruments';
import { jsonBody } from '../middleware/json-body';
import { ApiError, Instrument } from '../schemas/index';
import { ID_PATH, shareIdKeyOf } from '../share-id';
import { spendShareBudget } from '../share-budget';
import { saveShared } from '../store';
import { validJson } from '../validation';

/**
 * Instrument profiles: POST /api/v1/instruments stores a profile behind a link (/i/<id>) exactly as panels are
 * stored; GET /api/v1/instruments/:id returns it as it was sent; GET /api/v1/instruments lists the example profiles.
 */
export const instruments = new Hono<AppEnv>()
  .get('/', async (c) => {
    const list = (await exampleInstruments()).map(({ id, spec }) => ({
      id,
      name: spec.name,
      description: spec.description ?? '',
      url: `/i/${id}`,
    }));
    return c.json({ instruments: list }, 200, { 'cache-control': 'public, max-age=3600' });
  })
  .post('/', jsonBody(), validJson(Instrument), async (c) => {
    const sent = c.req.valid('json');
    const key = shareIdKeyOf(c.env.SHARE_ID_KEY);
    await spendShareBudget(c);
    // An example profile keeps its public id (nothing is written); any other is stored under its keyed id.
    const id = (await exampleIdOf(sent)) ?? (await saveShared(c.env.PANELS, 'instrument', sent, key));
    // 201 whether or not the profile was stored before, as for panels.
    return c.json({ id, url: `/i/${id}` }, 201);
  })
  .get(ID_PATH, async (c) => {
    const text = await loadInstrumentText(c.env.PANELS, c.req.param('id') ?? '');
    if (text === null) throw new ApiError(404, 'not_found', 'no instrument profile is stored under this id', ['id']);
    // A stored profile never changes, so any cache may keep it.
    return c.body(text, 200, {
      'content-type': 'application/json; charset=utf-8',
      'cache-control': 'public, max-age=31536000, immutable',
    });
  });
