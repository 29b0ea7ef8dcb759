// Line blocking (how well each channel blocks the lines it is read under) through the HTTP API on the real runtime.
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

describe('line blocking over HTTP', () => {
  const panel = (extra: Record<string, unknown> = {}) => ({
    excitation: [{ wavelengthNm: 405 }],
    probes: [{ id: 'p', material: 'cdse', emissionPeakNm: 605 }],
    channels: [
      { id: 'near', label: '420/20', filters: [{ type: 'bandpass', centerNm: 420, widthNm: 20 }] },
      { id: 'far', label: '605/20', filters: [{ type: 'bandpass', centerNm: 605, widthNm: 20 }] },
    ],
    ...extra,
  });

  it('POST /panels/evaluate warns that 420/20 blocks the 405 nm line by only OD 4.8, not about 605/20', async () => {
    const ev = (await (await postJson(worker, '/api/v1/panels/evaluate', panel())).json()) as { warnings: string[] };
    const blocking = ev.warnings.filter((w) => w.includes('blocks the'));
    expect(blocking).toEqual([
      'channel 420/20 (near) blocks the 405 nm line it is read under by only OD 4.8 (less than OD 6): scattered ' +
        'excitation light will reach its detector',
    ]);
  });

  it.each([-1, 13, 'six'])('minBlockingOD %s is a 400 naming minBlockingOD', async (od) => {
    const res = await postJson(worker, '/api/v1/panels/evaluate', panel({ minBlockingOD: od }));
    expect(res.status).toBe(400);
    expect((await errorOf(res))!.path).toEqual(['minBlockingOD']);
  });

  it('POST /panels/evaluate reports lineLeak per channel and line: the 605/20 channel leaks 1e-6 × 1e10', async () => {
    const ev = (await (await postJson(worker, '/api/v1/panels/evaluate', panel())).json()) as { lineLeak: number[][] };
    expect(ev.lineLeak).toHaveLength(2);
    expect(Math.abs(ev.lineLeak[1][0] / 1e4 - 1)).toBeLessThan(1e-9);
  });

  it.each([-1, 1e16, 'a lot'])('scatterLevel %s is a 400 naming scatterLevel', async (level) => {
    const res = await postJson(worker, '/api/v1/panels/evaluate', panel({ scatterLevel: level }));
    expect(res.status).toBe(400);
    expect((await errorOf(res))!.path).toEqual(['scatterLevel']);
  });

  it('a panel with a shared light path evaluates as the library does; a bad shared filter is a 400', async () => {
    const withPath = panel({
      lightPath: { emissionFilters: [{ type: 'dichroic', edgeNm: 500, passes: 'above' }] },
    });
    const ok = await postJson(worker, '/api/v1/panels/evaluate', withPath);
    expect(ok.status).toBe(200);
    const ev = (await ok.json()) as { collected: number[][] };
    const lib = evaluatePanel(withPath as unknown as PanelSpec, { sensitivity: false });
    expect(Math.abs(ev.collected[1][0] / lib.collected[1][0] - 1)).toBeLessThan(1e-9);
    const bad = panel({ lightPath: { emissionFilters: [{ type: 'notch', edgeNm: 500 }] } });
    const res = await postJson(worker, '/api/v1/panels/evaluate', bad);
    expect(res.status).toBe(400);
    expect((await errorOf(res))!.path.slice(0, 3)).toEqual(['lightPath', 'emissionFilters', 0]);
  });
});
