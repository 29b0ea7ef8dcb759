/**
 * SVD of a tall matrix by QR with column pivoting followed by one-sided Jacobi on Rᵀ (Drmač & Veselić, SIAM J.
 * Matrix Anal. Appl. 2008, 29, 1322; pivoted QR: Businger & Golub, Numer. Math. 1965, 7, 269; both from memory).
 * The pivoted triangular factor is strongly diagonal, so Jacobi needs only a few sweeps, and it needs no V: the right
 * singular vectors of A are the permuted left singular vectors of Rᵀ. Used for the per-evaluation diagnostics.
 */
import { EPSILON } from './matrix';
import { jacobiColumns } from './svd';

/** Singular values (descending) and right singular vectors v[j][k] of a tall matrix given as columns (overwritten). */
export function svdPivotedQr(columns: Float64Array[], tolerance = EPSILON): { s: number[]; v: number[][] } {
  const n = columns.length;
  const m = columns[0].length;
  const perm = columns.map((_, j) => j);
  const a = columns.slice();
  const norms = new Float64Array(n);
  for (let k = 0; k < n; k++) {
    // Pivot: the remaining column of largest norm below row k (recomputed: n is small and it avoids downdating error).
    let best = k;
    for (let j = k; j < n; j++) {
      let s = 0;
      for (let i = k; i < m; i++) s += a[j][i] * a[j][i];
      norms[j] = s;
      if (s > norms[best]) best = j;
    }
    const x = a[best];
    const norm = Math.sqrt(norms[best]);
    a[best] = a[k];
    a[k] = x;
    const moved = perm[best];
    perm[best] = perm[k];
    perm[k] = moved;
    if (norm === 0) continue;
    const alpha = x[k] >= 0 ? -norm : norm;
    x[k] -= alpha;
    let vv = 0;
    for (let i = k; i < m; i++) vv += x[i] * x[i];
    for (let j = k + 1; j < n; j++) {
      const col = a[j];
      let s = 0;
      for (let i = k; i < m; i++) s += x[i] * col[i];
      const f = (2 * s) / vv;
      for (let i = k; i < m; i++) col[i] -= f * x[i];
    }
    x[k] = alpha; // R_kk; entries below the diagonal are no longer needed
  }
  // X = Rᵀ: column r of X is row r of R, i.e. R[r][j] = a[j][r] for j ≥ r.
  const xt = Array.from({ length: n }, (_, r) => {
    const col = new Float64Array(n);
    for (let j = r; j < n; j++) col[j] = a[j][r];
    return col;
  });
  jacobiColumns(xt, null, tolerance);
  const sigma = xt.map((col) => Math.sqrt(col.reduce((s, v) => s + v * v, 0)));
  const order = sigma.map((_, k) => k).sort((p, q) => sigma[q] - sigma[p]);
  const v = Array.from({ length: n }, () => new Array<number>(n).fill(0));
  order.forEach((k, rank) => {
    if (!(sigma[k] > 0)) return;
    for (let r = 0; r < n; r++) v[perm[r]][rank] = xt[k][r] / sigma[k];
  });
  return { s: order.map((k) => sigma[k]), v };
}
