import { modelExtinctionAtNm, sampleExtinction, type AbsorptionModel } from './absorption';
import { SpectraError } from './errors';
import { DEFAULT_GRID, spectrumAtNm, type SampledSpectrum, type WavelengthGrid } from './grid';
import { centerEvForPeakNm, fwhmNmOfLine, sampleGaussianLine } from './lineshape';
import { resolveCarbon, resolveCustom, resolveSized, type ModelPart } from './materials/resolve';
import { optionalNumber } from './materials/inputs';
import { requireTable, resampleMeasuredEmission } from './materials/measured';
import { isSizedMaterial, requireMaterialId } from './materials/sizing';
import type { MaterialId } from './panel';

/** What a probe is, as the API and panels give it (see api-v1.md "One dot"). */
export interface DotInput {
  material: MaterialId;
  emissionPeakNm?: number;
  diameterNm?: number;
  sizeDispersionPct?: number;
  fwhmNm?: number;
  quantumYield?: number;
  measuredEmission?: { points: [number, number][] };
  extinction?: { points: [number, number][] };
  /** For extinctionAtExcitation and the carbon-dot excitation dependence. */
  excitationNm?: number;
}

/** A probe resolved to spectra. `emission` has unit area on its grid; `absorption` is ε in M⁻¹ cm⁻¹ on the same grid. */
export interface ResolvedDot {
  material: MaterialId;
  diameterNm: number | null;
  firstExcitonNm: number | null;
  emissionPeakNm: number;
  fwhmNm: number;
  quantumYield: number;
  extinctionFirstExciton: number | null;
  extinctionAtExcitation: number | null;
  /** Which sizing model answered: the law's name, 'measured' for custom probes, 'measured emission; size by …'. */
  model: string;
  measured: { emission: boolean; extinction: boolean };
  warnings: string[];
  emission: SampledSpectrum;
  absorption: SampledSpectrum;
}

// The exact absorption model behind each resolved dot (so extinctionAtNm is not limited to the grid), and its grid.
const absorptionModels = new WeakMap<ResolvedDot, { model: AbsorptionModel; grid: WavelengthGrid }>();

// Sampling the absorption on the grid costs as much as the emission, and a panel evaluation never reads it (it uses
// extinctionAtNm, the exact model): `absorption` is an accessor that samples on first read, then becomes a plain data
// property. Enumerable, so spreading or serialising a dot includes it as before. Module-level functions and one shared
// descriptor: nothing is allocated per dot for this.
function readAbsorption(this: ResolvedDot): SampledSpectrum {
  const { model, grid } = absorptionModels.get(this)!;
  const absorption = sampleExtinction(model, grid);
  // A frozen or sealed dot cannot take the data property: it is sampled again on each read instead.
  if (!Object.isSealed(this)) Object.defineProperty(this, 'absorption', { value: absorption, writable: true, enumerable: true, configurable: true });
  return absorption;
}

function writeAbsorption(this: ResolvedDot, value: SampledSpectrum): void {
  Object.defineProperty(this, 'absorption', { value, writable: true, enumerable: true, configurable: true });
}

const LAZY_ABSORPTION: PropertyDescriptor = { get: readAbsorption, set: writeAbsorption, enumerable: true, configurable: true };

/**
 * Resolves a probe description to its size, peaks, width and spectra on `options.grid` (default 300–1000 nm, 1 nm).
 * Measured data come first: a measured emission replaces the model's shape (peak and FWHM read from it), a measured
 * extinction replaces the model's absorption. Bad input throws SpectraError naming the field.
 * @example resolveDot({ material: 'cdse', emissionPeakNm: 605 }).diameterNm // ≈ 4.2
 */
export function resolveDot(input: DotInput, options: { grid?: WavelengthGrid } = {}): ResolvedDot {
  if (typeof input !== 'object' || input === null) throw new SpectraError('invalid_input', 'a dot must be an object', []);
  const raw = input as unknown as Record<string, unknown>;
  const material = requireMaterialId(raw.material);
  const grid = options.grid ?? DEFAULT_GRID;
  const excitationNm = optionalNumber(raw, 'excitationNm', 0, 10000, ' nm', { minExclusive: true });
  const quantumYield = optionalNumber(raw, 'quantumYield', 0, 1, '');
  const measuredEm = input.measuredEmission === undefined ? null
    : resampleMeasuredEmission(input.measuredEmission?.points, grid, ['measuredEmission', 'points']);
  const extinctionTable = input.extinction === undefined ? null : requireTable(input.extinction?.points, ['extinction', 'points']);

  const part: ModelPart = isSizedMaterial(material) ? resolveSized(material, raw, measuredEm?.peakNm)
    : material === 'carbon' ? resolveCarbon(raw, excitationNm, measuredEm?.peakNm)
    : resolveCustom(raw, measuredEm);
  const warnings = [...part.warnings, ...(measuredEm?.warnings ?? [])];

  let emission: SampledSpectrum;
  let emissionPeakNm: number;
  let fwhmNm: number;
  if (measuredEm) {
    ({ spectrum: emission, peakNm: emissionPeakNm, fwhmNm } = measuredEm);
    if (part.peakNm !== null && Math.abs(part.peakNm - emissionPeakNm) > 10) {
      warnings.push(`The measured emission peaks at ${emissionPeakNm.toFixed(1)} nm, ${Math.abs(part.peakNm - emissionPeakNm).toFixed(1)} nm from the model's ${part.peakNm.toFixed(1)} nm; the measured spectrum is used.`);
    }
  } else {
    const centerEv = centerEvForPeakNm(part.peakNm!, part.fwhmEv!);
    const line = sampleGaussianLine(grid, centerEv, part.fwhmEv!);
    if (line.areaOnGrid < 0.99) warnings.push(`Only ${(100 * line.areaOnGrid).toFixed(1)} % of the emission lies on the wavelength grid; the spectrum is renormalised to unit area on the grid.`);
    emission = line.spectrum;
    emissionPeakNm = part.peakNm!;
    fwhmNm = fwhmNmOfLine(centerEv, part.fwhmEv!);
  }

  const absorptionModel: AbsorptionModel = extinctionTable ? { type: 'table', points: extinctionTable } : part.absorption;
  if (!extinctionTable && part.absorptionWarning) warnings.push(part.absorptionWarning);
  if (extinctionTable && extinctionTable.some((p) => p[1] < 0)) warnings.push('Measured extinction has negative values; they are used as given.');
  const firstExcitonNm = part.firstExcitonNm;
  const dot = {
    material,
    diameterNm: part.diameterNm,
    firstExcitonNm,
    emissionPeakNm,
    fwhmNm,
    quantumYield: quantumYield ?? part.typicalQuantumYield,
    extinctionFirstExciton: firstExcitonNm === null ? null : modelExtinctionAtNm(absorptionModel, firstExcitonNm),
    extinctionAtExcitation: excitationNm === undefined ? null : modelExtinctionAtNm(absorptionModel, excitationNm),
    model: measuredEm && material !== 'custom' ? `measured emission; size by ${part.model}` : part.model,
    measured: { emission: measuredEm !== null, extinction: extinctionTable !== null },
    warnings,
    emission,
  } as ResolvedDot;
  Object.defineProperty(dot, 'absorption', LAZY_ABSORPTION);
  absorptionModels.set(dot, { model: absorptionModel, grid });
  return dot;
}

/**
 * Molar extinction (M⁻¹ cm⁻¹) of a resolved dot at any wavelength: from its exact absorption model when the dot came
 * from resolveDot in this process, else interpolated on its sampled absorption (0 off the grid).
 */
export function extinctionAtNm(dot: ResolvedDot, wavelengthNm: number): number {
  const exact = absorptionModels.get(dot);
  const eps = exact ? modelExtinctionAtNm(exact.model, wavelengthNm) : spectrumAtNm(dot.absorption, wavelengthNm);
  return Number.isFinite(eps) ? eps : 0;
}

