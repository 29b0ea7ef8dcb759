// Bad input at scale, the project's one fuzz suite: at least 10,000 seeded fast-check cases across every route (near-
// valid panels with one random edit anywhere, deep nesting, huge numbers, NaN strings, unicode, wrong content types,
// enormous arrays) give no 5xx, every 4xx from /api/ is in the contract's error shape, and no 2xx carries NaN or
// Infinity. Cases are generated up front with a fixed seed (a failure prints its case) and sent over keep-alive
// connections a few at a time.
import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startApp, type StartedApp } from './helpers/app';
import { demoPanelTitled, errorShapeProblem } from './helpers/contract';

const SEED = 20_261_202;
const CASES = Number(process.env.FUZZ_CASES ?? 10_000);
const CONCURRENCY = 6;

let app: StartedApp;
beforeAll(async () => {
  app = await startApp();
});
afterAll(async () => {
  await app?.stop();
});

interface Case {
  method: string;
  path: string;
  contentType?: string;
  body?: string;
}

const POST_ROUTES = ['/api/v1/panels/evaluate', '/api/v1/panels', '/api/v1/dots/resolve', '/api/v1/panels/design'];
const GET_ROUTES = [
  '/api/v1/health',
  '/api/v1/materials',
  '/api/v1/detectors',
  '/api/v1/backgrounds',
  '/api/v1/dyes',
  '/api/v1/openapi.json',
];

const nested = (depth: number, open: string, close: string, inner = '1') =>
  open.repeat(depth) + inner + close.repeat(depth);
const numberText = fc.oneof(
  fc.constantFrom(
    '1e999',
    '-1e999',
    '1e308',
    '-0',
    '5e-324',
    '1e-400',
    '123456789012345678901234567890',
    'NaN',
    'Infinity',
    '"NaN"',
    '"Infinity"',
    '"-Infinity"',
    '"1e999"',
    'null',
    'true',
    '"605"',
  ),
  fc.double().map((d) => (Number.isFinite(d) ? String(d) : '0')),
);
const unicodeText = fc.oneof(
  fc.string({ unit: 'grapheme', maxLength: 80 }),
  fc.string({ unit: 'binary', maxLength: 80 }),
  fc.constantFrom('\u0000', '\u202e', '\ud800', '\uffff', '𝔮𝔡', 'é'.normalize('NFD')),
);

/** The demo panel with one field's JSON text swapped for a generated literal. */
const panelWithLiteral = fc
  .tuple(
    fc.constantFrom(
      '"centerNm":460',
      '"widthNm":40',
      '"emissionPeakNm":525',
      '"quantumYield":0.5',
      '"wavelengthNm":405',
      '"abundance":0.2',
      '"level":0.1',
    ),
    numberText,
  )
  .map(([field, literal]) => {
    const text = JSON.stringify(demoPanelTitled('fuzz'));
    return text.replace(field, `${field.split(':')[0]}:${literal}`);
  });
/** The demo panel with a generated string in a text field. */
const panelWithText = fc
  .tuple(fc.constantFrom('title', 'label', 'target', 'id', 'material', 'detector'), unicodeText)
  .map(([field, text]) => {
    const panel = demoPanelTitled('fuzz') as {
      title: string;
      probes: Record<string, unknown>[];
      channels: Record<string, unknown>[];
    };
    if (field === 'title') panel.title = text;
    else if (field === 'detector') panel.channels[0].detector = text;
    else panel.probes[1][field] = text;
    return JSON.stringify(panel);
  });
/** Enormous arrays, within or beyond the body limit. */
const enormous = fc
  .tuple(fc.constantFrom('probes', 'channels', 'excitation', 'points'), fc.integer({ min: 17, max: 24_000 }))
  .map(([what, n]) => {
    const panel = demoPanelTitled('fuzz') as Record<string, any>;
    if (what === 'points')
      panel.channels[0].filters = [
        { type: 'table', points: Array.from({ length: n }, (_, i) => [300 + i * 0.01, 0.5]) },
      ];
    else panel[what] = Array.from({ length: n }, (_, i) => ({ ...(panel[what][0] as object), id: `x${i}` }));
    return JSON.stringify(panel);
  });
type Path = (string | number)[];

/** Every path to a value inside a JSON value (objects' keys, arrays' indices). */
function allPaths(value: unknown, prefix: Path = []): Path[] {
  if (value === null || typeof value !== 'object') return [prefix];
  const entries = Array.isArray(value) ? value.map((v, i) => [i, v] as const) : Object.entries(value);
  return [prefix, ...entries.flatMap(([k, v]) => allPaths(v, [...prefix, k]))];
}

type Edit = { kind: 'set'; value: unknown } | { kind: 'delete' } | { kind: 'addKey'; key: string; value: unknown };
const anyValue = fc.oneof(
  fc.jsonValue({ maxDepth: 3 }),
  fc.oneof(fc.double(), fc.integer(), fc.constantFrom(0, -1, 1e308, 5e-324, 405, 605, 4001)),
  fc.string({ maxLength: 300 }),
);
const edit: fc.Arbitrary<Edit> = fc.oneof(
  fc.record({ kind: fc.constant('set' as const), value: anyValue }),
  fc.record({ kind: fc.constant('delete' as const) }),
  fc.record({ kind: fc.constant('addKey' as const), key: fc.string({ maxLength: 12 }), value: anyValue }),
);
/** The demo panel with one random edit at one of its paths: set a value, delete it, or add a key beside it. */
const nearValidPanel = fc.tuple(fc.nat(), edit).map(([pathIndex, change]) => {
  const panel = demoPanelTitled('fuzz') as Record<string, unknown>;
  const paths = allPaths(panel).filter((p) => p.length > 0);
  const path = paths[pathIndex % paths.length];
  let parent = panel as Record<string | number, unknown>;
  for (const key of path.slice(0, -1)) parent = parent[key] as Record<string | number, unknown>;
  const last = path[path.length - 1];
  if (change.kind === 'set') parent[last] = change.value;
  else if (change.kind === 'delete') {
    if (Array.isArray(parent)) parent.splice(Number(last), 1);
    else delete parent[last];
  } else {
    const target = parent[last];
    if (typeof target === 'object' && target !== null && !Array.isArray(target))
      (target as Record<string, unknown>)[change.key] = change.value;
    else parent[last] = { [change.key]: change.value };
  }
  return JSON.stringify(panel);
});
const deep = fc
  .tuple(fc.integer({ min: 50, max: 20_000 }), fc.constantFrom(['[', ']'], ['{"a":', '}']))
  .map(([depth, [o, c]]) => nested(depth, o, c));
const bodyText = fc.oneof(
  { weight: 3, arbitrary: fc.jsonValue({ maxDepth: 4 }).map((v) => JSON.stringify(v)) },
  { weight: 3, arbitrary: panelWithLiteral },
  { weight: 3, arbitrary: panelWithText },
  { weight: 4, arbitrary: nearValidPanel },
  { weight: 1, arbitrary: enormous },
  { weight: 1, arbitrary: deep },
  { weight: 2, arbitrary: fc.string({ unit: 'binary', maxLength: 400 }) },
  { weight: 1, arbitrary: fc.constantFrom('', '{', 'null', '[]', '"x"', '{"version":1}', '\ufeff{}') },
);
const contentType = fc.oneof(
  { weight: 6, arbitrary: fc.constant('application/json') },
  {
    weight: 1,
    arbitrary: fc.constantFrom(
      'text/plain',
      'application/x-www-form-urlencoded',
      'multipart/form-data; boundary=x',
      'application/json; charset=utf-16',
      'application/problem+json',
      'APPLICATION/JSON',
      '',
      'application/jsonx',
    ),
  },
);
const postCase: fc.Arbitrary<Case> = fc.record({
  method: fc.constant('POST'),
  path: fc.constantFrom(...POST_ROUTES),
  contentType,
  body: bodyText,
});
const idText = fc.oneof(
  fc.string({ unit: 'grapheme', maxLength: 40 }),
  fc.stringMatching(/^[A-Za-z0-9_-]{24}$/),
  fc.constantFrom('..', '%2e%2e', '%00', 'evaluate', 'design', 'a'.repeat(5000)),
);
const getCase: fc.Arbitrary<Case> = fc.oneof(
  fc.record({ method: fc.constant('GET'), path: fc.constantFrom(...GET_ROUTES) }),
  idText.map((id) => ({ method: 'GET', path: `/api/v1/panels/${encodeURIComponent(id)}` })),
  idText.map((id) => ({ method: 'GET', path: `/p/${encodeURIComponent(id)}` })),
  fc.record({
    method: fc.constantFrom('PUT', 'DELETE', 'PATCH', 'HEAD', 'OPTIONS'),
    path: fc.constantFrom(...POST_ROUTES, ...GET_ROUTES, '/api/v1/panels/AAAAAAAAAAAAAAAAAAAAAAAA'),
  }),
  fc
    .string({ maxLength: 60 })
    .map((s) => ({ method: 'GET', path: `/api/v1/${encodeURIComponent(s)}?q=${encodeURIComponent(s)}` })),
);
const anyCase = fc.oneof({ weight: 4, arbitrary: postCase }, { weight: 1, arbitrary: getCase });

/** What is wrong with the answer to one case, or null. */
async function problemOf(c: Case): Promise<string | null> {
  const res = await fetch(app.baseUrl + c.path, {
    method: c.method,
    headers: c.contentType === undefined ? {} : { 'content-type': c.contentType },
    body: c.body,
  });
  const text = await res.text();
  if (res.status >= 500) return `${res.status}: ${text.slice(0, 300)}`;
  const isApi = c.path.startsWith('/api/');
  if (isApi && res.status >= 400 && c.method !== 'HEAD') {
    const shape = errorShapeProblem(text);
    if (shape) return `${res.status} not in the error shape: ${shape}`;
  }
  if (
    isApi &&
    res.status < 300 &&
    c.method !== 'HEAD' &&
    c.method !== 'OPTIONS' &&
    /\bNaN\b|Infinity/.test(text) &&
    !/"[^"]*(NaN|Infinity)[^"]*"/.test(text)
  )
    return `non-finite number in ${text.slice(0, 200)}`;
  return null;
}

describe('fuzz', () => {
  it(`every route answers ${CASES} seeded bad or odd requests with no 5xx and contract-shaped 4xx errors`, async () => {
    // Generated in seeded batches, so the enormous bodies of one batch are dropped before the next is made.
    const BATCH = 100;
    const failures: string[] = [];
    let sent = 0;
    for (let batch = 0; sent < CASES; batch++) {
      const cases = fc.sample(anyCase, { seed: SEED + batch, numRuns: Math.min(BATCH, CASES - sent) });
      let next = 0;
      await Promise.all(
        Array.from({ length: CONCURRENCY }, async () => {
          while (next < cases.length) {
            const c = cases[next++];
            try {
              const problem = await problemOf(c);
              if (problem)
                failures.push(
                  `batch ${batch}: ${c.method} ${c.path} [${c.contentType}] ${String(c.body).slice(0, 120)} → ` +
                    `${problem}`,
                );
            } catch (err) {
              failures.push(`batch ${batch}: ${c.method} ${c.path}: ${String((err as Error).cause ?? err)}`);
            }
          }
        }),
      );
      sent += cases.length;
    }
    console.log(`fuzz: ${sent} cases, ${failures.length} failures`);
    expect(sent).toBeGreaterThanOrEqual(CASES);
    expect(failures.slice(0, 10)).toEqual([]);
  });
});
