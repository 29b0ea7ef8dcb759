/**
 * Empirical sizing curves and first-exciton extinction laws of CdTe, CdSe and CdS nanocrystals:
 * Yu, Qu, Guo, Peng, Chem. Mater. 2003, 15, 2854 (DOI 10.1021/cm034081k), equations 1–6.
 * D = diameter (nm) from λ = first-exciton absorption peak (nm); ε per mole of particles at the first exciton, M⁻¹ cm⁻¹.
 * Coefficients: status T (independent transcriptions agree digit for digit; the paper itself not read here).
 * The paper states roughly ±10–15 % on ε. A later CdSe calibration (Jasieniak, Smith, van Embden, Mulvaney, Califano,
 * J. Phys. Chem. C 2009, 113, 19468) differs by up to ~0.25 nm in D and up to ~66 % in ε below 4 nm: published
 * sources disagree, and the tool follows Yu 2003 for all three materials so they stay mutually consistent.
 */
export interface YuCurve {
  /** Polynomial coefficients of D(λ), highest power first. */
  sizeCoefficients: readonly number[];
  /** ε = prefactor · D^exponent, M⁻¹ cm⁻¹ with D in nm. */
  extinctionPrefactor: number;
  extinctionExponent: number;
  /** Conservative validity (science notes, C): outside it the polynomials give nonsense. */
  diameterRangeNm: readonly [number, number];
  /** λ bracket (nm) inside which D(λ) rises monotonically and spans the diameter range (C, checked numerically). */
  bracketNm: readonly [number, number];
}

/** The three Yu–Qu–Guo–Peng curves. */
export const YU_2003 = {
  cdte: {
    sizeCoefficients: [9.8127e-7, -1.7147e-3, 1.0064, -194.84],
    extinctionPrefactor: 10043,
    extinctionExponent: 2.12,
    diameterRangeNm: [2, 7],
    bracketNm: [450, 750],
  },
  cdse: {
    sizeCoefficients: [1.6122e-9, -2.6575e-6, 1.6242e-3, -0.4277, 41.57],
    extinctionPrefactor: 5857,
    extinctionExponent: 2.65,
    diameterRangeNm: [1.5, 8],
    bracketNm: [350, 700],
  },
  cds: {
    sizeCoefficients: [-6.6521e-8, 1.9557e-4, -9.2352e-2, 13.29],
    extinctionPrefactor: 21536,
    extinctionExponent: 2.3,
    diameterRangeNm: [1.5, 5.5],
    bracketNm: [280, 520],
  },
} as const satisfies Record<string, YuCurve>;

/** Materials with a Yu–Qu–Guo–Peng curve. */
export type YuMaterialId = keyof typeof YU_2003;

/** D(λ) of the published polynomial, nm (Horner's rule). */
export function yuDiameterNm(curve: YuCurve, firstExcitonNm: number): number {
  let d = 0;
  for (const c of curve.sizeCoefficients) d = d * firstExcitonNm + c;
  return d;
}

/**
 * First-exciton wavelength (nm) whose D(λ) equals `diameterNm`, by bisection on a bracket where D rises monotonically
 * (checked for all three curves over their ranges; the CdTe curve is nearly flat between ~560 and 610 nm, so λ is
 * ill-conditioned there: a 0.1 nm change in D moves λ by ~10 nm). 60 halvings of a ≤ 350 nm bracket reach well below 1e-9 nm.
 */
export function yuFirstExcitonNm(curve: YuCurve, diameterNm: number): number {
  let [lo, hi] = curve.bracketNm;
  for (let i = 0; i < 60; i++) {
    const mid = 0.5 * (lo + hi);
    if (yuDiameterNm(curve, mid) < diameterNm) lo = mid;
    else hi = mid;
  }
  return 0.5 * (lo + hi);
}

/** ε at the first exciton, M⁻¹ cm⁻¹ (Yu et al. 2003 power law). */
export function yuExtinctionFirstExciton(curve: YuCurve, diameterNm: number): number {
  return curve.extinctionPrefactor * Math.pow(diameterNm, curve.extinctionExponent);
}
