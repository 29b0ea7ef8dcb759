// Instrument profiles on the real local runtime and KV: POST/GET /api/v1/instruments, /i/:id, and panels that name
// an instrument (POST /api/v1/panels/evaluate and POST /api/v1/panels).
import { spawn } from 'node:child_process';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { reverseKeys } from './helpers/panels';
import {
  errorOf,
  freePort,
  freshPersistDir,
  LOCAL_ENV_FILE,
  postJson,
  ROOT,
  startWorker,
  type RunningWorker,
} from './helpers/worker';

const persistDir = freshPersistDir();
let worker: RunningWorker;

beforeAll(async () => {
  worker = await startWorker(persistDir);
});
afterAll(async () => {
  await worker?.dispose();
});

/** An invented two-line widefield: a 405 nm LED at 20 mW and a 488 nm laser at 5 mW, one dichroic, three filters. */
function profile(): Record<string, unknown> {
  return {
    version: 1,
    name: 'Test stand, two lines',
    lasers: [
      { name: 'violet', wavelengthNm: 405, powerMw: 20 },
      { wavelengthNm: 488, powerMw: 5 },
    ],
    dichroics: [{ name: 'main 420 LP', filter: { type: 'dichroic', edgeNm: 420, passes: 'above' } }],
    excitationFilters: [{ name: 'clean-up 405/10', filter: { type: 'bandpass', centerNm: 405, widthNm: 10 } }],
    filters: [
      { name: '525/20', filter: { type: 'bandpass', centerNm: 525, widthNm: 20 } },
      { name: '605/20', filter: { type: 'bandpass', centerNm: 605, widthNm: 20 } },
      { name: '650 LP', filter: { type: 'longpass', edgeNm: 650 } },
    ],
    detectors: [{ name: 'cam', type: 'scmos' }],
    channels: [
      { id: 'g', label: 'Green', filters: ['525/20'], detector: 'cam' },
      { id: 'o', label: 'Orange', filters: ['605/20'], excitationNm: 405, detector: 'cam' },
    ],
  };
}

const PROBES = [
  { id: 'p1', material: 'cdse', emissionPeakNm: 525, quantumYield: 0.5, channel: 'g' },
  { id: 'p2', material: 'cdse', emissionPeakNm: 605, quantumYield: 0.5, channel: 'o' },
];

async function store(body: unknown): Promise<string> {
  const res = await postJson(worker, '/api/v1/instruments', body);
  expect(res.status).toBe(201);
  return ((await res.json()) as { id: string }).id;
}

describe('POST and GET /api/v1/instruments', () => {
  it('POST /api/v1/instruments stores a profile with 201 and an /i/ link; again: 201, same body', async () => {
    const first = await postJson(worker, '/api/v1/instruments', { ...profile(), name: 'first store' });
    expect(first.status).toBe(201);
    const body = (await first.json()) as { id: string; url: string };
    expect(body.id).toMatch(/^[A-Za-z0-9_-]{24}$/);
    expect(body.url).toBe(`/i/${body.id}`);
    const again = await postJson(worker, '/api/v1/instruments', { ...profile(), name: 'first store' });
    expect(again.status).toBe(201);
    expect(await again.json()).toEqual(body);
  });

  it('GET /api/v1/instruments/:id returns the profile as canonical JSON text, whatever the key order', async () => {
    const id = await store(reverseKeys(profile()));
    const res = await worker.call(`/api/v1/instruments/${id}`);
    expect(res.status).toBe(200);
    const text = await res.text();
    expect(JSON.parse(text)).toStrictEqual(profile());
    // RFC 8785 canonical form: keys sorted, no white space (the same text every time).
    expect(text.startsWith('{"channels":[{"detector":"cam","filters":["525/20"],"id":"g","label":"Green"}')).toBe(true);
    expect(text).not.toMatch(/\s"|":\s/);
    expect(await (await worker.call(`/api/v1/instruments/${id}`)).text()).toBe(text);
  });

  it('GET /api/v1/instruments lists three example profiles whose links open and whose ids resolve', async () => {
    const res = await worker.call('/api/v1/instruments');
    expect(res.status).toBe(200);
    const { instruments } = (await res.json()) as { instruments: { id: string; name: string; url: string }[] };
    expect(instruments).toHaveLength(3);
    for (const example of instruments) {
      const got = await worker.call(`/api/v1/instruments/${example.id}`);
      expect(got.status, example.name).toBe(200);
      expect(((await got.json()) as { name: string }).name).toBe(example.name);
      // The example is a valid profile: stored again, it gets the same id (the id is the content's).
      const stored = await postJson(
        worker,
        '/api/v1/instruments',
        await (await worker.call(`/api/v1/instruments/${example.id}`)).json(),
      );
      expect(((await stored.json()) as { id: string }).id).toBe(example.id);
      const page = await worker.call(example.url);
      expect(page.status, example.url).toBe(200);
      expect(page.headers.get('content-type')).toMatch(/^text\/html/);
    }
  });

  it('GET /api/v1/instruments/:id of an unknown id is a 404; /i/ of one shows the not-found page', async () => {
    const res = await worker.call('/api/v1/instruments/AAAAAAAAAAAAAAAAAAAAAAAA');
    expect(res.status).toBe(404);
    expect((await errorOf(res))?.code).toBe('not_found');
    const page = await worker.call('/i/AAAAAAAAAAAAAAAAAAAAAAAA');
    expect(page.status).toBe(404);
    expect(await page.text()).toContain('not found');
  });
});

describe('bad instrument profiles', () => {
  const cases: [string, (p: Record<string, unknown>) => void, string, (string | number)[]][] = [
    ['no lasers', (p) => (p.lasers = []), 'invalid_input', ['lasers']],
    ['no lasers field', (p) => delete p.lasers, 'invalid_input', ['lasers']],
    [
      'a duplicate filter name',
      (p) => (p.dichroics = [{ name: '525/20', filter: { type: 'longpass', edgeNm: 420 } }]),
      'duplicate_id',
      ['filters', 0, 'name'],
    ],
    [
      'a duplicate laser line',
      (p) =>
        (p.lasers = [
          { wavelengthNm: 405, powerMw: 1 },
          { wavelengthNm: 405, powerMw: 2 },
        ]),
      'duplicate_id',
      ['lasers', 1, 'wavelengthNm'],
    ],
    [
      'a duplicate detector name',
      (p) =>
        (p.detectors = [
          { name: 'cam', type: 'scmos' },
          { name: 'cam', type: 'emccd' },
        ]),
      'duplicate_id',
      ['detectors', 1, 'name'],
    ],
    [
      'a duplicate channel id',
      (p) => (p.channels as unknown[]).push({ id: 'g', filters: [] }),
      'duplicate_id',
      ['channels', 2, 'id'],
    ],
    [
      'a preset naming a filter it lacks',
      (p) => ((p.channels as { filters: string[] }[])[0].filters = ['500/20']),
      'invalid_input',
      ['channels', 0, 'filters', 0],
    ],
    [
      'a preset naming a line it lacks',
      (p) => ((p.channels as { excitationNm?: number }[])[0].excitationNm = 561),
      'invalid_input',
      ['channels', 0, 'excitationNm'],
    ],
    [
      'a negative laser power',
      (p) => ((p.lasers as { powerMw: number }[])[0].powerMw = -1),
      'out_of_range',
      ['lasers', 0, 'powerMw'],
    ],
    [
      'an unknown detector class',
      (p) => (p.detectors = [{ name: 'cam', type: 'film' }]),
      'invalid_input',
      ['detectors', 0, 'type'],
    ],
  ];
  for (const [what, edit, code, path] of cases) {
    it(`POST /api/v1/instruments with ${what} is a 400 ${code} naming ${path.join('.')}`, async () => {
      const body = profile();
      edit(body);
      const res = await postJson(worker, '/api/v1/instruments', body);
      expect(res.status).toBe(400);
      const error = await errorOf(res);
      expect(error?.code).toBe(code);
      expect(error?.path).toEqual(path);
      expect(error?.message.length).toBeGreaterThan(5);
    });
  }
});

describe('panels that name an instrument', () => {
  it('a panel naming an instrument evaluates exactly as the panel with the parts written out by hand', async () => {
    const id = await store(profile());
    const byReference = { version: 1, instrument: id, probes: PROBES, scatterLevel: 1e9 };
    // The profile's parts, written out: lasers at their mW as powerRel, the dichroic in front of every channel, the
    // clean-up filter on every line, presets with their filters and detector written out.
    const writtenOut = {
      version: 1,
      probes: PROBES,
      scatterLevel: 1e9,
      excitation: [
        { wavelengthNm: 405, powerRel: 20 },
        { wavelengthNm: 488, powerRel: 5 },
      ],
      lightPath: {
        emissionFilters: [{ type: 'dichroic', edgeNm: 420, passes: 'above' }],
        excitationFilters: [{ type: 'bandpass', centerNm: 405, widthNm: 10 }],
      },
      channels: [
        { id: 'g', label: 'Green', filters: [{ type: 'bandpass', centerNm: 525, widthNm: 20 }], detector: 'scmos' },
        {
          id: 'o',
          label: 'Orange',
          filters: [{ type: 'bandpass', centerNm: 605, widthNm: 20 }],
          excitationNm: 405,
          detector: 'scmos',
        },
      ],
    };
    const a = await postJson(worker, '/api/v1/panels/evaluate', byReference);
    const b = await postJson(worker, '/api/v1/panels/evaluate', writtenOut);
    expect(a.status).toBe(200);
    expect(b.status).toBe(200);
    const [ea, eb] = [await a.json(), await b.json()];
    expect(ea).toStrictEqual(eb);
    // The written-out form really carries the instrument's parts: without the dichroic and clean-up it differs.
    const bare = { ...writtenOut, lightPath: undefined };
    const c = await postJson(worker, '/api/v1/panels/evaluate', bare);
    expect(await c.json()).not.toStrictEqual(ea);
  });

  it('a panel naming an instrument may pick some of its lines, which take the laser power unless given', async () => {
    const id = await store(profile());
    const one = { instrument: id, probes: PROBES, excitation: [{ wavelengthNm: 405 }] };
    const explicit = { instrument: id, probes: PROBES, excitation: [{ wavelengthNm: 405, powerRel: 20 }] };
    const [a, b] = await Promise.all([
      postJson(worker, '/api/v1/panels/evaluate', one),
      postJson(worker, '/api/v1/panels/evaluate', explicit),
    ]);
    expect(a.status).toBe(200);
    expect(await a.json()).toStrictEqual(await b.json());
  });

  const bad: [string, (id: string) => Record<string, unknown>, string, (string | number)[]][] = [
    [
      'a line its instrument lacks',
      (id) => ({ instrument: id, probes: PROBES, excitation: [{ wavelengthNm: 561 }] }),
      'invalid_input',
      ['excitation', 0, 'wavelengthNm'],
    ],
    [
      'an unknown instrument id',
      () => ({ instrument: 'AAAAAAAAAAAAAAAAAAAAAAAA', probes: PROBES }),
      'unknown_instrument',
      ['instrument'],
    ],
    ['a malformed instrument id', () => ({ instrument: 'not an id', probes: PROBES }), 'invalid_input', ['instrument']],
    [
      'a light path of its own',
      (id) => ({ instrument: id, probes: PROBES, lightPath: { emissionFilters: [] } }),
      'invalid_input',
      ['lightPath'],
    ],
    [
      'a probe naming a channel the instrument lacks',
      (id) => ({ instrument: id, probes: [{ ...PROBES[0], channel: 'x' }] }),
      'unknown_channel',
      ['probes', 0, 'channel'],
    ],
    [
      'no instrument and no channels',
      () => ({ probes: PROBES, excitation: [{ wavelengthNm: 405 }] }),
      'invalid_input',
      ['channels'],
    ],
    [
      'a negative scatter level',
      (id) => ({ instrument: id, probes: PROBES, scatterLevel: -1 }),
      'out_of_range',
      ['scatterLevel'],
    ],
  ];
  for (const [what, make, code, path] of bad) {
    it(`POST /api/v1/panels/evaluate and /panels with ${what} are 400 ${code} at ${path.join('.')}`, async () => {
      const id = await store(profile());
      for (const route of ['/api/v1/panels/evaluate', '/api/v1/panels']) {
        const res = await postJson(worker, route, make(id));
        expect(res.status, route).toBe(400);
        const error = await errorOf(res);
        expect(error?.code, route).toBe(code);
        expect(error?.path, route).toEqual(path);
      }
    });
  }

  it('a stored panel that names an instrument comes back as sent, reference and all', async () => {
    const id = await store(profile());
    const panel = { version: 1, title: 'by reference', instrument: id, probes: PROBES };
    const res = await postJson(worker, '/api/v1/panels', panel);
    expect(res.status).toBe(201);
    const { id: panelId } = (await res.json()) as { id: string };
    expect(await (await worker.call(`/api/v1/panels/${panelId}`)).json()).toStrictEqual(panel);
  });
});

/** Starts `wrangler dev` in its own process group on `port` with local KV under `dir`; resolves once it answers. */
async function startDev(port: number, dir: string): Promise<number> {
  const child = spawn(
    'npx',
    [
      'wrangler',
      'dev',
      '--env-file',
      LOCAL_ENV_FILE,
      '--ip',
      '127.0.0.1',
      '--port',
      String(port),
      '--persist-to',
      dir,
      '--log-level',
      'warn',
      '--show-interactive-dev-session=false',
    ],
    {
      cwd: ROOT,
      detached: true,
      env: { ...process.env, CLOUDFLARE_CF_FETCH_ENABLED: 'false', WRANGLER_SEND_METRICS: 'false', CI: 'true' },
      stdio: 'ignore',
    },
  );
  const until = Date.now() + 90_000;
  while (Date.now() < until) {
    try {
      if ((await fetch(`http://127.0.0.1:${port}/api/v1/health`)).ok) return child.pid!;
    } catch {
      // not up yet
    }
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error('wrangler dev did not start');
}

it('a stored instrument survives a hard restart (SIGKILL of the whole server) byte for byte', async () => {
  const dir = freshPersistDir();
  const port = await freePort();
  let pid = await startDev(port, dir);
  const base = `http://127.0.0.1:${port}`;
  try {
    const posted = await fetch(`${base}/api/v1/instruments`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify(profile()),
    });
    expect(posted.status).toBe(201);
    const { id } = (await posted.json()) as { id: string };
    const before = await (await fetch(`${base}/api/v1/instruments/${id}`)).text();
    process.kill(-pid, 'SIGKILL');
    await new Promise((r) => setTimeout(r, 500));
    pid = await startDev(port, dir);
    const after = await fetch(`${base}/api/v1/instruments/${id}`);
    expect(after.status).toBe(200);
    expect(await after.text()).toBe(before);
  } finally {
    process.kill(-pid, 'SIGKILL');
  }
}, 200_000);
