// The dye library, dye probes and the absorption fields of custom probes through the HTTP API on the real runtime: the
// numbers must be the spectral library's own, and every bad input a 400 in the contract's shape naming the field.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DYE_IDS, evaluatePanel, listDyes, resolveDot, spectrumOnGrid, type PanelSpec } from '../../spectra/index';
import { DyeList, ErrorBody } from '../../worker/schemas/index';
import { errorOf, freshPersistDir, postJson, startWorker, type RunningWorker } from './helpers/worker';

let worker: RunningWorker;
beforeAll(async () => {
  worker = await startWorker(freshPersistDir());
});
afterAll(async () => {
  await worker?.dispose();
});

// workerd's and Node's Math may differ in the last bit, and the band solvers carry that into ~1e-12: equal means
// equal to 1e-9 relative (with a floor for far tails).
function expectClose(api: number, lib: number, what: string, floor = 0): void {
  expect(Math.abs(api - lib), what).toBeLessThanOrEqual(1e-9 * Math.abs(lib) + floor);
}

const emission = (peakNm: number, sigmaNm: number): [number, number][] => {
  const points: [number, number][] = [];
  for (let nm = peakNm - 60; nm <= peakNm + 60; nm += 1)
    points.push([nm, Math.exp(-0.5 * ((nm - peakNm) / sigmaNm) ** 2)]);
  return points;
};

describe('GET /api/v1/dyes', () => {
  it('GET /api/v1/dyes answers 200 with listDyes(), a body the DyeList schema accepts', async () => {
    const res = await worker.call('/api/v1/dyes');
    expect(res.status).toBe(200);
    const body = await res.json();
    expect(DyeList.safeParse(body).success).toBe(true);
    expect(body).toEqual({ dyes: JSON.parse(JSON.stringify(listDyes())) });
  });

  it("GET /api/v1/materials lists material 'dye', whose record points to GET /api/v1/dyes", async () => {
    const { materials } = (await (await worker.call('/api/v1/materials')).json()) as { materials: any[] };
    const dye = materials.find((m) => m.id === 'dye');
    expect(dye.warnings.join(' ')).toContain('GET /api/v1/dyes');
  });
});

describe('POST /api/v1/dots/resolve with dye and custom probes', () => {
  it('POST /api/v1/dots/resolve for dye egfp at 488 nm gives resolveDot()’s numbers and spectrum', async () => {
    const input = { material: 'dye' as const, dye: 'egfp', excitationNm: 488 };
    const api = (await (await postJson(worker, '/api/v1/dots/resolve', input)).json()) as any;
    const lib = resolveDot(input);
    for (const key of ['emissionPeakNm', 'fwhmNm', 'quantumYield', 'extinctionAtExcitation'] as const)
      expectClose(api[key], lib[key]!, key);
    expect([api.material, api.model, api.warnings]).toEqual([lib.material, lib.model, lib.warnings]);
    const values = spectrumOnGrid(lib.emission, lib.grid);
    const floor = 1e-12 * Math.max(...values);
    (api.spectrum.values as number[]).forEach((v, i) => expectClose(v, values[i], `spectrum[${i}]`, floor));
  });

  it(
    'POST /api/v1/dots/resolve for a custom probe absorbing at 650 nm: ε at 405 nm under a tenth of ε at ' + '640 nm',
    async () => {
      const dot = { material: 'custom', measuredEmission: { points: emission(670, 12) }, absorptionPeakNm: 650 };
      const at = async (nm: number) =>
        ((await (await postJson(worker, '/api/v1/dots/resolve', { ...dot, excitationNm: nm })).json()) as any)
          .extinctionAtExcitation as number;
      expect((await at(405)) / (await at(640))).toBeLessThan(0.1);
    },
  );
});

describe('POST /api/v1/panels/evaluate with dye probes', () => {
  it(
    'POST /api/v1/panels/evaluate of a dye counterstain, a fluorescent protein and a dot gives ' +
      'evaluatePanel()’s collected light',
    async () => {
      const panel: PanelSpec = {
        excitation: [{ wavelengthNm: 405 }, { wavelengthNm: 488 }, { wavelengthNm: 561 }],
        probes: [
          { id: 'nuclei', material: 'dye', dye: 'dapi' },
          { id: 'actin', material: 'dye', dye: 'egfp', quantumYield: 0.5 },
          { id: 'dot', material: 'cdse', emissionPeakNm: 620 },
        ],
        channels: [450, 520, 620].map((centerNm) => ({
          id: `c${centerNm}`,
          filters: [{ type: 'bandpass' as const, centerNm, widthNm: 30 }],
        })),
      };
      const res = await postJson(worker, '/api/v1/panels/evaluate', panel);
      expect(res.status).toBe(200);
      const api = (await res.json()) as { collected: number[][] };
      const lib = evaluatePanel(panel);
      lib.collected.forEach((row, c) =>
        row.forEach((v, p) => expectClose(api.collected[c][p], v!, `collected[${c}][${p}]`)),
      );
    },
  );
});

describe('bad dye and absorption fields are a 400 naming the field', () => {
  const custom = { material: 'custom', measuredEmission: { points: emission(600, 10) } };
  it.each<[string, Record<string, unknown>, string, string]>([
    ["material 'dye' without dye", { material: 'dye' }, 'invalid_input', 'dye'],
    ['an unknown dye id', { material: 'dye', dye: 'no-such-dye' }, 'unknown_dye', 'dye'],
    ['a number as the dye', { material: 'dye', dye: 7 }, 'invalid_input', 'dye'],
    ['dye on a sized dot', { material: 'cdse', emissionPeakNm: 600, dye: 'egfp' }, 'invalid_input', 'dye'],
    ['dye on a custom probe', { ...custom, dye: 'egfp' }, 'invalid_input', 'dye'],
    ['a dye probe with diameterNm', { material: 'dye', dye: 'egfp', diameterNm: 4 }, 'invalid_input', 'diameterNm'],
    [
      'a dye probe with emissionPeakNm',
      { material: 'dye', dye: 'egfp', emissionPeakNm: 510 },
      'invalid_input',
      'emissionPeakNm',
    ],
    [
      'a dye probe with sizeDispersionPct',
      { material: 'dye', dye: 'egfp', sizeDispersionPct: 5 },
      'invalid_input',
      'sizeDispersionPct',
    ],
    [
      'a dye probe with absorptionPeakNm',
      { material: 'dye', dye: 'egfp', absorptionPeakNm: 480 },
      'invalid_input',
      'absorptionPeakNm',
    ],
    [
      'absorptionPeakNm on a sized dot',
      { material: 'cdse', emissionPeakNm: 600, absorptionPeakNm: 580 },
      'invalid_input',
      'absorptionPeakNm',
    ],
    [
      'extinctionPeak on a sized dot',
      { material: 'inp', diameterNm: 3, extinctionPeak: 1e5 },
      'invalid_input',
      'extinctionPeak',
    ],
    [
      'absorptionPeakNm on a carbon dot',
      { material: 'carbon', emissionPeakNm: 450, absorptionPeakNm: 400 },
      'invalid_input',
      'absorptionPeakNm',
    ],
    [
      'extinctionPeak on a carbon dot',
      { material: 'carbon', emissionPeakNm: 450, extinctionPeak: 1e5 },
      'invalid_input',
      'extinctionPeak',
    ],
    ['an absorptionPeakNm of 100 nm', { ...custom, absorptionPeakNm: 100 }, 'out_of_range', 'absorptionPeakNm'],
    ['a negative extinctionPeak', { ...custom, extinctionPeak: -1 }, 'out_of_range', 'extinctionPeak'],
    ['an extinctionPeak of 2e9', { ...custom, extinctionPeak: 2e9 }, 'out_of_range', 'extinctionPeak'],
  ])('POST /api/v1/dots/resolve with %s is a 400 %s naming %s', async (_what, body, code, field) => {
    const res = await postJson(worker, '/api/v1/dots/resolve', body);
    expect(res.status).toBe(400);
    const json = await res.json();
    expect(ErrorBody.safeParse(json).success).toBe(true);
    const { error } = json as { error: { code: string; path: (string | number)[] } };
    expect([error.code, error.path]).toEqual([code, [field]]);
  });

  it('POST /api/v1/dots/resolve with an unknown dye says where the ids are listed, and lists them', async () => {
    const error = await errorOf(await postJson(worker, '/api/v1/dots/resolve', { material: 'dye', dye: 'dapl' }));
    expect(error?.message).toContain('GET /api/v1/dyes');
    for (const id of DYE_IDS) expect(error?.message).toContain(id);
  });

  it('POST /api/v1/panels/evaluate with an unknown dye in the second probe names probes[1].dye', async () => {
    const panel = {
      excitation: [{ wavelengthNm: 488 }],
      probes: [
        { id: 'a', material: 'dye', dye: 'egfp' },
        { id: 'b', material: 'dye', dye: 'cherry' },
      ],
      channels: [{ id: 'c', filters: [] }],
    };
    const error = await errorOf(await postJson(worker, '/api/v1/panels/evaluate', panel));
    expect([error?.code, error?.path]).toEqual(['unknown_dye', ['probes', 1, 'dye']]);
  });
});
