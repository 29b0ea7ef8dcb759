import { BULK_PARAMS, type SizedMaterialId } from '../materials/params';

/**
 * Ensemble Stokes shift (first-exciton absorption peak to emission peak), eV, modelled as
 * ΔE = 0.010 eV + 0.12 × (E₁ − Eg): a floor plus a share of the confinement energy, so smaller dots shift more.
 * Basis: for CdSe the ensemble shift is ≈ 10–25 nm (20–80 meV), larger for smaller dots (from memory, unverified);
 * its size dependence comes from the band-edge exciton fine structure (Efros, Rosen, Kuno, Nirmal, Norris, Bawendi,
 * Phys. Rev. B 1996, 54, 4843; from memory) plus size selection in the ensemble. The coefficients are this tool's
 * choice to reproduce that span over the Yu CdSe range (≈ 20 nm at 2.5 nm, ≈ 10 nm at 8 nm) and are applied to the
 * other materials by analogy: an approximation, not a published law.
 */
export const STOKES_MODEL = { floorEv: 0.01, confinementShare: 0.12 } as const;

/** Stokes shift (eV) of a dot whose first exciton lies at `firstExcitonEv`. */
export function stokesShiftEv(material: SizedMaterialId, firstExcitonEv: number): number {
  const confinementEv = Math.max(0, firstExcitonEv - BULK_PARAMS[material].bandGapEv);
  return STOKES_MODEL.floorEv + STOKES_MODEL.confinementShare * confinementEv;
}

/** First-exciton energy (eV) whose emission, after the Stokes shift, lies at `emissionEv` (exact inverse). */
export function firstExcitonEvForEmissionEv(material: SizedMaterialId, emissionEv: number): number {
  const gap = BULK_PARAMS[material].bandGapEv;
  const e1 =
    (emissionEv + STOKES_MODEL.floorEv - STOKES_MODEL.confinementShare * gap) / (1 - STOKES_MODEL.confinementShare);
  // Below the gap the confinement term is clamped at zero, so the shift is only the floor.
  return e1 >= gap ? e1 : emissionEv + STOKES_MODEL.floorEv;
}
