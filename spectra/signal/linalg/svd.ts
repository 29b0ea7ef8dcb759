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

/**
 * One-sided Jacobi on the columns of a (rows ≥ cols); rotates them and, unless null, the columns of V (identity at
 * the start) in place. Column norms are carried through each rotation (‖ap‖² − tγ, ‖aq‖² + tγ; exact for the Jacobi
 * angle) and
 * recomputed at every sweep so rounding cannot build up; only the cross product γ is summed per pair.
 */
export function jacobiColumns(a: Float64Array[], v: Float64Array[] | null, tolerance: number): void {
  const n = a.length;
  const m = a[0].length;
  const norms = new Float64Array(n);
  for (let sweep = 0; sweep < MAX_SWEEPS; sweep++) {
    for (let j = 0; j < n; j++) {
      let s = 0;
      const col = a[j];
      for (let i = 0; i < m; i++) s += col[i] * col[i];
      norms[j] = s;
    }
    let rotated = false;
    for (let p = 0; p < n - 1; p++) {
      const ap = a[p];
      const vp = v?.[p];
      for (let q = p + 1; q < n; q++) {
        const aq = a[q];
        let gamma = 0;
        for (let i = 0; i < m; i++) gamma += ap[i] * aq[i];
        const alpha = norms[p];
        const beta = norms[q];
        if (gamma === 0 || Math.abs(gamma) <= tolerance * Math.sqrt(alpha * beta)) continue;
        rotated = true;
        // Rotation that zeroes the (p, q) entry of AᵀA (Golub & Van Loan, Matrix Computations, Jacobi methods; from
        // memory).
        const zeta = (beta - alpha) / (2 * gamma);
        const t = (zeta >= 0 ? 1 : -1) / (Math.abs(zeta) + Math.sqrt(1 + zeta * zeta));
        const c = 1 / Math.sqrt(1 + t * t);
        const s = c * t;
        for (let i = 0; i < m; i++) {
          const x = ap[i];
          const y = aq[i];
          ap[i] = c * x - s * y;
          aq[i] = s * x + c * y;
        }
        const vq = v?.[q];
        if (vp && vq)
          for (let i = 0; i < n; i++) {
            const x = vp[i];
            const y = vq[i];
            vp[i] = c * x - s * y;
            vq[i] = s * x + c * y;
          }
        norms[p] = alpha - t * gamma;
        norms[q] = beta + t * gamma;
      }
    }
    if (!rotated) break;
  }
}

/**
 * Rotates the columns (overwritten) until they are orthogonal: their norms σ, the column order by descending σ, and
 * the columns of V (V[k][i]: column k, row i).
 */
function orthogonalise(columns: Float64Array[], tolerance: number) {
  const v = columns.map((_, j) => {
    const e = new Float64Array(columns.length);
    e[j] = 1;
    return e;
  });
  jacobiColumns(columns, v, tolerance);
  const sigma = columns.map((col) => {
    let sum = 0;
    for (let i = 0; i < col.length; i++) sum += col[i] * col[i];
    return Math.sqrt(sum);
  });
  const order = sigma.map((_, j) => j).sort((x, y) => sigma[y] - sigma[x]);
  return { sigma, order, v };
}

/**
 * Singular values (descending) and right singular vectors (V[j][k], column k belonging to s[k]) of a tall matrix
 * given as its columns, which are overwritten. The lean path for diagnostics: no checks, no U.
 */
export function svdOfColumns(columns: Float64Array[], tolerance = EPSILON): { s: number[]; v: number[][] } {
  const { sigma, order, v } = orthogonalise(columns, tolerance);
  return {
    s: order.map((j) => sigma[j]),
    v: Array.from({ length: columns.length }, (_, i) => order.map((j) => v[j][i])),
  };
}

/**
 * Thin SVD of a non-empty finite matrix. Zero singular values get a zero U column. Rotation stops once every pair of
 * columns has |cos angle| ≤ `tolerance` (default ε); the singular values are then accurate to about
 * (cols − 1) × tolerance relative (Demmel & Veselić 1992, from memory), so a diagnostic may pass e.g. 1e-12 to save
 * sweeps.
 */
export function svd(matrix: readonly (readonly number[])[], tolerance = EPSILON): Svd {
  const { rows, cols } = checkMatrix(matrix);
  const transposed = rows < cols;
  const source = transposed ? matrix[0].map((_, j) => matrix.map((row) => row[j])) : matrix;
  const a = columnsOf(source);
  const { sigma, order, v } = orthogonalise(a, tolerance);
  const s = order.map((j) => sigma[j]);
  const left = Array.from({ length: a[0].length }, (_, i) => order.map((j) => (sigma[j] > 0 ? a[j][i] / sigma[j] : 0)));
  const right = Array.from({ length: a.length }, (_, i) => order.map((j) => v[j][i]));
  return transposed ? { u: right, s, v: left } : { u: left, s, v: right };
}

/** Singular values only, descending. */
export function singularValues(matrix: readonly (readonly number[])[]): number[] {
  return svd(matrix).s;
}
