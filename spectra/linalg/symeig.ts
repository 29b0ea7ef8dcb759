/**
 * Eigenvalues and eigenvectors of a small symmetric matrix: Householder reduction to tridiagonal form, then the
 * implicit symmetric QR iteration with Wilkinson shifts (Golub & Van Loan, Matrix Computations, the symmetric QR
 * algorithm; from memory). About 10 n³ flops: for the 8 × 8 Gram matrix of a panel several times cheaper than Jacobi.
 */
import { EPSILON } from './matrix';

/** Eigenvalues (descending) and eigenvectors (vectors[k] belongs to values[k]), or null if the iteration stalls. */
export interface SymmetricEigen {
  values: number[];
  vectors: Float64Array[];
}

/** Reduces symmetric `a` (rows, overwritten) to tridiagonal d/e with a = Q T Qᵀ; returns Q as columns when asked. */
function tridiagonalise(a: Float64Array[], d: Float64Array, e: Float64Array, wantQ: boolean): Float64Array[] | null {
  const n = a.length;
  let q: Float64Array[] | null = null;
  if (wantQ) {
    q = [];
    for (let j = 0; j < n; j++) {
      const col = new Float64Array(n);
      col[j] = 1;
      q.push(col);
    }
  }
  const v = new Float64Array(n);
  const w = new Float64Array(n);
  for (let k = 0; k < n - 2; k++) {
    // Plain sum of squares: the callers pass Gram matrices of unit columns (entries ≤ 1), far from overflow.
    let sq = 0;
    for (let i = k + 1; i < n; i++) sq += a[i][k] * a[i][k];
    if (sq === 0) continue;
    const norm = Math.sqrt(sq);
    // Householder vector v (entries k+1..n-1) mapping column k below the diagonal onto alpha e1; H = I − β v vᵀ.
    const alpha = a[k + 1][k] >= 0 ? -norm : norm;
    let vv = 0;
    for (let i = k + 1; i < n; i++) {
      v[i] = a[i][k] - (i === k + 1 ? alpha : 0);
      vv += v[i] * v[i];
    }
    if (vv === 0) continue;
    const beta = 2 / vv;
    // Two-sided update of the trailing block: p = β B v, w = p − (β pᵀv / 2) v, B ← B − v wᵀ − w vᵀ.
    let pv = 0;
    for (let i = k + 1; i < n; i++) {
      let s = 0;
      for (let j = k + 1; j < n; j++) s += a[i][j] * v[j];
      w[i] = beta * s;
      pv += w[i] * v[i];
    }
    const half = (beta * pv) / 2;
    for (let i = k + 1; i < n; i++) w[i] -= half * v[i];
    for (let i = k + 1; i < n; i++) for (let j = k + 1; j < n; j++) a[i][j] -= v[i] * w[j] + w[i] * v[j];
    for (let i = k + 2; i < n; i++) a[i][k] = a[k][i] = 0;
    a[k + 1][k] = a[k][k + 1] = alpha;
    // Q ← Q H, one row of Q at a time.
    if (q)
      for (let r = 0; r < n; r++) {
        let s = 0;
        for (let i = k + 1; i < n; i++) s += q[i][r] * v[i];
        s *= beta;
        for (let i = k + 1; i < n; i++) q[i][r] -= s * v[i];
      }
  }
  for (let i = 0; i < n; i++) {
    d[i] = a[i][i];
    e[i] = i < n - 1 ? a[i + 1][i] : 0;
  }
  return q;
}

/**
 * Implicit symmetric QR on tridiagonal d/e (overwritten: d ends as the eigenvalues, unordered); the rotations are
 * applied to the columns of q when given. False if the iteration stalls.
 */
function diagonalise(d: Float64Array, e: Float64Array, q: Float64Array[] | null): boolean {
  const n = d.length;
  let hi = n - 1;
  for (let iterations = 0; hi > 0; iterations++) {
    if (iterations > 30 * n) return false;
    if (Math.abs(e[hi - 1]) <= EPSILON * (Math.abs(d[hi - 1]) + Math.abs(d[hi]))) {
      e[hi - 1] = 0;
      hi--;
      continue;
    }
    let lo = hi - 1;
    while (lo > 0 && Math.abs(e[lo - 1]) > EPSILON * (Math.abs(d[lo - 1]) + Math.abs(d[lo]))) lo--;
    // Wilkinson shift: the eigenvalue of the trailing 2 × 2 block nearer to its last diagonal entry.
    const delta = (d[hi - 1] - d[hi]) / 2;
    const t = e[hi - 1];
    const mu = d[hi] - (t * t) / (delta + (delta >= 0 ? 1 : -1) * Math.sqrt(delta * delta + t * t));
    let x = d[lo] - mu;
    let z = e[lo];
    for (let k = lo; k < hi; k++) {
      // Givens rotation taking (x, z) to (r, 0): the shifted first column at k = lo, the bulge afterwards.
      const r = Math.sqrt(x * x + z * z);
      const c = r === 0 ? 1 : x / r;
      const s = r === 0 ? 0 : -z / r;
      if (k > lo) e[k - 1] = r;
      const dk = d[k];
      const dk1 = d[k + 1];
      const f = e[k];
      d[k] = c * c * dk - 2 * c * s * f + s * s * dk1;
      d[k + 1] = s * s * dk + 2 * c * s * f + c * c * dk1;
      e[k] = c * s * (dk - dk1) + (c * c - s * s) * f;
      if (k < hi - 1) {
        x = e[k];
        z = -s * e[k + 1];
        e[k + 1] *= c;
      }
      if (!q) continue;
      const qk = q[k];
      const qk1 = q[k + 1];
      for (let i = 0; i < n; i++) {
        const u = qk[i];
        const w = qk1[i];
        qk[i] = c * u - s * w;
        qk1[i] = s * u + c * w;
      }
    }
  }
  return true;
}

/** Eigen-decomposition of a symmetric matrix given as rows (overwritten). */
export function symmetricEigen(a: Float64Array[]): SymmetricEigen | null {
  const n = a.length;
  const d = new Float64Array(n);
  const e = new Float64Array(n);
  const q = tridiagonalise(a, d, e, true)!;
  if (!diagonalise(d, e, q)) return null;
  const order = Array.from(d, (_, k) => k).sort((p, r) => d[r] - d[p]);
  return { values: order.map((k) => d[k]), vectors: order.map((k) => q[k]) };
}

/**
 * Eigenvalues only (descending) of a symmetric matrix given as rows (overwritten), or null if the iteration stalls:
 * the same reduction and iteration as symmetricEigen, so the same values, without accumulating Q (about half the work).
 */
export function symmetricEigenvalues(a: Float64Array[]): Float64Array | null {
  const n = a.length;
  const d = new Float64Array(n);
  const e = new Float64Array(n);
  tridiagonalise(a, d, e, false);
  if (!diagonalise(d, e, null)) return null;
  return d.sort().reverse();
}
