// Share links on the real local runtime and KV: POST /api/v1/panels, GET /api/v1/panels/:id, /p/:id.
import { createHash, createHmac } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { canonicalJson } from '../../worker/share-id';
import { examplePanel, reverseKeys } from './helpers/panels';
import {
  errorOf,
  freshPersistDir,
  localEnvVar,
  plantKv,
  postJson,
  startWorker,
  type RunningWorker,
} from './helpers/worker';

const persistDir = freshPersistDir();
let worker: RunningWorker;

/** A panel stored as a link issued before ids were keyed stored it: under the plain SHA-256 id of its content. */
const OLD_SCHEME_PANEL = { ...examplePanel(), title: 'shared before ids were keyed' };
const OLD_SCHEME_ID = createHash('sha256')
  .update(canonicalJson(OLD_SCHEME_PANEL), 'utf8')
  .digest()
  .subarray(0, 18)
  .toString('base64url');

beforeAll(async () => {
  plantKv(persistDir, `panel:${OLD_SCHEME_ID}`, canonicalJson(OLD_SCHEME_PANEL));
  worker = await startWorker(persistDir);
});
afterAll(async () => {
  await worker?.dispose();
});

describe('POST /api/v1/panels', () => {
  it('POST /api/v1/panels stores a new panel with 201 and a URL-safe id of at least 128 bits', async () => {
    const res = await postJson(worker, '/api/v1/panels', { ...examplePanel(), title: 'first store' });
    expect(res.status).toBe(201);
    const body = (await res.json()) as { id: string; url: string };
    expect(body.id).toMatch(/^[A-Za-z0-9_-]+$/);
    expect(body.id.length * 6).toBeGreaterThanOrEqual(128); // base64url: 6 bits a character
    expect(body.url).toBe(`/p/${body.id}`);
  });

  it('POST /api/v1/panels of the same panel again answers 201 with a body identical to the first answer', async () => {
    const panel = { ...examplePanel(), title: 'shared twice' };
    const first = await postJson(worker, '/api/v1/panels', panel);
    const again = await postJson(worker, '/api/v1/panels', panel);
    expect([first.status, again.status]).toEqual([201, 201]);
    expect(await again.text()).toBe(await first.text());
  });

  it('POST /api/v1/panels gives an id that is not the plain SHA-256 of the canonical content', async () => {
    const panel = { ...examplePanel(), title: 'keyed id' };
    const { id } = (await (await postJson(worker, '/api/v1/panels', panel)).json()) as { id: string };
    const unkeyed = createHash('sha256').update(canonicalJson(panel), 'utf8').digest().subarray(0, 18);
    expect(id).not.toBe(unkeyed.toString('base64url'));
    const keyed = createHmac('sha256', localEnvVar('SHARE_ID_KEY')).update(canonicalJson(panel), 'utf8').digest();
    expect(id).toBe(keyed.subarray(0, 18).toString('base64url'));
  });

  it('POST /api/v1/panels gives the same id whatever the key order and white space', async () => {
    const a = (await (await postJson(worker, '/api/v1/panels', examplePanel())).json()) as { id: string };
    const spaced = JSON.stringify(reverseKeys(examplePanel()), null, 3);
    const b = (await (await postJson(worker, '/api/v1/panels', spaced, true)).json()) as { id: string };
    expect(b.id).toBe(a.id);
  });

  it('POST /api/v1/panels accepts a panel without version (it defaults to 1) and returns it as sent', async () => {
    const unversioned: Record<string, unknown> = { ...examplePanel(), title: 'no version field' };
    delete unversioned.version;
    const res = await postJson(worker, '/api/v1/panels', unversioned);
    expect(res.status).toBe(201);
    const { id } = (await res.json()) as { id: string };
    expect(await (await worker.call(`/api/v1/panels/${id}`)).json()).toStrictEqual(unversioned);
    const evaluated = await postJson(worker, '/api/v1/panels/evaluate', unversioned);
    expect(evaluated.status).toBe(200);
  });

  it('POST /api/v1/panels gives different panels different ids', async () => {
    const a = (await (await postJson(worker, '/api/v1/panels', examplePanel())).json()) as { id: string };
    const other = { ...examplePanel(), title: 'another title' };
    const b = (await (await postJson(worker, '/api/v1/panels', other)).json()) as { id: string };
    expect(b.id).not.toBe(a.id);
  });
});

describe('GET /api/v1/panels/:id', () => {
  it('GET /api/v1/panels/:id returns the panel exactly as it was sent', async () => {
    const sent = reverseKeys(examplePanel());
    const { id } = (await (await postJson(worker, '/api/v1/panels', sent)).json()) as { id: string };
    const res = await worker.call(`/api/v1/panels/${id}`);
    expect(res.status).toBe(200);
    expect(res.headers.get('content-type')).toMatch(/^application\/json/);
    expect(await res.json()).toStrictEqual(examplePanel());
  });

  it('GET /api/v1/panels/:id returns measured reference columns as sent; they evaluate as measured', async () => {
    const measuredReference = { channels: ['c1', 'c2'], columns: [{ probe: 'p1', values: [900, 45.5] }] };
    const sent = { ...examplePanel(), title: 'with controls', measuredReference };
    const { id } = (await (await postJson(worker, '/api/v1/panels', sent)).json()) as { id: string };
    const stored = (await (await worker.call(`/api/v1/panels/${id}`)).json()) as typeof sent;
    expect(stored.measuredReference).toStrictEqual(measuredReference);
    const ev = (await (await postJson(worker, '/api/v1/panels/evaluate', stored)).json()) as {
      referenceColumns: string[];
    };
    expect(ev.referenceColumns).toEqual(['measured', 'model']);
  });

  it('GET /api/v1/panels/:id of a well-formed unknown id is a 404 in the contract shape', async () => {
    const res = await worker.call('/api/v1/panels/AAAAAAAAAAAAAAAAAAAAAAAA');
    expect(res.status).toBe(404);
    expect((await errorOf(res))?.code).toBe('not_found');
  });

  it('GET /api/v1/panels/:id of malformed ids is a 404 in the contract shape', async () => {
    for (const id of ['short', 'A'.repeat(25), 'AAAAAAAAAAAAAAAAAAAAAA+/', '%00AAAAAAAAAAAAAAAAAAAAAAA']) {
      const res = await worker.call(`/api/v1/panels/${id}`);
      expect(res.status, id).toBe(404);
      expect((await errorOf(res))?.code, id).toBe('not_found');
    }
  });

  it('DELETE /api/v1/panels/:id is a 405 that allows only GET', async () => {
    const { id } = (await (await postJson(worker, '/api/v1/panels', examplePanel())).json()) as { id: string };
    const res = await worker.call(`/api/v1/panels/${id}`, { method: 'DELETE' });
    expect(res.status).toBe(405);
    expect(res.headers.get('allow')).toContain('GET');
    expect((await errorOf(res))?.code).toBe('method_not_allowed');
  });

  it('POST /api/v1/panels/design is never taken for a share id', async () => {
    const res = await postJson(worker, '/api/v1/panels/design', { targets: [] });
    expect(res.status).not.toBe(405);
    expect(await res.text()).not.toContain('"url"');
  });
});

describe('/p/:id page route', () => {
  it('GET /p/:id of a stored panel returns the front end with 200', async () => {
    const { url } = (await (await postJson(worker, '/api/v1/panels', examplePanel())).json()) as { url: string };
    const res = await worker.call(url);
    expect(res.status).toBe(200);
    expect(res.headers.get('content-type')).toMatch(/^text\/html/);
    const index = await (await worker.call('/')).text();
    expect(await res.text()).toBe(index);
  });

  it('GET /p/:id of an unknown or malformed id shows a 404 not-found page', async () => {
    for (const path of ['/p/AAAAAAAAAAAAAAAAAAAAAAAA', '/p/nope', '/p/']) {
      const res = await worker.call(path);
      expect(res.status, path).toBe(404);
      expect(res.headers.get('content-type'), path).toMatch(/^text\/html/);
      expect(await res.text(), path).toContain('not found');
    }
  });
});

describe('persistence', () => {
  it('GET /api/v1/panels/:id still finds a panel after the server restarts on the same state directory', async () => {
    const panel = { ...examplePanel(), title: 'kept across a restart' };
    const { id } = (await (await postJson(worker, '/api/v1/panels', panel)).json()) as { id: string };
    await worker.dispose();
    worker = await startWorker(persistDir);
    const res = await worker.call(`/api/v1/panels/${id}`);
    expect(res.status).toBe(200);
    expect(await res.json()).toStrictEqual(panel);
    expect((await postJson(worker, '/api/v1/panels', panel)).status).toBe(201);
  });
});

describe('a deployment without SHARE_ID_KEY', () => {
  it('POST /api/v1/panels answers 500 internal_error in the error shape and stores nothing', async () => {
    const bare = await startWorker(freshPersistDir(), []);
    try {
      const res = await postJson(bare, '/api/v1/panels', examplePanel());
      expect(res.status).toBe(500);
      expect((await errorOf(res))?.code).toBe('internal_error');
      const keyed = createHmac('sha256', localEnvVar('SHARE_ID_KEY')).update(canonicalJson(examplePanel()), 'utf8');
      expect((await bare.call(`/api/v1/panels/${keyed.digest().subarray(0, 18).toString('base64url')}`)).status).toBe(
        404,
      );
    } finally {
      await bare.dispose();
    }
  });
});

describe('links issued before ids were keyed', () => {
  it('GET /api/v1/panels/<old id> and /p/<old id> open a panel stored under its plain SHA-256 id', async () => {
    const res = await worker.call(`/api/v1/panels/${OLD_SCHEME_ID}`);
    expect(res.status).toBe(200);
    expect(await res.json()).toStrictEqual(OLD_SCHEME_PANEL);
    expect((await worker.call(`/p/${OLD_SCHEME_ID}`)).status).toBe(200);
  });

  it('POST /api/v1/panels of a panel stored under an old id gives its keyed id, and both ids open it', async () => {
    const res = await postJson(worker, '/api/v1/panels', OLD_SCHEME_PANEL);
    expect(res.status).toBe(201);
    const { id } = (await res.json()) as { id: string };
    expect(id).not.toBe(OLD_SCHEME_ID);
    expect(await (await worker.call(`/api/v1/panels/${id}`)).json()).toStrictEqual(OLD_SCHEME_PANEL);
    expect((await worker.call(`/api/v1/panels/${OLD_SCHEME_ID}`)).status).toBe(200);
  });
});

describe('a panel that states its exclusions', () => {
  it('is stored with them and returned as sent, and the evaluate route names the excluded probe', async () => {
    const panel = { ...examplePanel(), exclude: ['cadmium'] };
    const stored = (await (await postJson(worker, '/api/v1/panels', panel)).json()) as { id: string };
    const back = (await (await worker.call(`/api/v1/panels/${stored.id}`)).json()) as { exclude?: string[] };
    expect(back.exclude).toEqual(['cadmium']);
    const evaluation = (await (await postJson(worker, '/api/v1/panels/evaluate', panel)).json()) as {
      warnings: string[];
    };
    expect(evaluation.warnings).toContain('probe CD-x (p1) contains cadmium, which this panel excludes');
  });

  it('naming a class the tool does not know is a 400 at ["exclude", 0]', async () => {
    const res = await postJson(worker, '/api/v1/panels', { ...examplePanel(), exclude: ['mercury'] });
    expect(res.status).toBe(400);
    expect((await errorOf(res))?.path).toEqual(['exclude', 0]);
  });
});
