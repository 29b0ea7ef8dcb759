// Security of the running API: ids that cannot be guessed and never reach the store when malformed, stored panels
// that cannot be changed, size limits on every route, security headers on every kind of response, and the per-client
// budget of new share links.
import { execFileSync } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { SECURITY_HEADERS } from '../../worker/middleware/security-headers';
import { freshPersistDir, ROOT, startApp, type StartedApp } from './helpers/app';
import { demoPanelTitled, errorShapeProblem, postJson } from './helpers/contract';

const PLANTED_BAD_ID = 'not-a-share-id';
const PLANTED_GOOD_ID = 'Planted_id_0123456789abc'; // 24 base64url characters: the form of a real id
let app: StartedApp;
let storedId = '';
const stored = demoPanelTitled('Stored panel that must never change');

/** Writes a key straight into the local KV store with wrangler's own CLI (before the server opens it). */
function plantKv(persistDir: string, key: string, value: string): void {
  execFileSync(
    'npx',
    ['wrangler', 'kv', 'key', 'put', '--binding', 'PANELS', '--local', '--persist-to', persistDir, key, value],
    {
      cwd: ROOT,
      env: { ...process.env, CLOUDFLARE_CF_FETCH_ENABLED: 'false', WRANGLER_SEND_METRICS: 'false', CI: 'true' },
      stdio: 'pipe',
    },
  );
}

beforeAll(async () => {
  const persistDir = freshPersistDir();
  plantKv(persistDir, `panel:${PLANTED_BAD_ID}`, JSON.stringify(demoPanelTitled('planted under a malformed id')));
  plantKv(persistDir, `panel:${PLANTED_GOOD_ID}`, JSON.stringify(demoPanelTitled('planted under a well-formed id')));
  app = await startApp({ persistDir });
  const res = await postJson(app.baseUrl, '/api/v1/panels', stored);
  storedId = ((await res.json()) as { id: string }).id;
});
afterAll(async () => {
  await app?.stop();
});

async function expectContractError(
  res: Response,
  status: number,
): Promise<{ code: string; path?: (string | number)[] }> {
  const text = await res.text();
  expect(res.status, text.slice(0, 200)).toBe(status);
  expect(errorShapeProblem(text)).toBeNull();
  return (JSON.parse(text) as { error: { code: string; path?: (string | number)[] } }).error;
}

describe('share ids', () => {
  it('GET /api/v1/panels/<random 144-bit id> answers 404 in the error shape for 200 random ids', async () => {
    for (let i = 0; i < 200; i++) {
      const id = randomBytes(18).toString('base64url');
      expect((await expectContractError(await fetch(`${app.baseUrl}/api/v1/panels/${id}`), 404)).code).toBe(
        'not_found',
      );
    }
  });

  it('GET of a malformed id is 404 without reading the store, though a key of that name is in it', async () => {
    // The planted well-formed key is found: planting works, so the malformed id's 404 means KV was not asked.
    expect((await fetch(`${app.baseUrl}/api/v1/panels/${PLANTED_GOOD_ID}`)).status).toBe(200);
    await expectContractError(await fetch(`${app.baseUrl}/api/v1/panels/${PLANTED_BAD_ID}`), 404);
    expect((await fetch(`${app.baseUrl}/p/${PLANTED_BAD_ID}`)).status).toBe(404);
    for (const id of [
      'a',
      storedId.slice(1),
      `${storedId}A`,
      `${storedId.slice(0, 23)}.`,
      '%2e%2e%2fx',
      `${storedId.slice(0, 22)}é`,
    ]) {
      expect((await fetch(`${app.baseUrl}/api/v1/panels/${id}`)).status, id).toBe(404);
    }
  });

  it(
    'POST /api/v1/panels gives 144-bit base64url ids, the same id for the same panel and a new id for a changed ' +
      'one',
    async () => {
      expect(storedId).toMatch(/^[A-Za-z0-9_-]{24}$/);
      const again = await postJson(app.baseUrl, '/api/v1/panels', stored);
      expect(again.status).toBe(201);
      expect(((await again.json()) as { id: string }).id).toBe(storedId);
      const changed = await postJson(app.baseUrl, '/api/v1/panels', {
        ...stored,
        title: 'Stored panel that must never change!',
      });
      expect(changed.status).toBe(201);
      expect(((await changed.json()) as { id: string }).id).not.toBe(storedId);
    },
  );

  it('PUT, DELETE and PATCH on a stored panel and on /api/v1/panels answer 405; the panel is unchanged', async () => {
    for (const method of ['PUT', 'DELETE', 'PATCH']) {
      for (const path of [`/api/v1/panels/${storedId}`, '/api/v1/panels']) {
        const res = await fetch(app.baseUrl + path, {
          method,
          headers: { 'content-type': 'application/json' },
          body: JSON.stringify(demoPanelTitled('overwrite')),
        });
        expect(res.headers.get('allow'), `${method} ${path}`).toBeTruthy();
        expect((await expectContractError(res, 405)).code).toBe('method_not_allowed');
      }
    }
    expect(await (await fetch(`${app.baseUrl}/api/v1/panels/${storedId}`)).json()).toEqual(stored);
  });
});

describe('limits', () => {
  const big = 'x'.repeat(300 * 1024);
  it.each(['/api/v1/panels/evaluate', '/api/v1/panels', '/api/v1/dots/resolve', '/api/v1/panels/design'])(
    'POST %s with a 300 KiB body answers 413 in the error shape',
    async (route) => {
      const res = await fetch(app.baseUrl + route, {
        method: 'POST',
        headers: { 'content-type': 'application/json' },
        body: JSON.stringify({ title: big }),
      });
      expect((await expectContractError(res, 413)).code).toBe('payload_too_large');
    },
  );

  const cases: [string, (p: Record<string, any>) => void, string][] = [
    [
      '17 probes',
      (p) => (p.probes = Array.from({ length: 17 }, (_, i) => ({ ...p.probes[1], id: `q${i}` }))),
      'probes',
    ],
    [
      '65 channels',
      (p) => (p.channels = Array.from({ length: 65 }, (_, i) => ({ ...p.channels[1], id: `k${i}` }))),
      'channels',
    ],
    [
      '17 excitation lines',
      (p) => (p.excitation = Array.from({ length: 17 }, (_, i) => ({ wavelengthNm: 300 + i }))),
      'excitation',
    ],
    [
      'a 1,001-point filter table',
      (p) =>
        (p.channels[0].filters = [
          { type: 'table', points: Array.from({ length: 1001 }, (_, i) => [400 + i * 0.1, 0.5]) },
        ]),
      'points',
    ],
    ['a 201-character title', (p) => (p.title = 't'.repeat(201)), 'title'],
    ['a 201-character label', (p) => (p.probes[0].label = 'l'.repeat(201)), 'label'],
    ['a 65-character id', (p) => (p.probes[0].id = 'i'.repeat(65)), 'id'],
  ];
  it.each(cases)(
    'POST /api/v1/panels and /evaluate refuse %s with 400 naming the field',
    async (_what, change, field) => {
      for (const route of ['/api/v1/panels', '/api/v1/panels/evaluate']) {
        const panel = demoPanelTitled('limits') as Record<string, any>;
        change(panel);
        const error = await expectContractError(await postJson(app.baseUrl, route, panel), 400);
        expect(error.path, route).toContain(field);
      }
    },
  );

  it('POST /api/v1/dots/resolve refuses a grid of more than 4,001 points with 400 naming the grid', async () => {
    const res = await postJson(app.baseUrl, '/api/v1/dots/resolve', {
      material: 'cdse',
      emissionPeakNm: 605,
      grid: { startNm: 300, endNm: 1000, stepNm: 0.1 },
    });
    expect((await expectContractError(res, 400)).path).toContain('grid');
  });
});

describe('security headers', () => {
  it('every route, error, page and static file carries the same CSP, nosniff, referrer and frame headers', async () => {
    const html = readFileSync(join(app.root, 'dist', 'index.html'), 'utf8');
    const script = /src="(\/assets\/[^"]+\.js)"/.exec(html)![1];
    const requests: [string, RequestInit?][] = [
      ['/'],
      [script],
      ['/page.css'],
      ['/no/such/page'],
      [`/p/${storedId}`],
      ['/p/AAAAAAAAAAAAAAAAAAAAAAAA'],
      ['/api/v1/health'],
      ['/api/v1/materials'],
      ['/api/v1/detectors'],
      ['/api/v1/backgrounds'],
      ['/api/v1/dyes'],
      ['/api/v1/filters/stock'],
      ['/api/v1/openapi.json'],
      [`/api/v1/panels/${storedId}`],
      ['/api/v1/nothing'],
      ['/api/v1/panels/evaluate', { method: 'GET' }],
      ['/api/v1/panels/evaluate', { method: 'OPTIONS' }],
      [
        '/api/v1/panels/evaluate',
        { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(stored) },
      ],
      ['/api/v1/panels', { method: 'POST', headers: { 'content-type': 'application/json' }, body: '{' }],
      ['/api/v1/dots/resolve', { method: 'POST', headers: { 'content-type': 'text/plain' }, body: '{}' }],
    ];
    for (const [path, init] of requests) {
      const res = await fetch(app.baseUrl + path, init);
      await res.arrayBuffer();
      for (const [name, value] of Object.entries(SECURITY_HEADERS))
        expect(res.headers.get(name), `${init?.method ?? 'GET'} ${path}: ${name}`).toBe(value);
    }
  });

  it('the built index.html has no inline script, no event-handler attribute and no inline style', () => {
    const html = readFileSync(join(app.root, 'dist', 'index.html'), 'utf8');
    const scripts = [...html.matchAll(/<script\b([^>]*)>([\s\S]*?)<\/script>/gi)];
    expect(scripts.length).toBeGreaterThan(0);
    for (const [, attrs, body] of scripts) {
      expect(attrs).toMatch(/\bsrc="\/[^"]+"/);
      expect(body.trim()).toBe('');
    }
    expect(html).not.toMatch(/\son[a-z]+\s*=/i);
    expect(html).not.toMatch(/<style\b|\sstyle\s*=/i);
    expect(html).not.toMatch(/javascript:/i);
  });
});

describe('budget of new share links per client', () => {
  const limit = Number(
    /\[\[ratelimits\]\][^[]*?limit\s*=\s*(\d+)/.exec(readFileSync(join(ROOT, 'wrangler.toml'), 'utf8'))![1],
  );
  const client = { 'cf-connecting-ip': '203.0.113.77' }; // TEST-NET-3 (RFC 5737): no real client

  it(
    'POST /api/v1/panels from one address gets 429 in the error shape after its budget, re-shares too, while reads, ' +
      'evaluation, other addresses and loopback still work',
    async () => {
      expect(limit).toBeGreaterThan(0);
      // The local limiter counts in fixed 60 s windows aligned to the clock: stay clear of a window's end.
      const intoWindowMs = Date.now() % 60_000;
      if (intoWindowMs > 40_000) await new Promise((r) => setTimeout(r, 60_500 - intoWindowMs));
      const statuses: number[] = [];
      for (let i = 0; i < limit + 5; i++) {
        const res = await postJson(app.baseUrl, '/api/v1/panels', demoPanelTitled(`Budget test ${i}`), client);
        statuses.push(res.status);
        if (res.status === 429) {
          expect(res.headers.get('retry-after')).toMatch(/^\d+$/);
          expect((await expectContractError(res, 429)).code).toBe('rate_limited');
        } else await res.text();
      }
      expect(statuses.filter((s) => s === 201)).toHaveLength(limit);
      expect(statuses.slice(limit)).toEqual([429, 429, 429, 429, 429]);
      // Reads cost nothing; re-sharing a stored panel answers as sharing a new one would (429 here), so the answer
      // never tells whether someone else stored it.
      expect((await fetch(`${app.baseUrl}/api/v1/panels/${storedId}`, { headers: client })).status).toBe(200);
      expect((await postJson(app.baseUrl, '/api/v1/panels', stored, client)).status).toBe(429);
      expect((await postJson(app.baseUrl, '/api/v1/panels/evaluate', stored, client)).status).toBe(200);
      // Another address, and loopback (local runs), still create links.
      expect(
        (
          await postJson(app.baseUrl, '/api/v1/panels', demoPanelTitled('Budget other client'), {
            'cf-connecting-ip': '203.0.113.78',
          })
        ).status,
      ).toBe(201);
      expect((await postJson(app.baseUrl, '/api/v1/panels', demoPanelTitled('Budget loopback'))).status).toBe(201);
    },
  );

  it('POST /api/v1/panels from addresses in one IPv6 /64 shares one budget', async () => {
    const intoWindowMs = Date.now() % 60_000;
    if (intoWindowMs > 40_000) await new Promise((r) => setTimeout(r, 60_500 - intoWindowMs));
    const statuses: number[] = [];
    for (let i = 0; i < limit + 1; i++) {
      const ip = `2001:db8:1:2:${(i + 1).toString(16)}::${i}`; // 2001:db8::/32 is the documentation prefix (RFC 3849)
      const res = await postJson(app.baseUrl, '/api/v1/panels', demoPanelTitled(`Budget v6 ${i}`), {
        'cf-connecting-ip': ip,
      });
      statuses.push(res.status);
      await res.text();
    }
    expect(statuses.at(-1)).toBe(429);
  });
});
