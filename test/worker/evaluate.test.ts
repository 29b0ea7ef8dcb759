// POST /api/v1/panels/evaluate on the real runtime: the spectral library's numbers, nulls instead of non-finite
// values, and library errors mapped to the contract's 400 naming the field.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { evaluatePanel, type PanelSpec } from '../../spectra/index';
import { examplePanel } from './helpers/panels';
import { errorOf, freshPersistDir, postJson, startWorker, type RunningWorker } from './helpers/worker';

let worker: RunningWorker;

beforeAll(async () => {
  worker = await startWorker(freshPersistDir());
});
afterAll(async () => {
  await worker?.dispose();
});

/**
 * Equal to 1e-9 relative (plus a floor of 1e-12 of the largest value): workerd's V8 and Node's V8 run the same source
 * but may round Math.exp/log/pow differently in the last bit, which iterative steps carry into the ~1e-10 place.
 */
function expectSame(api: unknown, lib: unknown, what: string, floor = 0): void {
  if (typeof lib === 'number') {
    expect(typeof api, what).toBe('number');
    expect(Math.abs((api as number) - lib), what).toBeLessThanOrEqual(1e-9 * Math.abs(lib) + floor);
  } else if (Array.isArray(lib)) {
    expect(Array.isArray(api) && api.length, what).toBe(lib.length);
    lib.forEach((v, i) => expectSame((api as unknown[])[i], v, `${what}[${i}]`, floor));
  } else if (lib !== null && typeof lib === 'object') {
    expect(Object.keys(api as object).sort(), what).toEqual(Object.keys(lib).sort());
    for (const [k, v] of Object.entries(lib)) expectSame((api as Record<string, unknown>)[k], v, `${what}.${k}`, floor);
  } else {
    expect(api, what).toEqual(lib);
  }
}

const twinPanel = () => ({
  version: 1,
  excitation: [{ wavelengthNm: 405 }],
  probes: [
    { id: 'a', material: 'cdse', emissionPeakNm: 605 },
    { id: 'b', material: 'cdse', emissionPeakNm: 605 },
  ],
  channels: [
    { id: 'c1', filters: [{ type: 'bandpass', centerNm: 605, widthNm: 20 }] },
    { id: 'c2', filters: [{ type: 'bandpass', centerNm: 1500, widthNm: 20 }] },
  ],
});

describe('POST /api/v1/panels/evaluate', () => {
  it('POST /api/v1/panels/evaluate gives evaluatePanel()’s figures for the same panel', async () => {
    const res = await postJson(worker, '/api/v1/panels/evaluate', examplePanel());
    expect(res.status).toBe(200);
    const api = (await res.json()) as Record<string, unknown>;
    const lib = JSON.parse(JSON.stringify(evaluatePanel(examplePanel() as unknown as PanelSpec)));
    const peak = Math.max(...(lib.collected as number[][]).flat());
    for (const key of [
      'collected',
      'spillover',
      'primaryChannel',
      'conditionNumber',
      'noiseAmplification',
      'signalToBackground',
    ]) {
      expectSame(api[key], lib[key], key, key === 'collected' ? 1e-12 * peak : 1e-15);
    }
    expectSame(api.worst, lib.worst, 'worst');
    expectSame(api.probes, lib.probes, 'probes', 1e-15);
  });

  it('POST /api/v1/panels/evaluate answers the contract fields with spillover 1 in each primary channel', async () => {
    const body = (await (await postJson(worker, '/api/v1/panels/evaluate', examplePanel())).json()) as any;
    expect(body.collected).toHaveLength(2); // channels
    expect(body.collected[0]).toHaveLength(2); // probes
    body.primaryChannel.forEach((c: number, p: number) => expect(body.spillover[c][p]).toBeCloseTo(1, 12));
    expect(body.worst).toEqual({
      from: expect.any(String),
      into: expect.any(String),
      interference: expect.any(Number),
    });
    expect(Array.isArray(body.warnings)).toBe(true);
  });

  it('POST /panels/evaluate of two identical probes: a null condition number with a warning, never NaN', async () => {
    const res = await postJson(worker, '/api/v1/panels/evaluate', twinPanel());
    expect(res.status).toBe(200);
    const text = await res.text();
    expect(text).not.toMatch(/NaN|Infinity/);
    const body = JSON.parse(text);
    expect(body.conditionNumber).toBeNull();
    expect(body.noiseAmplification).toEqual([null, null]);
    expect(body.warnings.join(' ')).toMatch(/rank|dependent/i);
  });

  it.each([
    [
      'a peak CdSe cannot reach',
      (p: any) => (p.probes[0].emissionPeakNm = 900),
      'out_of_range',
      ['probes', 0, 'emissionPeakNm'],
    ],
    [
      'a bandpass narrower than its edges',
      (p: any) => (p.channels[0].filters[0].edgeWidthNm = 50),
      'invalid_input',
      ['channels', 0, 'filters', 0, 'edgeWidthNm'],
    ],
    [
      'an InP dot larger than its size law covers',
      (p: any) => (p.probes[1] = { id: 'p2', material: 'inp', diameterNm: 29 }),
      'out_of_range',
      ['probes', 1, 'diameterNm'],
    ],
  ])('POST /api/v1/panels/evaluate with %s is a 400 naming the probe or channel', async (_name, change, code, path) => {
    const panel = examplePanel();
    change(panel);
    const res = await postJson(worker, '/api/v1/panels/evaluate', panel);
    expect(res.status).toBe(400);
    const error = await errorOf(res);
    expect(error?.code).toBe(code);
    expect(error?.path).toEqual(path);
  });
});

describe('POST /api/v1/panels/evaluate with a measured reference', () => {
  const twoColour = () => ({
    version: 1,
    excitation: [{ wavelengthNm: 405 }],
    probes: [
      { id: 'a', material: 'cdse', emissionPeakNm: 540 },
      { id: 'b', material: 'cdse', emissionPeakNm: 600 },
    ],
    channels: [
      { id: 'green', filters: [{ type: 'bandpass', centerNm: 540, widthNm: 20 }] },
      { id: 'red', filters: [{ type: 'bandpass', centerNm: 600, widthNm: 20 }] },
    ],
  });

  it('POST /api/v1/panels/evaluate: measured column [400, 100] gives spillover 0.25, marked measured', async () => {
    const panel = {
      ...twoColour(),
      measuredReference: { channels: ['green', 'red'], columns: [{ probe: 'a', values: [400, 100] }] },
    };
    const res = await postJson(worker, '/api/v1/panels/evaluate', panel);
    expect(res.status).toBe(200);
    const body = (await res.json()) as { referenceColumns: string[]; spillover: (number | null)[][] };
    expect(body.referenceColumns).toEqual(['measured', 'model']);
    // 100 / 400, worked by hand: the control's red over its green.
    expect(body.spillover[1][0]).toBeCloseTo(0.25, 12);
  });

  it('POST /api/v1/panels/evaluate: a measured column with 1 value for 2 channels is a 400 at its values', async () => {
    const panel = {
      ...twoColour(),
      measuredReference: { channels: ['green', 'red'], columns: [{ probe: 'a', values: [400] }] },
    };
    const res = await postJson(worker, '/api/v1/panels/evaluate', panel);
    expect(res.status).toBe(400);
    const error = await errorOf(res);
    expect(error?.path).toEqual(['measuredReference', 'columns', 0, 'values']);
    expect(error?.message).toContain('has 1 values for 2 channels');
  });
});
