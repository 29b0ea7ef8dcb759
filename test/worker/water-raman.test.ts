// Water Raman and the sample's light in the design noise through the HTTP API on the real runtime.
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

const panel = (extra: Record<string, unknown> = {}) => ({
  excitation: [{ wavelengthNm: 488 }],
  probes: [{ id: 'p', material: 'cdse', emissionPeakNm: 605 }],
  channels: [{ id: 'c585', filters: [{ type: 'bandpass', centerNm: 585, widthNm: 40 }] }],
  ...extra,
});

const design = (extra: Record<string, unknown> = {}) => ({
  targets: [{ name: 'membrane marker', abundance: 'high' }],
  excitation: [{ wavelengthNm: 405 }],
  candidates: {
    probes: [{ id: 'q', material: 'cdse', emissionPeakNm: 605 }],
    channels: [{ id: 'c', filters: [{ type: 'bandpass', centerNm: 605, widthNm: 20 }] }],
  },
  ...extra,
});

describe('water Raman over HTTP', () => {
  it('POST /panels/evaluate with waterRaman alone reports waterRamanCollected as the library does', async () => {
    const body = panel({ waterRaman: { level: 0.5 } });
    const res = await postJson(worker, '/api/v1/panels/evaluate', body);
    expect(res.status).toBe(200);
    const ev = (await res.json()) as { waterRamanCollected: number[][]; signalToBackground: number[] };
    const lib = evaluatePanel(body as unknown as PanelSpec, { sensitivity: false });
    expect(Math.abs(ev.waterRamanCollected[0][0] / lib.waterRamanCollected![0][0] - 1)).toBeLessThan(1e-9);
    expect(ev.signalToBackground).toHaveLength(1);
  });

  it.each([
    [-1, 'out_of_range'],
    [1e7, 'out_of_range'],
    ['strong', 'invalid_input'],
    [null, 'invalid_input'],
  ])('POST /panels/evaluate with waterRaman.level %s is a 400 %s naming waterRaman.level', async (level, code) => {
    const res = await postJson(worker, '/api/v1/panels/evaluate', panel({ waterRaman: { level } }));
    expect(res.status).toBe(400);
    expect(await errorOf(res)).toMatchObject({ code, path: ['waterRaman', 'level'] });
  });

  it('POST /panels/evaluate with waterRaman.level 1e999 (Infinity once parsed) is a 400 naming the field', async () => {
    const text = JSON.stringify(panel({ waterRaman: { level: 7 } })).replace('"level":7', '"level":1e999');
    const res = await postJson(worker, '/api/v1/panels/evaluate', text, true);
    expect(res.status).toBe(400);
    expect(await errorOf(res)).toMatchObject({ code: 'invalid_input', path: ['waterRaman', 'level'] });
  });

  it('POST /panels/evaluate with waterRaman {} or an unknown key in it is a 400 under waterRaman', async () => {
    const missing = await postJson(worker, '/api/v1/panels/evaluate', panel({ waterRaman: {} }));
    expect(missing.status).toBe(400);
    expect((await errorOf(missing))!.path).toEqual(['waterRaman', 'level']);
    const extra = await postJson(worker, '/api/v1/panels/evaluate', panel({ waterRaman: { level: 1, shiftCm1: 3 } }));
    expect(extra.status).toBe(400);
    expect((await errorOf(extra))!.path).toEqual(['waterRaman', 'shiftCm1']);
  });

  it('POST /panels/design carries scatterLevel and waterRaman into its proposal; bad values are 400s', async () => {
    const ok = await postJson(worker, '/api/v1/panels/design', design({ scatterLevel: 1e8, waterRaman: { level: 2 } }));
    expect(ok.status).toBe(200);
    const body = (await ok.json()) as { panel: PanelSpec };
    expect(body.panel.scatterLevel).toBe(1e8);
    expect(body.panel.waterRaman).toEqual({ level: 2 });
    const badLevel = await postJson(worker, '/api/v1/panels/design', design({ waterRaman: { level: -2 } }));
    expect(badLevel.status).toBe(400);
    expect((await errorOf(badLevel))!.path).toEqual(['waterRaman', 'level']);
    const badScatter = await postJson(worker, '/api/v1/panels/design', design({ scatterLevel: 'lots' }));
    expect(badScatter.status).toBe(400);
    expect((await errorOf(badScatter))!.path).toEqual(['scatterLevel']);
  });
});
