import { GAUSSIAN_FWHM_PER_SIGMA, HC_EV_NM } from './constants';
import { expNonPositive } from './fast-exp';
import type { SampledSpectrum, WavelengthGrid } from './grid';

/**
 * Emission line shape: a Gaussian in photon energy (the natural variable for size and phonon broadening), sampled on a
 * wavelength grid as a photon-count density per nm through the Jacobian |dE/dλ| = hc/λ²:
 * f(λ) = g(E(λ)) · hc/λ². Because of that factor the per-nm peak sits slightly to the blue of hc/E₀; the helpers below
 * place E₀ so that the per-nm peak lands exactly where asked (the emission peak users quote is read off per-nm spectra).
 */

// Plain module constants: read in the per-point loops below (an imported binding can cost a getter call there when a
// bundler turns modules into objects).
const HC = HC_EV_NM;
const FWHM_PER_SIGMA = GAUSSIAN_FWHM_PER_SIGMA;
const SQRT_2PI = Math.sqrt(2 * Math.PI);

/**
 * A line is sampled only within ±10σ of its centre in energy; beyond, it is set to exactly 0. There the density is
 * exp(−10²/2) = exp(−50) ≈ 2e-22 of the peak and the dropped tails hold under 1e-22 of the line's area: against the
 * smallest signal the model can carry (a 10^-12 blocking floor times a unit-area line) that is 1e-10 relative, and the
 * tails of a Gaussian model are no physics that far out.
 */
export const LINE_CUTOFF_SIGMAS = 10;

/** Gaussian density per eV with unit area over energy. */
export function gaussianDensityPerEv(energyEv: number, centerEv: number, fwhmEv: number): number {
  const sigma = fwhmEv / FWHM_PER_SIGMA;
  const z = (energyEv - centerEv) / sigma;
  return Math.exp(-0.5 * z * z) / (sigma * SQRT_2PI);
}

/** The same line as a photon density per nm (unit area over wavelength): g(hc/λ) · hc/λ². */
export function gaussianDensityPerNm(wavelengthNm: number, centerEv: number, fwhmEv: number): number {
  return (gaussianDensityPerEv(HC / wavelengthNm, centerEv, fwhmEv) * HC) / (wavelengthNm * wavelengthNm);
}

/**
 * Energy centre E₀ whose per-nm density peaks at `peakNm`. Maximising g(E)·E² gives (E − E₀)/σ² = 2/E, so exactly
 * E₀ = E_pk − 2σ²/E_pk.
 */
export function centerEvForPeakNm(peakNm: number, fwhmEv: number): number {
  const sigma = fwhmEv / FWHM_PER_SIGMA;
  const peakEv = HC / peakNm;
  return peakEv - (2 * sigma * sigma) / peakEv;
}

/** Wavelength (nm) of the per-nm density's maximum: the positive root of E² − E₀E − 2σ² = 0. */
export function peakNmOfLine(centerEv: number, fwhmEv: number): number {
  return HC / peakEvOfLine(centerEv, fwhmEv / FWHM_PER_SIGMA);
}

function peakEvOfLine(centerEv: number, sigma: number): number {
  return 0.5 * (centerEv + Math.sqrt(centerEv * centerEv + 8 * sigma * sigma));
}

/**
 * Energy (eV) where the per-nm density falls to half its peak, on the blue (`side` = 1) or red (−1) side. In energy
 * the per-nm density is ∝ exp(−(E − E₀)²/2σ²)·E², so its log ψ(E) = −(E − E₀)²/2σ² + 2 ln E is concave for E > 0:
 * Newton's method on ψ(E) = ψ(E_pk) − ln 2 started beyond the crossing moves monotonically towards it (a concave
 * function lies below its tangents), and converges quadratically to round-off.
 */
function halfCrossingEv(centerEv: number, sigma: number, peakEv: number, side: 1 | -1): number {
  const inv2s2 = 0.5 / (sigma * sigma);
  const target = -(peakEv - centerEv) * (peakEv - centerEv) * inv2s2 + 2 * Math.log(peakEv) - Math.LN2;
  // A start beyond the crossing: 2σ out (below half for the Gaussian alone), pushed further while still above half.
  let offset = 2 * sigma;
  let e = peakEv + side * offset;
  if (side === -1 && e <= 0) e = peakEv / 2;
  for (let k = 0; k < 200; k++) {
    const psi = -(e - centerEv) * (e - centerEv) * inv2s2 + 2 * Math.log(e);
    if (psi < target) break;
    offset *= 2;
    e = side === 1 ? peakEv + offset : e / 2;
  }
  for (let k = 0; k < 100; k++) {
    const psi = -(e - centerEv) * (e - centerEv) * inv2s2 + 2 * Math.log(e);
    const slope = -2 * (e - centerEv) * inv2s2 + 2 / e;
    const step = (psi - target) / slope;
    if (!Number.isFinite(step)) break;
    e -= step;
    if (Math.abs(step) <= 4e-16 * e) break;
  }
  return e;
}

/** FWHM (nm) of the per-nm density, from its two half-maximum wavelengths (Newton on each side, in energy). */
export function fwhmNmOfLine(centerEv: number, fwhmEv: number): number {
  const sigma = fwhmEv / FWHM_PER_SIGMA;
  const peakEv = peakEvOfLine(centerEv, sigma);
  return HC / halfCrossingEv(centerEv, sigma, peakEv, -1) - HC / halfCrossingEv(centerEv, sigma, peakEv, 1);
}

// Per-nm FWHM of the line peaked at peakNm with energy FWHM w, minus the wanted one (a plain function, no closure).
function fwhmMismatchNm(peakNm: number, fwhmEv: number, wantedNm: number): number {
  return fwhmNmOfLine(centerEvForPeakNm(peakNm, fwhmEv), fwhmEv) - wantedNm;
}

/**
 * Energy FWHM (eV) of the Gaussian whose per-nm spectrum, peaked at `peakNm`, is `fwhmNm` wide. The per-nm width grows
 * monotonically with the energy width, so a bracketed root search is safe: Illinois false position on
 * [0, hc/peak], starting from the small-width estimate hc·Δλ/λ², converges in a handful of steps.
 */
export function fwhmEvForFwhmNm(peakNm: number, fwhmNm: number): number {
  let lo = 0;
  let flo = -fwhmNm;
  let hi = Math.min((HC * fwhmNm) / (peakNm * peakNm), HC / peakNm);
  let fhi = fwhmMismatchNm(peakNm, hi, fwhmNm);
  // Grow the bracket if the small-width estimate falls short (it does: 1/E is convex).
  while (fhi < 0 && hi < HC / peakNm) {
    lo = hi; flo = fhi;
    hi = Math.min(hi * 1.5, HC / peakNm);
    fhi = fwhmMismatchNm(peakNm, hi, fwhmNm);
  }
  let side = 0;
  for (let i = 0; i < 100 && hi - lo > 1e-13; i++) {
    const w = (lo * fhi - hi * flo) / (fhi - flo);
    const fw = fwhmMismatchNm(peakNm, w, fwhmNm);
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

// Writes the per-nm density at grid points [from, to] into `values`; returns their sum.
function fillLine(values: Float64Array, grid: WavelengthGrid, from: number, to: number, centerEv: number, sigma: number): number {
  const { startNm, stepNm } = grid;
  const invSigma = 1 / sigma;
  const scale = HC / (sigma * SQRT_2PI);
  let sum = 0;
  for (let i = from; i <= to; i++) {
    const nm = startNm + i * stepNm;
    const z = (HC / nm - centerEv) * invSigma;
    const v = (expNonPositive(-0.5 * z * z) * scale) / (nm * nm);
    values[i] = v;
    sum += v;
  }
  return sum;
}

// Below this share of the line on the grid the renormalisation would magnify the dropped tails (2e-22 of the peak)
// by more than 1e6: the whole grid is sampled instead (a line almost entirely off the grid: rare, and warned about).
const WINDOW_AREA_FLOOR = 1e-6;

/**
 * Samples the line on `grid` as photon counts per nm, renormalised so that sum(values) × stepNm = 1 on the grid.
 * Also returns the fraction of the line's exact area that lies on the grid (1 when the grid covers it). Only the
 * points within ±LINE_CUTOFF_SIGMAS of the centre (in energy) are computed and the rest are exactly 0, unless less
 * than 1e-6 of the line falls in that window (a line almost entirely off the grid): then every point is computed.
 */
export function sampleGaussianLine(grid: WavelengthGrid, centerEv: number, fwhmEv: number): { spectrum: SampledSpectrum; areaOnGrid: number } {
  const { startNm, stepNm, count } = grid;
  const values = new Float64Array(count);
  const sigma = fwhmEv / FWHM_PER_SIGMA;
  const reach = LINE_CUTOFF_SIGMAS * sigma;
  // Blue end of the window from the high-energy cut; red end from the low-energy cut (none when it is at or below 0 eV).
  const blueNm = HC / (centerEv + reach);
  const redNm = centerEv - reach > 0 ? HC / (centerEv - reach) : Infinity;
  let from = Math.max(0, Math.floor((blueNm - startNm) / stepNm));
  let to = Math.min(count - 1, Math.ceil((redNm - startNm) / stepNm));
  let areaOnGrid = fillLine(values, grid, from, to, centerEv, sigma) * stepNm;
  if (!(areaOnGrid >= WINDOW_AREA_FLOOR)) {
    from = 0;
    to = count - 1;
    areaOnGrid = fillLine(values, grid, from, to, centerEv, sigma) * stepNm;
  }
  if (areaOnGrid > 0) {
    const inverse = 1 / areaOnGrid; // one division; the products differ from quotients by at most an ulp
    for (let i = from; i <= to; i++) values[i] *= inverse;
  }
  return { spectrum: { startNm, stepNm, values }, areaOnGrid };
}
