import { SpectraError, requireFinite } from '../errors';
import { MATERIAL_IDS, type MaterialId } from '../panel';
import { evToNm, nmToEv } from '../units';
import { SIZE_LAWS, type SizeLaw } from './laws';
import { BULK_PARAMS, type SizedMaterialId } from './params';
import { firstExcitonEvForEmissionEv, stokesShiftEv } from './stokes';

/** True for materials with a size law (every material except carbon dots and custom probes). */
export function isSizedMaterial(material: string): material is SizedMaterialId {
  return Object.prototype.hasOwnProperty.call(BULK_PARAMS, material);
}

/** Throws `unknown_material` unless `material` is one of the contract's ids. */
export function requireMaterialId(material: unknown, path: (string | number)[] = ['material']): MaterialId {
  if (typeof material !== 'string' || !(MATERIAL_IDS as readonly string[]).includes(material)) {
    throw new SpectraError(
      'unknown_material',
      `unknown material ${JSON.stringify(material)}; known: ${MATERIAL_IDS.join(', ')}`,
      path,
    );
  }
  return material as MaterialId;
}

/** The size law of a sized material; `invalid_input` naming `material` for carbon and custom. */
export function sizeLawOf(material: unknown): SizeLaw {
  const id = requireMaterialId(material);
  if (!isSizedMaterial(id)) {
    throw new SpectraError(
      'invalid_input',
      `${id} has no size law: give emissionPeakNm (carbon) or measuredEmission (custom)`,
      ['material'],
    );
  }
  return SIZE_LAWS[id];
}

function checkDiameter(material: SizedMaterialId, diameterNm: number): void {
  requireFinite(diameterNm, 'diameterNm');
  if (diameterNm <= 0)
    throw new SpectraError('invalid_input', `diameterNm must be above 0 nm, got ${diameterNm}`, ['diameterNm']);
  const [lo, hi] = SIZE_LAWS[material].diameterRangeNm;
  if (diameterNm < lo || diameterNm > hi) {
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
  requireFinite(emissionPeakNm, 'emissionPeakNm', path);
  if (emissionPeakNm <= 0)
    throw new SpectraError('invalid_input', `emissionPeakNm must be above 0 nm, got ${emissionPeakNm}`, path);
  const [minNm, maxNm] = rangeOf(material);
  // Allow a hair of round-off at the ends so the range's own end points resolve.
  if (emissionPeakNm < minNm - 1e-9 || emissionPeakNm > maxNm + 1e-9) {
    throw new SpectraError(
      'out_of_range',
      `an emission peak of ${emissionPeakNm} nm is out of reach for ${material}: its size law reaches ${Math.ceil(minNm)}–${Math.floor(maxNm)} nm (diameters ${law.diameterRangeNm[0]}–${law.diameterRangeNm[1]} nm)`,
      path,
    );
  }
  const e1 = firstExcitonEvForEmissionEv(material as SizedMaterialId, nmToEv(emissionPeakNm));
  const [lo, hi] = law.diameterRangeNm;
  return Math.min(hi, Math.max(lo, law.diameterNm(e1)));
}
