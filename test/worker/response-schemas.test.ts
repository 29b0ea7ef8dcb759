// The response schemas (worker/schemas, the OpenAPI document's responses) against real answers of the worker on the
// real Workers runtime with real local KV: every route's body must parse with its schema, including the null cases
// (no pair for `worst`, no primary channel, no unmixing), so the description cannot drift from what is returned.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { z } from 'zod';
import {
  BackgroundPresetList,
  ControlsSpillover,
  DesignResponse,
  DetectorList,
  DyeList,
  ErrorBody,
  Evaluation,
  Health,
  MaterialList,
  Panel,
  ResolvedDotJson,
  ShareCreated,
} from '../../worker/schemas';
import { exampleControls, examplePanel } from './helpers/panels';
import { freshPersistDir, postJson, startWorker, type RunningWorker } from './helpers/worker';

let worker: RunningWorker;
beforeAll(async () => {
  worker = await startWorker(freshPersistDir());
});
afterAll(async () => {
  await worker?.dispose();
});

/** Parses a body with a schema; on failure the message lists zod's issues (path and text) so the drift is plain. */
function expectValid<S extends z.ZodType>(schema: S, body: unknown, what: string): z.infer<S> {
  const result = schema.safeParse(body);
  const issues = result.success ? [] : result.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`);
  expect(issues, what).toEqual([]);
  return result.data as z.infer<S>;
}

async function bodyOf(res: Response, status: number): Promise<unknown> {
  expect(res.status, await res.clone().text()).toBe(status);
  return res.json();
}

const evaluate = async (panel: unknown) => bodyOf(await postJson(worker, '/api/v1/panels/evaluate', panel), 200);
const line405 = [{ wavelengthNm: 405 }];
const bandpass = (id: string, centerNm: number) => ({ id, filters: [{ type: 'bandpass', centerNm, widthNm: 20 }] });

describe('GET routes', () => {
  it('GET /api/v1/health, /materials, /detectors and /dyes answer bodies their schemas accept', async () => {
    expectValid(Health, await bodyOf(await worker.call('/api/v1/health'), 200), 'health');
    const materials = expectValid(MaterialList, await bodyOf(await worker.call('/api/v1/materials'), 200), 'materials');
    // Carbon dots have no size law: the nullable range is exercised, not only allowed.
    expect(materials.materials.find((m) => m.id === 'carbon')?.diameterRangeNm).toBeNull();
    expectValid(DetectorList, await bodyOf(await worker.call('/api/v1/detectors'), 200), 'detectors');
    expectValid(DyeList, await bodyOf(await worker.call('/api/v1/dyes'), 200), 'dyes');
  });

  it('GET /api/v1/backgrounds answers a body BackgroundPresetList accepts', async () => {
    const list = expectValid(
      BackgroundPresetList,
      await bodyOf(await worker.call('/api/v1/backgrounds'), 200),
      'backgrounds',
    );
    expect(list.presets.length).toBeGreaterThan(0);
  });
});

describe('POST /api/v1/dots/resolve', () => {
  it.each([
    ['a CdSe dot by peak', { material: 'cdse', emissionPeakNm: 605 }],
    [
      'a CdSe dot by size at 405 nm on a 0.5 nm grid',
      { material: 'cdse', diameterNm: 4, excitationNm: 405, grid: { startNm: 400, endNm: 800, stepNm: 0.5 } },
    ],
    ['a carbon dot', { material: 'carbon', emissionPeakNm: 480, fwhmNm: 90, excitationNm: 405 }],
    ['a dye of the library', { material: 'dye', dye: 'mcherry', excitationNm: 561 }],
    [
      'a custom probe from measured emission',
      {
        material: 'custom',
        measuredEmission: {
          points: [
            [430, 0],
            [460, 1],
            [500, 0],
          ],
        },
      },
    ],
  ])('POST /dots/resolve with %s answers a body ResolvedDotJson accepts', async (_name, dot) => {
    expectValid(ResolvedDotJson, await bodyOf(await postJson(worker, '/api/v1/dots/resolve', dot), 200), 'resolve');
  });
});

describe('POST /api/v1/panels/evaluate', () => {
  it('POST /panels/evaluate of a panel with a background preset answers a body Evaluation accepts', async () => {
    const body = expectValid(
      Evaluation,
      await evaluate({ ...examplePanel(), background: { level: 0.1, preset: 'frozen-tissue' } }),
      'evaluate with a preset',
    );
    expect(body.backgroundCollected).toHaveLength(2);
  });

  it('POST /panels/evaluate of a two-probe panel with background answers a body Evaluation accepts', async () => {
    const body = expectValid(Evaluation, await evaluate(examplePanel()), 'evaluate');
    expect(body.signalToBackground).toHaveLength(2);
    expect(body.probes[0].extinctionAtLines).toHaveLength(1);
    expect(body.probes[0].extinctionAtExcitation).toBe(body.probes[0].extinctionAtLines[0]);
  });

  it('POST /panels/evaluate of a one-probe panel answers worst with from, into and interference all null', async () => {
    const body = expectValid(
      Evaluation,
      await evaluate({
        version: 1,
        excitation: line405,
        probes: [{ id: 'p1', material: 'cdse', emissionPeakNm: 605 }],
        channels: [bandpass('c1', 605)],
      }),
      'one probe',
    );
    expect(body.worst).toEqual({ from: null, into: null, interference: null });
  });

  it(
    'POST /panels/evaluate of a panel whose channel sees nothing answers null primary channels and condition ' +
      'number',
    async () => {
      const dark = {
        id: 'c1',
        filters: [
          {
            type: 'table',
            points: [
              [300, 0],
              [1000, 0],
            ],
          },
        ],
      };
      const probes = [
        { id: 'p1', material: 'cdse', emissionPeakNm: 605 },
        { id: 'p2', material: 'cdse', emissionPeakNm: 650 },
      ];
      const body = expectValid(
        Evaluation,
        await evaluate({ version: 1, excitation: line405, probes, channels: [dark] }),
        'dark',
      );
      expect(body.primaryChannel).toEqual([null, null]);
      expect(body.conditionNumber).toBeNull();
      expect(body.noiseAmplification).toEqual([null, null]);
    },
  );

  it('POST /panels/evaluate of a carbon dot under two lines answers one ε and one peak per line', async () => {
    const panel = {
      version: 1,
      excitation: [{ wavelengthNm: 405 }, { wavelengthNm: 488, powerRel: 0.5 }],
      probes: [
        { id: 'cd', material: 'carbon', emissionPeakNm: 520 },
        { id: 'q', material: 'cdse', emissionPeakNm: 620 },
      ],
      channels: [bandpass('c1', 530), { ...bandpass('c2', 620), excitationNm: 488 }],
    };
    const body = expectValid(Evaluation, await evaluate(panel), 'carbon');
    expect(body.probes[0].extinctionAtLines).toHaveLength(2);
    expect(typeof body.probes[0].extinctionAtExcitation).toBe('number');
    expect(body.probes[0].emissionPeakNmByLine).toHaveLength(2);
  });
});

describe('share links and errors', () => {
  it('POST /panels then GET /panels/<id> answer bodies ShareCreated and Panel accept', async () => {
    const first = expectValid(
      ShareCreated,
      await bodyOf(await postJson(worker, '/api/v1/panels', examplePanel()), 201),
      'created',
    );
    expectValid(ShareCreated, await bodyOf(await postJson(worker, '/api/v1/panels', examplePanel()), 201), 'again');
    expectValid(Panel, await bodyOf(await worker.call(`/api/v1/panels/${first.id}`), 200), 'stored');
  });

  it.each([
    ['a 400 (bad field)', () => postJson(worker, '/api/v1/panels/evaluate', { ...examplePanel(), version: 2 }), 400],
    ['a 400 (malformed JSON)', () => postJson(worker, '/api/v1/dots/resolve', '{"material":', true), 400],
    ['a 404 (unknown id)', () => worker.call('/api/v1/panels/AAAAAAAAAAAAAAAAAAAAAAAA'), 404],
    ['a 405', () => worker.call('/api/v1/panels/evaluate'), 405],
    ['a 413', () => postJson(worker, '/api/v1/panels', { title: 'x'.repeat(300_000) }), 413],
    [
      'a 415',
      () => worker.call('/api/v1/panels', { method: 'POST', headers: { 'content-type': 'text/plain' }, body: '{}' }),
      415,
    ],
  ])('an API error, %s, answers a body ErrorBody accepts', async (_name, send, status) => {
    expectValid(ErrorBody, await bodyOf(await send(), status), 'error');
  });
});

describe('POST /api/v1/panels/design', () => {
  it('POST /panels/design (catalog mode) answers a body DesignResponse accepts, holding a valid Panel', async () => {
    const peaks = [520, 565, 605, 655];
    const request = {
      targets: [
        { name: 'A', abundance: 'high' },
        { name: 'B', abundance: 'low' },
        { name: 'C', abundance: 0.3 },
      ],
      excitation: line405,
      candidates: {
        probes: peaks.map((nm, i) => ({ id: `d${i}`, material: 'cdse', emissionPeakNm: nm })),
        channels: peaks.map((nm, i) => bandpass(`b${i}`, nm)),
      },
    };
    const body = expectValid(
      DesignResponse,
      await bodyOf(await postJson(worker, '/api/v1/panels/design', request), 200),
      'catalog',
    );
    expect(body.mode).toBe('catalog');
  });

  it('POST /panels/design in free mode answers a body DesignResponse accepts', async () => {
    const request = {
      targets: [
        { name: 'A', abundance: 1 },
        { name: 'B', abundance: 'low' },
      ],
      excitation: line405,
      options: { nodeBudget: 500 },
    };
    const body = expectValid(
      DesignResponse,
      await bodyOf(await postJson(worker, '/api/v1/panels/design', request), 200),
      'free',
    );
    expect(body.mode).toBe('free');
  });

  it('POST /panels/design for 16 targets answers 200 with the no_usable_panel verdict in a valid body', async () => {
    const request = {
      targets: Array.from({ length: 16 }, (_, i) => ({ name: `target ${i + 1}`, abundance: 'high' })),
      excitation: line405,
    };
    const body = expectValid(
      DesignResponse,
      await bodyOf(await postJson(worker, '/api/v1/panels/design', request), 200),
      'sixteen',
    );
    expect(body.verdict).toBe('no_usable_panel');
    // With no design found the panel is null and the reason says so; with one, the reason names the binding figure.
    if (body.panel === null) expect(body.verdictReason).toContain('16 targets');
    else expect(body.verdictReason).toMatch(/signal-to-noise|% of/);
    expect(body.largestUsableTargets).toBeGreaterThanOrEqual(1);
  });
});

describe('POST /api/v1/controls/spillover', () => {
  it('POST /controls/spillover without a panel answers a valid ControlsSpillover, comparison and se null', async () => {
    const res = await postJson(worker, '/api/v1/controls/spillover', exampleControls());
    const body = expectValid(ControlsSpillover, await bodyOf(res, 200), 'no panel');
    expect(body.comparison).toBeNull();
    expect(body.se[1][0]).toBeNull();
  });

  it('POST /controls/spillover with the panel answers a valid ControlsSpillover with a comparison', async () => {
    const request = { ...exampleControls(), panel: examplePanel() };
    const res = await postJson(worker, '/api/v1/controls/spillover', request);
    const body = expectValid(ControlsSpillover, await bodyOf(res, 200), 'with panel');
    expect(body.comparison?.entries).toHaveLength(2);
  });

  it('POST /controls/spillover with two probes on one primary answers fcsSpillover null in a valid body', async () => {
    const request = {
      channels: ['a', 'b'],
      unstained: [0, 0],
      controls: [
        { probe: 'x', values: [9, 1] },
        { probe: 'y', values: [9, 2] },
      ],
    };
    const res = await postJson(worker, '/api/v1/controls/spillover', request);
    const body = expectValid(ControlsSpillover, await bodyOf(res, 200), 'shared primary');
    expect(body.fcsSpillover).toBeNull();
  });
});
