import { GAUSSIAN_FWHM_PER_SIGMA, HC_EV_NM } from './constants';
import type { SampledSpectrum, WavelengthGrid } from './grid';

/**
 * Emission line shape: a Gaussian in photon energy (the natural variable for size and phonon broadening), sampled on a
 * wavelength grid as a photon-count density per nm through the Jacobian |dE/dλ| = hc/λ²:
 * f(λ) = g(E(λ)) · hc/λ². Because of that factor the per-nm peak sits slightly to the blue of hc/E₀; the helpers below
 * place E₀ so that the per-nm peak lands exactly where asked (the emission peak users quote is read off per-nm spectra).
 */

/** Gaussian density per eV with unit area over energy. */
export function gaussianDensityPerEv(energyEv: number, centerEv: number, fwhmEv: number): number {
  const sigma = fwhmEv / GAUSSIAN_FWHM_PER_SIGMA;
  const z = (energyEv - centerEv) / sigma;
  return Math.exp(-0.5 * z * z) / (sigma * Math.sqrt(2 * Math.PI));
}

/** The same line as a photon density per nm (unit area over wavelength): g(hc/λ) · hc/λ². */
export function gaussianDensityPerNm(wavelengthNm: number, centerEv: number, fwhmEv: number): number {
  return (gaussianDensityPerEv(HC_EV_NM / wavelengthNm, centerEv, fwhmEv) * HC_EV_NM) / (wavelengthNm * wavelengthNm);
}

/**
 * Energy centre E₀ whose per-nm density peaks at `peakNm`. Maximising g(E)·E² gives (E − E₀)/σ² = 2/E, so exactly
 * E₀ = E_pk − 2σ²/E_pk.
 */
export function centerEvForPeakNm(peakNm: number, fwhmEv: number): number {
  const sigma = fwhmEv / GAUSSIAN_FWHM_PER_SIGMA;
  const peakEv = HC_EV_NM / peakNm;
  return peakEv - (2 * sigma * sigma) / peakEv;
}

/** Wavelength (nm) of the per-nm density's maximum: the positive root of E² − E₀E − 2σ² = 0. */
export function peakNmOfLine(centerEv: number, fwhmEv: number): number {
  const sigma = fwhmEv / GAUSSIAN_FWHM_PER_SIGMA;
  return HC_EV_NM / (0.5 * (centerEv + Math.sqrt(centerEv * centerEv + 8 * sigma * sigma)));
}

function halfCrossingNm(centerEv: number, fwhmEv: number, peakNm: number, towardNm: number): number {
  const half = 0.5 * gaussianDensityPerNm(peakNm, centerEv, fwhmEv);
  let inside = peakNm;
  let outside = towardNm;
  for (let i = 0; i < 56; i++) {
    const mid = 0.5 * (inside + outside);
    if (gaussianDensityPerNm(mid, centerEv, fwhmEv) > half) inside = mid;
    else outside = mid;
  }
  return 0.5 * (inside + outside);
}

/** FWHM (nm) of the per-nm density, from its two half-maximum wavelengths (bisection on each side). */
export function fwhmNmOfLine(centerEv: number, fwhmEv: number): number {
  const peakNm = peakNmOfLine(centerEv, fwhmEv);
  // Brackets: 8 widths away in energy is far below half maximum; keep the blue side above 0 eV·nm.
  const blueEv = centerEv + 8 * fwhmEv;
  const redEv = Math.max(centerEv - 8 * fwhmEv, centerEv / 50);
  return halfCrossingNm(centerEv, fwhmEv, peakNm, HC_EV_NM / redEv) - halfCrossingNm(centerEv, fwhmEv, peakNm, HC_EV_NM / blueEv);
}

/**
 * Energy FWHM (eV) of the Gaussian whose per-nm spectrum, peaked at `peakNm`, is `fwhmNm` wide. The per-nm width grows
 * monotonically with the energy width, so a bracketed root search is safe: Illinois false position on
 * [0, hc/peak], starting from the small-width estimate hc·Δλ/λ², converges in a handful of steps.
 */
export function fwhmEvForFwhmNm(peakNm: number, fwhmNm: number): number {
  const f = (w: number) => fwhmNmOfLine(centerEvForPeakNm(peakNm, w), w) - fwhmNm;
  let lo = 0;
  let flo = -fwhmNm;
  let hi = Math.min((HC_EV_NM * fwhmNm) / (peakNm * peakNm), HC_EV_NM / peakNm);
  let fhi = f(hi);
  // Grow the bracket if the small-width estimate falls short (it does: 1/E is convex).
  while (fhi < 0 && hi < HC_EV_NM / peakNm) {
    lo = hi; flo = fhi;
    hi = Math.min(hi * 1.5, HC_EV_NM / peakNm);
    fhi = f(hi);
  }
  let side = 0;
  for (let i = 0; i < 100 && hi - lo > 1e-13; i++) {
    const w = (lo * fhi - hi * flo) / (fhi - flo);
    const fw = f(w);
    if (Math.abs(fw) < 1e-10) return w;
    if (fw < 0) {
      lo = w; flo = fw;
      if (side === -1) fhi /= 2;
      side = -1;
    } else {
      hi = w; fhi = fw;
      if (side === 1) flo /= 2;
      side = 1;
    }
  }
  return 0.5 * (lo + hi);
}

/**
 * Samples the line on `grid` as photon counts per nm, renormalised so that sum(values) × stepNm = 1 on the grid.
 * Also returns the fraction of the line's exact area that lies on the grid (1 when the grid covers it).
 */
export function sampleGaussianLine(grid: WavelengthGrid, centerEv: number, fwhmEv: number): { spectrum: SampledSpectrum; areaOnGrid: number } {
  const values = new Float64Array(grid.count);
  let sum = 0;
  for (let i = 0; i < grid.count; i++) {
    const v = gaussianDensityPerNm(grid.startNm + i * grid.stepNm, centerEv, fwhmEv);
    values[i] = v;
    sum += v;
  }
  const areaOnGrid = sum * grid.stepNm;
  if (areaOnGrid > 0) for (let i = 0; i < grid.count; i++) values[i] /= areaOnGrid;
  return { spectrum: { startNm: grid.startNm, stepNm: grid.stepNm, values }, areaOnGrid };
}
