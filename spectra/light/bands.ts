/**
 * Autofluorescence bands: one endogenous fluorophore (or fixation product) as a Gaussian emission band in wavelength,
 * excited through one or more Gaussian excitation bands. The default model (background.ts) and the sample-type
 * presets (background-presets.ts) are lists of these, summed by one function.
 */
import type { WavelengthGrid } from '../core/grid';

/** One autofluorescence band. Widths are FWHM in nm. */
export interface AutofluorescenceBand {
  name: string;
  emissionNm: number;
  emissionFwhmNm: number;
  /** Excitation bands: [peak nm, FWHM nm, relative weight]. */
  excitation: [number, number, number][];
  /** Relative total emission when excited at the strongest excitation band. */
  brightness: number;
}

const FWHM_TO_SIGMA = 1 / (2 * Math.sqrt(2 * Math.LN2));

/** How strongly a line at `excitationNm` excites a band: Σ weight × exp(−(λx − peak)²/2σ²) over its excitations. */
export function excitationWeight(band: AutofluorescenceBand, excitationNm: number): number {
  let weight = 0;
  for (const [peakNm, fwhmNm, w] of band.excitation) {
    const z = (excitationNm - peakNm) / (fwhmNm * FWHM_TO_SIGMA);
    weight += w * Math.exp(-0.5 * z * z);
  }
  return weight;
}

/**
 * The bands' emission (relative photon density per nm) under a line at `excitationNm`, times `scale`: each band a
 * Gaussian in wavelength with unit area times scale × brightness × excitation weight. Nothing is emitted at or below
 * the exciting wavelength (no anti-Stokes emission in this model).
 */
export function bandsEmission(
  bands: readonly AutofluorescenceBand[],
  excitationNm: number,
  grid: WavelengthGrid,
  scale = 1,
): number[] {
  const out = new Array<number>(grid.count).fill(0);
  for (const band of bands) {
    const amount = scale * band.brightness * excitationWeight(band, excitationNm);
    if (amount < 1e-300) continue;
    const sigma = band.emissionFwhmNm * FWHM_TO_SIGMA;
    const norm = amount / (sigma * Math.sqrt(2 * Math.PI));
    for (let i = 0; i < grid.count; i++) {
      const nm = grid.startNm + i * grid.stepNm;
      if (nm <= excitationNm) continue;
      const z = (nm - band.emissionNm) / sigma;
      out[i] += norm * Math.exp(-0.5 * z * z);
    }
  }
  return out;
}
