// Autofluorescence presets through the API on the real Workers runtime: the listing route, a panel with a preset, and
// the two refusals (a preset with a measured spectrum, an unknown preset) in the contract's error shape.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { evaluatePanel, type PanelSpec } from '../../spectra/index';
import { BackgroundPresetList, ErrorBody, Evaluation } from '../../worker/schemas';
import { examplePanel } from './helpers/panels';
import { freshPersistDir, postJson, startWorker, type RunningWorker } from './helpers/worker';

let worker: RunningWorker;
beforeAll(async () => {
  worker = await startWorker(freshPersistDir());
});
afterAll(async () => {
  await worker?.dispose();
});

const withBackground = (background: unknown) => ({ ...examplePanel(), background });

describe('GET /api/v1/backgrounds', () => {
  it('GET /api/v1/backgrounds lists three presets, each band with a dated source and a P, T or M mark', async () => {
    const res = await worker.call('/api/v1/backgrounds');
    expect(res.status).toBe(200);
    const body = BackgroundPresetList.parse(await res.json());
    expect(body.presets.map((p) => p.id)).toEqual(['ffpe-tissue', 'frozen-tissue', 'cultured-cells']);
    for (const preset of body.presets) {
      expect(preset.bands.length, preset.id).toBeGreaterThan(0);
      for (const band of preset.bands) {
        expect(band.source.cite, band.fluorophore).toMatch(/\b(19|20)\d\d\b/); // names a year
        expect(['P', 'T', 'M']).toContain(band.source.status);
      }
    }
    expect(body.statusMarks.M).toMatch(/from memory, unverified/);
  });

  it('GET /api/v1/backgrounds cautions: samples vary by orders of magnitude, measured is better', async () => {
    const body = BackgroundPresetList.parse(await (await worker.call('/api/v1/backgrounds')).json());
    expect(body.caution).toMatch(/orders of magnitude/);
    expect(body.caution).toMatch(/measured background spectrum/);
    expect(body.level).toMatch(/405 nm/);
  });

  it('GET /api/v1/backgrounds gives the FFPE preset the fixation band and cultured cells none', async () => {
    const body = BackgroundPresetList.parse(await (await worker.call('/api/v1/backgrounds')).json());
    const names = (id: string) => body.presets.find((p) => p.id === id)!.bands.map((b) => b.fluorophore);
    expect(names('ffpe-tissue')).toContain('formaldehyde fixation products');
    expect(names('cultured-cells')).not.toContain('formaldehyde fixation products');
  });
});

describe.each(['/api/v1/panels/evaluate', '/api/v1/panels'])('POST %s with a bad background preset', (route) => {
  it(`POST ${route} with both a preset and points is a 400 invalid_input naming background.preset`, async () => {
    const points = [
      [500, 1],
      [600, 2],
    ];
    const res = await postJson(worker, route, withBackground({ level: 0.1, preset: 'ffpe-tissue', points }));
    expect(res.status).toBe(400);
    const { error } = ErrorBody.parse(await res.json());
    expect(error.code).toBe('invalid_input');
    expect(error.path).toEqual(['background', 'preset']);
    expect(error.message).toMatch(/^background\.preset .*points/);
  });

  it(`POST ${route} with an unknown preset is a 400 naming background.preset and the route listing ids`, async () => {
    const res = await postJson(worker, route, withBackground({ level: 0.1, preset: 'paraffin' }));
    expect(res.status).toBe(400);
    const { error } = ErrorBody.parse(await res.json());
    expect(error.code).toBe('invalid_input');
    expect(error.path).toEqual(['background', 'preset']);
    expect(error.message).toMatch(/^background\.preset must be one of ffpe-tissue, frozen-tissue, cultured-cells/);
    expect(error.message).toContain('GET /api/v1/backgrounds');
  });
});

describe('a panel with a background preset', () => {
  it('POST /api/v1/panels/evaluate with preset ffpe-tissue answers the library numbers, not the default', async () => {
    const panel = withBackground({ level: 0.1, preset: 'ffpe-tissue' });
    const res = await postJson(worker, '/api/v1/panels/evaluate', panel);
    expect(res.status).toBe(200);
    const body = Evaluation.parse(await res.json());
    const library = evaluatePanel(panel as unknown as PanelSpec, { sensitivity: false }).backgroundCollected!;
    const asDefault = evaluatePanel(withBackground({ level: 0.1 }) as unknown as PanelSpec, { sensitivity: false });
    body.backgroundCollected!.forEach((b, c) => {
      expect(b / library[c]).toBeCloseTo(1, 9);
      expect(Math.abs(b / asDefault.backgroundCollected![c] - 1)).toBeGreaterThan(0.05);
    });
  });

  it('POST /api/v1/panels stores a panel with a preset and GET /api/v1/panels/{id} returns the preset', async () => {
    const created = await postJson(worker, '/api/v1/panels', withBackground({ level: 0.3, preset: 'cultured-cells' }));
    expect([200, 201]).toContain(created.status);
    const { id } = (await created.json()) as { id: string };
    const stored = (await (await worker.call(`/api/v1/panels/${id}`)).json()) as { background: unknown };
    expect(stored.background).toEqual({ level: 0.3, preset: 'cultured-cells' });
  });
});
