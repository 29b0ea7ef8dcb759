/**
 * A resolved probe before it becomes a ResolvedDot: every scalar field, the emission as its nonzero window and the
 * exact absorption model. Panel evaluation works on this form (no grid-long arrays, nothing kept in a WeakMap:
 * both cost far more in garbage collection than in arithmetic when dots are resolved from scratch); resolveDot turns
 * it into the public ResolvedDot.
 */
import { modelExtinctionAtNm, type AbsorptionModel } from './absorption';
import { SpectraError } from './errors';
import type { WavelengthGrid } from './grid';
import { centerEvForPeakNm, fwhmNmOfLine } from './lineshape';
import { sampleGaussianWindow } from './line-sampling';
import { gridEmissionWindow, lineEmissionWindow, type EmissionWindow } from './emission-window';
import { resolveCarbon, resolveCustom, resolveSized, type ModelPart } from './materials/resolve';
import { optionalNumber } from './materials/inputs';
import { requireTable, resampleMeasuredEmission } from './materials/measured';
import { isSizedMaterial, requireMaterialId } from './materials/sizing';
import type { MaterialId, ProbeSpec } from './panel';

/** What a probe is, as the API and panels give it (see api-v1.md "One dot"). */
export interface DotInput extends Pick<
  ProbeSpec,
  | 'material'
  | 'emissionPeakNm'
  | 'diameterNm'
  | 'sizeDispersionPct'
  | 'fwhmNm'
  | 'quantumYield'
  | 'measuredEmission'
  | 'extinction'
> {
  /** For extinctionAtExcitation and the carbon-dot excitation dependence. */
  excitationNm?: number;
}

/** The scalar fields of a resolved probe, shared by the public ResolvedDot and the internal DotCore. */
export interface DotFields {
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
}

/** A resolved probe: ResolvedDot's scalar fields, its emission window (unit area on `grid`) and absorption model. */
export interface DotCore extends DotFields {
  grid: WavelengthGrid;
  emissionWindow: EmissionWindow;
  /** The grid-long emission: the measured array, or made from the window on first need (see coreEmissionValues). */
  emissionValues: Float64Array | null;
  absorptionModel: AbsorptionModel;
  /** The public ResolvedDot made from this core, once asked for (dot.ts dotFromCore). */
  dot: object | null;
}

/** The core's emission on the whole grid, made once and kept (callers must not change it). */
export function coreEmissionValues(core: DotCore): Float64Array {
  if (!core.emissionValues) {
    const { from, to, offset, values } = core.emissionWindow;
    const out = new Float64Array(core.grid.count);
    for (let i = from; i < to; i++) out[i] = values[i - offset];
    core.emissionValues = out;
  }
  return core.emissionValues;
}

/** ε (M⁻¹ cm⁻¹) of a core at any wavelength, from its exact absorption model (0 where the model is not finite). */
export function coreExtinctionAtNm(core: DotCore, wavelengthNm: number): number {
  const eps = modelExtinctionAtNm(core.absorptionModel, wavelengthNm);
  return Number.isFinite(eps) ? eps : 0;
}

/**
 * Resolves a probe description on `grid` (resolveDot's work without building the ResolvedDot). Bad input throws
 * SpectraError naming the field.
 */
export function resolveDotCore(input: DotInput, grid: WavelengthGrid): DotCore {
  if (typeof input !== 'object' || input === null)
    throw new SpectraError('invalid_input', 'a dot must be an object', []);
  const raw = input as unknown as Record<string, unknown>;
  const material = requireMaterialId(raw.material);
  const excitationNm = optionalNumber(raw, 'excitationNm', 0, 10000, ' nm', { minExclusive: true });
  const quantumYield = optionalNumber(raw, 'quantumYield', 0, 1, '');
  const measuredEm =
    input.measuredEmission === undefined
      ? null
      : resampleMeasuredEmission(input.measuredEmission?.points, grid, ['measuredEmission', 'points']);
  const extinctionTable =
    input.extinction === undefined ? null : requireTable(input.extinction?.points, ['extinction', 'points']);

  const part: ModelPart = isSizedMaterial(material)
    ? resolveSized(material, raw, measuredEm?.peakNm)
    : material === 'carbon'
      ? resolveCarbon(raw, excitationNm, measuredEm?.peakNm)
      : resolveCustom(raw, measuredEm);
  const warnings = [...part.warnings, ...(measuredEm?.warnings ?? [])];

  let emissionWindow: EmissionWindow;
  let emissionValues: Float64Array | null = null;
  let emissionPeakNm: number;
  let fwhmNm: number;
  if (measuredEm) {
    ({ peakNm: emissionPeakNm, fwhmNm } = measuredEm);
    emissionValues = measuredEm.spectrum.values;
    emissionWindow = gridEmissionWindow(emissionValues);
    if (part.peakNm !== null && Math.abs(part.peakNm - emissionPeakNm) > 10) {
      warnings.push(
        `The measured emission peaks at ${emissionPeakNm.toFixed(1)} nm, ${Math.abs(part.peakNm - emissionPeakNm).toFixed(1)} nm from the model's ${part.peakNm.toFixed(1)} nm; the measured spectrum is used.`,
      );
    }
  } else {
    const centerEv = centerEvForPeakNm(part.peakNm!, part.fwhmEv!);
    const line = sampleGaussianWindow(grid, centerEv, part.fwhmEv!);
    if (line.areaOnGrid < 0.99)
      warnings.push(
        `Only ${(100 * line.areaOnGrid).toFixed(1)} % of the emission lies on the wavelength grid; the spectrum is renormalised to unit area on the grid.`,
      );
    emissionWindow = lineEmissionWindow(line.window.from, line.window.values);
    emissionPeakNm = part.peakNm!;
    fwhmNm = fwhmNmOfLine(centerEv, part.fwhmEv!);
  }

  const absorptionModel: AbsorptionModel = extinctionTable
    ? { type: 'table', points: extinctionTable }
    : part.absorption;
  if (!extinctionTable && part.absorptionWarning) warnings.push(part.absorptionWarning);
  if (extinctionTable && extinctionTable.some((p) => p[1] < 0))
    warnings.push('Measured extinction has negative values; they are used as given.');
  const firstExcitonNm = part.firstExcitonNm;
  return {
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
    grid,
    emissionWindow,
    emissionValues,
    absorptionModel,
    dot: null,
  };
}
