/**
 * Smooth monotone fit of a sizing curve, used only for its derivative dE/dd (the inhomogeneous line width).
 * Model: E(d) = a + b·d^(−p) with b > 0, p > 0, i.e. strictly decreasing and convex in d, the form of confinement laws
 * (Brus: p = 2 dominant; Almeida et al. 2023 fit InP with p = 0.684 in edge length). Least squares in E over samples
 * of the law: for each p on a grid, a and b come from the closed-form linear fit; the best p is then refined by
 * golden-section search. Why not the raw polynomial's derivative: the Yu CdTe curve is nearly flat in D between
 * ~560 and 610 nm, so dλ/dD spikes there while a physical width cannot.
 */
export interface PowerLawFit {
  offsetEv: number;
  prefactorEvNmP: number;
  exponent: number;
  /** Largest |fit − law| over the samples, eV. */
  maxResidualEv: number;
}

function linearFit(xs: number[], ys: number[], p: number): { a: number; b: number; sse: number } {
  const n = xs.length;
  let su = 0,
    sy = 0,
    suu = 0,
    suy = 0;
  for (let i = 0; i < n; i++) {
    const u = Math.pow(xs[i], -p);
    su += u;
    sy += ys[i];
    suu += u * u;
    suy += u * ys[i];
  }
  const b = (n * suy - su * sy) / (n * suu - su * su);
  const a = (sy - b * su) / n;
  let sse = 0;
  for (let i = 0; i < n; i++) sse += (a + b * Math.pow(xs[i], -p) - ys[i]) ** 2;
  return { a, b, sse };
}

/** Fits E = a + b d^−p to the law sampled at `samples` diameters spread evenly over `rangeNm`. */
export function fitPowerLaw(
  lawEv: (diameterNm: number) => number,
  rangeNm: readonly [number, number],
  samples = 41,
): PowerLawFit {
  const xs: number[] = [];
  const ys: number[] = [];
  for (let i = 0; i < samples; i++) {
    const d = rangeNm[0] + ((rangeNm[1] - rangeNm[0]) * i) / (samples - 1);
    xs.push(d);
    ys.push(lawEv(d));
  }
  const score = (p: number) => {
    const f = linearFit(xs, ys, p);
    return f.b > 0 ? f.sse : Number.POSITIVE_INFINITY; // only decreasing fits are admissible
  };
  let best = 0.3;
  for (let p = 0.3; p <= 3.0001; p += 0.05) if (score(p) < score(best)) best = p;
  let lo = Math.max(0.05, best - 0.05);
  let hi = best + 0.05;
  const g = (Math.sqrt(5) - 1) / 2;
  for (let i = 0; i < 60; i++) {
    const m1 = hi - g * (hi - lo);
    const m2 = lo + g * (hi - lo);
    if (score(m1) < score(m2)) hi = m2;
    else lo = m1;
  }
  const p = 0.5 * (lo + hi);
  const { a, b } = linearFit(xs, ys, p);
  let maxResidualEv = 0;
  for (let i = 0; i < xs.length; i++)
    maxResidualEv = Math.max(maxResidualEv, Math.abs(a + b * Math.pow(xs[i], -p) - ys[i]));
  return { offsetEv: a, prefactorEvNmP: b, exponent: p, maxResidualEv };
}

/** |dE/dd| of a power-law fit at `diameterNm`, eV/nm (always finite and positive for d > 0). */
export function powerLawSlopeEvPerNm(fit: PowerLawFit, diameterNm: number): number {
  return fit.exponent * fit.prefactorEvNmP * Math.pow(diameterNm, -fit.exponent - 1);
}
