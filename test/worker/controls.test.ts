// POST /api/v1/controls/spillover on the real Workers runtime: measured spillover, its errors, the comparison with the
// panel's model, the FCS 3.1 $SPILLOVER value and the refusals, each naming the probe and channel.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { evaluatePanel, type PanelSpec } from '../../spectra/index';
import { errorOf, freshPersistDir, postJson, startWorker, type RunningWorker } from './helpers/worker';

let worker: RunningWorker;
beforeAll(async () => {
  worker = await startWorker(freshPersistDir());
});
afterAll(async () => {
  await worker?.dispose();
});

const ROUTE = '/api/v1/controls/spillover';

const panel = (): PanelSpec => ({
  version: 1,
  excitation: [{ wavelengthNm: 405, powerRel: 1 }],
  probes: [
    { id: 'g', label: 'Green dot', material: 'cdse', emissionPeakNm: 560, quantumYield: 0.5, channel: 'c560' },
    { id: 'r', label: 'Red dot', material: 'cdse', emissionPeakNm: 620, quantumYield: 0.5, channel: 'c620' },
  ],
  channels: [
    { id: 'c560', label: 'Green', filters: [{ type: 'bandpass', centerNm: 560, widthNm: 40 }] },
    { id: 'c620', label: 'Red', filters: [{ type: 'bandpass', centerNm: 620, widthNm: 40 }] },
  ],
});

/** Controls made from the model itself: 1000 × the collected column plus an unstained level of 50. */
function modelControls(p: PanelSpec) {
  const collected = evaluatePanel(p, { sensitivity: false }).collected;
  const scale = (probe: number) => 1000 / collected[probe][probe];
  return {
    channels: ['c560', 'c620'],
    unstained: [50, 50],
    controls: p.probes.map((q, probe) => ({
      probe: q.id,
      values: collected.map((row) => 50 + row[probe] * scale(probe)),
    })),
  };
}

interface Report {
  spillover: number[][];
  se: (number | null)[][];
  primaryChannel: number[];
  comparison: { entries: { flagged: boolean; sentence: string | null }[][]; sentences: string[] } | null;
  fcsSpillover: string | null;
  warnings: string[];
}

describe('POST /api/v1/controls/spillover', () => {
  it('POST /controls/spillover with hand-worked controls answers spill 0.2, SE 0.029462 (Taylor 1997)', async () => {
    // The hand-worked example of test/spectra/controls.test.ts: N = [100, 20, 10], σN² = 8, σD² = 17.
    const body = {
      channels: ['a', 'b', 'c'],
      unstained: [10, 20, 5],
      unstainedSd: [5, 10, 5],
      unstainedN: 25,
      controls: [{ probe: 'x', values: [110, 40, 15], sd: [20, 10, 5], n: 25 }],
    };
    const res = await postJson(worker, ROUTE, body);
    expect(res.status).toBe(200);
    const report = (await res.json()) as Report;
    expect(report.spillover.map((r) => r[0])).toEqual([1, 0.2, 0.1]);
    expect(report.se[1][0]).toBeCloseTo(0.029462, 6);
    expect(report.comparison).toBeNull();
    expect(report.fcsSpillover).toBe('1,a,1');
  });

  it('POST /controls/spillover with controls made from the model matches evaluatePanel and flags nothing', async () => {
    const p = panel();
    const res = await postJson(worker, ROUTE, { ...modelControls(p), panel: p });
    expect(res.status).toBe(200);
    const report = (await res.json()) as Report;
    const ev = evaluatePanel(p, { sensitivity: false });
    expect(report.spillover[1][0]).toBeCloseTo(ev.spillover[1][0]!, 9);
    expect(report.spillover[0][1]).toBeCloseTo(ev.spillover[0][1]!, 9);
    expect(report.comparison?.sentences).toEqual([]);
    // FCS 3.1 $SPILLOVER: n, the primaries' names, then row by row (Spidlen et al. 2010).
    const parts = report.fcsSpillover!.split(',');
    expect(parts.slice(0, 3)).toEqual(['2', 'c560', 'c620']);
    expect(Number(parts[4])).toBeCloseTo(ev.spillover[1][0]!, 9);
  });

  it('POST /controls/spillover with Green dot three times brighter in Red flags it in a sentence', async () => {
    const p = panel();
    const body = modelControls(p);
    const green = body.controls[0].values;
    green[1] = 50 + (green[1] - 50) * 3;
    const report = (await (await postJson(worker, ROUTE, { ...body, panel: p })).json()) as Report;
    expect(report.comparison?.entries[1][0].flagged).toBe(true);
    expect(report.comparison?.sentences[0]).toMatch(/^Green dot spills [\d.]+ % into Red; predicted [\d.]+ % \(band /);
  });

  it('POST /controls/spillover with two probes sharing a primary answers fcsSpillover null and says why', async () => {
    const body = {
      channels: ['a', 'b'],
      unstained: [0, 0],
      controls: [
        { probe: 'x', values: [10, 1] },
        { probe: 'y', values: [10, 2] },
      ],
    };
    const report = (await (await postJson(worker, ROUTE, body)).json()) as Report;
    expect(report.fcsSpillover).toBeNull();
    expect(report.warnings).toContain(
      'no FCS $SPILLOVER value: probes x and y share the primary channel a: the matrix cannot be square',
    );
  });

  it.each([
    [
      'a probe not in the panel',
      (b: any) => (b.controls[0].probe = 'blue'),
      ['controls', 0, 'probe'],
      /probe blue is not a probe of the panel/,
    ],
    [
      'a missing value (null)',
      (b: any) => (b.controls[1].values[0] = null),
      ['controls', 1, 'values', 0],
      /finite number/,
    ],
    [
      'one value too many',
      (b: any) => b.controls[0].values.push(1),
      ['controls', 0, 'values'],
      /has 3 values for 2 channels/,
    ],
    [
      'a value far under the unstained',
      (b: any) => (b.controls[0].values[1] = 0),
      ['controls', 0, 'values', 1],
      /Green dot \(g\) in channel Red \(c620\) is below the unstained/,
    ],
    [
      'a dark primary channel',
      (b: any) => (b.controls[1].values = [900, 50]),
      ['controls', 1, 'values', 1],
      /Red dot \(r\) is no brighter than the unstained/,
    ],
    [
      'nine replicates of one probe',
      (b: any) => b.controls.push(...Array(8).fill(b.controls[0])),
      ['controls', 9],
      /more than 8 replicate rows/,
    ],
    ['a channel listed twice', (b: any) => (b.channels[1] = 'c560'), ['channels', 1], /listed twice/],
  ])('POST /controls/spillover with %s answers 400 naming the field', async (_, edit, path, message) => {
    const p = panel();
    const body: any = { ...modelControls(p), panel: p };
    edit(body);
    const res = await postJson(worker, ROUTE, body);
    expect(res.status).toBe(400);
    const error = await errorOf(res);
    expect(error?.path).toEqual(path);
    expect(error?.message).toMatch(message);
  });

  it('POST /controls/spillover with 65 channels answers 400 naming channels', async () => {
    const channels = Array.from({ length: 65 }, (_, i) => `c${i}`);
    const values = channels.map(() => 1);
    const res = await postJson(worker, ROUTE, { channels, unstained: values, controls: [{ probe: 'x', values }] });
    expect(res.status).toBe(400);
    expect((await errorOf(res))?.path[0]).toBe('channels');
  });
});
