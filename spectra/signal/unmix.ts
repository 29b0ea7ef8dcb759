/**
 * Unmixing diagnostics of a mixing matrix M (rows = channels, columns = probes; M = collected): the 2-norm condition
 * number of the column-normalised M, the least-squares noise gain per probe, and the unmixing of one measured channel
 * vector by least squares or by NNLS (Lawson & Hanson, Solving Least Squares Problems, 1974). Where a figure has no
 * finite value (rank-deficient M, more probes than channels) it is null and a warning says why; never NaN or Infinity.
 */
import { EPSILON, checkMatrix, checkVector, norm2 } from './linalg/matrix';
import { svdOfColumns } from './linalg/svd';
import { leastSquaresQr } from './linalg/qr';
import { nnls } from './linalg/nnls';

/** Condition number and noise gains of a mixing matrix, with the warnings that explain any null. */
export interface UnmixingDiagnostics {
  conditionNumber: number | null;
  noiseAmplification: (number | null)[];
  warnings: string[];
}

/** Why M cannot be unmixed (a sentence), or null when it can: too few rows, a zero column, or rank deficiency. */
function rankProblem(m: number[][], s: number[] | null, ids?: string[]): string | null {
  const rows = m.length;
  const cols = m[0].length;
  if (cols > rows) return `${cols} probes but only ${rows} channels: the probes cannot be unmixed`;
  for (let j = 0; j < cols; j++) {
    let i = 0;
    while (i < rows && m[i][j] === 0) i++;
    if (i === rows) return `probe ${ids?.[j] ?? j + 1} gives no signal in any channel: the probes cannot be unmixed`;
  }
  if (s && !(s[cols - 1] > Math.max(rows, cols) * EPSILON * s[0])) {
    return "the probes' channel signatures are linearly dependent (rank-deficient): they cannot be unmixed";
  }
  return null;
}

/** The columns of m (rows = channels) scaled to unit 2-norm; m has no zero column. */
function unitColumns(m: number[][]): Float64Array[] {
  const columns: Float64Array[] = [];
  for (let j = 0; j < m[0].length; j++) {
    const col = new Float64Array(m.length);
    for (let i = 0; i < m.length; i++) col[i] = m[i][j];
    const norm = norm2(col);
    for (let i = 0; i < col.length; i++) col[i] /= norm;
    columns.push(col);
  }
  return columns;
}

/** σ (descending) and V of M with every column scaled to unit 2-norm (one-sided Jacobi; M has no zero column). */
function normalisedSvd(m: number[][]): { s: number[]; v: number[][] } {
  return svdOfColumns(unitColumns(m));
}

/**
 * Both figures from one SVD of the column-normalised M: κ = σmax/σmin, and noise gain_j = √[(MᵀM)⁻¹]jj · ‖mj‖
 * = √Σk V²jk/σk² of the normalised matrix (unit-norm columns make the two forms equal). `probeIds` name the
 * columns in warnings. Throws SpectraError naming ['matrix', i, j] for a matrix that is not rectangular and finite.
 */
export function unmixingDiagnostics(m: number[][], probeIds?: string[]): UnmixingDiagnostics {
  checkMatrix(m, 'matrix');
  return diagnoseMixing(m, probeIds);
}

function nullFigures(cols: number, warning: string): UnmixingDiagnostics {
  return { conditionNumber: null, noiseAmplification: new Array<null>(cols).fill(null), warnings: [warning] };
}

/**

 * unmixingDiagnostics of a panel's own collected matrix (rectangular by construction; non-finite entries give nulls).

 */
export function diagnoseMixing(m: number[][], probeIds?: string[]): UnmixingDiagnostics {
  const cols = m[0].length;
  if (!m.every((row) => row.every(Number.isFinite))) {
    return nullFigures(cols, 'the collected light has values with no finite result: the probes cannot be unmixed');
  }
  const early = rankProblem(m, null, probeIds);
  if (early) return nullFigures(cols, early);
  const { s, v } = normalisedSvd(m);
  const late = rankProblem(m, s);
  if (late) return nullFigures(cols, late);
  const gains = v.map((row) => {
    let sum = 0;
    for (let k = 0; k < row.length; k++) sum += (row[k] * row[k]) / (s[k] * s[k]);
    return Math.sqrt(sum);
  });
  return { conditionNumber: s[0] / s[cols - 1], noiseAmplification: gains, warnings: [] };
}

/** 2-norm condition number of M with each column scaled to unit norm; null when M cannot be unmixed. */
export function conditionNumber(m: number[][]): number | null {
  return unmixingDiagnostics(m).conditionNumber;
}

/** Least-squares noise gain per probe, √[(MᵀM)⁻¹]jj · ‖mj‖ (1 for orthogonal signatures); nulls when M cannot be
 * unmixed. */
export function noiseAmplification(m: number[][]): (number | null)[] {
  return unmixingDiagnostics(m).noiseAmplification;
}

/** Unmixed abundances (one per column) with warnings; nulls when M cannot be unmixed. */
export interface UnmixResult {
  abundances: (number | null)[];
  warnings: string[];
}

function prepare(m: number[][], y: number[]): string | null {
  const { rows } = checkMatrix(m, 'matrix');
  checkVector(y, rows, 'y');
  const problem = rankProblem(m, null);
  if (problem) return problem;
  return rankProblem(m, normalisedSvd(m).s);
}

/** Ordinary least-squares unmixing â = argmin ‖M a − y‖₂ (Householder QR); may give negative abundances. */
export function unmixLeastSquares(m: number[][], y: number[]): UnmixResult {
  const problem = prepare(m, y);
  const x = problem ? null : leastSquaresQr(m, y);
  if (!x)
    return {
      abundances: new Array(m[0].length).fill(null),
      warnings: [problem ?? 'the least-squares problem is rank-deficient'],
    };
  const warnings = x.some((v) => v < 0)
    ? ['least squares gave negative abundances (noise or a missing probe); NNLS keeps them ≥ 0']
    : [];
  return { abundances: x, warnings };
}

/** Non-negative least-squares unmixing (Lawson–Hanson 1974): argmin ‖M a − y‖₂ subject to a ≥ 0. */
export function unmixNnls(m: number[][], y: number[]): UnmixResult {
  const problem = prepare(m, y);
  if (problem) return { abundances: new Array(m[0].length).fill(null), warnings: [problem] };
  const result = nnls(m, y);
  return {
    abundances: result.x,
    warnings: result.converged ? [] : [`NNLS stopped after ${result.iterations} iterations without converging`],
  };
}
