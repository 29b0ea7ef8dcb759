import { AVOGADRO_PER_MOL, GAUSSIAN_FWHM_PER_SIGMA, HC_EV_NM } from '../core/constants';
import type { SampledSpectrum, WavelengthGrid } from '../core/grid';
import { interpolateTable } from '../core/grid';
import { logNormalShape, nmToPerCm, type LogNormalBand } from './lognormal';

/**
 * Absorption of one probe as molar extinction ε(λ), M⁻¹ cm⁻¹ per mole of particles. Approximate by design; a measured
 * extinction (type 'table') always replaces the model. Shapes:
 * - 'exciton' (sized dots): zero below the band edge (4 line σ under the first exciton), a Gaussian first-exciton
 *   feature whose height is the first-exciton ε, and above it a continuum rising linearly in energy to the
 *   volume-scaled intrinsic value at 350 nm (Hens & Moreels, J. Mater. Chem. 2012; Leatherdale et al., J. Phys. Chem. B
 *   2002), switched on smoothly (smoothstep over 3σ) so that ε at the first exciton equals the first-exciton ε.
 * - 'tail' (carbon dots): ε350 · exp(−(λ − 350)/decay).
 * - 'lognormal' (dyes, and custom probes without a measured extinction): ε_peak · S(10⁷/λ), the log-normal band of
 *   Siano & Metzler, J. Chem. Phys. 1969 (lognormal.ts); on its blue side never below BLUE_FLOOR_SHARE of the peak.
 * - 'table' (measured): linear interpolation, zero outside the table.
 */
export type AbsorptionModel =
  | {
      type: 'exciton';
      firstExcitonEv: number;
      firstExcitonEpsilon: number;
      lineFwhmEv: number;
      epsilonAt350: number;
      /** Shell layers (core/shell dots), innermost first; absent for a bare core. */
      shells?: ShellAbsorptionPart[];
    }
  | { type: 'tail'; epsilonAt350: number; decayNm: number }
  | { type: 'lognormal'; band: LogNormalBand; peakEpsilon: number }
  | { type: 'table'; points: readonly (readonly [number, number])[] };

/** One shell layer's absorption: its volume and the intrinsic absorption of its material (shells/materials.ts). */
export interface ShellAbsorptionPart {
  bandGapEv: number;
  volumeNm3: number;
  /** Intrinsic absorption 0.5 eV above the layer's gap, cm⁻¹. */
  intrinsicHalfEvPerCm: number;
}

/** Largest energy above a shell's gap its square-root edge rises over, eV (shells/materials.ts). */
const SHELL_EDGE_CAP_EV = 1.5;

/**
 * ε (M⁻¹ cm⁻¹) of one shell layer at `energyEv`: zero below its gap, above it its volume of bulk material with
 * μi(E) = μ½ √((E − Eg)/0.5 eV), capped 1.5 eV above the gap (shells/materials.ts gives the sources).
 */
export function shellExtinction(part: ShellAbsorptionPart, energyEv: number): number {
  const above = energyEv - part.bandGapEv;
  if (!(above > 0) || part.intrinsicHalfEvPerCm === 0) return 0;
  const mu = part.intrinsicHalfEvPerCm * Math.sqrt(Math.min(above, SHELL_EDGE_CAP_EV) / 0.5);
  return intrinsicExtinction(part.volumeNm3, mu);
}

/**
 * On the blue side of a dye's main absorption band, ε rarely falls below a few percent of its peak: vibronic shoulders
 * and higher singlet bands follow (common practice, M; e.g. fluorescein, the fluorescent proteins and cyanines are
 * all weakly excited by a 405 nm line). A single log-normal band falls to 1e-4 and less there, so the modelled band
 * keeps a floor of 5 % of its peak on its blue side (ours, approximate); a measured extinction replaces it.
 */
export const BLUE_FLOOR_SHARE = 0.05;

/** Energy of 350 nm light, eV: the reference wavelength of the intrinsic absorption. */
const E350_EV = HC_EV_NM / 350;

/**
 * Volume-scaled intrinsic extinction ε = N_A · V · μi / (1000 ln 10), M⁻¹ cm⁻¹, with V in nm³ (converted to cm³) and
 * μi in cm⁻¹ (Hens & Moreels, J. Mater. Chem. 2012, 22, 10406).
 */
export function intrinsicExtinction(volumeNm3: number, intrinsicPerCm: number): number {
  return (AVOGADRO_PER_MOL * volumeNm3 * 1e-21 * intrinsicPerCm) / (1000 * Math.LN10);
}

function excitonEpsilon(m: Extract<AbsorptionModel, { type: 'exciton' }>, energyEv: number): number {
  const sigma = m.lineFwhmEv / GAUSSIAN_FWHM_PER_SIGMA;
  const dE = energyEv - m.firstExcitonEv;
  if (dE < -4 * sigma) return 0; // below the band edge: a dot does not absorb
  let eps = m.firstExcitonEpsilon * Math.exp(-0.5 * (dE / sigma) ** 2);
  if (dE > 0) {
    // Linear rise to the intrinsic value at 350 nm; 0.5 eV floor keeps the slope finite when E₁ lies near or above 350
    // nm.
    const rise = (m.epsilonAt350 * dE) / Math.max(E350_EV - m.firstExcitonEv, 0.5);
    const t = Math.min(1, dE / (3 * sigma));
    eps += rise * t * t * (3 - 2 * t);
  }
  return eps;
}

/** ε (M⁻¹ cm⁻¹) of an absorption model at one wavelength; 0 for non-positive or non-finite wavelengths. */
export function modelExtinctionAtNm(model: AbsorptionModel, wavelengthNm: number): number {
  if (!(wavelengthNm > 0) || !Number.isFinite(wavelengthNm)) return 0;
  switch (model.type) {
    case 'exciton': {
      const energyEv = HC_EV_NM / wavelengthNm;
      let eps = excitonEpsilon(model, energyEv);
      if (model.shells) for (const part of model.shells) eps += shellExtinction(part, energyEv);
      return eps;
    }
    case 'tail':
      return model.epsilonAt350 * Math.exp(-(wavelengthNm - 350) / model.decayNm);
    case 'lognormal': {
      const perCm = nmToPerCm(wavelengthNm);
      const shape = logNormalShape(perCm, model.band);
      return model.peakEpsilon * (perCm > model.band.peakPerCm ? Math.max(shape, BLUE_FLOOR_SHARE) : shape);
    }
    case 'table':
      return interpolateTable(model.points, wavelengthNm, 0);
  }
}

/** Samples an absorption model on a grid (M⁻¹ cm⁻¹). */
export function sampleExtinction(model: AbsorptionModel, grid: WavelengthGrid): SampledSpectrum {
  const values = new Array<number>(grid.count);
  for (let i = 0; i < grid.count; i++) values[i] = modelExtinctionAtNm(model, grid.startNm + i * grid.stepNm);
  return { startNm: grid.startNm, stepNm: grid.stepNm, values };
}
