/**
 * Water Raman: every excitation line is inelastically scattered by the water of the sample, and the broad O–H
 * stretching band lands at a fixed shift in wavenumber below the line, at about 3400 cm⁻¹ (350 nm excitation puts it
 * near 397 nm: Lakowicz, Principles of Fluorescence Spectroscopy, 3rd ed., Springer 2006, ch. 2, which treats water
 * Raman as a background of fluorescence measurements). The band is modelled as one Gaussian in wavenumber; its
 * strength follows the ν⁴ law of scattering (Long, The Raman Effect, Wiley 2002, ch. 5), approximate: away from
 * electronic resonance, and in photon counts the exponent is nearer ν₀·ν_s³ (a few per cent across the visible).
 */
import type { WavelengthGrid } from '../core/grid';
import type { WaterRamanSpec } from '../core/panel';
import { BACKGROUND_REFERENCE_BRIGHTNESS } from './background';

/**
 * Raman shift of the O–H stretching band of liquid water, cm⁻¹: the band spans about 3000–3700 cm⁻¹ with its centre
 * near 3400 cm⁻¹ (Walrafen, J. Chem. Phys. 1967, 47, 114; Lakowicz 2006, ch. 2). From memory, unverified.
 */
export const WATER_RAMAN_SHIFT_CM1 = 3400;

/**
 * FWHM of the O–H stretching band, cm⁻¹, taken as one Gaussian (the real band is a sum of two or more components,
 * Walrafen, J. Chem. Phys. 1967, 47, 114). From memory, unverified: about 400 cm⁻¹.
 */
export const WATER_RAMAN_FWHM_CM1 = 400;

/** The line at which a water Raman `level` of 1 is defined, nm (the background's reference line, a violet laser). */
export const WATER_RAMAN_REFERENCE_NM = 405;

const FWHM_TO_SIGMA = 1 / (2 * Math.sqrt(2 * Math.LN2));
/** nm → cm⁻¹: 1 cm = 1e7 nm. */
const NM_PER_CM = 1e7;
/** How far from its centre the band is computed, in standard deviations (a numerical cut of ours). */
const BAND_REACH_SIGMAS = 8;

/**
 * Wavelength of the Raman band of a line, nm: 1/λ_R = 1/λ_ex − shift (the shift in cm⁻¹, 1 cm = 1e7 nm).
 * @example ramanPeakNm(350) // ≈ 397.3 (Lakowicz 2006, ch. 2: near 397 nm)
 */
export function ramanPeakNm(excitationNm: number, shiftCm1 = WATER_RAMAN_SHIFT_CM1): number {
  return 1 / (1 / excitationNm - shiftCm1 / NM_PER_CM);
}

/**
 * Water Raman photons under a line relative to the reference line (405 nm) at the same power: (ν_s / ν_s,ref)⁴ with
 * ν_s the scattered wavenumber (the ν⁴ law, Long 2002; approximate).
 */
export function ramanRelativeStrength(excitationNm: number): number {
  const nu = NM_PER_CM / ramanPeakNm(excitationNm);
  const nuRef = NM_PER_CM / ramanPeakNm(WATER_RAMAN_REFERENCE_NM);
  return (nu / nuRef) ** 4;
}

/**
 * The O–H band under a line as a photon density per nm on the grid with unit area (when the band lies on the grid): a
 * Gaussian in wavenumber centred at ν_ex − shift with FWHM WATER_RAMAN_FWHM_CM1, times |dν/dλ| = 1e7/λ², times
 * `scale`; 0 further than 8 standard deviations from the centre.
 */
export function waterRamanBand(excitationNm: number, grid: WavelengthGrid, scale = 1): number[] {
  const centreCm1 = NM_PER_CM / excitationNm - WATER_RAMAN_SHIFT_CM1;
  const sigma = WATER_RAMAN_FWHM_CM1 * FWHM_TO_SIGMA;
  const norm = scale / (sigma * Math.sqrt(2 * Math.PI));
  const out = new Array<number>(grid.count).fill(0);
  // Only within BAND_REACH_SIGMAS of the centre: beyond it the Gaussian is below e^-32 ≈ 1e-14 of its peak.
  const fromNm = NM_PER_CM / (centreCm1 + BAND_REACH_SIGMAS * sigma);
  const toNm = centreCm1 > BAND_REACH_SIGMAS * sigma ? NM_PER_CM / (centreCm1 - BAND_REACH_SIGMAS * sigma) : Infinity;
  const first = Math.max(0, Math.floor((fromNm - grid.startNm) / grid.stepNm));
  const last = Math.min(grid.count - 1, Math.ceil((toNm - grid.startNm) / grid.stepNm));
  for (let i = first; i <= last; i++) {
    const nm = grid.startNm + i * grid.stepNm;
    const z = (NM_PER_CM / nm - centreCm1) / sigma;
    out[i] = norm * Math.exp(-0.5 * z * z) * (NM_PER_CM / (nm * nm));
  }
  return out;
}

/**
 * Water Raman on the grid in the panel's signal units, per unit line power: level × 1e5 × (ν_s/ν_s,ref)⁴ × the band.
 * Level 1 (a convention of this tool, like the background's) means that under a 405 nm line the band carries as many
 * photons as one probe with ε × QY = 1e5 M⁻¹ cm⁻¹ at abundance 1 under the same line.
 */
export function waterRamanEmission(spec: WaterRamanSpec, excitationNm: number, grid: WavelengthGrid): number[] {
  const scale = spec.level * BACKGROUND_REFERENCE_BRIGHTNESS * ramanRelativeStrength(excitationNm);
  return waterRamanBand(excitationNm, grid, scale);
}
