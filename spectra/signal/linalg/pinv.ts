/**
 * Moore–Penrose pseudo-inverse from the SVD: A⁺ = V diag(1/σ) Uᵀ over the singular values above the usual
 * numerical-rank tolerance max(rows, cols) · ε · σmax (Golub & Van Loan, Matrix Computations; from memory).
 */
import { EPSILON, checkMatrix } from './matrix';
import { svd } from './svd';

/**
 * Pseudo-inverse (cols × rows) of a finite matrix, or null when the matrix has rank 0 (all zeros: nothing to invert).
 * Invalid input throws SpectraError naming ['matrix', row, col].
 * @example pseudoInverse([[2, 0], [0, 4], [0, 0]]) // [[0.5, 0, 0], [0, 0.25, 0]]
 */
export function pseudoInverse(m: number[][]): number[][] | null {
  const { rows, cols } = checkMatrix(m);
  const { u, s, v } = svd(m);
  const tol = Math.max(rows, cols) * EPSILON * s[0];
  if (!(s[0] > 0)) return null;
  const out = Array.from({ length: cols }, () => new Array<number>(rows).fill(0));
  s.forEach((sigma, k) => {
    if (sigma <= tol) return;
    for (let i = 0; i < cols; i++) {
      const vik = v[i][k] / sigma;
      for (let j = 0; j < rows; j++) out[i][j] += vik * u[j][k];
    }
  });
  return out;
}
