/**
 * Checks a reference matrix (rows = channels, columns = probes) once and precomputes what every pixel reuses: the
 * matrix itself, its pseudo-inverse (least squares is then one matrix-vector product per pixel) and the Gram matrix
 * MᵀM (the cross-products the fast NNLS of Bro & De Jong, J. Chemometrics 1997, 11, 393, works on).
 */
import { SpectraError } from '../core/errors';
import { EPSILON, norm2 } from '../signal/linalg/matrix';
import { pseudoInverse } from '../signal/linalg/pinv';
import { svdOfColumns } from '../signal/linalg/svd';
import { complementRows } from './complement';

/** A checked, full-column-rank reference in flat row-major Float64Arrays. */
export interface PreparedReference {
  channels: number;
  probes: number;
  /** M, channels × probes. */
  matrix: Float64Array;
  /** M⁺ = (MᵀM)⁻¹Mᵀ, probes × channels. */
  pseudoInverse: Float64Array;
  /** MᵀM, probes × probes. */
  gram: Float64Array;
  /** Q₂ᵀ, (channels − probes) × channels: the residual's basis (complement.ts). */
  complement: Float64Array;
  /** ‖M‖ (Frobenius), for scale-aware tolerances. */
  normFrobenius: number;
}

const fail = (message: string, path: (string | number)[] = ['reference']) => {
  throw new SpectraError('invalid_input', message, path);
};

/** Shape and finiteness of [channel][probe]; returns (channels, probes). */
function checkShape(reference: readonly (readonly number[])[]): { channels: number; probes: number } {
  if (!Array.isArray(reference) || reference.length === 0) {
    fail('The reference matrix has no channels: give one row of probe values per channel');
  }
  const channels = reference.length;
  const probes = Array.isArray(reference[0]) ? reference[0].length : 0;
  if (probes === 0)
    fail('The reference matrix has no probes: each channel row needs one value per probe', ['reference', 0]);
  reference.forEach((row, i) => {
    const length = Array.isArray(row) ? row.length : 0;
    if (length !== probes) {
      fail(
        `Reference row ${i + 1} has ${length} values but row 1 has ${probes}: every channel needs one value per probe`,
        ['reference', i],
      );
    }
    row.forEach((v, j) => {
      if (typeof v !== 'number' || !Number.isFinite(v)) {
        fail(`Reference value for channel ${i + 1}, probe ${j + 1} is ${String(v)}, not a finite number`, [
          'reference',
          i,
          j,
        ]);
      }
    });
  });
  if (probes > channels) {
    fail(
      `The reference has ${probes} probes but only ${channels} channels: ` +
        'unmixing needs at least as many channels as probes',
    );
  }
  return { channels, probes };
}

/**
 * Checks the reference and precomputes M, M⁺ and MᵀM. Rank is judged on the column-normalised matrix (so a probe
 * that is merely dim is not mistaken for a missing one) with the usual numerical-rank tolerance
 * max(rows, cols) · ε · σmax (Golub & Van Loan, Matrix Computations, 4th ed. 2013, §5.4.1; from memory).
 */
export function prepareReference(reference: readonly (readonly number[])[]): PreparedReference {
  const { channels, probes } = checkShape(reference);
  const norms = new Float64Array(probes);
  const unit: Float64Array[] = [];
  for (let j = 0; j < probes; j++) {
    const column = Float64Array.from(reference, (row) => row[j]);
    norms[j] = norm2(column);
    if (norms[j] === 0) fail(`Probe ${j + 1} gives no signal in any channel of the reference: it cannot be unmixed`);
    for (let i = 0; i < channels; i++) column[i] /= norms[j];
    unit.push(column);
  }
  const normalised = unit.map((c) => Float64Array.from(c));
  const { s } = svdOfColumns(normalised);
  if (!(s[probes - 1] > Math.max(channels, probes) * EPSILON * s[0])) {
    fail("The probes' reference spectra are linearly dependent (rank-deficient): they cannot be unmixed");
  }
  // M = N D with N the unit columns and D = diag(norms), so M⁺ = D⁻¹ N⁺: N⁺ is well scaled whatever the brightness.
  const unitRows = Array.from({ length: channels }, (_, i) => unit.map((c) => c[i]));
  const unitInverse = pseudoInverse(unitRows) as number[][];
  const matrix = new Float64Array(channels * probes);
  const inverse = new Float64Array(probes * channels);
  const gram = new Float64Array(probes * probes);
  let frobenius = 0;
  for (let i = 0; i < channels; i++) {
    for (let j = 0; j < probes; j++) {
      matrix[i * probes + j] = reference[i][j];
      inverse[j * channels + i] = unitInverse[j][i] / norms[j];
      frobenius += reference[i][j] * reference[i][j];
    }
  }
  for (let j = 0; j < probes; j++) {
    for (let k = 0; k < probes; k++) {
      let sum = 0;
      for (let i = 0; i < channels; i++) sum += matrix[i * probes + j] * matrix[i * probes + k];
      gram[j * probes + k] = sum;
    }
  }
  const complement = complementRows(unitRows, unitInverse);
  return { channels, probes, matrix, pseudoInverse: inverse, gram, complement, normFrobenius: Math.sqrt(frobenius) };
}
