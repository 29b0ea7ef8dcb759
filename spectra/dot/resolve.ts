/**
 * One probe resolved to its spectra: size, peaks, width, the emission sampled on a grid and the absorption model.
 * Measured data come first: a measured emission replaces the model's shape (peak and FWHM read from it), a measured
 * extinction replaces the model's absorption.
 */
import { DEFAULT_GRID, type SampledSpectrum, type WavelengthGrid } from '../core/grid';
import type { DotInput, MaterialId } from '../core/panel';
import { modelExtinctionAtNm, type AbsorptionModel } from './absorption';
import { centerEvForPeakNm, fwhmNmOfLine, sampleGaussianLine } from './lineshape';
import { resampleMeasuredEmission } from './measured';
import { cutEmissionAtLine } from './line-cut';
import { sampleLogNormalLine } from './lognormal';
import { resolveCarbon, resolveCustom, resolveDye, resolveSized, type ModelPart } from './model';
import { isSizedMaterial } from './sizing/sizing';

/** The scalar fields of a resolved probe (what the API reports for one dot, besides its spectra). */
export interface DotFields {
  material: MaterialId;
  /** The core's size (its meaning per material: sizeMeaning); null without a size law. */
  diameterNm: number | null;
  /** The same as diameterNm, named for core/shell dots. */
  coreDiameterNm: number | null;
  /** Core plus shell layers, nm; null without a size law. */
  overallDiameterNm: number | null;
  /** Typical hydrodynamic diameter of a water-soluble conjugate, nm (nominal); null where unknown. */
  hydrodynamicDiameterNm: number | null;
  firstExcitonNm: number | null;
  emissionPeakNm: number;
  fwhmNm: number;
  quantumYield: number;
  extinctionFirstExciton: number | null;
  extinctionAtExcitation: number | null;
  /**
   * Share of the nominal emission removed because it lay at or below the exciting line (excitationNm given); null
   * without a line.
   */
  emissionCutFraction: number | null;
  /** Which sizing model answered: the law's name, 'measured' for custom probes, 'measured emission; size by …'. */
  model: string;
  measured: { emission: boolean; extinction: boolean };
  warnings: string[];
}

/** A probe resolved on a grid. */
export interface ResolvedDot extends DotFields {
  grid: WavelengthGrid;
  /**
   * Photon density per nm with unit area on the grid (sum × stepNm = 1), held on the grid points where it is not 0
   * (spectrumOnGrid writes it out on the whole grid).
   */
  emission: SampledSpectrum;
  /** Grid index of emission.values[0]. */
  emissionFrom: number;
  /** Molar extinction ε (M⁻¹ cm⁻¹) of one mole of particles at any wavelength: see extinctionAtNm. */
  absorption: AbsorptionModel;
}

/** The part of a spectrum on every point of `grid` that is not 0 at either end, and the grid index it starts at. */
function trimmed(values: number[], grid: WavelengthGrid): { spectrum: SampledSpectrum; from: number } {
  let from = 0;
  let to = values.length;
  while (from < to && values[from] === 0) from++;
  while (to > from && values[to - 1] === 0) to--;
  const spectrum = { startNm: grid.startNm + from * grid.stepNm, stepNm: grid.stepNm, values: values.slice(from, to) };
  return { spectrum, from };
}

/**
 * Resolves a probe on `options.grid` (default 300–1000 nm, 1 nm). The input is taken as the API's schema checks it;
 * what only the models decide (a peak out of a size law's reach, a measured emission with nothing on the grid) throws
 * SpectraError naming the field.
 * @example resolveDot({ material: 'cdse', emissionPeakNm: 605 }).diameterNm // ≈ 4.2
 */
export function resolveDot(input: DotInput, options: { grid?: WavelengthGrid } = {}): ResolvedDot {
  const grid = options.grid ?? DEFAULT_GRID;
  const { material } = input;
  const measuredEm =
    input.measuredEmission === undefined
      ? null
      : resampleMeasuredEmission(input.measuredEmission.points, grid, ['measuredEmission', 'points']);
  const part: ModelPart = isSizedMaterial(material)
    ? resolveSized(material, input, measuredEm?.peakNm)
    : material === 'carbon'
      ? resolveCarbon(input, measuredEm?.peakNm)
      : material === 'dye'
        ? resolveDye(input)
        : resolveCustom(input, measuredEm);
  const warnings = [...part.warnings, ...(measuredEm?.warnings ?? [])];

  let emission: SampledSpectrum;
  let emissionFrom: number;
  let emissionPeakNm: number;
  let fwhmNm: number;
  if (measuredEm) {
    ({ peakNm: emissionPeakNm, fwhmNm } = measuredEm);
    ({ spectrum: emission, from: emissionFrom } = trimmed(measuredEm.spectrum.values, grid));
    if (part.peakNm !== null && Math.abs(part.peakNm - emissionPeakNm) > 10) {
      const apart = Math.abs(part.peakNm - emissionPeakNm).toFixed(1);
      warnings.push(
        `The measured emission peaks at ${emissionPeakNm.toFixed(1)} nm, ${apart} nm from the model's ` +
          `${part.peakNm.toFixed(1)} nm; the measured spectrum is used.`,
      );
    }
  } else {
    // A dye's log-normal band, or the dots' Gaussian line in energy.
    const band = part.emissionBand;
    const centerEv = band ? null : centerEvForPeakNm(part.peakNm!, part.fwhmEv!);
    const line = band ? sampleLogNormalLine(grid, band.band) : sampleGaussianLine(grid, centerEv!, part.fwhmEv!);
    if (line.areaOnGrid < 0.99) {
      warnings.push(
        `Only ${(100 * line.areaOnGrid).toFixed(1)} % of the emission lies on the wavelength grid; the spectrum is ` +
          'renormalised to unit area on the grid.',
      );
    }
    emission = line.spectrum;
    emissionFrom = line.from;
    emissionPeakNm = part.peakNm!;
    fwhmNm = band ? band.fwhmNm : fwhmNmOfLine(centerEv!, part.fwhmEv!);
  }

  let emissionCutFraction: number | null = null;
  if (input.excitationNm !== undefined) {
    const cut = cutEmissionAtLine(emission, emissionFrom, grid, input.excitationNm);
    ({ spectrum: emission, from: emissionFrom, cutFraction: emissionCutFraction } = cut);
    if (emissionCutFraction > 0.001)
      warnings.push(cutWarning(input.excitationNm, emissionCutFraction, isSizedMaterial(material)));
  }

  const measuredExtinction = input.extinction?.points;
  const absorption: AbsorptionModel = measuredExtinction
    ? { type: 'table', points: measuredExtinction }
    : part.absorption;
  if (!measuredExtinction && part.absorptionWarning) warnings.push(part.absorptionWarning);
  if (measuredExtinction?.some((p) => p[1] < 0))
    warnings.push('Measured extinction has negative values; they are used as given.');
  const { firstExcitonNm, diameterNm } = part;
  return {
    material,
    diameterNm,
    coreDiameterNm: diameterNm,
    overallDiameterNm: part.overallDiameterNm,
    hydrodynamicDiameterNm: part.hydrodynamicDiameterNm,
    firstExcitonNm,
    emissionPeakNm,
    fwhmNm,
    quantumYield: input.quantumYield ?? part.typicalQuantumYield,
    extinctionFirstExciton: firstExcitonNm === null ? null : modelExtinctionAtNm(absorption, firstExcitonNm),
    extinctionAtExcitation:
      input.excitationNm === undefined ? null : modelExtinctionAtNm(absorption, input.excitationNm),
    emissionCutFraction,
    model:
      !measuredEm || material === 'custom'
        ? part.model
        : `measured emission; ${material === 'dye' ? '' : 'size by '}${part.model}`,
    measured: { emission: measuredEm !== null, extinction: measuredExtinction !== undefined },
    warnings,
    grid,
    emission,
    emissionFrom,
    absorption,
  };
}

/** The warning for emission removed at a line (one wording for dots and panels). */
export function cutWarning(lineNm: number, cutFraction: number, sized: boolean): string {
  return (
    `${(100 * cutFraction).toFixed(1)} % of the nominal emission lies at or below the ${lineNm} nm line and is ` +
    'removed (no photon is emitted bluer than the one absorbed); the rest is renormalised.' +
    (sized
      ? ' Only the larger dots of the ensemble absorb this line: expect the measured peak to the red of the nominal ' +
        'one.'
      : '')
  );
}

/** Molar extinction (M⁻¹ cm⁻¹) of a resolved dot at any wavelength (0 where the model has no finite value). */
export function extinctionAtNm(dot: Pick<ResolvedDot, 'absorption'>, wavelengthNm: number): number {
  const eps = modelExtinctionAtNm(dot.absorption, wavelengthNm);
  return Number.isFinite(eps) ? eps : 0;
}
