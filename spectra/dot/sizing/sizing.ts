import { SpectraError } from '../../core/errors';
import type { MaterialId, ShellLayer, SizingModelId } from '../../core/panel';
import { evToNm, nmToEv } from '../../core/units';
import { SIZE_LAWS, sizeLawFor, type SizeLaw } from './laws';
import { BULK_PARAMS, type SizedMaterialId } from '../materials/params';
import { shellShiftEv } from '../shells/shell';
import { firstExcitonEvForEmissionEv, stokesShiftEv } from './stokes';
import { smoothSizeFit } from './width';

/** What besides the material sets a sized dot's colour: its shell layers and, for CdSe, the sizing curve. */
export interface SizingOptions {
  shell?: readonly ShellLayer[];
  sizingModel?: SizingModelId;
}

/** True for materials with a size law (every material except carbon dots, custom probes and dyes). */
export function isSizedMaterial(material: string): material is SizedMaterialId {
  return Object.prototype.hasOwnProperty.call(BULK_PARAMS, material);
}

/** The size law of a sized material; `invalid_input` naming `material` for carbon and custom. */
export function sizeLawOf(material: MaterialId, sizingModel?: SizingModelId): SizeLaw {
  if (!isSizedMaterial(material)) {
    throw new SpectraError(
      'invalid_input',
      `${material} has no size law: give emissionPeakNm (carbon) or measuredEmission (custom)`,
      ['material'],
    );
  }
  return sizeLawFor(material, sizingModel);
}

function checkDiameter(law: SizeLaw, material: MaterialId, diameterNm: number): void {
  const [lo, hi] = law.diameterRangeNm;
  if (!(diameterNm >= lo && diameterNm <= hi)) {
    throw new SpectraError(
      'out_of_range',
      `diameterNm ${diameterNm} is outside the ${material} size law's range ${lo}–${hi} nm`,
      ['diameterNm'],
    );
  }
}

/** First-exciton energy (eV) of a core of size `diameterNm` under its shell, by an already checked law. */
function firstExcitonEvOf(law: SizeLaw, material: SizedMaterialId, diameterNm: number, options: SizingOptions): number {
  const bare = law.firstExcitonEv(diameterNm);
  const shell = options.shell ?? [];
  return shell.length === 0 ? bare : bare - shellShiftEv(material, diameterNm, shell, smoothSizeFit(law));
}

/** First-exciton absorption peak (nm) of a dot of core size `diameterNm` (see the material's sizeMeaning). */
export function firstExcitonNmForDiameter(
  material: MaterialId,
  diameterNm: number,
  options: SizingOptions = {},
): number {
  return evToNm(sizedDotPeaks(material, diameterNm, options).firstExcitonEv);
}

/**
 * Emission peak (nm) of a dot of core size `diameterNm`: the size law's first exciton (red-shifted by any shell),
 * red-shifted by the size-dependent Stokes shift (stokes.ts).
 * @example emissionPeakForDiameterNm('cdse', 4) // ≈ 600
 */
export function emissionPeakForDiameterNm(
  material: MaterialId,
  diameterNm: number,
  options: SizingOptions = {},
): number {
  return sizedDotPeaks(material, diameterNm, options).emissionPeakNm;
}

/**
 * First-exciton energy (eV) and emission peak (nm) of a dot of core size `diameterNm`, from one evaluation of the
 * size law (resolveDot needs both). Same checks and errors as emissionPeakForDiameterNm.
 */
export function sizedDotPeaks(
  material: MaterialId,
  diameterNm: number,
  options: SizingOptions = {},
): { firstExcitonEv: number; emissionPeakNm: number } {
  const law = sizeLawOf(material, options.sizingModel);
  checkDiameter(law, material, diameterNm);
  const sized = material as SizedMaterialId;
  const e1 = firstExcitonEvOf(law, sized, diameterNm, options);
  return { firstExcitonEv: e1, emissionPeakNm: evToNm(e1 - stokesShiftEv(sized, e1)) };
}

// The reach of each bare size law, computed on first use: every emissionPeakNm input is checked against it.
const ranges = new Map<SizeLaw, readonly [number, number]>();

function rangeOf(material: MaterialId, options: SizingOptions): readonly [number, number] {
  const law = sizeLawOf(material, options.sizingModel);
  const bare = (options.shell ?? []).length === 0;
  let range = bare ? ranges.get(law) : undefined;
  if (!range) {
    const [lo, hi] = law.diameterRangeNm;
    range = [emissionPeakForDiameterNm(material, lo, options), emissionPeakForDiameterNm(material, hi, options)];
    if (bare) ranges.set(law, range);
  }
  return range;
}

/** Emission peaks (nm) the size law reaches over its diameter range (under the shell, if any), [bluest, reddest]. */
export function emissionRangeForMaterialNm(material: MaterialId, options: SizingOptions = {}): [number, number] {
  const [minNm, maxNm] = rangeOf(material, options);
  return [minNm, maxNm];
}

/**
 * Core size (nm) of the dot that emits at `emissionPeakNm`: the inverse of emissionPeakForDiameterNm. A bare core uses
 * the closed form of the Stokes step, then the size law's own inverse; under a shell, the core is found by bisection
 * (the core/shell peak moves monotonically with the core). Outside the reach: `out_of_range` naming the reachable
 * range.
 */
export function diameterForEmissionPeakNm(
  material: MaterialId,
  emissionPeakNm: number,
  path: (string | number)[] = ['emissionPeakNm'],
  options: SizingOptions = {},
): number {
  const law = sizeLawOf(material, options.sizingModel);
  const [minNm, maxNm] = rangeOf(material, options);
  const shelled = (options.shell ?? []).length > 0;
  // Allow a hair of round-off at the ends so the range's own end points resolve.
  if (!(emissionPeakNm >= minNm - 1e-9 && emissionPeakNm <= maxNm + 1e-9)) {
    throw new SpectraError(
      'out_of_range',
      `an emission peak of ${emissionPeakNm} nm is out of reach for ${material}${shelled ? ' with this shell' : ''}: ` +
        `its size law reaches ${Math.ceil(minNm)}–${Math.floor(maxNm)} nm (core diameters ` +
        `${law.diameterRangeNm[0]}–${law.diameterRangeNm[1]} nm)`,
      path,
    );
  }
  let [lo, hi] = law.diameterRangeNm;
  if (!shelled) {
    const e1 = firstExcitonEvForEmissionEv(material as SizedMaterialId, nmToEv(emissionPeakNm));
    return Math.min(hi, Math.max(lo, law.diameterNm(e1)));
  }
  // Bisection on the core: the peak grows with the core across the law's range.
  for (let i = 0; i < 200 && hi - lo > 1e-12; i++) {
    const mid = 0.5 * (lo + hi);
    if (emissionPeakForDiameterNm(material, mid, options) < emissionPeakNm) lo = mid;
    else hi = mid;
  }
  return 0.5 * (lo + hi);
}

/** Whether a material's size law is illustrative only (no published law: GaAs). */
export function isIllustrativeMaterial(material: MaterialId): boolean {
  return isSizedMaterial(material) && SIZE_LAWS[material].illustrative;
}
