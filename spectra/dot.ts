/**
 * One probe resolved to its spectra (the public form). The work is dot-core.ts's; this file shapes its answer as a
 * ResolvedDot and keeps the exact absorption model beside it for extinctionAtNm.
 */
import { modelExtinctionAtNm, sampleExtinction, type AbsorptionModel } from './absorption';
import { DEFAULT_GRID, spectrumAtNm, type SampledSpectrum, type WavelengthGrid } from './grid';
import { coreEmissionValues, resolveDotCore, type DotCore, type DotFields, type DotInput } from './dot-core';

export type { DotInput } from './dot-core';

/** A probe resolved to spectra. `emission` has unit area on its grid; `absorption` is ε in M⁻¹ cm⁻¹ on the same grid. */
export interface ResolvedDot extends DotFields {
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
  if (!Object.isSealed(this))
    Object.defineProperty(this, 'absorption', {
      value: absorption,
      writable: true,
      enumerable: true,
      configurable: true,
    });
  return absorption;
}

function writeAbsorption(this: ResolvedDot, value: SampledSpectrum): void {
  Object.defineProperty(this, 'absorption', { value, writable: true, enumerable: true, configurable: true });
}

const LAZY_ABSORPTION: PropertyDescriptor = {
  get: readAbsorption,
  set: writeAbsorption,
  enumerable: true,
  configurable: true,
};

/**
 * The ResolvedDot of a resolved core: its scalar fields, its emission on the whole grid and the lazily sampled
 * absorption. Made once per core and kept on it, so a cached core gives the same dot object every time (its arrays
 * and lists are the core's: they must not be changed).
 */
export function dotFromCore(core: DotCore): ResolvedDot {
  if (core.dot) return core.dot as ResolvedDot;
  const { grid } = core;
  const dot = {
    material: core.material,
    diameterNm: core.diameterNm,
    firstExcitonNm: core.firstExcitonNm,
    emissionPeakNm: core.emissionPeakNm,
    fwhmNm: core.fwhmNm,
    quantumYield: core.quantumYield,
    extinctionFirstExciton: core.extinctionFirstExciton,
    extinctionAtExcitation: core.extinctionAtExcitation,
    model: core.model,
    measured: core.measured,
    warnings: core.warnings,
    emission: { startNm: grid.startNm, stepNm: grid.stepNm, values: coreEmissionValues(core) },
  } as ResolvedDot;
  Object.defineProperty(dot, 'absorption', LAZY_ABSORPTION);
  absorptionModels.set(dot, { model: core.absorptionModel, grid });
  core.dot = dot;
  return dot;
}

/**
 * Resolves a probe description to its size, peaks, width and spectra on `options.grid` (default 300–1000 nm, 1 nm).
 * Measured data come first: a measured emission replaces the model's shape (peak and FWHM read from it), a measured
 * extinction replaces the model's absorption. Bad input throws SpectraError naming the field.
 * @example resolveDot({ material: 'cdse', emissionPeakNm: 605 }).diameterNm // ≈ 4.2
 */
export function resolveDot(input: DotInput, options: { grid?: WavelengthGrid } = {}): ResolvedDot {
  return dotFromCore(resolveDotCore(input, options.grid ?? DEFAULT_GRID));
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
