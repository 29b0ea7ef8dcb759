import { describe, expect, it } from 'vitest';
import {
  DEFAULT_GRID,
  evaluatePanel,
  panelSpectra,
  ramanPeakNm,
  ramanRelativeStrength,
  waterRamanBand,
  type PanelSpec,
} from '../../spectra/index';

const FINE = { startNm: 300, stepNm: 0.05, count: 14001 };
const nmAt = (grid: typeof FINE, i: number) => grid.startNm + i * grid.stepNm;

describe('ramanPeakNm', () => {
  it('ramanPeakNm(350) is near 397 nm, the worked example of Lakowicz 2006 (ch. 2), within 0.5 nm', () => {
    // Lakowicz, Principles of Fluorescence Spectroscopy, 3rd ed., 2006, ch. 2: 350 nm excitation, water Raman ≈ 397 nm.
    expect(Math.abs(ramanPeakNm(350) - 397)).toBeLessThan(0.5);
  });

  it('ramanPeakNm(488) is 585.08 nm by hand: 1e7/488 = 20491.80 cm⁻¹, − 3400 = 17091.80, 1e7/17091.80 = 585.08', () => {
    expect(ramanPeakNm(488)).toBeCloseTo(585.08, 1);
  });

  it('ramanPeakNm(405, 0) is the line itself (no shift: 1/λ_R = 1/λ_ex)', () => {
    expect(ramanPeakNm(405, 0)).toBeCloseTo(405, 10);
  });
});

describe('ramanRelativeStrength', () => {
  it('under 488 nm is (17091.80 / 21291.36)⁴ = 0.4153 of the 405 nm reference (ν⁴ law, Long 2002; by hand)', () => {
    // ν_s(405) = 1e7/405 − 3400 = 21291.36 cm⁻¹; ν_s(488) = 17091.80 cm⁻¹; ratio 0.80276, fourth power 0.41528.
    expect(ramanRelativeStrength(488)).toBeCloseTo(0.4153, 3);
    expect(ramanRelativeStrength(405)).toBeCloseTo(1, 12);
  });
});

describe('waterRamanBand', () => {
  const band = waterRamanBand(488, FINE);
  it('waterRamanBand(488) has unit area on the grid (a unit-area Gaussian in wavenumber, change of variable)', () => {
    const area = band.reduce((a, v) => a + v, 0) * FINE.stepNm;
    expect(area).toBeCloseTo(1, 3);
  });

  it('waterRamanBand(488) peaks within 0.3 nm of 585.08 nm and is 13.69 nm wide at half maximum (by hand)', () => {
    // Half maximum at ν0 ± 200 cm⁻¹: 1e7/(17091.80 − 200) − 1e7/(17091.80 + 200) = 592.0 − 578.3 = 13.69 nm.
    let top = 0;
    band.forEach((v, i) => (band[top] < v ? (top = i) : 0));
    expect(Math.abs(nmAt(FINE, top) - 585.08)).toBeLessThan(0.3);
    const above = band.map((v, i) => [nmAt(FINE, i), v] as const).filter(([, v]) => v >= band[top] / 2);
    const width = above.at(-1)![0] - above[0][0];
    expect(Math.abs(width - 13.69)).toBeLessThan(0.2);
  });
});

const panel = (extra: Partial<PanelSpec>, lines = [488]): PanelSpec => ({
  version: 1,
  excitation: lines.map((wavelengthNm) => ({ wavelengthNm })),
  probes: [{ id: 'q605', material: 'cdse', emissionPeakNm: 605 }],
  channels: [
    { id: 'c585', filters: [{ type: 'bandpass', centerNm: 585, widthNm: 40, edgeWidthNm: 0, peakTransmission: 1 }] },
    { id: 'c700', filters: [{ type: 'bandpass', centerNm: 700, widthNm: 20 }] },
  ],
  scatterLevel: 0,
  ...extra,
});

describe('evaluatePanel with waterRaman', () => {
  it('a 565–605 nm channel under 488 nm collects level × 1e5 × 0.4153 (convention × ν⁴ law) within 1 %', () => {
    const ev = evaluatePanel(panel({ waterRaman: { level: 0.2 } }), { sensitivity: false });
    // The band (578–592 nm at half maximum) lies inside the ideal 565–605 nm passband: all of it is collected.
    const expected = 0.2 * 1e5 * 0.41528;
    expect(Math.abs(ev.backgroundCollected![0] / expected - 1)).toBeLessThan(0.01);
    expect(ev.waterRamanCollected![0][0]).toBe(ev.backgroundCollected![0]);
    // The 700 nm channel sees only the band's far tail.
    expect(ev.waterRamanCollected![1][0]).toBeLessThan(1e-6 * expected);
  });

  it('without a background, water Raman alone gives signalToBackground = Σ collected / Raman (scatter 0)', () => {
    const ev = evaluatePanel(panel({ waterRaman: { level: 1 } }), { sensitivity: false });
    expect(ev.signalToBackground).toHaveLength(2);
    const total = ev.collected[0].reduce((a, v) => a + v, 0);
    expect(ev.signalToBackground![0]).toBeCloseTo(total / ev.waterRamanCollected![0][0], 9);
  });

  it('water Raman adds to the autofluorescence in backgroundCollected (the sum of the two evaluated apart)', () => {
    const both = evaluatePanel(panel({ waterRaman: { level: 1 }, background: { level: 0.1 } }), { sensitivity: false });
    const af = evaluatePanel(panel({ background: { level: 0.1 } }), { sensitivity: false });
    const raman = evaluatePanel(panel({ waterRaman: { level: 1 } }), { sensitivity: false });
    both.backgroundCollected!.forEach((b, c) =>
      expect(b).toBeCloseTo(af.backgroundCollected![c] + raman.backgroundCollected![c], 6),
    );
    expect(af).not.toHaveProperty('waterRamanCollected');
  });

  it('per line under 405 and 488 nm: the 405 nm band reaches a 565–605 nm channel only through its OD 6 floor', () => {
    // 405 nm puts the band at 1e7/(1e7/405 − 3400) = 469.7 nm, far outside the passband: all of its 1e5 (level 1,
    // ν⁴ factor 1 at the reference line) passes at the blocking floor 10⁻⁶ (the bandpass default OD 6).
    const ev = evaluatePanel(panel({ waterRaman: { level: 1 } }, [405, 488]), { sensitivity: false });
    const [from405, from488] = ev.waterRamanCollected![0];
    expect(Math.abs(from405 / (1e5 * 1e-6) - 1)).toBeLessThan(0.01);
    expect(from488).toBeGreaterThan(0.99 * 1e5 * 0.41528);
  });

  it('panelSpectra draws the Raman band in the background: its largest value lies at 585 nm ± 1 under 488 nm', () => {
    const s = panelSpectra(panel({ waterRaman: { level: 1 } }));
    let top = 0;
    s.background!.forEach((v, i) => (s.background![top] < v ? (top = i) : 0));
    expect(Math.abs(DEFAULT_GRID.startNm + top * DEFAULT_GRID.stepNm - 585)).toBeLessThanOrEqual(1);
    expect(s.waterRaman).toEqual(s.background);
  });
});
