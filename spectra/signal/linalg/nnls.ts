/**
 * Non-negative least squares min ‖A x − y‖₂ subject to x ≥ 0, by the active-set algorithm of Lawson & Hanson,
 * Solving Least Squares Problems, Prentice-Hall 1974, chapter 23 (SIAM reprint 1995). Each inner step solves an
 * unconstrained least-squares problem on the passive columns with Householder QR.
 */
import { EPSILON, norm2 } from './matrix';
import { leastSquaresQr } from './qr';

/** Solution, whether the iteration limit stopped it early, and the iterations used. */
export interface NnlsResult {
  x: number[];
  converged: boolean;
  iterations: number;
}

/**
 * Lawson–Hanson NNLS for a checked, finite A (rows × cols) and y. Stops when every active variable's gradient
 * w = Aᵀ(y − A x) is ≤ tol, with tol = 10 · ε · ‖A‖_F · max(rows, cols) (scale-aware, as in common implementations).
 */
export function nnls(a: readonly (readonly number[])[], y: readonly number[]): NnlsResult {
  const m = a.length;
  const n = a[0].length;
  const x = new Array<number>(n).fill(0);
  const passive = new Array<boolean>(n).fill(false);
  const tol = 10 * EPSILON * norm2(a.flat()) * Math.max(m, n);
  const gradient = () => {
    const r = y.map((yi, i) => yi - a[i].reduce((s, aij, j) => s + aij * x[j], 0));
    return Array.from({ length: n }, (_, j) => a.reduce((s, row, i) => s + row[j] * r[i], 0));
  };
  const maxIterations = 30 * n;
  let iterations = 0;
  for (;;) {
    const w = gradient();
    let t = -1;
    for (let j = 0; j < n; j++) if (!passive[j] && w[j] > tol && (t < 0 || w[j] > w[t])) t = j;
    if (t < 0) return { x, converged: true, iterations };
    passive[t] = true;
    for (;;) {
      if (++iterations > maxIterations) return { x, converged: false, iterations };
      const idx = passive.flatMap((p, j) => (p ? [j] : []));
      const sub = leastSquaresQr(
        a.map((row) => idx.map((j) => row[j])),
        y,
      );
      // A rank-deficient passive set cannot improve the fit: drop the column just added and stop there.
      if (sub === null) {
        passive[t] = false;
        return { x, converged: true, iterations };
      }
      const z = new Array<number>(n).fill(0);
      idx.forEach((j, k) => (z[j] = sub[k]));
      if (idx.every((j) => z[j] > 0)) {
        for (let j = 0; j < n; j++) x[j] = z[j];
        break;
      }
      // Step from x towards z as far as feasibility allows, then free the variables that hit zero.
      let alpha = Infinity;
      for (const j of idx) if (z[j] <= 0) alpha = Math.min(alpha, x[j] / (x[j] - z[j]));
      for (let j = 0; j < n; j++) x[j] += alpha * (z[j] - x[j]);
      for (const j of idx) {
        if (x[j] <= tol) {
          passive[j] = false;
          x[j] = 0;
        }
      }
    }
  }
}
