// Core/shell probes, the second CdSe curve and the cut at the line through the HTTP API on the real runtime.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { SHELL_MATERIALS, TYPICAL_SHELLS } from '../../spectra/index';
import { errorOf, freshPersistDir, postJson, startWorker, type RunningWorker } from './helpers/worker';
import { examplePanel } from './helpers/panels';

let worker: RunningWorker;

beforeAll(async () => {
  worker = await startWorker(freshPersistDir());
});
afterAll(async () => {
  await worker?.dispose();
});

const resolve = (body: unknown) => postJson(worker, '/api/v1/dots/resolve', body);

describe('core/shell probes over HTTP', () => {
  it('GET /api/v1/materials gives each sized material its typical shell and lists the shell materials', async () => {
    const body = (await (await worker.call('/api/v1/materials')).json()) as {
      materials: { id: string; typicalShell: unknown }[];
      shellMaterials: { id: string; toxicity: { cautions: string[] } }[];
    };
    expect(body.materials.find((m) => m.id === 'inp')!.typicalShell).toEqual(TYPICAL_SHELLS.inp);
    expect(body.materials.find((m) => m.id === 'carbon')!.typicalShell).toBeNull();
    expect(body.shellMaterials.map((s) => s.id)).toEqual(Object.keys(SHELL_MATERIALS));
    for (const s of body.shellMaterials) expect(s.toxicity.cautions.length, s.id).toBeGreaterThan(0);
  });

  it(
    'POST /dots/resolve with a shell reports coreDiameterNm, ' +
      'overallDiameterNm = core + 2 × shell, and the peak asked',
    async () => {
      const res = await resolve({
        material: 'cdse',
        emissionPeakNm: 605,
        shell: [{ material: 'zns', thicknessNm: 0.9 }],
      });
      expect(res.status).toBe(200);
      const dot = (await res.json()) as Record<string, number>;
      expect(dot.emissionPeakNm).toBeCloseTo(605, 6);
      expect(dot.overallDiameterNm).toBeCloseTo(dot.coreDiameterNm + 1.8, 9);
      expect(dot.diameterNm).toBe(dot.coreDiameterNm);
    },
  );

  it('POST /dots/resolve with excitationNm inside the emission reports the cut share and warns', async () => {
    const dot = (await (await resolve({ material: 'cdse', emissionPeakNm: 480, excitationNm: 488 })).json()) as {
      emissionCutFraction: number;
      warnings: string[];
    };
    expect(dot.emissionCutFraction).toBeGreaterThan(0.4);
    expect(dot.warnings.join(' ')).toMatch(/488 nm line/);
  });

  it('POST /panels/evaluate gives each probe emissionCutAtLines, one share per panel line', async () => {
    const panel = { ...examplePanel(), excitation: [{ wavelengthNm: 405 }, { wavelengthNm: 488 }] };
    const res = await postJson(worker, '/api/v1/panels/evaluate', panel);
    expect(res.status).toBe(200);
    const ev = (await res.json()) as { probes: { emissionCutAtLines: number[] }[] };
    for (const p of ev.probes) expect(p.emissionCutAtLines).toHaveLength(2);
  });

  it.each([
    ['an unknown shell material', { shell: [{ material: 'gold', thicknessNm: 1 }] }, ['shell', 0, 'material']],
    ['a negative thickness', { shell: [{ material: 'zns', thicknessNm: -1 }] }, ['shell', 0, 'thicknessNm']],
    ['a zero thickness', { shell: [{ material: 'zns', thicknessNm: 0 }] }, ['shell', 0, 'thicknessNm']],
    ['an absurd thickness (50 nm)', { shell: [{ material: 'zns', thicknessNm: 50 }] }, ['shell', 0, 'thicknessNm']],
    [
      'a ZnS layer over its 3 nm cap (5 nm)',
      { shell: [{ material: 'zns', thicknessNm: 5 }] },
      ['shell', 0, 'thicknessNm'],
    ],
    [
      'layers adding up to over 20 nm (four 6 nm silica layers)',
      { shell: Array.from({ length: 4 }, () => ({ material: 'silica', thicknessNm: 6 })) },
      ['shell'],
    ],
    ['a thickness that is a string', { shell: [{ material: 'zns', thicknessNm: '1' }] }, ['shell', 0, 'thicknessNm']],
    ['a layer with an extra field', { shell: [{ material: 'zns', thicknessNm: 1, ml: 3 }] }, ['shell', 0, 'ml']],
    ['five layers', { shell: Array.from({ length: 5 }, () => ({ material: 'zns', thicknessNm: 0.3 })) }, ['shell']],
    ['a shell that is not an array', { shell: { material: 'zns', thicknessNm: 1 } }, ['shell']],
    ['sizingModel on InP', { material: 'inp', sizingModel: 'jasieniak2009' }, ['sizingModel']],
    ['an unknown sizingModel', { sizingModel: 'peng2099' }, ['sizingModel']],
  ])('POST /dots/resolve with %s is a 400 in the contract shape naming the field', async (_what, extra, path) => {
    const res = await resolve({ material: 'cdse', emissionPeakNm: 620, ...extra });
    expect(res.status).toBe(400);
    const err = await errorOf(res);
    expect(err).not.toBeNull();
    expect(err!.path).toEqual(path);
    expect(['invalid_input', 'out_of_range', 'unknown_material']).toContain(err!.code);
  });

  it.each([
    ['carbon', { material: 'carbon', emissionPeakNm: 500 }],
    [
      'custom',
      {
        material: 'custom',
        measuredEmission: {
          points: [
            [500, 0],
            [520, 1],
            [540, 0],
          ],
        },
      },
    ],
  ])('a shell on a %s probe is a 400 naming shell', async (_m, dot) => {
    const res = await resolve({ ...dot, shell: [{ material: 'zns', thicknessNm: 1 }] });
    expect(res.status).toBe(400);
    expect((await errorOf(res))!.path).toEqual(['shell']);
  });

  it('a panel probe with a bad shell layer is a 400 naming probes.i.shell.j.thicknessNm', async () => {
    const panel = examplePanel() as { probes: Record<string, unknown>[] };
    panel.probes[1].shell = [
      { material: 'zns', thicknessNm: 1 },
      { material: 'cds', thicknessNm: -2 },
    ];
    const res = await postJson(worker, '/api/v1/panels/evaluate', panel);
    expect(res.status).toBe(400);
    expect((await errorOf(res))!.path).toEqual(['probes', 1, 'shell', 1, 'thicknessNm']);
  });
});
