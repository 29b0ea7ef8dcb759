/**
 * Singular value decomposition by one-sided Jacobi rotations (Hestenes, J. SIAM 1958, 6, 51; convergence test as in
 * Demmel & Veselić, SIAM J. Matrix Anal. Appl. 1992, 13, 1204; both citations from memory): columns of A are rotated
 * pairwise until all are mutually orthogonal; their norms are then the singular values. Accurate to high relative
 * precision, simple, and fast enough for the at most 64 × 16 matrices of a panel.
 */
import { EPSILON, checkMatrix, columnsOf } from './matrix';

/** A = U diag(s) Vᵀ with k = min(rows, cols): U rows×k, s descending (length k), V cols×k, all row-major. */
export interface Svd {
  u: number[][];
  s: number[];
  v: number[][];
}

const MAX_SWEEPS = 80;

/** One-sided Jacobi on the columns of a (rows ≥ cols); returns rotated columns and the accumulated V columns. */
function orthogonaliseColumns(a: Float64Array[]): { a: Float64Array[]; v: Float64Array[] } {
  const n = a.length;
  const m = a[0].length;
  const v = Array.from({ length: n }, (_, j) => {
    const e = new Float64Array(n);
    e[j] = 1;
    return e;
  });
  for (let sweep = 0; sweep < MAX_SWEEPS; sweep++) {
    let rotated = false;
    for (let p = 0; p < n - 1; p++) {
      for (let q = p + 1; q < n; q++) {
        const ap = a[p];
        const aq = a[q];
        let alpha = 0;
        let beta = 0;
        let gamma = 0;
        for (let i = 0; i < m; i++) {
          alpha += ap[i] * ap[i];
          beta += aq[i] * aq[i];
          gamma += ap[i] * aq[i];
        }
        if (gamma === 0 || Math.abs(gamma) <= EPSILON * Math.sqrt(alpha * beta)) continue;
        rotated = true;
        // Rotation that zeroes the (p, q) entry of AᵀA (Golub & Van Loan, Matrix Computations, Jacobi methods; from memory).
        const zeta = (beta - alpha) / (2 * gamma);
        const t = Math.sign(zeta || 1) / (Math.abs(zeta) + Math.sqrt(1 + zeta * zeta));
        const c = 1 / Math.sqrt(1 + t * t);
        const s = c * t;
        for (let i = 0; i < m; i++) {
          const x = ap[i];
          const y = aq[i];
          ap[i] = c * x - s * y;
          aq[i] = s * x + c * y;
        }
        const vp = v[p];
        const vq = v[q];
        for (let i = 0; i < n; i++) {
          const x = vp[i];
          const y = vq[i];
          vp[i] = c * x - s * y;
          vq[i] = s * x + c * y;
        }
      }
    }
    if (!rotated) break;
  }
  return { a, v };
}

/** Thin SVD of a non-empty finite matrix. Zero singular values get a zero U column. */
export function svd(matrix: readonly (readonly number[])[]): Svd {
  const { rows, cols } = checkMatrix(matrix);
  const transposed = rows < cols;
  const source = transposed ? matrix[0].map((_, j) => matrix.map((row) => row[j])) : matrix;
  const { a, v } = orthogonaliseColumns(columnsOf(source));
  const sigma = a.map((col) => Math.sqrt(col.reduce((sum, x) => sum + x * x, 0)));
  const order = sigma.map((_, j) => j).sort((x, y) => sigma[y] - sigma[x]);
  const m = a[0].length;
  const n = a.length;
  const s = order.map((j) => sigma[j]);
  const left = Array.from({ length: m }, (_, i) => order.map((j) => (sigma[j] > 0 ? a[j][i] / sigma[j] : 0)));
  const right = Array.from({ length: n }, (_, i) => order.map((j) => v[j][i]));
  return transposed ? { u: right, s, v: left } : { u: left, s, v: right };
}

/** Singular values only, descending. */
export function singularValues(matrix: readonly (readonly number[])[]): number[] {
  return svd(matrix).s;
}
