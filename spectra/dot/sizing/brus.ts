import { CONFINEMENT_EV_NM2, COULOMB_EV_NM, RYDBERG_EV } from '../../core/constants';
import { BULK_PARAMS, type SizedMaterialId } from '../materials/params';

/**
 * Brus effective-mass estimate of the lowest exciton energy of a spherical dot, eV:
 * E(R) = Eg + ħ²π²/(2R²μ) − 1.786 e²/(4πε0 εr R) − 0.248 E*Ry, with E*Ry = Ry μ/εr².
 * Brus, J. Chem. Phys. 1984, 80, 4403 (kinetic and Coulomb terms, ≈1.8 there); the 1.786 coefficient and the
 * −0.248 E*Ry correlation term: Kayanuma, Phys. Rev. B 1988, 38, 9797. R is half of `diameterNm`; for CsPbBr3 cubes
 * R is half the edge (the inscribed sphere: an approximation). The model ignores band non-parabolicity and finite
 * barriers, so it overestimates the gap of small dots (e.g. +0.43 eV for 4 nm CdSe against the empirical curve).
 */
export function brusGapEv(material: SizedMaterialId, diameterNm: number): number {
  const p = BULK_PARAMS[material];
  const radiusNm = diameterNm / 2;
  const kinetic = CONFINEMENT_EV_NM2 / (radiusNm * radiusNm * p.reducedMassRel);
  const coulomb = (1.786 * COULOMB_EV_NM) / (p.dielectricConstant * radiusNm);
  const correlation = (0.248 * RYDBERG_EV * p.reducedMassRel) / (p.dielectricConstant * p.dielectricConstant);
  return p.bandGapEv + kinetic - coulomb - correlation;
}

/**
 * Inverse of {@link brusGapEv}: the diameter (nm) whose Brus energy is `energyEv`, from the quadratic in 1/R
 * (A x² − B x + (Eg − C − E) = 0, larger root = smaller dot on the confined branch). NaN when no dot has that energy.
 */
export function brusDiameterNm(material: SizedMaterialId, energyEv: number): number {
  const p = BULK_PARAMS[material];
  const a = CONFINEMENT_EV_NM2 / p.reducedMassRel;
  const b = (1.786 * COULOMB_EV_NM) / p.dielectricConstant;
  const c = p.bandGapEv - (0.248 * RYDBERG_EV * p.reducedMassRel) / p.dielectricConstant ** 2 - energyEv;
  const disc = b * b - 4 * a * c;
  if (disc < 0) return Number.NaN;
  const x = (b + Math.sqrt(disc)) / (2 * a);
  return x > 0 ? 2 / x : Number.NaN;
}
