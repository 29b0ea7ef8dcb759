/**
 * The unmixing diagnostics of a well-conditioned mixing matrix from its Gram matrix: N = M with unit-norm columns,
 * G = NᵀN, κ = √(λmax/λmin) from G's eigenvalues (symeig.ts), and the least-squares noise gains √[G⁻¹]jj. Gram
 * eigenvalues carry a relative error of about ε κ², so this route answers only up to κ = 1e4 (error ≤ 2e-8) and the
 * caller falls back to the one-sided Jacobi SVD beyond. For κ ≤ 300 the gains come from a Cholesky factor of G
 * (G = LLᵀ, [G⁻¹]jj = Σk [L⁻¹]kj²: a few hundred flops, error about ε κ² ≤ 1e-11), above that from G's
 * eigenvectors (√Σk V²jk/λk).
 */
import { dot, norm2 } from './matrix';
import { symmetricEigen, symmetricEigenvalues } from './symeig';

/** Largest κ this route answers for (see above). */
export const GRAM_MAX_CONDITION = 1e4;
// Largest κ for the Cholesky gains: their error, about ε κ², stays under 1e-11 relative.
const CHOLESKY_MAX_CONDITION = 300;

/** The columns of m (rows = channels) scaled to unit 2-norm; m has no zero column. */
export function unitColumns(m: number[][]): Float64Array[] {
  const rows = m.length;
  const cols = m[0].length;
  const columns: Float64Array[] = [];
  for (let j = 0; j < cols; j++) {
    const col = new Float64Array(rows);
    for (let i = 0; i < rows; i++) col[i] = m[i][j];
    const norm = norm2(col);
    for (let i = 0; i < rows; i++) col[i] /= norm;
    columns.push(col);
  }
  return columns;
}

// A module function for map (no closure per call).
function copyRow(row: Float64Array): Float64Array {
  return row.slice();
}

function gramOf(columns: Float64Array[]): Float64Array[] {
  const n = columns.length;
  const gram: Float64Array[] = [];
  for (let i = 0; i < n; i++) gram.push(new Float64Array(n));
  for (let i = 0; i < n; i++) {
    for (let j = i; j < n; j++) gram[i][j] = gram[j][i] = dot(columns[i], columns[j]);
  }
  return gram;
}

/** √[G⁻¹]jj for every j from the Cholesky factor of G (rows, overwritten by L), or null if G is not positive definite. */
function choleskyGains(g: Float64Array[]): number[] | null {
  const n = g.length;
  for (let j = 0; j < n; j++) {
    let d = g[j][j];
    for (let k = 0; k < j; k++) d -= g[j][k] * g[j][k];
    if (!(d > 0)) return null;
    const ljj = Math.sqrt(d);
    g[j][j] = ljj;
    for (let i = j + 1; i < n; i++) {
      let s = g[i][j];
      for (let k = 0; k < j; k++) s -= g[i][k] * g[j][k];
      g[i][j] = s / ljj;
    }
  }
  // Column j of L⁻¹ by forward substitution (L x = e_j); [G⁻¹]jj = ‖x‖².
  const gains: number[] = [];
  const x = new Float64Array(n);
  for (let j = 0; j < n; j++) {
    let sum = 0;
    for (let i = j; i < n; i++) {
      let s = i === j ? 1 : 0;
      for (let k = j; k < i; k++) s -= g[i][k] * x[k];
      x[i] = s / g[i][i];
      sum += x[i] * x[i];
    }
    gains.push(Math.sqrt(sum));
  }
  return gains;
}

/**
 * κ of the column-normalised m and its noise gains (see above), or null when κ > GRAM_MAX_CONDITION or the
 * iteration stalls (the caller then takes the Jacobi route). m has no zero column and no more columns than rows.
 */
export function gramDiagnostics(m: number[][]): { conditionNumber: number; gains: number[] } | null {
  const columns = unitColumns(m);
  const n = columns.length;
  const gram = gramOf(columns);
  const values = symmetricEigenvalues(gram.map(copyRow));
  if (!values || !(values[n - 1] > 0) || values[0] / values[n - 1] > GRAM_MAX_CONDITION ** 2) return null;
  const conditionNumber = Math.sqrt(values[0]) / Math.sqrt(values[n - 1]);
  const cholesky = conditionNumber <= CHOLESKY_MAX_CONDITION ? choleskyGains(gram) : null;
  if (cholesky) return { conditionNumber, gains: cholesky };
  const eigen = symmetricEigen(gramOf(columns));
  if (!eigen) return null;
  const s = eigen.values.map(Math.sqrt);
  const gains: number[] = [];
  for (let j = 0; j < n; j++) {
    let sum = 0;
    for (let k = 0; k < n; k++) sum += (eigen.vectors[k][j] * eigen.vectors[k][j]) / (s[k] * s[k]);
    gains.push(Math.sqrt(sum));
  }
  return { conditionNumber, gains };
}
