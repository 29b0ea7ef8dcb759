/**
 * Linear least squares min ‖A x − y‖₂ by Householder QR (Golub, Numer. Math. 1965, 7, 206; from memory), the
 * numerically stable route that never forms AᵀA. Columns whose pivot falls below the rank tolerance mark the problem
 * as rank-deficient: the caller gets null rather than an arbitrary solution.
 */
import { EPSILON, columnsOf } from './matrix';

/**
 * Least-squares solution for a full-column-rank A (rows ≥ cols), or null when A is rank-deficient (a pivot
 * |R_jj| ≤ max(rows, cols) · ε · max|R_ii|, the usual numerical-rank tolerance) or has more columns than rows.
 * Inputs are assumed checked (finite, rectangular, y of length rows).
 */
export function leastSquaresQr(a: readonly (readonly number[])[], y: readonly number[]): number[] | null {
  const m = a.length;
  const n = a[0].length;
  if (n > m) return null;
  const cols = columnsOf(a);
  const b = Float64Array.from(y);
  const diag = new Float64Array(n);
  for (let k = 0; k < n; k++) {
    const x = cols[k];
    let norm = 0;
    for (let i = k; i < m; i++) norm = Math.hypot(norm, x[i]);
    if (norm === 0) {
      diag[k] = 0;
      continue;
    }
    // Householder vector v = x + sign(x_k)‖x‖e_k, stored in place; R_kk = −sign(x_k)‖x‖.
    const alpha = x[k] >= 0 ? -norm : norm;
    x[k] -= alpha;
    let vv = 0;
    for (let i = k; i < m; i++) vv += x[i] * x[i];
    const reflect = (target: Float64Array) => {
      let s = 0;
      for (let i = k; i < m; i++) s += x[i] * target[i];
      const f = (2 * s) / vv;
      for (let i = k; i < m; i++) target[i] -= f * x[i];
    };
    for (let j = k + 1; j < n; j++) reflect(cols[j]);
    reflect(b);
    diag[k] = alpha;
  }
  let largest = 0;
  for (let k = 0; k < n; k++) largest = Math.max(largest, Math.abs(diag[k]));
  const tol = Math.max(m, n) * EPSILON * largest;
  if (largest === 0) return null;
  for (let k = 0; k < n; k++) if (Math.abs(diag[k]) <= tol) return null;
  // Back substitution on R (upper triangle: diag plus cols[j][k] for k < j).
  const x = new Array<number>(n).fill(0);
  for (let k = n - 1; k >= 0; k--) {
    let s = b[k];
    for (let j = k + 1; j < n; j++) s -= cols[j][k] * x[j];
    x[k] = s / diag[k];
  }
  return x;
}
