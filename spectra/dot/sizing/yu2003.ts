/**
 * Empirical sizing curves and first-exciton extinction laws of CdTe, CdSe and CdS nanocrystals:
 * Yu, Qu, Guo, Peng, Chem. Mater. 2003, 15, 2854 (DOI 10.1021/cm034081k), equations 1–6.
 * D = diameter (nm) from λ = first-exciton absorption peak (nm); ε per mole of particles at the first exciton, M⁻¹
 * cm⁻¹.
 * Coefficients: status T (independent secondary copies of the coefficients agree digit for digit; the paper itself not
 * read here).
 * The paper states roughly ±10–15 % on ε. A later CdSe calibration (jasieniak2009.ts) disagrees; the tool follows
 * Yu 2003 by default for all three materials so they stay mutually consistent, and offers the other for CdSe.
 */
/** A published sizing polynomial D(λ) with the sizes it is used over (Yu 2003, Jasieniak 2009). */
export interface PolynomialCurve {
  /** Polynomial coefficients of D(λ), highest power first. */
  sizeCoefficients: readonly number[];
  /** Conservative validity (docs/science.md, C): outside it the polynomials give nonsense. */
  diameterRangeNm: readonly [number, number];
  /** λ bracket (nm) inside which D(λ) rises monotonically and spans the diameter range (C, checked numerically). */
  bracketNm: readonly [number, number];
}

/** A Yu 2003 curve: the sizing polynomial plus its first-exciton extinction power law. */
export interface YuCurve extends PolynomialCurve {
  /** ε = prefactor · D^exponent, M⁻¹ cm⁻¹ with D in nm. */
  extinctionPrefactor: number;
  extinctionExponent: number;
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
export function yuDiameterNm(curve: PolynomialCurve, firstExcitonNm: number): number {
  const c = curve.sizeCoefficients;
  let d = 0;
  // Indexed, not for-of: an iterator object per call where the call is not inlined (this runs in Newton loops).
  for (let k = 0; k < c.length; k++) d = d * firstExcitonNm + c[k];
  return d;
}

/** dD/dλ of the published polynomial, nm per nm (Horner's rule on the derivative). */
function yuSlope(curve: PolynomialCurve, firstExcitonNm: number): number {
  const c = curve.sizeCoefficients;
  const degree = c.length - 1;
  let s = 0;
  for (let k = 0; k < degree; k++) s = s * firstExcitonNm + (degree - k) * c[k];
  return s;
}

// D(λ) tabulated at every nanometre of each curve's bracket (≤ 350 points), built on first use and kept: resolving a
// dot inverts the curve once or twice, on every cold panel evaluation.
const TABLE_STEP_NM = 1;
const tables = new WeakMap<PolynomialCurve, Float64Array>();

function tableOf(curve: PolynomialCurve): Float64Array {
  let table = tables.get(curve);
  if (!table) {
    const [lo, hi] = curve.bracketNm;
    const n = Math.round((hi - lo) / TABLE_STEP_NM);
    table = new Float64Array(n + 1);
    for (let k = 0; k <= n; k++) table[k] = yuDiameterNm(curve, lo + k * TABLE_STEP_NM);
    tables.set(curve, table);
  }
  return table;
}

/**
 * First-exciton wavelength (nm) whose D(λ) equals `diameterNm`, on a bracket where D rises monotonically (checked for
 * all three curves over their ranges; the CdTe curve is nearly flat between ~560 and 610 nm, so λ is ill-conditioned
 * there: a 0.1 nm change in D moves λ by ~10 nm). The 1 nm table gives the interval holding the root; Newton's method
 * kept inside that interval (a bisection step whenever it would leave it) then converges to round-off. Diameters
 * beyond the bracket's ends give the nearer end.
 */
export function yuFirstExcitonNm(curve: PolynomialCurve, diameterNm: number): number {
  const table = tableOf(curve);
  const bracketLo = curve.bracketNm[0];
  const bracketHi = curve.bracketNm[1];
  const last = table.length - 1;
  if (!(diameterNm > table[0])) return bracketLo;
  if (!(diameterNm < table[last])) return bracketHi;
  // Largest k with table[k] < diameterNm (table[0] < d ≤ ... < table[last]).
  let k = 0;
  let top = last;
  while (top - k > 1) {
    const mid = (k + top) >> 1;
    if (table[mid] < diameterNm) k = mid;
    else top = mid;
  }
  let lo = bracketLo + k * TABLE_STEP_NM;
  let hi = bracketLo + top * TABLE_STEP_NM;
  // Linear interpolation in the table as the first guess.
  let x = lo + ((diameterNm - table[k]) / (table[top] - table[k])) * (hi - lo);
  for (let i = 0; i < 100; i++) {
    const f = yuDiameterNm(curve, x) - diameterNm;
    if (f === 0) return x;
    if (f < 0) lo = x;
    else hi = x;
    let next = x - f / yuSlope(curve, x);
    if (!(next > lo && next < hi)) next = 0.5 * (lo + hi);
    if (Math.abs(next - x) <= 1e-15 * x || next === lo || next === hi) return next;
    x = next;
  }
  return x;
}

/** ε at the first exciton, M⁻¹ cm⁻¹ (Yu et al. 2003 power law). */
export function yuExtinctionFirstExciton(curve: YuCurve, diameterNm: number): number {
  return curve.extinctionPrefactor * Math.pow(diameterNm, curve.extinctionExponent);
}
