/**
 * The second CdSe calibration: Jasieniak, Smith, van Embden, Mulvaney, Califano, J. Phys. Chem. C 2009, 113, 19468.
 * - Size: d (nm) = 59.60816 − 0.54736 λ + 1.8873e-3 λ² − 2.85743e-6 λ³ + 1.62974e-9 λ⁴, λ the first-exciton
 *   absorption peak in nm (status T: secondary copies agree; the paper itself not read here).
 * - Extinction at the first exciton: ε = 155507 + 6.67054e13 · exp(−E₁/0.10551 eV), E₁ in eV (M: from memory,
 *   unverified; the tests mark it so).
 * Used over 2–8 nm, the sizes the calibration covers (M); the bracket keeps d(λ) monotone there (C, checked in the
 * tests). Against Yu et al. 2003 it differs in size by a few tenths of a nm and in extinction by far more for small
 * dots (the material's warning gives the figures, computed from both curves).
 */
import type { PolynomialCurve } from './yu2003';

export const JASIENIAK_2009 = {
  sizeCoefficients: [1.62974e-9, -2.85743e-6, 1.8873e-3, -0.54736, 59.60816],
  diameterRangeNm: [2, 8],
  bracketNm: [420, 720],
  extinctionOffset: 155507,
  extinctionPrefactor: 6.67054e13,
  extinctionDecayEv: 0.10551,
} as const satisfies PolynomialCurve & Record<string, unknown>;

/** ε at the first exciton (M⁻¹ cm⁻¹) of a CdSe dot whose first exciton lies at `firstExcitonEv` (Jasieniak 2009). */
export function jasieniakExtinctionFirstExciton(firstExcitonEv: number): number {
  const c = JASIENIAK_2009;
  return c.extinctionOffset + c.extinctionPrefactor * Math.exp(-firstExcitonEv / c.extinctionDecayEv);
}
