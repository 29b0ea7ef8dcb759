// POST /api/v1/panels/design on the real Workers runtime (workerd via wrangler) with real local KV.
// The scenario is fictional: an imagined four-target tissue panel, no real lab or product.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { evaluatePanel } from '../../spectra/index';
import { errorOf, freshPersistDir, postJson, startWorker, type RunningWorker } from './helpers/worker';

let worker: RunningWorker;
beforeAll(async () => {
  worker = await startWorker(freshPersistDir());
});
afterAll(async () => {
  await worker?.dispose();
});

const peaks = [500, 525, 550, 575, 600, 625, 650, 680];
const catalogRequest = () => ({
  targets: [
    { name: 'marker A', abundance: 'high' },
    { name: 'marker B', abundance: 'low' },
    { name: 'marker C', abundance: 0.3 },
    { name: 'marker D', abundance: 'medium' },
  ],
  excitation: [{ wavelengthNm: 405 }],
  candidates: {
    probes: peaks.map((nm, i) => ({ id: `dot${i + 1}`, material: nm < 660 ? 'cdse' : 'cdte', emissionPeakNm: nm })),
    channels: peaks.map((nm, i) => ({ id: `bp${i + 1}`, filters: [{ type: 'bandpass', centerNm: nm, widthNm: 20 }] })),
  },
});
const design = (body: unknown) => postJson(worker, '/api/v1/panels/design', body);

describe('POST /api/v1/panels/design', () => {
  it('POST /panels/design (catalog) returns an exact design whose evaluation reproduces the objective', async () => {
    const res = await design(catalogRequest());
    expect(res.status).toBe(200);
    const body = (await res.json()) as any;
    expect(body.exact).toBe(true);
    expect(body.panel.probes).toHaveLength(4);
    expect(body.stats.nodesVisited).toBeGreaterThan(0);
    expect(body.stats.nodesVisited).toBeLessThan(body.stats.fullEnumeration);
    // The evaluation the worker returns reproduces the search's objective to rounding.
    expect(Math.abs(body.evaluation.worst.interference / body.objective.worstInterference - 1)).toBeLessThan(1e-12);
    // So does the library run here in Node on the proposed panel; another engine's Math functions and the sizing
    // law's iterative inversion allow a relative 1e-6.
    const again = evaluatePanel(body.panel);
    expect(Math.abs(again.worst.interference! / body.objective.worstInterference - 1)).toBeLessThan(1e-6);
    expect([body.objective.from, body.objective.into]).toEqual([again.worst.from, again.worst.into]);
    for (const probe of body.panel.probes)
      expect(body.panel.channels.map((c: { id: string }) => c.id)).toContain(probe.channel);
    expect(body.noise.sd).toHaveLength(4);
    expect(body.noise.sd.every((x: number | null) => typeof x === 'number' && x > 0)).toBe(true);
  });

  it('POST /panels/design with nodeBudget 1: exact false and a bound no higher than the exact objective', async () => {
    const exact = (await (await design(catalogRequest())).json()) as any;
    const cut = (await (await design({ ...catalogRequest(), options: { nodeBudget: 1 } })).json()) as any;
    expect(cut.exact).toBe(false);
    expect(cut.stats.bound).toBeLessThanOrEqual(exact.objective.worstInterference + 1e-15);
    expect(cut.objective.worstInterference).toBeGreaterThanOrEqual(exact.objective.worstInterference - 1e-15);
    expect(cut.warnings.join(' ')).toMatch(/node budget/);
  });

  it('POST /panels/design (free, cadmium-free) proposes no cadmium material and non-overlapping bands', async () => {
    const res = await design({
      targets: [
        { name: 'A', abundance: 1 },
        { name: 'B', abundance: 'low' },
        { name: 'C', abundance: 'medium' },
      ],
      excitation: [{ wavelengthNm: 405 }],
      exclude: ['cadmium'],
      windowNm: [450, 750],
      options: { nodeBudget: 2000 },
    });
    expect(res.status).toBe(200);
    const body = (await res.json()) as any;
    expect(body.panel.probes.some((p: { material: string }) => ['cdse', 'cdte', 'cds'].includes(p.material))).toBe(
      false,
    );
    const bands = body.panel.channels.map((c: { filters: { centerNm: number; widthNm: number }[] }) => c.filters[0]);
    for (let i = 0; i < bands.length; i++) {
      for (let j = i + 1; j < bands.length; j++)
        expect(Math.abs(bands[i].centerNm - bands[j].centerNm)).toBeGreaterThanOrEqual(
          (bands[i].widthNm + bands[j].widthNm) / 2,
        );
    }
  });

  const bad: [string, (r: ReturnType<typeof catalogRequest>) => unknown, (string | number)[]][] = [
    ['no targets', (r) => ({ ...r, targets: [] }), ['targets']],
    [
      '17 targets',
      (r) => ({ ...r, targets: Array.from({ length: 17 }, (_, i) => ({ name: `t${i}`, abundance: 1 })) }),
      ['targets'],
    ],
    ['a zero abundance', (r) => ({ ...r, targets: [{ name: 'x', abundance: 0 }] }), ['targets', 0, 'abundance']],
    ['a negative abundance', (r) => ({ ...r, targets: [{ name: 'x', abundance: -2 }] }), ['targets', 0, 'abundance']],
    [
      'an abundance word that is not one',
      (r) => ({ ...r, targets: [{ name: 'x', abundance: 'lots' }] }),
      ['targets', 0, 'abundance'],
    ],
    ['an empty window', (r) => ({ targets: r.targets, excitation: r.excitation, windowNm: [600, 600] }), ['windowNm']],
    [
      'an inverted window',
      (r) => ({ targets: r.targets, excitation: r.excitation, windowNm: [700, 500] }),
      ['windowNm'],
    ],
    [
      'every material excluded',
      (r) => ({
        targets: r.targets,
        excitation: r.excitation,
        allowedMaterials: ['cdse', 'cdte'],
        exclude: ['cadmium'],
      }),
      ['allowedMaterials'],
    ],
    ['an unknown exclusion', (r) => ({ ...r, exclude: ['mercury'] }), ['exclude', 0]],
    [
      'fewer candidate probes than targets',
      (r) => ({ ...r, candidates: { ...r.candidates, probes: r.candidates.probes.slice(0, 2) } }),
      ['candidates', 'probes'],
    ],
    [
      'a duplicate target name',
      (r) => ({
        ...r,
        targets: [
          { name: 'x', abundance: 1 },
          { name: 'x', abundance: 1 },
        ],
      }),
      ['targets', 1, 'name'],
    ],
    ['an unknown option', (r) => ({ ...r, options: { speed: 'max' } }), ['options', 'speed']],
    ['a node budget of 0', (r) => ({ ...r, options: { nodeBudget: 0 } }), ['options', 'nodeBudget']],
    [
      'a candidate dot out of its material reach',
      (r) => ({
        ...r,
        candidates: {
          ...r.candidates,
          probes: [{ id: 'x', material: 'cdse', emissionPeakNm: 900 }, ...r.candidates.probes],
        },
      }),
      ['candidates', 'probes', 0, 'emissionPeakNm'],
    ],
  ];

  it.each(bad)('POST /panels/design with %s answers 400 naming the field', async (_name, change, path) => {
    const res = await design(change(catalogRequest()));
    expect(res.status).toBe(400);
    const error = await errorOf(res);
    expect(error?.path).toEqual(path);
    expect(error?.message.length).toBeGreaterThan(10);
  });

  it('GET /panels/design answers 405, and the share-id route does not take "design" for an id', async () => {
    const res = await worker.call('/api/v1/panels/design');
    expect(res.status).toBe(405);
    expect((await errorOf(res))?.code).toBe('method_not_allowed');
  });
});
