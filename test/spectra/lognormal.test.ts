// The log-normal band of Siano & Metzler, J. Chem. Phys. 1969, 51, 1856 (the form as recalled, M: from memory,
// unverified against the paper), checked against the formula written out here independently of spectra/, and its
// sampling checked against an independent adaptive Simpson quadrature.
import { createRequire } from 'node:module';
import { describe, expect, it } from 'vitest';
import {
  logNormalBandForNm,
  logNormalEmissionBand,
  logNormalShape,
  makeGrid,
  sampleLogNormalLine,
  type LogNormalBand,
} from '../../spectra/index';

const integrate = createRequire(import.meta.url)('integrate-adaptive-simpson') as (
  f: (x: number) => number,
  a: number,
  b: number,
  tol?: number,
  maxDepth?: number,
) => number;

/**
 * Siano & Metzler 1969 (M): ε(ν̃)/ε₀ = exp(−(ln 2/ln²ρ) · ln²[1 + (ν̃ − ν̃₀)(ρ² − 1)/(Hρ)]) where the bracket is
 * positive, else 0; ν̃₀ the peak, H the FWHM, ρ the skewness (blue half-width over red half-width, in wavenumber).
 */
function published(nu: number, nu0: number, h: number, rho: number): number {
  const x = 1 + ((nu - nu0) * (rho * rho - 1)) / (h * rho);
  if (!(x > 0)) return 0;
  return Math.exp((-Math.LN2 / Math.log(rho) ** 2) * Math.log(x) ** 2);
}

/** Where f falls to `level` between x0 (above it) and x1 (below it), by bisection. */
function crossing(f: (x: number) => number, x0: number, x1: number, level: number): number {
  for (let i = 0; i < 200; i++) {
    const mid = 0.5 * (x0 + x1);
    if (f(mid) >= level) x0 = mid;
    else x1 = mid;
  }
  return 0.5 * (x0 + x1);
}

/** The maximum of a unimodal f on [a, b], by golden-section search (a flat top resolves it to about √ε relative). */
function argmax(f: (x: number) => number, a: number, b: number): number {
  const g = (Math.sqrt(5) - 1) / 2;
  for (let i = 0; i < 200; i++) {
    const c = b - g * (b - a);
    const d = a + g * (b - a);
    if (f(c) > f(d)) b = d;
    else a = c;
  }
  return 0.5 * (a + b);
}

const bands: LogNormalBand[] = [
  { peakPerCm: 20000, fwhmPerCm: 1500, asymmetry: 1.3 }, // an absorption band, blue tail
  { peakPerCm: 16000, fwhmPerCm: 1200, asymmetry: 1 / 1.3 }, // an emission band, red tail
  { peakPerCm: 27000, fwhmPerCm: 4500, asymmetry: 2 }, // a broad, strongly skewed UV band
];

describe('logNormalShape (Siano & Metzler 1969)', () => {
  it.each(bands)('logNormalShape(%o) equals the published formula to 1e-12 from the red to the blue tail', (band) => {
    for (let k = -40; k <= 40; k++) {
      const nu = band.peakPerCm + (k / 10) * band.fwhmPerCm;
      const expected = published(nu, band.peakPerCm, band.fwhmPerCm, band.asymmetry);
      expect(Math.abs(logNormalShape(nu, band) - expected)).toBeLessThanOrEqual(1e-12);
    }
  });

  it.each(bands)('logNormalShape(%o) is 1 at the peak and lower 1 cm⁻¹ either side', (band) => {
    expect(logNormalShape(band.peakPerCm, band)).toBe(1);
    expect(logNormalShape(band.peakPerCm - 1, band)).toBeLessThan(1);
    expect(logNormalShape(band.peakPerCm + 1, band)).toBeLessThan(1);
  });

  it.each(bands)(
    'logNormalShape(%o) is at half maximum H apart, blue half-width over red half-width = ρ (to 1e-9)',
    (band) => {
      const f = (nu: number) => logNormalShape(nu, band);
      const { peakPerCm: nu0, fwhmPerCm: h, asymmetry: rho } = band;
      const blue = crossing(f, nu0, nu0 + 5 * h, 0.5);
      const red = crossing(f, nu0, nu0 - 5 * h, 0.5);
      expect(Math.abs(blue - red - h) / h).toBeLessThan(1e-9);
      expect(Math.abs((blue - nu0) / (nu0 - red) - rho)).toBeLessThan(1e-9);
    },
  );

  it(
    'logNormalShape with ρ = 1 is the Gaussian exp(−4 ln 2 (ν̃ − ν̃₀)²/H²), and ρ = 1.0001 is within 1e-3 ' + 'of it',
    () => {
      const gauss = (nu: number) => Math.exp((-4 * Math.LN2 * (nu - 18000) ** 2) / 1000 ** 2);
      for (let nu = 16000; nu <= 20000; nu += 50) {
        expect(logNormalShape(nu, { peakPerCm: 18000, fwhmPerCm: 1000, asymmetry: 1 })).toBeCloseTo(gauss(nu), 14);
        expect(
          Math.abs(logNormalShape(nu, { peakPerCm: 18000, fwhmPerCm: 1000, asymmetry: 1.0001 }) - gauss(nu)),
        ).toBeLessThan(1e-3);
      }
    },
  );
});

describe('logNormalBandForNm (absorption, ε(λ) = ε_peak · S(10⁷/λ))', () => {
  it.each([
    [650, 35, 1.3],
    [358, 55, 1.3],
    [490, 120, 1.6],
    [700, 40, 0.8],
  ])('logNormalBandForNm(%s nm, FWHM %s nm, ρ %s) peaks there and is at half maximum fwhmNm apart', (peak, w, rho) => {
    const band = logNormalBandForNm(peak, w, rho);
    const f = (nm: number) => published(1e7 / nm, band.peakPerCm, band.fwhmPerCm, band.asymmetry);
    expect(argmax(f, peak - w, peak + w)).toBeCloseTo(peak, 5);
    const red = crossing(f, peak, peak + 5 * w, 0.5);
    const blue = crossing(f, peak, Math.max(1, peak - 5 * w), 0.5);
    expect(red - blue).toBeCloseTo(w, 9);
    expect(band.asymmetry).toBe(rho);
  });
});

describe('logNormalEmissionBand and sampleLogNormalLine (emission, photons per nm)', () => {
  // The per-nm density of a band, from the published formula and the Jacobian |dν̃/dλ| = 10⁷/λ².
  const perNm = (band: LogNormalBand) => (nm: number) =>
    (published(1e7 / nm, band.peakPerCm, band.fwhmPerCm, band.asymmetry) * 1e7) / (nm * nm);

  it.each([
    [507, 35, 1 / 1.3],
    [461, 90, 1 / 1.3],
    [670, 35, 1 / 1.3],
    [610, 50, 1.2],
    [400, 300, 1 / 1.3],
  ])('logNormalEmissionBand(%s nm, %s nm, ρ %s): the per-nm density peaks there and is fwhmNm wide', (peak, w, rho) => {
    const band = logNormalEmissionBand(peak, w, rho)!;
    const f = perNm(band);
    const top = argmax(f, Math.max(1, peak - w), peak + w);
    expect(top).toBeCloseTo(peak, 5);
    const red = crossing(f, top, top + 20 * w, f(top) / 2);
    const blue = crossing(f, top, Math.max(1, top - 3 * w), f(top) / 2);
    expect(red - blue).toBeCloseTo(w, 7);
  });

  it('logNormalEmissionBand(400 nm, 300 nm, ρ 2) is null: no band of that skew has a per-nm peak there so wide', () => {
    expect(logNormalEmissionBand(400, 300, 2)).toBeNull();
  });

  it('sampleLogNormalLine on a 0.5 nm grid has unit area (sum × step = 1) and the published shape', () => {
    const band = logNormalEmissionBand(507, 35, 1 / 1.3)!;
    const grid = makeGrid(300, 1000, 0.5);
    const { spectrum, areaOnGrid } = sampleLogNormalLine(grid, band);
    expect(spectrum.values.reduce((a, b) => a + b, 0) * spectrum.stepNm).toBeCloseTo(1, 12);
    expect(areaOnGrid).toBeCloseTo(1, 6);
    const f = perNm(band);
    const k = Math.round((507 - spectrum.startNm) / spectrum.stepNm);
    const j = Math.round((530 - spectrum.startNm) / spectrum.stepNm);
    expect(spectrum.values[j] / spectrum.values[k]).toBeCloseTo(f(530) / f(507), 12);
  });

  it('sampleLogNormalLine: areaOnGrid of a band cut by the grid is its share by adaptive Simpson quadrature', () => {
    const band = logNormalEmissionBand(690, 60, 1 / 1.3)!;
    const f = perNm(band);
    const grid = makeGrid(500, 700, 0.1);
    const cuts = [300, 500, 600, 650, 690, 700, 750, 850, 1200, 3000];
    const part = (a: number, b: number) => integrate(f, a, b, 1e-13, 40);
    let total = 0;
    for (let i = 1; i < cuts.length; i++) total += part(cuts[i - 1], cuts[i]);
    // Each grid point stands for one step around it: the grid covers 499.95–700.05 nm.
    const onGrid = part(499.95, 600) + part(600, 650) + part(650, 690) + part(690, 700.05);
    expect(sampleLogNormalLine(grid, band).areaOnGrid).toBeCloseTo(onGrid / total, 5);
  });
});
