import { describe, expect, it } from 'vitest';
import erfc from '@stdlib/math-base-special-erfc';
import { Matrix } from 'ml-matrix';
import { fcnnlsVector } from 'ml-fcnnls';
import {
  AUTOFLUORESCENCE_BANDS,
  BACKGROUND_REFERENCE_BRIGHTNESS,
  DEFAULT_GRID,
  defaultAutofluorescence,
  evaluatePanel,
} from '../../spectra/index';
import type { PanelSpec } from '../../spectra/index';

const area = (values: number[]) => values.reduce((a, b) => a + b, 0) * DEFAULT_GRID.stepNm;

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
  // The spectrum under one line is a sum of the table's emission bands, each a unit-area Gaussian in wavelength cut at
  // the line. Checked without the library's excitation weights: the bands are fitted back out of its output with
  // ml-fcnnls (Lawson–Hanson NNLS), the fit must be exact, and the output's area must equal the fitted amounts times
  // each cut band's area from the erfc closed form (@stdlib/math-base-special-erfc).
  it.each([340, 405, 488, 561])(
    'defaultAutofluorescence(%s nm) is exactly a sum of the cut bands, with the erfc closed-form area',
    (excitationNm) => {
      const y = defaultAutofluorescence(excitationNm, DEFAULT_GRID);
      const nm = Array.from({ length: DEFAULT_GRID.count }, (_, i) => DEFAULT_GRID.startNm + i * DEFAULT_GRID.stepNm);
      const sigmas = AUTOFLUORESCENCE_BANDS.map((b) => b.emissionFwhmNm / (2 * Math.sqrt(2 * Math.LN2)));
      const columns = AUTOFLUORESCENCE_BANDS.map((b, k) =>
        nm.map((x) =>
          x <= excitationNm
            ? 0
            : Math.exp(-0.5 * ((x - b.emissionNm) / sigmas[k]) ** 2) / (sigmas[k] * Math.sqrt(2 * Math.PI)),
        ),
      );
      const design = new Matrix(nm.map((_, i) => columns.map((col) => col[i])));
      const amounts = fcnnlsVector(design, y).K.to1DArray();
      const fitted = nm.map((_, i) => columns.reduce((s, col, k) => s + col[i] * amounts[k], 0));
      const residual = Math.hypot(...fitted.map((f, i) => f - y[i]));
      expect(residual / Math.hypot(...y)).toBeLessThan(1e-10);
      // Each cut band's area on the grid: ½ erfc((λex + ½ step − μ)/(σ√2)), the grid sum starting half a step above.
      const expected = AUTOFLUORESCENCE_BANDS.reduce(
        (s, b, k) => s + amounts[k] * 0.5 * erfc((excitationNm + 0.5 - b.emissionNm) / (sigmas[k] * Math.SQRT2)),
        0,
      );
      expect(area(y) / expected).toBeCloseTo(1, 4);
    },
  );

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
  it('evaluatePanel reports signal-to-background = probe signal / (background collected + excitation leak)', () => {
    const ev = evaluatePanel(onePanel({ level: 0.2 }), { sensitivity: false });
    expect(ev.backgroundCollected).toHaveLength(2);
    ev.signalToBackground!.forEach((sb, c) => {
      const leak = ev.lineLeak[c].reduce((a, v) => a + v, 0);
      expect(sb).toBeCloseTo(ev.collected[c][0] / (ev.backgroundCollected![c] + leak), 12);
    });
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

  it('evaluatePanel gives a null signal-to-background, warned, when no background and no leak reach a channel', () => {
    const ev = evaluatePanel({ ...onePanel({ level: 0 }), scatterLevel: 0 }, { sensitivity: false });
    expect(ev.signalToBackground).toEqual([null, null]);
    expect(ev.warnings.join('\n')).toMatch(/collects no background/);
  });
});
