import { describe, expect, it } from 'vitest';
import { Matrix, SVD, pseudoInverse as mlPseudoInverse } from 'ml-matrix';
import { SpectraError, pseudoInverse, singularValues, svd } from '../../spectra/index';

/** Deterministic pseudo-random matrices (a 32-bit LCG, Numerical Recipes constants) so failures reproduce. */
function randomMatrix(rows: number, cols: number, seed: number): number[][] {
  let state = seed >>> 0;
  const next = () => ((state = (Math.imul(state, 1664525) + 1013904223) >>> 0) / 2 ** 32) * 2 - 1;
  return Array.from({ length: rows }, () => Array.from({ length: cols }, next));
}

const shapes: [number, number][] = [
  [8, 8],
  [12, 5],
  [5, 12],
  [64, 16],
  [3, 1],
  [1, 4],
];

describe('svd', () => {
  // Independent reference: ml-matrix 6.15 SVD (Golub–Kahan), a different algorithm from the one-sided Jacobi here.
  it('singularValues(A) matches ml-matrix SVD to 1e-12 relative on random matrices of several shapes', () => {
    shapes.forEach(([r, c], k) => {
      const a = randomMatrix(r, c, 11 + k);
      const ours = singularValues(a);
      const ref = new SVD(new Matrix(a), { autoTranspose: true }).diagonal;
      expect(ours).toHaveLength(Math.min(r, c));
      ours.forEach((s, i) => expect(Math.abs(s - ref[i]) / ref[0]).toBeLessThan(1e-12));
    });
  });

  it('svd(A) reconstructs A as U diag(s) Vᵀ with orthonormal U and V columns', () => {
    shapes.forEach(([r, c], k) => {
      const a = randomMatrix(r, c, 101 + k);
      const { u, s, v } = svd(a);
      for (let i = 0; i < r; i++) {
        for (let j = 0; j < c; j++) {
          const back = s.reduce((sum, sk, q) => sum + u[i][q] * sk * v[j][q], 0);
          expect(back).toBeCloseTo(a[i][j], 12);
        }
      }
      for (let p = 0; p < s.length; p++) {
        for (let q = 0; q < s.length; q++) {
          expect(v.reduce((sum, row) => sum + row[p] * row[q], 0)).toBeCloseTo(p === q ? 1 : 0, 12);
          expect(u.reduce((sum, row) => sum + row[p] * row[q], 0)).toBeCloseTo(p === q ? 1 : 0, 12);
        }
      }
    });
  });

  it('singularValues of a matrix with a repeated column has an exact zero within 1e-15 of σmax', () => {
    const a = randomMatrix(6, 3, 7).map((row) => [row[0], row[1], row[0]]);
    const s = singularValues(a);
    expect(s[2] / s[0]).toBeLessThan(1e-15);
  });
});

describe('pseudoInverse', () => {
  // Independent reference: ml-matrix pseudoInverse (SVD-based Moore–Penrose inverse).
  it('pseudoInverse(A) matches ml-matrix pseudoInverse for tall, wide and rank-deficient matrices', () => {
    const deficient = randomMatrix(7, 4, 5).map((row) => [row[0], row[1], row[0] + 2 * row[1], row[3]]);
    for (const a of [randomMatrix(9, 4, 1), randomMatrix(3, 6, 2), randomMatrix(8, 8, 3), deficient]) {
      const ours = pseudoInverse(a);
      const ref = mlPseudoInverse(new Matrix(a)).to2DArray();
      expect(ours).not.toBeNull();
      ours!.forEach((row, i) => row.forEach((v, j) => expect(v).toBeCloseTo(ref[i][j], 9)));
    }
  });

  it('pseudoInverse satisfies the Penrose condition A A⁺ A = A on a rank-deficient matrix', () => {
    const a = randomMatrix(5, 4, 9).map((row) => [row[0], row[1], row[0] - row[1], row[3]]);
    const p = pseudoInverse(a)!;
    const ap = new Matrix(a).mmul(new Matrix(p)).mmul(new Matrix(a)).to2DArray();
    ap.forEach((row, i) => row.forEach((v, j) => expect(v).toBeCloseTo(a[i][j], 12)));
  });

  it('pseudoInverse returns null for an all-zero matrix and throws on a ragged one naming the row', () => {
    expect(
      pseudoInverse([
        [0, 0],
        [0, 0],
      ]),
    ).toBeNull();
    try {
      pseudoInverse([[1, 2], [3]]);
      expect.unreachable();
    } catch (err) {
      expect(err).toBeInstanceOf(SpectraError);
      expect((err as SpectraError).path).toEqual(['matrix', 1]);
    }
    expect(() => pseudoInverse([[1, NaN]])).toThrow(/matrix\[0\]\[1\] must be a finite number/);
  });
});
