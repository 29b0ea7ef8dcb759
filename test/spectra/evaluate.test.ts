import { describe, expect, it } from 'vitest';
import { errorOf } from './helpers/errors';
import { gaussianProbe } from './helpers/probes';
import erf from '@stdlib/math-base-special-erf';
import {
  DEFAULT_GRID,
  channelTransmission,
  conditionNumber,
  evaluatePanel,
  makeGrid,
  noiseAmplification,
  panelSpectra,
} from '../../spectra/index';
import type { ChannelSpec, PanelSpec } from '../../spectra/index';

const bandpass = (id: string, centerNm: number, widthNm = 24, extra: Partial<ChannelSpec> = {}): ChannelSpec => ({
  id,
  filters: [{ type: 'bandpass', centerNm, widthNm }],
  ...extra,
});

/** Walks a result and fails on any number that JSON could not carry (NaN, ±Infinity). */
function expectJsonSafe(value: unknown, path = 'evaluation'): void {
  if (typeof value === 'number') expect(Number.isFinite(value), `${path} is ${value}`).toBe(true);
  else if (Array.isArray(value)) value.forEach((v, i) => expectJsonSafe(v, `${path}[${i}]`));
  else if (value && typeof value === 'object')
    for (const [k, v] of Object.entries(value)) expectJsonSafe(v, `${path}.${k}`);
}

const fourProbePanel = (): PanelSpec => ({
  version: 1,
  excitation: [
    { wavelengthNm: 405, powerRel: 1 },
    { wavelengthNm: 488, powerRel: 0.5 },
  ],
  probes: [
    { id: 'q525', material: 'cdse', emissionPeakNm: 525, quantumYield: 0.6 },
    { id: 'q565', material: 'cdse', emissionPeakNm: 565, quantumYield: 0.5, abundance: 2 },
    { id: 'q605', material: 'cdse', emissionPeakNm: 605, quantumYield: 0.7, channel: 'c605' },
    { id: 'q655', material: 'cdse', emissionPeakNm: 655, quantumYield: 0.4 },
  ],
  channels: [
    bandpass('c525', 525, 20),
    bandpass('c565', 565, 20, { excitationNm: 405 }),
    bandpass('c605', 605, 20, { detector: 'pmt-gaasp', excitationNm: [405, 488] }),
    {
      id: 'c655',
      filters: [
        { type: 'longpass', edgeNm: 640 },
        { type: 'shortpass', edgeNm: 680 },
      ],
      detector: 'scmos',
    },
  ],
});

describe('evaluatePanel: the signal model', () => {
  // Closed form: ∫ N(μ, σ²) over [a, b] = ½[erf((b−μ)/σ√2) − erf((a−μ)/σ√2)], erf from @stdlib/math-base-special-erf.
  it('evaluatePanel(one Gaussian probe, ideal 605/20) collects powerRel × ε × QY × abundance × erf closed form', () => {
    const grid = makeGrid(480, 730, 0.0625);
    const panel: PanelSpec = {
      version: 1,
      excitation: [{ wavelengthNm: 405, powerRel: 2 }],
      probes: [gaussianProbe('a', 600, 12, { abundance: 3 })],
      channels: [
        {
          id: 'c',
          filters: [
            { type: 'bandpass', centerNm: 605, widthNm: 20, edgeWidthNm: 0, peakTransmission: 1, blockingOD: 12 },
          ],
        },
      ],
    };
    const closedForm = 0.5 * (erf((615 - 600) / (12 * Math.SQRT2)) - erf((595 - 600) / (12 * Math.SQRT2)));
    const ev = evaluatePanel(panel, { grid });
    // The measured table is sampled at 1 nm and interpolated linearly: ~1e-4 relative error from that alone.
    expect(ev.collected[0][0] / (2 * 1e5 * 0.5 * 3 * closedForm)).toBeCloseTo(1, 3);
    // Brightness = power × extinction at the lines × quantum yield × abundance (the spectral-core definition).
    expect(ev.probes[0].brightness).toBeCloseTo(2 * 1e5 * 0.5 * 3, 6);
    expect(ev.probes[0].brightnessPerAbundance).toBeCloseTo(2 * 1e5 * 0.5, 6);
  });

  it(
    'evaluatePanel collected[c][p] equals an independent naive sum over lines and ' +
      'grid points, with each emission cut at the line and renormalised',
    () => {
      const panel = fourProbePanel();
      const ev = evaluatePanel(panel, { sensitivity: false });
      const spectra = panelSpectra(panel);
      const lineOn = (c: number, l: number) => {
        const on = panel.channels[c].excitationNm;
        return on === undefined || [on].flat().includes(panel.excitation[l].wavelengthNm);
      };
      const nm = (i: number) => DEFAULT_GRID.startNm + i * DEFAULT_GRID.stepNm;
      panel.channels.forEach((channel, c) => {
        const t = channelTransmission(channel, DEFAULT_GRID);
        panel.probes.forEach((probe, p) => {
          const em = spectra.emission[p].values;
          let expected = 0;
          panel.excitation.forEach((line, l) => {
            if (!lineOn(c, l)) return;
            // No emission at or below the exciting line; what is left has unit area again.
            let kept = 0;
            let collected = 0;
            for (let i = 0; i < t.length; i++) {
              if (nm(i) <= line.wavelengthNm) continue;
              kept += em[i] * DEFAULT_GRID.stepNm;
              collected += em[i] * t[i] * DEFAULT_GRID.stepNm;
            }
            const weight =
              (line.powerRel ?? 1) *
              ev.probes[p].extinctionAtLines[l] *
              ev.probes[p].quantumYield *
              (probe.abundance ?? 1);
            if (kept > 0) expected += (weight * collected) / kept;
          });
          expect(Math.abs(ev.collected[c][p] - expected) / expected).toBeLessThan(1e-12);
        });
      });
    },
  );

  it('evaluatePanel with channel-specific lines adds up the single-line panels (sequential excitation)', () => {
    const panel = fourProbePanel();
    const both = evaluatePanel(panel, { sensitivity: false }).collected;
    const only = (l: number) =>
      evaluatePanel(
        {
          ...panel,
          excitation: [panel.excitation[l]],
          channels: panel.channels.map(({ excitationNm: _x, ...c }) => c),
        },
        { sensitivity: false },
      ).collected;
    const at405 = only(0);
    const at488 = only(1);
    for (let p = 0; p < 4; p++) {
      expect(both[0][p]).toBeCloseTo(at405[0][p] + at488[0][p], 6); // all lines on
      expect(both[1][p]).toBeCloseTo(at405[1][p], 6); // 405 only
      expect(both[2][p]).toBeCloseTo(at405[2][p] + at488[2][p], 6);
      expect(at488[1][p]).toBeGreaterThan(0);
    }
  });

  it('evaluatePanel reads a 32-bin spectral detector (10 nm bins) whose bins add up to one wide band', () => {
    const ideal = { edgeWidthNm: 0, peakTransmission: 1, blockingOD: 12 };
    const probes = [gaussianProbe('a', 560, 15), gaussianProbe('b', 600, 15), gaussianProbe('c', 650, 20)];
    const bins: ChannelSpec[] = Array.from({ length: 32 }, (_, i) => ({
      id: `b${i}`,
      filters: [{ type: 'bandpass', centerNm: 455 + 10 * i, widthNm: 10, ...ideal }],
    }));
    const ev = evaluatePanel({ version: 1, excitation: [{ wavelengthNm: 405 }], probes, channels: bins });
    const wide = evaluatePanel({
      version: 1,
      excitation: [{ wavelengthNm: 405 }],
      probes,
      channels: [{ id: 'w', filters: [{ type: 'bandpass', centerNm: 610, widthNm: 320, ...ideal }] }],
    });
    expect(ev.collected).toHaveLength(32);
    for (let p = 0; p < 3; p++) {
      const sum = ev.collected.reduce((s, row) => s + row[p], 0);
      expect(sum / wide.collected[0][p]).toBeCloseTo(1, 9);
    }
    expect(ev.conditionNumber).toBeGreaterThan(1);
    expectJsonSafe(ev);
  });
});

describe('evaluatePanel: crosstalk figures', () => {
  it('evaluatePanel spillover, primary channel, purity and worst follow their definitions on collected', () => {
    const ev = evaluatePanel(fourProbePanel());
    const { collected, primaryChannel } = ev;
    expect(primaryChannel).toEqual([0, 1, 2, 3]);
    collected.forEach((row, c) =>
      row.forEach((v, p) => expect(ev.spillover[c][p]).toBeCloseTo(v / collected[primaryChannel[p]!][p], 12)),
    );
    let worst = { value: -1, from: '', into: '' };
    for (let u = 0; u < 4; u++) {
      for (let t = 0; t < 4; t++) {
        const value = collected[primaryChannel[u]!][t] / collected[primaryChannel[u]!][u];
        if (t !== u && value > worst.value) worst = { value, from: ev.probes[t].id, into: ev.probes[u].id };
      }
    }
    expect(ev.worst).toEqual({ from: worst.from, into: worst.into, interference: expect.closeTo(worst.value, 12) });
    ev.purity.forEach((purity, c) => {
      const row = collected[c];
      expect(purity).toBeCloseTo(row[c] / row.reduce((a, b) => a + b, 0), 12);
    });
    ev.belowResolution.forEach((row, c) => row.forEach((flag, p) => expect(flag).toBe(ev.spillover[c][p]! < 1e-3)));
    expect(ev.belowResolution.flat()).toContain(true);
    expect(ev.conditionNumber).toBeCloseTo(conditionNumber(collected)!, 12);
    expect(ev.noiseAmplification).toEqual(noiseAmplification(collected));
    expectJsonSafe(ev);
  });

  it('evaluatePanel counts both of two lines 0.3 nm apart when a channel names both (each is its own line)', () => {
    const probe = gaussianProbe('g', 560, 12);
    const panelWith = (excitationNm: number[]): PanelSpec => ({
      excitation: [{ wavelengthNm: 494.5 }, { wavelengthNm: 494.2, powerRel: 2 }],
      probes: [probe],
      channels: [{ id: 'c', filters: [{ type: 'bandpass', centerNm: 560, widthNm: 30 }], excitationNm }],
    });
    const first = evaluatePanel(panelWith([494.5]), { sensitivity: false }).collected[0][0];
    const second = evaluatePanel(panelWith([494.2]), { sensitivity: false }).collected[0][0];
    const both = evaluatePanel(panelWith([494.5, 494.2]), { sensitivity: false }).collected[0][0];
    expect(second / first).toBeCloseTo(2, 12);
    expect(both / first).toBeCloseTo(3, 12);
  });

  it("evaluatePanel uses a probe's assigned channel as its primary even where another collects more", () => {
    const panel = fourProbePanel();
    panel.probes[0] = { ...panel.probes[0], channel: 'c565' };
    const ev = evaluatePanel(panel, { sensitivity: false });
    expect(ev.primaryChannel[0]).toBe(1);
    expect(ev.spillover[1][0]).toBe(1);
    expect(ev.spillover[0][0]!).toBeGreaterThan(1);
  });

  it('evaluatePanel gives null, not NaN, for figures of two identical probes and of a probe no line excites', () => {
    const panel: PanelSpec = {
      version: 1,
      excitation: [{ wavelengthNm: 405 }],
      probes: [
        gaussianProbe('a', 600, 12),
        gaussianProbe('b', 600, 12),
        gaussianProbe('dark', 650, 12, {
          extinction: {
            points: [
              [500, 0],
              [900, 0],
            ],
          },
        }),
      ],
      channels: [bandpass('c1', 600), bandpass('c2', 650), bandpass('c3', 700)],
    };
    const ev = evaluatePanel(panel);
    expect(ev.conditionNumber).toBeNull();
    expect(ev.noiseAmplification).toEqual([null, null, null]);
    expect(ev.primaryChannel[2]).toBeNull();
    expect(ev.spillover.map((row) => row[2])).toEqual([null, null, null]);
    expect(ev.warnings.join('\n')).toMatch(/probe dark gives no signal in any channel/);
    expect(ev.warnings.join('\n')).toMatch(/cannot be unmixed/);
    expectJsonSafe(ev);
  });
});

// Input the API's schema refuses never reaches the library (test/worker/schemas.test.ts). Here: model refusals.
describe('evaluatePanel: what the models refuse', () => {
  it('evaluatePanel moves a probe\'s model error under its index: ["probes", 3, "emissionPeakNm"]', () => {
    const panel = fourProbePanel();
    panel.probes[3] = { ...panel.probes[3], emissionPeakNm: 900 };
    const err = errorOf(() => evaluatePanel(panel));
    expect([err.code, err.path]).toEqual(['out_of_range', ['probes', 3, 'emissionPeakNm']]);
  });

  it('evaluatePanel refuses a bandpass narrower than its own edges, naming its edgeWidthNm', () => {
    const panel = fourProbePanel();
    panel.channels[2].filters[0] = { type: 'bandpass', centerNm: 605, widthNm: 3, edgeWidthNm: 5 };
    const err = errorOf(() => evaluatePanel(panel));
    expect([err.code, err.path]).toEqual(['invalid_input', ['channels', 2, 'filters', 0, 'edgeWidthNm']]);
  });
});

describe('evaluatePanel on figures that overflow double precision', () => {
  it('evaluatePanel with a measured extinction of 1e308 answers nulls and a warning, never NaN or Infinity', () => {
    const panel = fourProbePanel();
    panel.probes[0] = {
      ...panel.probes[0],
      abundance: 1e6,
      extinction: {
        points: [
          [300, 1e308],
          [1000, 1e308],
        ],
      },
    };
    const ev = evaluatePanel(panel);
    const text = JSON.stringify(ev, (_k, v) => (typeof v === 'number' && !Number.isFinite(v) ? `NONFINITE(${v})` : v));
    expect(text).not.toContain('NONFINITE');
    expect(ev.collected.some((row) => row[0] === null)).toBe(true);
    expect(ev.warnings.join(' ')).toMatch(/finite/i);
  });
});

describe('evaluatePanel: carbon dots and charts', () => {
  it("evaluatePanel resolves a carbon dot once per line and adds the lines' contributions", () => {
    const panel: PanelSpec = {
      version: 1,
      excitation: [{ wavelengthNm: 405 }, { wavelengthNm: 488 }],
      probes: [{ id: 'cd', material: 'carbon', emissionPeakNm: 470, fwhmNm: 90, quantumYield: 0.1 }],
      channels: [bandpass('blue', 470, 40), bandpass('green', 540, 40)],
    };
    const ev = evaluatePanel(panel, { sensitivity: false });
    const [a, b] = ev.probes[0].emissionPeakNmByLine!;
    expect(b).toBeGreaterThan(a); // the modelled peak follows the line to the red
    const single = (l: number) =>
      evaluatePanel({ ...panel, excitation: [panel.excitation[l]] }, { sensitivity: false }).collected;
    const [s405, s488] = [single(0), single(1)];
    for (let c = 0; c < 2; c++) expect(ev.collected[c][0]).toBeCloseTo(s405[c][0] + s488[c][0], 6);
    expectJsonSafe(ev);
  });

  it('panelSpectra returns unit-area emissions and the channel transmissions on the grid as plain arrays', () => {
    const panel = fourProbePanel();
    const spectra = panelSpectra(panel);
    expect(spectra.count).toBe(DEFAULT_GRID.count);
    for (const { values } of spectra.emission) {
      expect(Array.isArray(values)).toBe(true);
      expect(values.reduce((a, b) => a + b, 0) * spectra.stepNm).toBeCloseTo(1, 6);
    }
    spectra.channels.forEach(({ values }, c) =>
      expect(values).toEqual(Array.from(channelTransmission(panel.channels[c], DEFAULT_GRID))),
    );
    expect(spectra.background).toBeNull();
  });
});
