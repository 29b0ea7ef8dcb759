import { describe, expect, it } from 'vitest';
import { Matrix, SVD, inverse, solve } from 'ml-matrix';
import { fcnnlsVector } from 'ml-fcnnls';
import { SpectraError, conditionNumber, noiseAmplification, unmixLeastSquares, unmixNnls } from '../../spectra/index';

function randomMatrix(rows: number, cols: number, seed: number, positive = false): number[][] {
  let state = seed >>> 0;
  const next = () =>
    ((state = (Math.imul(state, 1664525) + 1013904223) >>> 0) / 2 ** 32) * (positive ? 1 : 2) - (positive ? 0 : 1);
  return Array.from({ length: rows }, () => Array.from({ length: cols }, next));
}

const normalised = (m: number[][]) => {
  const norms = m[0].map((_, j) => Math.hypot(...m.map((row) => row[j])));
  return m.map((row) => row.map((v, j) => v / norms[j]));
};

describe('conditionNumber and noiseAmplification', () => {
  // Independent reference: ml-matrix SVD `condition` (σmax/σmin) of the column-normalised matrix.
  it('conditionNumber(M) matches ml-matrix SVD condition of the column-normalised M', () => {
    for (const [r, c, seed] of [
      [8, 8, 1],
      [32, 8, 2],
      [64, 16, 3],
      [4, 2, 4],
    ]) {
      const m = randomMatrix(r, c, seed, true);
      const ref = new SVD(new Matrix(normalised(m))).condition;
      expect(Math.abs(conditionNumber(m)! - ref) / ref).toBeLessThan(1e-10);
    }
  });

  // Independent reference: √[(MᵀM)⁻¹]jj · ‖mj‖ computed with ml-matrix's inverse.
  it('noiseAmplification(M) matches √[(MᵀM)⁻¹]jj · ‖mj‖ computed with ml-matrix', () => {
    const m = randomMatrix(10, 6, 8, true);
    const mm = new Matrix(m);
    const inv = inverse(mm.transpose().mmul(mm));
    const gains = noiseAmplification(m);
    gains.forEach((g, j) => {
      const norm = Math.hypot(...m.map((row) => row[j]));
      expect(g!).toBeCloseTo(Math.sqrt(inv.get(j, j)) * norm, 8);
    });
  });

  // Derived by hand: unit columns at cosine c give NᵀN = [[1, c], [c, 1]], eigenvalues 1 ± c, (NᵀN)⁻¹jj = 1/(1 − c²).
  it('conditionNumber, noiseAmplification of two unit signatures at cosine c: √((1+c)/(1−c)) and 1/√(1−c²)', () => {
    for (const c of [0, 0.3, 0.9, 0.999]) {
      const m = [
        [1, c],
        [0, Math.sqrt(1 - c * c)],
        [0, 0],
      ].map((row) => row.map((v) => v * 7));
      expect(conditionNumber(m)!).toBeCloseTo(Math.sqrt((1 + c) / (1 - c)), 9);
      for (const g of noiseAmplification(m)) expect(g!).toBeCloseTo(1 / Math.sqrt(1 - c * c), 9);
    }
  });

  // Derived by hand, two probes of equal brightness whose light crosses into the other's channel at fraction a
  // (rows channels, columns probes): M = [[1, a], [a, 1]], ‖mj‖² = 1 + a², MᵀM = [[1 + a², 2a], [2a, 1 + a²]],
  // det = (1 + a²)² − 4a² = (1 − a²)², so [(MᵀM)⁻¹]jj = (1 + a²)/(1 − a²)² and the gain √[(MᵀM)⁻¹]jj · ‖mj‖ is
  // (1 + a²)/(1 − a²): 1 without crosstalk, 3.03 at a = 0.71.
  it('noiseAmplification of M = [[1, a], [a, 1]] (crosstalk a both ways) is (1 + a²)/(1 − a²) for each probe', () => {
    for (const a of [0, 0.1, 0.5, 0.71, 0.95]) {
      const gains = noiseAmplification([
        [1, a],
        [a, 1],
      ]);
      for (const g of gains) expect(g!).toBeCloseTo((1 + a * a) / (1 - a * a), 9);
    }
  });

  // Derived by hand, crosstalk one way only: probe 2 puts b of probe 1's own signal into channel 1,
  // M = [[1, b], [0, 1]] (equal own signals). MᵀM = [[1, b], [b, 1 + b²]], det = 1,
  // (MᵀM)⁻¹ = [[1 + b², −b], [−b, 1]]; ‖m1‖ = 1 and ‖m2‖ = √(1 + b²), so both gains are √(1 + b²).
  // A neighbour k times brighter in its own channel is M = [[1, b], [0, k]]: its signature turns towards channel 2
  // alone and the gains fall to √(1 + b²/k²), close to 1 for k ≫ b.
  it('noiseAmplification of one-way crosstalk b: √(1 + b²), and √(1 + b²/k²) from a neighbour k times brighter', () => {
    for (const b of [0.3, 0.71, 1.21]) {
      for (const g of noiseAmplification([
        [1, b],
        [0, 1],
      ]))
        expect(g!).toBeCloseTo(Math.sqrt(1 + b * b), 9);
      for (const k of [10, 70]) {
        for (const g of noiseAmplification([
          [1, b],
          [0, k],
        ]))
          expect(g!).toBeCloseTo(Math.sqrt(1 + (b * b) / (k * k)), 9);
      }
    }
  });

  // Same closed form far into the ill-conditioned range (κ ≈ 1.4e4 and 1.4e6), where the Gram route is not trusted.
  it('conditionNumber of two nearly parallel unit signatures keeps the closed form √((1+c)/(1−c)) to 1e-6', () => {
    for (const c of [1 - 1e-8, 1 - 1e-12]) {
      const m = [
        [1, c],
        [0, Math.sqrt((1 - c) * (1 + c))],
        [0, 0],
      ];
      const expected = Math.sqrt((1 + c) / (1 - c));
      expect(Math.abs(conditionNumber(m)! - expected) / expected).toBeLessThan(1e-6);
      expect(
        Math.abs(noiseAmplification(m)[0]! - 1 / Math.sqrt((1 - c) * (1 + c))) * Math.sqrt((1 - c) * (1 + c)),
      ).toBeLessThan(1e-6);
    }
  });

  it(
    'conditionNumber is null (never NaN or Infinity) for a rank-deficient M, a zero column, or more probes than ' +
      'channels',
    () => {
      const base = randomMatrix(6, 3, 5, true);
      expect(conditionNumber(base.map((row) => [row[0], row[1], row[0] * 3]))).toBeNull();
      expect(conditionNumber(base.map((row) => [row[0], 0, row[2]]))).toBeNull();
      expect(conditionNumber(randomMatrix(3, 4, 6, true))).toBeNull();
      expect(noiseAmplification(randomMatrix(3, 4, 6, true))).toEqual([null, null, null, null]);
    },
  );
});

describe('unmixLeastSquares', () => {
  // Independent reference: ml-matrix solve (QR least squares for a tall matrix).
  it('unmixLeastSquares(M, y) matches ml-matrix solve on a noisy overdetermined system', () => {
    const m = randomMatrix(12, 5, 21);
    const y = randomMatrix(12, 1, 22).map((row) => row[0]);
    const ref = solve(new Matrix(m), Matrix.columnVector(y)).to1DArray();
    const { abundances } = unmixLeastSquares(m, y);
    abundances.forEach((a, j) => expect(a!).toBeCloseTo(ref[j], 10));
  });

  it('unmixLeastSquares recovers known abundances exactly from their mixed signal', () => {
    const m = randomMatrix(8, 8, 31, true);
    const truth = [1, 0.5, 2, 0, 3, 0.25, 1, 4];
    const y = m.map((row) => row.reduce((s, v, j) => s + v * truth[j], 0));
    unmixLeastSquares(m, y).abundances.forEach((a, j) => expect(a!).toBeCloseTo(truth[j], 9));
  });

  it('unmixLeastSquares gives nulls and a warning, never NaN, when two probes have the same signature', () => {
    const m = randomMatrix(6, 2, 41, true).map((row) => [row[0], row[0] * 2]);
    const out = unmixLeastSquares(m, [1, 2, 3, 4, 5, 6]);
    expect(out.abundances).toEqual([null, null]);
    expect(out.warnings[0]).toMatch(/rank-deficient/);
  });

  it('unmixLeastSquares rejects a y of the wrong length naming the field', () => {
    try {
      unmixLeastSquares(
        [
          [1, 0],
          [0, 1],
        ],
        [1],
      );
      expect.unreachable();
    } catch (err) {
      expect((err as SpectraError).path).toEqual(['y']);
    }
  });
});

describe('unmixNnls', () => {
  // Independent reference: ml-fcnnls 3 (Van Benthem & Keenan's fast combinatorial NNLS).
  it('unmixNnls(M, y) matches ml-fcnnls on random systems whose least-squares answer has negative entries', () => {
    let constrained = 0;
    for (let seed = 1; seed <= 20; seed++) {
      const m = randomMatrix(10, 6, 100 + seed);
      const y = randomMatrix(10, 1, 200 + seed).map((row) => row[0]);
      const ref = fcnnlsVector(m, y).K.to1DArray();
      const result = unmixNnls(m, y);
      expect(result.warnings).toEqual([]); // converged within Lawson–Hanson's iteration bound
      const ours = result.abundances as number[];
      ours.forEach((a, j) => expect(a).toBeCloseTo(ref[j], 8));
      if (ours.some((a) => a === 0)) constrained++;
    }
    expect(constrained).toBeGreaterThan(5);
  });

  // These seeds were picked because Lawson–Hanson's inner loop must step back and free a variable on them.
  it('unmixNnls matches ml-fcnnls where a variable has to leave the passive set again', () => {
    for (const seed of [47, 202, 379, 385]) {
      const m = randomMatrix(10, 6, 100 + seed);
      const y = randomMatrix(10, 1, 200 + seed).map((row) => row[0]);
      const ref = fcnnlsVector(m, y).K.to1DArray();
      const result = unmixNnls(m, y);
      expect(result.warnings).toEqual([]);
      (result.abundances as number[]).forEach((a, j) => expect(a).toBeCloseTo(ref[j], 8));
    }
  });

  // Reference value from the ml-fcnnls README example: K ≈ [0.4610, 0.5611, 0].
  it('unmixNnls reproduces the ml-fcnnls README example to 4 decimals', () => {
    const x = [
      [1, 1, 2],
      [10, 11, -9],
      [-1, 0, 0],
      [-5, 6, -7],
    ];
    const k = unmixNnls(x, [-1, 11, 0, 1]).abundances as number[];
    expect(k[0]).toBeCloseTo(0.461, 3);
    expect(k[1]).toBeCloseTo(0.5611, 4);
    expect(k[2]).toBe(0);
  });

  // Checked by hand: least squares gives x = (5/3, −1/3); NNLS gives x = (3/2, 0). KKT: r = y − A x = (½, −½, −1),
  // w = Aᵀr = (0, −½): zero gradient on the free variable, negative on the one held at zero.
  it('unmixNnls([[1,1],[1,0],[0,1]], [2,1,−1]) is (3/2, 0), satisfying the KKT conditions', () => {
    const a = [
      [1, 1],
      [1, 0],
      [0, 1],
    ];
    const y = [2, 1, -1];
    expect(unmixLeastSquares(a, y).abundances.map((v) => v!)).toEqual([
      expect.closeTo(5 / 3, 12),
      expect.closeTo(-1 / 3, 12),
    ]);
    const x = unmixNnls(a, y).abundances as number[];
    expect(x[0]).toBeCloseTo(1.5, 12);
    expect(x[1]).toBe(0);
    const r = y.map((yi, i) => yi - a[i][0] * x[0] - a[i][1] * x[1]);
    const w = [0, 1].map((j) => a.reduce((s, row, i) => s + row[j] * r[i], 0));
    expect(w[0]).toBeCloseTo(0, 12);
    expect(w[1]).toBeLessThan(0);
  });
});
