/**
 * The log-normal band of Siano & Metzler (J. Chem. Phys. 1969, 51, 1856) for the absorption and emission bands of
 * dyes, counterstains and fluorescent proteins. It is defined in wavenumber ν̃ = 10⁷/λ (cm⁻¹, λ in nm), as published:
 * the bands of large molecules are vibronic progressions spaced evenly in energy (wavenumber is energy over hc), so
 * their widths and the mirror relation between absorption and emission hold in energy, not in wavelength; the dots'
 * Gaussian line (lineshape.ts) is defined in energy for the same reason.
 *
 *   S(ν̃) = exp(−(ln 2 / ln²ρ) · ln²((ν̃ − a)/b))  where (ν̃ − a)/b > 0, and 0 elsewhere,
 *   b = H·ρ/(ρ² − 1),  a = ν̃₀ − b,
 *
 * with ν̃₀ the peak, H the FWHM and ρ the asymmetry: the half-width at half maximum on the high-wavenumber (blue) side
 * over the one on the low-wavenumber (red) side. Then S(ν̃₀) = 1 and S = ½ at ν̃₀ + Hρ/(1 + ρ) and ν̃₀ − H/(1 + ρ).
 * ρ > 1 gives a tail to the blue (absorption bands, with their vibronic shoulder above the peak), ρ < 1 a tail to the
 * red (emission), and ρ → 1 the Gaussian exp(−4 ln 2 (ν̃ − ν̃₀)²/H²). The form is written as recalled (from memory,
 * unverified against the paper); the side ρ measures is this file's statement, and the tests check it.
 *
 * Sampled for emission, the band is a photon density per nm, S(10⁷/λ) · 10⁷/λ² (the Jacobian |dν̃/dλ|), with unit area
 * on the grid; for absorption it is ε(λ) = ε_peak · S(10⁷/λ) (ε is not a density, so there is no Jacobian).
 */
import type { WavelengthGrid } from '../core/grid';
import { GAUSSIAN_FWHM_PER_SIGMA } from '../core/constants';
import { LINE_CUTOFF_SIGMAS, type SampledLine } from './lineshape';

/** nm × cm⁻¹: a wavenumber in cm⁻¹ is 1e7 over the wavelength in nm (1 cm = 1e7 nm, exact). */
const NM_PER_CM = 1e7;

/** A log-normal band in wavenumber. */
export interface LogNormalBand {
  /** Peak ν̃₀, cm⁻¹. */
  peakPerCm: number;
  /** Full width at half maximum H, cm⁻¹. */
  fwhmPerCm: number;
  /** ρ: blue half-width over red half-width, in wavenumber (1: Gaussian). */
  asymmetry: number;
}

/**
 * Nominal asymmetries where no fitted value is at hand (ours): ρ = 1.3 for absorption (a blue tail) and its mirror
 * image 1/1.3 for emission (a red tail); tuned by eye to the shoulders of typical dye and protein spectra, not fitted.
 */
export const NOMINAL_ABSORPTION_ASYMMETRY = 1.3;
export const NOMINAL_EMISSION_ASYMMETRY = 1 / 1.3;

/** Wavenumber (cm⁻¹) of a wavelength (nm), and back: the same map both ways. */
export function nmToPerCm(nmOrPerCm: number): number {
  return NM_PER_CM / nmOrPerCm;
}

// Below this |ln ρ| the band is its Gaussian limit (the log-normal form loses digits as ρ → 1).
const GAUSSIAN_BELOW = 1e-6;

interface Form {
  a: number;
  b: number;
  /** ln 2 / ln²ρ. */
  c: number;
}

function formOf(band: LogNormalBand): Form | null {
  const rho = band.asymmetry;
  const lnRho = Math.log(rho);
  if (Math.abs(lnRho) < GAUSSIAN_BELOW) return null;
  const b = (band.fwhmPerCm * rho) / (rho * rho - 1);
  return { a: band.peakPerCm - b, b, c: Math.LN2 / (lnRho * lnRho) };
}

/** ln S(ν̃): −∞ outside the band's domain. */
function logShape(perCm: number, band: LogNormalBand, form: Form | null): number {
  if (form === null) {
    const z = (perCm - band.peakPerCm) / band.fwhmPerCm;
    return -4 * Math.LN2 * z * z;
  }
  const t = (perCm - form.a) / form.b;
  if (!(t > 0)) return -Infinity;
  const l = Math.log(t);
  return -form.c * l * l;
}

/**
 * S(ν̃), the band's height relative to its peak (0–1) at a wavenumber in cm⁻¹.
 * @example logNormalShape(20000, { peakPerCm: 20000, fwhmPerCm: 1500, asymmetry: 1.3 }) // 1
 */
export function logNormalShape(wavenumberPerCm: number, band: LogNormalBand): number {
  return Math.exp(logShape(wavenumberPerCm, band, formOf(band)));
}

/** ∫ S dν̃ over every wavenumber, cm⁻¹: |b|·√(π/c)·e^(1/4c) (substitute t = e^u), or H·√(π/(4 ln 2)) when Gaussian. */
export function logNormalAreaPerCm(band: LogNormalBand): number {
  const form = formOf(band);
  if (form === null) return band.fwhmPerCm * Math.sqrt(Math.PI / (4 * Math.LN2));
  return Math.abs(form.b) * Math.sqrt(Math.PI / form.c) * Math.exp(1 / (4 * form.c));
}

/**
 * The band whose ε(λ) = S(10⁷/λ) peaks at `peakNm` and is at half maximum at two wavelengths `fwhmNm` apart, with
 * asymmetry ρ (absorption). The red half-width h in cm⁻¹ solves 10⁷/(ν̃₀ − h) − 10⁷/(ν̃₀ + ρh) = W, a quadratic:
 * Wρh² + (10⁷(1 + ρ) − Wν̃₀(ρ − 1))h − Wν̃₀² = 0, whose positive root is taken in the form free of cancellation.
 */
export function logNormalBandForNm(peakNm: number, fwhmNm: number, asymmetry: number): LogNormalBand {
  const nu0 = NM_PER_CM / peakNm;
  const w = fwhmNm;
  const rho = asymmetry;
  const bq = NM_PER_CM * (1 + rho) - w * nu0 * (rho - 1);
  const h = (2 * w * nu0 * nu0) / (bq + Math.sqrt(bq * bq + 4 * rho * w * w * nu0 * nu0));
  return { peakPerCm: nu0, fwhmPerCm: h * (1 + rho), asymmetry: rho };
}

// ln of the per-nm density (up to a constant) as a function of wavenumber: ln S(ν̃) + 2 ln ν̃.
function logPerNm(perCm: number, band: LogNormalBand, form: Form | null): number {
  if (!(perCm > 0)) return -Infinity;
  return logShape(perCm, band, form) + 2 * Math.log(perCm);
}

/**
 * The peak ν̃₀ that puts the per-nm density's maximum at wavenumber `peakPerCm`, for width H and asymmetry ρ; null
 * when a band this wide has no per-nm maximum there. Setting d/dν̃ [ln S + 2 ln ν̃] = 0 at ν̃_pk: for the Gaussian
 * ν̃₀ = ν̃_pk − 2σ²/ν̃_pk; for the log-normal, with t = (ν̃_pk − a)/b, ln t / t = b/(c ν̃_pk), solved by bisection on
 * the branch where ln t / t rises (t in (0, 1) for ρ < 1; t in (1, e) for ρ > 1, which needs b/(c ν̃_pk) < 1/e).
 */
function peakForPerNmMaximum(peakPerCm: number, fwhmPerCm: number, asymmetry: number): number | null {
  const form = formOf({ peakPerCm: 0, fwhmPerCm, asymmetry });
  if (form === null) {
    const sigma = fwhmPerCm / GAUSSIAN_FWHM_PER_SIGMA;
    return peakPerCm - (2 * sigma * sigma) / peakPerCm;
  }
  const k = form.b / (form.c * peakPerCm);
  let lo = form.b < 0 ? 0 : 1;
  let hi = form.b < 0 ? 1 : Math.E;
  if (form.b > 0 && !(k < 1 / Math.E)) return null;
  for (let i = 0; i < 200 && hi - lo > 1e-15 * hi; i++) {
    const t = 0.5 * (lo + hi);
    if (Math.log(t) / t < k) lo = t;
    else hi = t;
  }
  const t = 0.5 * (lo + hi);
  return peakPerCm - form.b * t + form.b;
}

/** Wavenumber (cm⁻¹) on one side of the per-nm maximum where the per-nm density is half of it. */
function perNmHalfCrossing(band: LogNormalBand, form: Form | null, peakPerCm: number, side: 1 | -1): number {
  const target = logPerNm(peakPerCm, band, form) - Math.LN2;
  // The domain's edge on this side (S = 0 beyond it), if there is one: a for the log-normal, 0 on the red side.
  let edge = side === 1 ? Infinity : 0;
  if (form !== null && (side === 1) === form.b < 0) edge = side === 1 ? Math.min(edge, form.a) : Math.max(edge, form.a);
  let inner = peakPerCm;
  let step = band.fwhmPerCm / 2;
  let outer = peakPerCm + side * step;
  for (let k = 0; k < 200; k++) {
    if (side * (outer - edge) >= 0) {
      outer = edge;
      break;
    }
    if (!(logPerNm(outer, band, form) >= target)) break;
    inner = outer;
    step *= 2;
    outer = peakPerCm + side * step;
  }
  for (let k = 0; k < 200 && Math.abs(outer - inner) > 1e-13 * Math.abs(inner); k++) {
    const mid = 0.5 * (inner + outer);
    if (logPerNm(mid, band, form) >= target) inner = mid;
    else outer = mid;
  }
  return 0.5 * (inner + outer);
}

/** The per-nm FWHM (nm) of `band`, whose per-nm maximum is at `peakPerCm`. */
function perNmFwhmNm(band: LogNormalBand, peakPerCm: number): number {
  const form = formOf(band);
  const blue = perNmHalfCrossing(band, form, peakPerCm, 1);
  const red = perNmHalfCrossing(band, form, peakPerCm, -1);
  return NM_PER_CM / red - NM_PER_CM / blue;
}

/**
 * The band whose photon density per nm, S(10⁷/λ) · 10⁷/λ², peaks at `peakNm` and is `fwhmNm` wide at half maximum,
 * with asymmetry ρ (emission). The Jacobian moves the per-nm maximum to the blue of ν̃₀ and changes its width a
 * little, so ν̃₀ and H are solved for: ν̃₀ in closed form or by bisection for each H, and H by bisection on the per-nm
 * width (which grows with H), from the bracket around the no-Jacobian width of logNormalBandForNm. Null when no band
 * of this asymmetry has that per-nm peak and width.
 */
export function logNormalEmissionBand(peakNm: number, fwhmNm: number, asymmetry: number): LogNormalBand | null {
  const peakPerCm = NM_PER_CM / peakNm;
  const bandFor = (fwhmPerCm: number): LogNormalBand | null => {
    const nu0 = peakForPerNmMaximum(peakPerCm, fwhmPerCm, asymmetry);
    return nu0 === null ? null : { peakPerCm: nu0, fwhmPerCm, asymmetry };
  };
  const widthNm = (fwhmPerCm: number): number => {
    const band = bandFor(fwhmPerCm);
    return band === null ? Infinity : perNmFwhmNm(band, peakPerCm);
  };
  const start = logNormalBandForNm(peakNm, fwhmNm, asymmetry).fwhmPerCm;
  let lo = start;
  let hi = start;
  for (let k = 0; k < 100 && widthNm(lo) > fwhmNm; k++) lo /= 1.25;
  for (let k = 0; k < 100 && widthNm(hi) < fwhmNm; k++) hi *= 1.25;
  if (!(widthNm(lo) <= fwhmNm && widthNm(hi) >= fwhmNm) || !Number.isFinite(widthNm(hi))) return null;
  for (let k = 0; k < 200 && hi - lo > 1e-13 * hi; k++) {
    const mid = 0.5 * (lo + hi);
    if (widthNm(mid) < fwhmNm) lo = mid;
    else hi = mid;
  }
  return bandFor(0.5 * (lo + hi));
}

// Below this share of the band on the grid, renormalising the window would magnify what it drops: the whole grid is
// sampled instead (as for the Gaussian line).
const WINDOW_AREA_FLOOR = 1e-6;

/** The window of wavenumbers where S exceeds exp(−LINE_CUTOFF_SIGMAS²/2), the cut of the Gaussian line. */
function windowPerCm(band: LogNormalBand, form: Form | null): [number, number] {
  const cut = 0.5 * LINE_CUTOFF_SIGMAS * LINE_CUTOFF_SIGMAS;
  if (form === null) {
    const reach = band.fwhmPerCm * Math.sqrt(cut / (4 * Math.LN2));
    return [band.peakPerCm - reach, band.peakPerCm + reach];
  }
  const r = Math.sqrt(cut / form.c);
  const ends = [form.a + form.b * Math.exp(-r), form.a + form.b * Math.exp(r)];
  return [Math.min(ends[0], ends[1]), Math.max(ends[0], ends[1])];
}

function perNmValues(grid: WavelengthGrid, from: number, to: number, band: LogNormalBand, form: Form | null) {
  const values = new Array<number>(Math.max(0, to - from));
  let total = 0;
  for (let i = from; i < to; i++) {
    const perCm = NM_PER_CM / (grid.startNm + i * grid.stepNm);
    const v = Math.exp(logShape(perCm, band, form)) * perCm * perCm;
    values[i - from] = v;
    total += v;
  }
  return { values, total };
}

/**
 * Samples the band as photons per nm on `grid`, renormalised to sum × stepNm = 1 on the grid, held on the grid points
 * where S exceeds exp(−50) (the Gaussian line's ±10σ cut) and exactly 0 elsewhere; `areaOnGrid` is the share of the
 * band's exact area (logNormalAreaPerCm) that lies on the grid.
 */
export function sampleLogNormalLine(grid: WavelengthGrid, band: LogNormalBand): SampledLine {
  const { startNm, stepNm, count } = grid;
  const form = formOf(band);
  const [loPerCm, hiPerCm] = windowPerCm(band, form);
  const blueNm = hiPerCm > 0 ? NM_PER_CM / hiPerCm : Infinity;
  const redNm = loPerCm > 0 ? NM_PER_CM / loPerCm : Infinity;
  let from = Math.min(count, Math.max(0, Math.floor((blueNm - startNm) / stepNm)));
  const to = Math.max(from, Math.min(count, Math.ceil((redNm - startNm) / stepNm) + 1));
  let { values, total } = perNmValues(grid, from, to, band, form);
  // Σ S(ν̃)·ν̃²/10⁷ · Δλ is the band's area on the grid, in the units of logNormalAreaPerCm.
  const exact = logNormalAreaPerCm(band);
  let areaOnGrid = (total * stepNm) / NM_PER_CM / exact;
  if (!(areaOnGrid >= WINDOW_AREA_FLOOR)) {
    from = 0;
    ({ values, total } = perNmValues(grid, 0, count, band, form));
    areaOnGrid = (total * stepNm) / NM_PER_CM / exact;
  }
  const scale = total > 0 ? 1 / (total * stepNm) : 0;
  for (let k = 0; k < values.length; k++) values[k] *= scale;
  return { spectrum: { startNm: startNm + from * stepNm, stepNm, values }, from, areaOnGrid };
}
