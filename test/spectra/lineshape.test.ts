import { createRequire } from 'node:module';
import { describe, expect, it } from 'vitest';
import erf from '@stdlib/math-base-special-erf';
import {
  GAUSSIAN_FWHM_PER_SIGMA,
  HC_EV_NM,
  centerEvForPeakNm,
  fwhmEvForFwhmNm,
  fwhmNmOfLine,
  gaussianDensityPerEv,
  gaussianDensityPerNm,
  makeGrid,
  peakNmOfLine,
  sampleGaussianLine,
} from '../../spectra/index';

// Independent quadrature: integrate-adaptive-simpson (CommonJS, untyped). It can return a false zero over wide ranges,
// so every integral is split at the peak and at ±2 and ±6 widths.
const integrate = createRequire(import.meta.url)('integrate-adaptive-simpson') as (
  f: (x: number) => number,
  a: number,
  b: number,
  tol?: number,
  maxDepth?: number,
) => number;
function integrateSplit(f: (x: number) => number, cuts: number[]): number {
  let total = 0;
  for (let i = 1; i < cuts.length; i++) total += integrate(f, cuts[i - 1], cuts[i], 1e-12, 30);
  return total;
}

const lines = [
  [2.05, 0.08],
  [2.6, 0.12],
  [1.7, 0.3],
  [2.9, 0.5],
] as const; // [centre eV, FWHM eV]: narrow dots to broad carbon dots

describe('gaussianDensityPerNm (Gaussian in energy with the hc/λ² Jacobian)', () => {
  it.each(lines)(
    'gaussianDensityPerNm(λ, %s eV, %s eV) integrates to 1 over wavelength (adaptive Simpson, split at the peak)',
    (c, w) => {
      const f = (nm: number) => gaussianDensityPerNm(nm, c, w);
      // Energies below 5 % of the centre carry no weight here (> 13σ away); clamp there so the red tail is kept.
      const cuts = [...new Set([8, 6, 2, 0, -2, -6, -8].map((k) => HC_EV_NM / Math.max(c + k * w, 0.05 * c)))];
      expect(integrateSplit(f, cuts)).toBeCloseTo(1, 8);
    },
  );

  it.each(lines)(
    'gaussianDensityPerNm(%s eV, %s eV) over a wavelength band equals the erf closed form over the matching energy ' +
      'band (@stdlib erf)',
    (c, w) => {
      const sigma = w / GAUSSIAN_FWHM_PER_SIGMA;
      const [aNm, bNm] = [HC_EV_NM / (c + 0.7 * w), HC_EV_NM / (c - 0.2 * w)];
      const exact =
        0.5 * (erf((HC_EV_NM / aNm - c) / (sigma * Math.SQRT2)) - erf((HC_EV_NM / bNm - c) / (sigma * Math.SQRT2)));
      const peak = peakNmOfLine(c, w);
      expect(
        integrateSplit((nm) => gaussianDensityPerNm(nm, c, w), [aNm, Math.min(Math.max(peak, aNm), bNm), bNm]),
      ).toBeCloseTo(exact, 9);
    },
  );

  it('gaussianDensityPerEv(centre ± FWHM/2) is half the peak (half maximum at half the FWHM, in energy)', () => {
    for (const [c, w] of lines) {
      const peak = gaussianDensityPerEv(c, c, w);
      expect(gaussianDensityPerEv(c + w / 2, c, w) / peak).toBeCloseTo(0.5, 12);
      expect(gaussianDensityPerEv(c - w / 2, c, w) / peak).toBeCloseTo(0.5, 12);
    }
  });

  it('gaussianDensityPerNm(λ) divided by hc/λ² is the energy density (the Jacobian)', () => {
    for (const nm of [480, 605, 700]) {
      expect(gaussianDensityPerNm(nm, 2.05, 0.1) / (HC_EV_NM / nm ** 2)).toBeCloseTo(
        gaussianDensityPerEv(HC_EV_NM / nm, 2.05, 0.1),
        12,
      );
    }
  });

  it('peakNmOfLine(centerEvForPeakNm(p, w), w) returns p, and the per-nm density is lower 0.01 nm either side', () => {
    for (const [p, w] of [
      [605, 0.08],
      [450, 0.5],
      [700, 0.3],
    ]) {
      const c = centerEvForPeakNm(p, w);
      expect(peakNmOfLine(c, w)).toBeCloseTo(p, 9);
      expect(gaussianDensityPerNm(p - 0.01, c, w)).toBeLessThan(gaussianDensityPerNm(p, c, w));
      expect(gaussianDensityPerNm(p + 0.01, c, w)).toBeLessThan(gaussianDensityPerNm(p, c, w));
    }
  });

  it('fwhmNmOfLine is the distance between the two per-nm half-maximum wavelengths', () => {
    const [c, w] = [2.05, 0.1];
    const peak = peakNmOfLine(c, w);
    const fwhm = fwhmNmOfLine(c, w);
    // Scan for the crossings on a fine grid, independently of the library's bisection.
    const half = gaussianDensityPerNm(peak, c, w) / 2;
    let left = peak;
    while (gaussianDensityPerNm(left, c, w) > half) left -= 0.001;
    let right = peak;
    while (gaussianDensityPerNm(right, c, w) > half) right += 0.001;
    expect(fwhm).toBeCloseTo(right - left, 2);
  });

  it('fwhmEvForFwhmNm(p, f) gives the energy width whose per-nm FWHM is f', () => {
    for (const [p, f] of [
      [605, 30],
      [450, 90],
      [520, 18],
    ]) {
      const w = fwhmEvForFwhmNm(p, f);
      expect(fwhmNmOfLine(centerEvForPeakNm(p, w), w)).toBeCloseTo(f, 6);
    }
  });
});

describe('sampleGaussianLine', () => {
  it(
    'sampleGaussianLine(default grid) has sum × step = 1 and its raw Riemann area is 1 within 1e-6 before ' +
      'renormalising',
    () => {
      const grid = makeGrid(300, 1000, 1);
      const { spectrum, areaOnGrid } = sampleGaussianLine(grid, 2.05, 0.09);
      expect(spectrum.values.reduce((a, b) => a + b, 0) * spectrum.stepNm).toBeCloseTo(1, 12);
      expect(areaOnGrid).toBeCloseTo(1, 6);
    },
  );

  it('sampleGaussianLine on a grid that cuts the line reports the fraction kept', () => {
    const c = centerEvForPeakNm(605, 0.09);
    const { areaOnGrid } = sampleGaussianLine(makeGrid(300, 605, 0.5), c, 0.09);
    expect(areaOnGrid).toBeGreaterThan(0.4);
    expect(areaOnGrid).toBeLessThan(0.6);
  });
});
