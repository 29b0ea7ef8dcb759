/**
 * Plain dense matrices for the unmixing diagnostics: number[][] at the public edge (JSON-friendly, row-major),
 * columns of Float64Array inside the algorithms (the one-sided methods below work column by column).
 */
import { SpectraError } from '../../core/errors';

/** Machine epsilon of IEEE-754 binary64 (2^-52). */
export const EPSILON = Number.EPSILON;

/** Checks a non-empty rectangular matrix of finite numbers; returns its shape. Errors name [name, row, col]. */
export function checkMatrix(m: unknown, name = 'matrix'): { rows: number; cols: number } {
  if (!Array.isArray(m) || m.length === 0 || !Array.isArray(m[0]) || m[0].length === 0) {
    throw new SpectraError('invalid_input', `${name} must be a non-empty array of non-empty rows`, [name]);
  }
  const cols = m[0].length;
  m.forEach((row: unknown, i) => {
    if (!Array.isArray(row) || row.length !== cols) {
      throw new SpectraError('invalid_input', `${name} row ${i} must have ${cols} entries like row 0`, [name, i]);
    }
    row.forEach((v: unknown, j) => {
      if (typeof v !== 'number' || !Number.isFinite(v)) {
        throw new SpectraError('invalid_input', `${name}[${i}][${j}] must be a finite number, got ${String(v)}`, [
          name,
          i,
          j,
        ]);
      }
    });
  });
  return { rows: m.length, cols };
}

/** Checks a vector of finite numbers of the given length. Errors name [name, i]. */
export function checkVector(y: unknown, length: number, name = 'y'): number[] {
  if (!Array.isArray(y) || y.length !== length) {
    throw new SpectraError('invalid_input', `${name} must be an array of ${length} numbers (one per matrix row)`, [
      name,
    ]);
  }
  y.forEach((v: unknown, i) => {
    if (typeof v !== 'number' || !Number.isFinite(v)) {
      throw new SpectraError('invalid_input', `${name}[${i}] must be a finite number, got ${String(v)}`, [name, i]);
    }
  });
  return y as number[];
}

/** The columns of a row-major matrix as fresh Float64Arrays. */
export function columnsOf(m: readonly (readonly number[])[]): Float64Array[] {
  const rows = m.length;
  const cols = m[0].length;
  const out: Float64Array[] = [];
  for (let j = 0; j < cols; j++) {
    const c = new Float64Array(rows);
    for (let i = 0; i < rows; i++) c[i] = m[i][j];
    out.push(c);
  }
  return out;
}

/** Dot product of two equal-length vectors. */
export function dot(a: Float64Array, b: Float64Array): number {
  let s = 0;
  for (let i = 0; i < a.length; i++) s += a[i] * b[i];
  return s;
}

/** Euclidean norm, scaled against overflow and underflow (LAPACK dnrm2's idea). */
export function norm2(a: Float64Array | readonly number[]): number {
  let scale = 0;
  for (let i = 0; i < a.length; i++) scale = Math.max(scale, Math.abs(a[i]));
  if (scale === 0) return 0;
  let s = 0;
  for (let i = 0; i < a.length; i++) {
    const v = a[i] / scale;
    s += v * v;
  }
  return scale * Math.sqrt(s);
}
