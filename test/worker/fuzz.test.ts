// Property-based: random JSON and random near-valid panels at evaluate and share never give a 5xx, and every refusal
// is in the contract's error shape (fast-check, fixed seed so a failure replays).
import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { examplePanel } from './helpers/panels';
import { freshPersistDir, postJson, startWorker, type RunningWorker } from './helpers/worker';

const SEED = 20_260_401;
const ROUTES = ['/api/v1/panels/evaluate', '/api/v1/panels'];
let worker: RunningWorker;

beforeAll(async () => {
  worker = await startWorker(freshPersistDir());
});
afterAll(async () => {
  await worker?.dispose();
});

type Path = (string | number)[];

/** Every path to a value inside a JSON value (objects' keys, arrays' indices). */
function allPaths(value: unknown, prefix: Path = []): Path[] {
  if (value === null || typeof value !== 'object') return [prefix];
  const entries = Array.isArray(value) ? value.map((v, i) => [i, v] as const) : Object.entries(value);
  return [prefix, ...entries.flatMap(([k, v]) => allPaths(v, [...prefix, k]))];
}

type Edit = { kind: 'set'; value: unknown } | { kind: 'delete' } | { kind: 'addKey'; key: string; value: unknown };

/** The example panel with one edit at one path. */
function edited(pathIndex: number, edit: Edit): unknown {
  const panel = examplePanel() as Record<string, unknown>;
  const paths = allPaths(panel).filter((p) => p.length > 0);
  const path = paths[pathIndex % paths.length];
  let parent: any = panel;
  for (const key of path.slice(0, -1)) parent = parent[key];
  const last = path[path.length - 1];
  if (edit.kind === 'set') parent[last] = edit.value;
  else if (edit.kind === 'delete') {
    if (Array.isArray(parent)) parent.splice(Number(last), 1);
    else delete parent[last];
  } else if (typeof parent[last] === 'object' && parent[last] !== null && !Array.isArray(parent[last]))
    parent[last][edit.key] = edit.value;
  else parent[last] = { [edit.key]: edit.value };
  return panel;
}

const number = fc.oneof(fc.double(), fc.integer(), fc.constantFrom(0, -1, 1e308, 5e-324, 405, 605, 4001));
const anyValue = fc.oneof(fc.jsonValue({ maxDepth: 3 }), number, fc.string({ maxLength: 300 }));
const edit: fc.Arbitrary<Edit> = fc.oneof(
  fc.record({ kind: fc.constant('set' as const), value: anyValue }),
  fc.record({ kind: fc.constant('delete' as const) }),
  fc.record({ kind: fc.constant('addKey' as const), key: fc.string({ maxLength: 12 }), value: anyValue }),
);
// Raw texts: numbers JSON.stringify would never write (1e999, -0, huge exponents) spliced into the example.
const rawNumber = fc.constantFrom(
  '1e999',
  '-1e999',
  '-0',
  '1e-400',
  '0.0000',
  '1E+2',
  '123456789012345678901234567890',
);

async function expectContractAnswer(res: Response): Promise<void> {
  expect(res.status).toBeLessThan(500);
  if (res.status >= 400) {
    const body = (await res.json()) as { error: { code: unknown; message: unknown; path: unknown } };
    expect(typeof body.error.code).toBe('string');
    expect(typeof body.error.message).toBe('string');
    expect(Array.isArray(body.error.path)).toBe(true);
    for (const p of body.error.path as unknown[]) expect(['string', 'number']).toContain(typeof p);
  } else {
    const text = await res.text();
    expect(text).not.toMatch(/NaN|Infinity/);
  }
}

describe.each(ROUTES)('POST %s under random input', (route) => {
  it(`POST ${route} answers random JSON values with a 4xx in the contract shape`, async () => {
    await fc.assert(
      fc.asyncProperty(fc.jsonValue({ maxDepth: 4 }), async (value) => {
        await expectContractAnswer(await postJson(worker, route, value));
      }),
      { seed: SEED, numRuns: 60 },
    );
  });

  it(`POST ${route} answers random text bodies without a 5xx`, async () => {
    await fc.assert(
      fc.asyncProperty(fc.string({ maxLength: 200, unit: 'binary' }), async (text) => {
        await expectContractAnswer(await postJson(worker, route, text, true));
      }),
      { seed: SEED, numRuns: 40 },
    );
  });

  it(`POST ${route} answers near-valid panels (one random edit) without a 5xx`, async () => {
    await fc.assert(
      fc.asyncProperty(fc.nat(), edit, async (pathIndex, change) => {
        await expectContractAnswer(await postJson(worker, route, edited(pathIndex, change)));
      }),
      { seed: SEED, numRuns: 150 },
    );
  });

  it(`POST ${route} answers unusual number literals in place of any number without a 5xx`, async () => {
    const text = JSON.stringify(examplePanel());
    const numbers = [...text.matchAll(/(?<=[:[,])-?\d+(\.\d+)?(?=[,\]}])/g)];
    await fc.assert(
      fc.asyncProperty(fc.nat(), rawNumber, async (k, literal) => {
        const m = numbers[k % numbers.length];
        const body = text.slice(0, m.index) + literal + text.slice(m.index! + m[0].length);
        await expectContractAnswer(await postJson(worker, route, body, true));
      }),
      { seed: SEED, numRuns: 60 },
    );
  });
});
