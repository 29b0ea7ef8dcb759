import { SpectraError } from '../../core/errors';
import type { MaterialId } from '../../core/panel';
import { evToNm, nmToEv } from '../../core/units';
import { SIZE_LAWS, type SizeLaw } from './laws';
import { BULK_PARAMS, type SizedMaterialId } from '../materials/params';
import { firstExcitonEvForEmissionEv, stokesShiftEv } from './stokes';

/** True for materials with a size law (every material except carbon dots and custom probes). */
export function isSizedMaterial(material: string): material is SizedMaterialId {
  return Object.prototype.hasOwnProperty.call(BULK_PARAMS, material);
}

/** The size law of a sized material; `invalid_input` naming `material` for carbon and custom. */
export function sizeLawOf(material: MaterialId): SizeLaw {
  if (!isSizedMaterial(material)) {
    throw new SpectraError(
      'invalid_input',
      `${material} has no size law: give emissionPeakNm (carbon) or measuredEmission (custom)`,
      ['material'],
    );
  }
  return SIZE_LAWS[material];
}

function checkDiameter(material: SizedMaterialId, diameterNm: number): void {
  const [lo, hi] = SIZE_LAWS[material].diameterRangeNm;
  if (!(diameterNm >= lo && diameterNm <= hi)) {
    throw new SpectraError(
      'out_of_range',
      `diameterNm ${diameterNm} is outside the ${material} size law's range ${lo}–${hi} nm`,
      ['diameterNm'],
    );
  }
}

/** First-exciton absorption peak (nm) of a dot of core size `diameterNm` (see the material's sizeMeaning). */
export function firstExcitonNmForDiameter(material: MaterialId, diameterNm: number): number {
  const law = sizeLawOf(material);
  checkDiameter(material as SizedMaterialId, diameterNm);
  return evToNm(law.firstExcitonEv(diameterNm));
}

/**
 * Emission peak (nm) of a dot of core size `diameterNm`: the size law's first exciton, red-shifted by the
 * size-dependent Stokes shift (stokes.ts).
 * @example emissionPeakForDiameterNm('cdse', 4) // ≈ 600
 */
export function emissionPeakForDiameterNm(material: MaterialId, diameterNm: number): number {
  return sizedDotPeaks(material, diameterNm).emissionPeakNm;
}

/**
 * First-exciton energy (eV) and emission peak (nm) of a dot of core size `diameterNm`, from one evaluation of the
 * size law (resolveDot needs both). Same checks and errors as emissionPeakForDiameterNm.
 */
export function sizedDotPeaks(
  material: MaterialId,
  diameterNm: number,
): { firstExcitonEv: number; emissionPeakNm: number } {
  const law = sizeLawOf(material);
  checkDiameter(material as SizedMaterialId, diameterNm);
  const e1 = law.firstExcitonEv(diameterNm);
  return { firstExcitonEv: e1, emissionPeakNm: evToNm(e1 - stokesShiftEv(material as SizedMaterialId, e1)) };
}

// The reach of each size law, computed on first use: every emissionPeakNm input is checked against it.
const ranges = new Map<MaterialId, readonly [number, number]>();

function rangeOf(material: MaterialId): readonly [number, number] {
  let range = ranges.get(material);
  if (!range) {
    const [lo, hi] = sizeLawOf(material).diameterRangeNm;
    range = [emissionPeakForDiameterNm(material, lo), emissionPeakForDiameterNm(material, hi)];
    ranges.set(material, range);
  }
  return range;
}

/** Emission peaks (nm) the size law reaches over its diameter range, [bluest, reddest]. */
export function emissionRangeForMaterialNm(material: MaterialId): [number, number] {
  sizeLawOf(material); // the typed error for unknown, carbon and custom materials
  const [minNm, maxNm] = rangeOf(material);
  return [minNm, maxNm];
}

/**
 * Core size (nm) of the dot that emits at `emissionPeakNm`: the inverse of emissionPeakForDiameterNm (closed form for
 * the Stokes step, then the size law's own inverse). Outside the reach: `out_of_range` naming the reachable range.
 */
export function diameterForEmissionPeakNm(
  material: MaterialId,
  emissionPeakNm: number,
  path: (string | number)[] = ['emissionPeakNm'],
): number {
  const law = sizeLawOf(material);
  const [minNm, maxNm] = rangeOf(material);
  // Allow a hair of round-off at the ends so the range's own end points resolve.
  if (!(emissionPeakNm >= minNm - 1e-9 && emissionPeakNm <= maxNm + 1e-9)) {
    throw new SpectraError(
      'out_of_range',
      `an emission peak of ${emissionPeakNm} nm is out of reach for ${material}: its size law reaches ` +
        `${Math.ceil(minNm)}–${Math.floor(maxNm)} nm (diameters ${law.diameterRangeNm[0]}–${law.diameterRangeNm[1]} ` +
        `nm)`,
      path,
    );
  }
  const e1 = firstExcitonEvForEmissionEv(material as SizedMaterialId, nmToEv(emissionPeakNm));
  const [lo, hi] = law.diameterRangeNm;
  return Math.min(hi, Math.max(lo, law.diameterNm(e1)));
}
