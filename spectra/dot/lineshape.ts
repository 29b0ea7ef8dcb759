import { GAUSSIAN_FWHM_PER_SIGMA, HC_EV_NM } from '../core/constants';

import type { SampledSpectrum, WavelengthGrid } from '../core/grid';
import { expNonPositive } from '../kernels/exp';

/**
 * Emission line shape: a Gaussian in photon energy (the natural variable for size and phonon broadening), sampled on a
 * wavelength grid as a photon-count density per nm through the Jacobian |dE/dλ| = hc/λ²:
 * f(λ) = g(E(λ)) · hc/λ². Because of that factor the per-nm peak sits slightly to the blue of hc/E₀; the helpers below
 * place E₀ so that the per-nm peak lands exactly where asked (the emission peak users quote is read off per-nm
 * spectra).
 */

const HC = HC_EV_NM;
const FWHM_PER_SIGMA = GAUSSIAN_FWHM_PER_SIGMA;
const SQRT_2PI = Math.sqrt(2 * Math.PI);

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
 * Newton's method on ψ(E) = ψ(E_pk) − ln 2 converges to the crossing (from beyond it monotonically, since a concave
 * function lies below its tangents; from inside, the first step lands beyond it), quadratically to round-off.
 * The start is the crossing of ψ's second-order expansion about the peak, where the linear terms cancel (ψ′(E_pk) = 0):
 * ψ(E_pk + u) ≈ ψ(E_pk) − u²(1/2σ² + 1/E_pk²), so u = ±√(ln 2 / (1/2σ² + 1/E_pk²)); its error is third order in
 * σ/E_pk, so two or three Newton steps reach round-off.
 */
function halfCrossingEv(centerEv: number, sigma: number, peakEv: number, side: 1 | -1): number {
  const inv2s2 = 0.5 / (sigma * sigma);
  const target = -(peakEv - centerEv) * (peakEv - centerEv) * inv2s2 + 2 * Math.log(peakEv) - Math.LN2;
  let e = peakEv + side * Math.sqrt(Math.LN2 / (inv2s2 + 1 / (peakEv * peakEv)));
  if (!(e > 0)) {
    // Lines so wide that the expansion puts the red crossing at or below 0 eV: start beyond it by halving instead.
    e = peakEv / 2;
    for (let k = 0; k < 200; k++) {
      if (-(e - centerEv) * (e - centerEv) * inv2s2 + 2 * Math.log(e) < target) break;
      e /= 2;
    }
  }
  for (let k = 0; k < 100; k++) {
    const psi = -(e - centerEv) * (e - centerEv) * inv2s2 + 2 * Math.log(e);
    const slope = -2 * (e - centerEv) * inv2s2 + 2 / e;
    const step = (psi - target) / slope;
    if (!Number.isFinite(step)) break;
    // Newton's next error is about |ψ″/2ψ′| · step²: when that is below round-off, this step is the last one (the
    // usual test, |step| at round-off, costs one more log to learn nothing).
    const curvature = 2 * inv2s2 + 2 / (e * e);
    e -= step;
    if (Math.abs(step) <= 4e-16 * e || (curvature * step * step) / Math.abs(2 * slope) <= 2e-16 * e) break;
  }
  return e;
}

/** FWHM (nm) of the per-nm density, from its two half-maximum wavelengths (Newton on each side, in energy). */
export function fwhmNmOfLine(centerEv: number, fwhmEv: number): number {
  const sigma = fwhmEv / FWHM_PER_SIGMA;
  const peakEv = peakEvOfLine(centerEv, sigma);
  return HC / halfCrossingEv(centerEv, sigma, peakEv, -1) - HC / halfCrossingEv(centerEv, sigma, peakEv, 1);
}

// Per-nm FWHM of the line peaked at peakNm with energy FWHM w, minus the wanted one.
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
    lo = hi;
    flo = fhi;
    hi = Math.min(hi * 1.5, HC / peakNm);
    fhi = fwhmMismatchNm(peakNm, hi, fwhmNm);
  }
  let side = 0;
  for (let i = 0; i < 100 && hi - lo > 1e-13; i++) {
    const w = (lo * fhi - hi * flo) / (fhi - flo);
    const fw = fwhmMismatchNm(peakNm, w, fwhmNm);
    if (Math.abs(fw) < 1e-10) return w;
    if (fw < 0) {
      lo = w;
      flo = fw;
      if (side === -1) fhi /= 2;
      side = -1;
    } else {
      hi = w;
      fhi = fw;
      if (side === 1) flo /= 2;
      side = 1;
    }
  }
  return 0.5 * (lo + hi);
}

/**
 * A line is sampled only within ±10σ of its centre in energy; beyond, it is exactly 0. There the density is
 * exp(−10²/2) = exp(−50) ≈ 2e-22 of the peak and the dropped tails hold under 1e-22 of the line's area: against the
 * smallest signal the model can carry (a 10^-12 blocking floor times a unit-area line) that is 1e-10 relative, and the
 * tails of a Gaussian model are no physics that far out.
 */
export const LINE_CUTOFF_SIGMAS = 10;

// Below this share of the line on the grid, renormalising the ±10σ window would magnify the dropped tails (2e-22 of
// the peak) by more than 1e6: the whole grid is sampled instead (a line almost entirely off the grid: rare, and warned
// about).
const WINDOW_AREA_FLOOR = 1e-6;

/** A line sampled on a grid: unit area on the grid, held on grid indices [from, to) and exactly 0 elsewhere. */
export interface SampledLine {
  spectrum: SampledSpectrum;
  /** Grid index of spectrum.values[0]. */
  from: number;
  /** Fraction of the line's exact area that lies on the grid (1 when the grid covers it). */
  areaOnGrid: number;
}

/** The line's per-nm shape, without its 1/(σ√2π) factor, at grid indices [from, to), and the sum of its values. */
function lineValues(grid: WavelengthGrid, from: number, to: number, centerEv: number, sigma: number) {
  const { startNm, stepNm } = grid;
  const values = new Array<number>(Math.max(0, to - from));
  const negHalfInvVariance = -0.5 / (sigma * sigma);
  let total = 0;
  for (let i = from; i < to; i++) {
    const nm = startNm + i * stepNm;
    const d = HC / nm - centerEv;
    const v = expNonPositive(d * d * negHalfInvVariance) * (HC / (nm * nm));
    values[i - from] = v;
    total += v;
  }
  return { values, total };
}

/**
 * Samples the line as photon counts per nm on `grid`, renormalised so that its sum × stepNm = 1 on the grid. Only the
 * points within ±LINE_CUTOFF_SIGMAS of the centre (in energy) are computed and held; the line is exactly 0 elsewhere,
 * unless less than 1e-6 of it falls in that window (a line almost entirely off the grid): then every point is.
 */
export function sampleGaussianLine(grid: WavelengthGrid, centerEv: number, fwhmEv: number): SampledLine {
  const { startNm, stepNm, count } = grid;
  const sigma = fwhmEv / FWHM_PER_SIGMA;
  const reach = LINE_CUTOFF_SIGMAS * sigma;
  // Blue end of the window from the high-energy cut; red end from the low-energy cut (none at or below 0 eV).
  const blueNm = HC / (centerEv + reach);
  const redNm = centerEv - reach > 0 ? HC / (centerEv - reach) : Infinity;
  let from = Math.min(count, Math.max(0, Math.floor((blueNm - startNm) / stepNm)));
  const to = Math.max(from, Math.min(count, Math.ceil((redNm - startNm) / stepNm) + 1));
  let { values, total } = lineValues(grid, from, to, centerEv, sigma);
  // The sum times the step over σ√2π is the area on the grid of the unit-area line.
  let areaOnGrid = (total * stepNm) / (sigma * SQRT_2PI);
  if (!(areaOnGrid >= WINDOW_AREA_FLOOR)) {
    from = 0;
    ({ values, total } = lineValues(grid, 0, count, centerEv, sigma));
    areaOnGrid = (total * stepNm) / (sigma * SQRT_2PI);
  }
  // One division; each product then differs from the quotient by at most an ulp.
  const scale = total > 0 ? 1 / (total * stepNm) : 0;
  for (let k = 0; k < values.length; k++) values[k] *= scale;
  return { spectrum: { startNm: startNm + from * stepNm, stepNm, values }, from, areaOnGrid };
}
