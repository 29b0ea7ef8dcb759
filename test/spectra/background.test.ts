import { describe, expect, it } from 'vitest';
import erfc from '@stdlib/math-base-special-erfc';
import {
  AUTOFLUORESCENCE_BANDS,
  BACKGROUND_REFERENCE_BRIGHTNESS,
  DEFAULT_GRID,
  SpectraError,
  defaultAutofluorescence,
  evaluatePanel,
} from '../../spectra/index';
import type { PanelSpec } from '../../spectra/index';

const area = (values: Float64Array) => values.reduce((a, b) => a + b, 0) * DEFAULT_GRID.stepNm;

const onePanel = (background: PanelSpec['background'], lines = [405]): PanelSpec => ({
  version: 1,
  excitation: lines.map((wavelengthNm) => ({ wavelengthNm })),
  probes: [{ id: 'q605', material: 'cdse', emissionPeakNm: 605, quantumYield: 0.5 }],
  channels: [
    {
      id: 'c605',
      filters: [{ type: 'bandpass', centerNm: 600, widthNm: 20, edgeWidthNm: 0, peakTransmission: 1, blockingOD: 12 }],
    },
    { id: 'c450', filters: [{ type: 'bandpass', centerNm: 450, widthNm: 40 }] },
  ],
  ...(background ? { background } : {}),
});

describe('defaultAutofluorescence', () => {
  // Closed form: each band is a unit-area Gaussian cut at the exciting wavelength, so its area on the grid is
  // amount × ½ erfc((λex − μ)/(σ√2)); erfc from @stdlib/math-base-special-erfc.
  it('defaultAutofluorescence(λ) has the area the erfc closed form gives for its bands cut at the line', () => {
    for (const excitationNm of [340, 405, 488, 561]) {
      let expected = 0;
      for (const band of AUTOFLUORESCENCE_BANDS) {
        const weight = band.excitation.reduce(
          (s, [nm, fwhm, w]) => s + w * Math.exp(-0.5 * ((excitationNm - nm) / (fwhm / 2.3548200450309493)) ** 2),
          0,
        );
        const sigma = band.emissionFwhmNm / 2.3548200450309493;
        expected +=
          band.brightness * weight * 0.5 * erfc((excitationNm + 0.5 - band.emissionNm) / (sigma * Math.SQRT2));
      }
      // The grid sum starts half a step above the line (first point after it): compare at the rectangle rule's accuracy.
      expect(area(defaultAutofluorescence(excitationNm, DEFAULT_GRID)) / expected).toBeCloseTo(1, 4);
    }
  });

  // Common practice: tissue autofluorescence falls steeply as the excitation moves to the red.
  it('defaultAutofluorescence is brightest under violet light, weaker under blue and weakest under red lines', () => {
    const [violet, blue, red] = [405, 488, 640].map((nm) => area(defaultAutofluorescence(nm, DEFAULT_GRID)));
    expect(violet).toBeGreaterThan(blue);
    expect(blue).toBeGreaterThan(5 * red);
    const uv = defaultAutofluorescence(340, DEFAULT_GRID);
    const peakNm = DEFAULT_GRID.startNm + uv.indexOf(Math.max(...uv));
    expect(peakNm).toBeGreaterThan(400); // collagen/NAD(P)H region
    expect(peakNm).toBeLessThan(480);
    expect(uv.slice(0, 41).every((v) => v === 0)).toBe(true); // nothing at or below the line
  });
});

describe('evaluatePanel with a background', () => {
  it('evaluatePanel reports signal-to-background = total probe signal / background collected, per channel', () => {
    const ev = evaluatePanel(onePanel({ level: 0.2 }), { sensitivity: false });
    expect(ev.backgroundCollected).toHaveLength(2);
    ev.signalToBackground!.forEach((sb, c) =>
      expect(sb).toBeCloseTo(ev.collected[c][0] / ev.backgroundCollected![c], 12),
    );
    const double = evaluatePanel(onePanel({ level: 0.4 }), { sensitivity: false });
    expect(double.backgroundCollected![0] / ev.backgroundCollected![0]).toBeCloseTo(2, 12);
    expect(evaluatePanel(onePanel(undefined), { sensitivity: false }).signalToBackground).toBeUndefined();
  });

  it('evaluatePanel with a measured flat background collects level × 1e5 × (passband / spectrum width)', () => {
    const ev = evaluatePanel(
      onePanel({
        level: 1,
        points: [
          [500, 3],
          [700, 3],
        ],
      }),
      { sensitivity: false },
    );
    // Flat over 500–700 nm on a 1 nm grid: 201 points of 1/201 each; the ideal 590–610 band passes 19 full points
    // and two half points.
    expect(ev.backgroundCollected![0]).toBeCloseTo((BACKGROUND_REFERENCE_BRIGHTNESS * 20) / 201, 6);
  });

  it('evaluatePanel gives a null signal-to-background with a warning when no background reaches a channel', () => {
    const ev = evaluatePanel(onePanel({ level: 0 }), { sensitivity: false });
    expect(ev.signalToBackground).toEqual([null, null]);
    expect(ev.warnings.join('\n')).toMatch(/collects no background/);
  });

  it('evaluatePanel rejects a negative background level naming ["background", "level"]', () => {
    try {
      evaluatePanel(onePanel({ level: -1 }));
      expect.unreachable();
    } catch (err) {
      expect(err).toBeInstanceOf(SpectraError);
      expect((err as SpectraError).path).toEqual(['background', 'level']);
    }
  });
});
