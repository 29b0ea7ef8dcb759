// Materials and single dots through the HTTP API on the real runtime; the numbers must be the spectral library's own.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { listMaterials, makeGrid, resolveDot, spectrumOnGrid } from '../../spectra/index';
import { errorOf, freshPersistDir, postJson, startWorker, type RunningWorker } from './helpers/worker';

let worker: RunningWorker;

beforeAll(async () => {
  worker = await startWorker(freshPersistDir());
});
afterAll(async () => {
  await worker?.dispose();
});

/**
 * Same source, two engines: workerd's V8 and Node's V8 may round Math.exp/log/pow differently in the last bit, and the
 * library's iterative solvers carry that into the ~1e-10 place. Equal means equal to 1e-9 relative here.
 */
function expectSameNumber(api: unknown, lib: unknown, what: string, floor = 0): void {
  if (typeof lib !== 'number') return void expect(api, what).toEqual(lib);
  expect(typeof api, what).toBe('number');
  expect(Math.abs((api as number) - lib), what).toBeLessThanOrEqual(1e-9 * Math.abs(lib) + floor);
}

function expectSameArray(api: number[], lib: number[], what: string): void {
  expect(api.length, what).toBe(lib.length);
  // Far tails (1e-300 and below) carry only rounding: compare them against a floor of 1e-12 of the peak.
  const floor = 1e-12 * Math.max(...lib.map(Math.abs));
  api.forEach((v, i) => expectSameNumber(v, lib[i], `${what}[${i}]`, floor));
}

type DotJson = Record<string, any> & { spectrum: { startNm: number; stepNm: number; values: number[] } };
const resolve = async (body: unknown) =>
  (await (await postJson(worker, '/api/v1/dots/resolve', body)).json()) as DotJson;

describe('GET /api/v1/materials', () => {
  it('GET /api/v1/materials lists the contract ids with the same data as listMaterials()', async () => {
    const res = await worker.call('/api/v1/materials');
    expect(res.status).toBe(200);
    const { materials } = (await res.json()) as { materials: any[] };
    expect(materials.map((m) => m.id)).toEqual([
      'cdse',
      'cdte',
      'cds',
      'inp',
      'gaas',
      'cspbbr3',
      'carbon',
      'custom',
      'dye',
    ]);
    expect(materials).toEqual(JSON.parse(JSON.stringify(listMaterials())));
  });

  it('GET /api/v1/materials gives cadmium and lead materials a high toxicity level with cautions', async () => {
    const { materials } = (await (await worker.call('/api/v1/materials')).json()) as { materials: any[] };
    for (const m of materials.filter((x) => x.elements.includes('Cd') || x.elements.includes('Pb'))) {
      expect(m.toxicity.level, m.id).toBe('high');
      expect(m.toxicity.cautions.length, m.id).toBeGreaterThan(0);
    }
  });
});

describe('POST /api/v1/dots/resolve', () => {
  it('POST /api/v1/dots/resolve for CdSe at 605 nm gives exactly resolveDot()’s numbers', async () => {
    const input = { material: 'cdse' as const, emissionPeakNm: 605, excitationNm: 405 };
    const api = await resolve(input);
    const lib = resolveDot(input);
    for (const key of [
      'diameterNm',
      'firstExcitonNm',
      'emissionPeakNm',
      'fwhmNm',
      'extinctionFirstExciton',
      'extinctionAtExcitation',
      'model',
    ]) {
      expectSameNumber(api[key], lib[key as keyof typeof lib], key);
    }
    expect(api.warnings).toEqual(lib.warnings);
    expect([api.spectrum.startNm, api.spectrum.stepNm]).toEqual([300, 1]);
    expectSameArray(api.spectrum.values, spectrumOnGrid(lib.emission, lib.grid), 'spectrum');
  });

  it('POST /api/v1/dots/resolve returns an emission normalised to unit area (sum × step = 1)', async () => {
    const { spectrum } = await resolve({ material: 'cdse', diameterNm: 4, sizeDispersionPct: 5 });
    const area = spectrum.values.reduce((a, b) => a + b, 0) * spectrum.stepNm;
    expect(area).toBeCloseTo(1, 9);
  });

  it('POST /api/v1/dots/resolve on a custom grid samples on that grid, as resolveDot() does', async () => {
    const api = await resolve({
      material: 'inp',
      emissionPeakNm: 620,
      grid: { startNm: 400, endNm: 800, stepNm: 0.5 },
    });
    const lib = resolveDot({ material: 'inp', emissionPeakNm: 620 }, { grid: makeGrid(400, 800, 0.5) });
    expect(api.spectrum.values).toHaveLength(801);
    expectSameArray(api.spectrum.values, spectrumOnGrid(lib.emission, lib.grid), 'spectrum');
  });

  it('POST /api/v1/dots/resolve without excitationNm gives extinctionAtExcitation null', async () => {
    expect((await resolve({ material: 'cdte', diameterNm: 4 })).extinctionAtExcitation).toBeNull();
  });

  it('POST /api/v1/dots/resolve for a carbon dot takes emissionPeakNm and fwhmNm', async () => {
    const api = await resolve({ material: 'carbon', emissionPeakNm: 520, fwhmNm: 80 });
    expect(api.material).toBe('carbon');
    expect(api.emissionPeakNm).toBe(resolveDot({ material: 'carbon', emissionPeakNm: 520, fwhmNm: 80 }).emissionPeakNm);
  });
});

describe('POST /api/v1/dots/resolve with bad input', () => {
  it.each([
    ['a peak CdSe cannot reach', { material: 'cdse', emissionPeakNm: 900 }, 'out_of_range', ['emissionPeakNm']],
    ['an unknown material', { material: 'gold', emissionPeakNm: 600 }, 'unknown_material', ['material']],
    ['both size fields', { material: 'cdse', emissionPeakNm: 600, diameterNm: 4 }, 'invalid_input', ['diameterNm']],
    ['no size field', { material: 'cdse' }, 'invalid_input', ['emissionPeakNm']],
    ['a diameter for a carbon dot', { material: 'carbon', diameterNm: 3 }, 'invalid_input', ['diameterNm']],
    ['a string diameter', { material: 'cdse', diameterNm: '4' }, 'invalid_input', ['diameterNm']],
    ['an unknown key', { material: 'cdse', diameterNm: 4, colour: 'red' }, 'invalid_input', ['colour']],
    [
      'a grid of 7,001 points',
      { material: 'cdse', diameterNm: 4, grid: { startNm: 300, endNm: 1000, stepNm: 0.1 } },
      'out_of_range',
      ['grid', 'stepNm'],
    ],
    [
      'a grid ending before it starts',
      { material: 'cdse', diameterNm: 4, grid: { startNm: 800, endNm: 400, stepNm: 1 } },
      'invalid_input',
      ['grid', 'endNm'],
    ],
    [
      'an excitation line at 100 nm',
      { material: 'cdse', diameterNm: 4, excitationNm: 100 },
      'out_of_range',
      ['excitationNm'],
    ],
  ])('POST /api/v1/dots/resolve with %s is a 400 naming the field', async (_name, body, code, path) => {
    const res = await postJson(worker, '/api/v1/dots/resolve', body);
    expect(res.status).toBe(400);
    const error = await errorOf(res);
    expect(error?.code).toBe(code);
    expect(error?.path).toEqual(path);
  });

  it('POST /api/v1/dots/resolve names the reachable range when a peak is out of reach', async () => {
    const error = await errorOf(
      await postJson(worker, '/api/v1/dots/resolve', { material: 'cdse', emissionPeakNm: 900 }),
    );
    expect(error?.message).toMatch(/\d+.*–.*\d+ nm/);
  });

  it('POST /api/v1/dots/resolve with 1e999 or malformed JSON is a 400', async () => {
    const inf = await postJson(worker, '/api/v1/dots/resolve', '{"material":"cdse","diameterNm":1e999}', true);
    expect(inf.status).toBe(400);
    expect((await errorOf(inf))?.path).toEqual(['diameterNm']);
    const bad = await postJson(worker, '/api/v1/dots/resolve', '{"material":', true);
    expect((await errorOf(bad))?.code).toBe('invalid_json');
  });
});
