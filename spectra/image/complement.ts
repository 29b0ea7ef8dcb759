/**
 * The least-squares residual through an orthonormal basis of what the probes cannot explain: r = (I − M M⁺) y lies in
 * the orthogonal complement of M's columns, so ‖r‖ = ‖Q₂ᵀ y‖ for an orthonormal basis Q₂ of that complement
 * (Golub & Van Loan, Matrix Computations, 4th ed. 2013, §5.3: the residual of the full QR's trailing block; from
 * memory). That costs channels × (channels − probes) multiply-adds per pixel instead of channels × probes for
 * y − M â, and never subtracts nearly equal numbers.
 */
import { svd } from '../signal/linalg/svd';

/**
 * Q₂ᵀ as rows (channels − probes rows of `channels` values), from the SVD of the projector I − N N⁺ (its singular
 * values are 1 on the complement and 0 on range(N)); an empty array when channels = probes (the fit is exact).
 */
export function complementRows(unitRows: number[][], unitInverse: number[][]): Float64Array {
  const channels = unitRows.length;
  const probes = unitRows[0].length;
  const rank = channels - probes;
  if (rank === 0) return new Float64Array(0);
  const projector = Array.from({ length: channels }, (_, i) =>
    Array.from({ length: channels }, (_, j) => {
      let hat = 0;
      for (let p = 0; p < probes; p++) hat += unitRows[i][p] * unitInverse[p][j];
      return (i === j ? 1 : 0) - hat;
    }),
  );
  const { u } = svd(projector);
  const rows = new Float64Array(rank * channels);
  for (let k = 0; k < rank; k++) for (let i = 0; i < channels; i++) rows[k * channels + i] = u[i][k];
  return rows;
}

/**
 * Σ over channels of the squared least-squares residual of y: ‖Q₂ᵀ y‖², with `rows` from complementRows.
 */
export function residualSquares(rows: Float64Array, channels: number, y: Float64Array): number {
  let squares = 0;
  for (let start = 0; start < rows.length; start += channels) {
    let s = 0;
    for (let c = 0; c < channels; c++) s += rows[start + c] * y[c];
    squares += s * s;
  }
  return squares;
}
