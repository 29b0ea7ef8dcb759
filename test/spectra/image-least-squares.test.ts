import { describe, expect, it } from 'vitest';
import { Matrix, pseudoInverse, solve } from 'ml-matrix';
import { allocateUnmixOutput, pixelUnmixer } from '../../spectra/index';
import { maxAbs, mix, pixelOf, randomMatrix, rmsResidual, toPlanes, uniformSource } from './helpers/pixels';

/** Unmixes `pixels` (vectors over channels) by least squares; returns the output. */
function unmixLs(m: number[][], pixels: number[][]) {
  const out = allocateUnmixOutput(m[0].length, pixels.length);
  pixelUnmixer(m, 'leastSquares').unmixRange(toPlanes(pixels, m.length), 0, pixels.length, out);
  return out;
}

describe('pixelUnmixer least squares', () => {
  // Independent reference: ml-matrix 6.15 `solve` (QR least squares for a tall matrix, LU for a square one) per
  // pixel. The output planes are float32, so agreement is asked to 1e-6 of the pixel's largest abundance.
  it.each([
    [8, 6, 1],
    [12, 5, 2],
    [12, 10, 6],
    [6, 6, 3],
    [32, 16, 4],
    [3, 1, 5],
  ])('unmixRange by least squares on %i channels × %i probes matches ml-matrix solve per pixel', (rows, cols, seed) => {
    const m = randomMatrix(rows, cols, seed);
    const pixels = randomMatrix(300, rows, seed + 100, -5, 5);
    const out = unmixLs(m, pixels);
    pixels.forEach((y, k) => {
      const expected = solve(new Matrix(m), Matrix.columnVector(y)).to1DArray();
      const { a, residual } = pixelOf(out, k);
      const scale = maxAbs(expected);
      a.forEach((v, j) => expect(Math.abs(v - expected[j])).toBeLessThanOrEqual(1e-6 * scale));
      const expectedResidual = rmsResidual(m, y, expected);
      expect(Math.abs(residual - expectedResidual)).toBeLessThanOrEqual(1e-6 * Math.max(expectedResidual, scale));
    });
  });

  // Independent reference: ml-matrix `pseudoInverse` (SVD) times y. The probes' brightness differs by 10⁶, which the
  // unmixer must not mistake for a missing probe.
  it('unmixRange by least squares matches ml-matrix pseudoInverse · y when probes differ 10⁶ in brightness', () => {
    const m = randomMatrix(8, 3, 7, 0, 1).map((row) => [row[0] * 1e4, row[1], row[2] * 1e-2]);
    const pixels = randomMatrix(200, 8, 8, 0, 1e4);
    const out = unmixLs(m, pixels);
    const inverse = pseudoInverse(new Matrix(m));
    pixels.forEach((y, k) => {
      const expected = inverse.mmul(Matrix.columnVector(y)).to1DArray();
      pixelOf(out, k).a.forEach((v, j) =>
        expect(Math.abs(v - expected[j])).toBeLessThanOrEqual(1e-6 * Math.abs(expected[j]) + 1e-9 * maxAbs(expected)),
      );
    });
  });

  // Invariant of least squares (exact in exact arithmetic): noiseless pixels M a give back a and a zero residual,
  // negative abundances included.
  it('unmixRange by least squares recovers noiseless pixels M a exactly (to float32) with zero residual', () => {
    const m = randomMatrix(8, 6, 11, 0, 1);
    const next = uniformSource(12);
    const truth = Array.from({ length: 500 }, () => Array.from({ length: 6 }, () => next(-100, 1000)));
    const out = unmixLs(
      m,
      truth.map((a) => mix(m, a)),
    );
    truth.forEach((a, k) => {
      const got = pixelOf(out, k);
      got.a.forEach((v, j) => expect(Math.abs(v - a[j])).toBeLessThanOrEqual(1e-6 * maxAbs(a)));
      expect(got.residual).toBeLessThanOrEqual(1e-9 * maxAbs(a));
    });
  });

  // 4 and 8 channels run the unrolled kernel of up to 8 channels (4 with padding), 12 the general loop.
  it.each([4, 8, 12])(
    'unmixRange by least squares on %i channels writes only pixels [from, to), NaN where a value is not finite',
    (channels) => {
      const m = randomMatrix(channels, 2, 13, 0, 1);
      const pixels = randomMatrix(10, channels, 14, 0, 1);
      pixels[5][2] = NaN;
      pixels[6][0] = Infinity;
      const out = allocateUnmixOutput(2, 10);
      const unmixer = pixelUnmixer(m, 'leastSquares');
      unmixer.unmixRange(toPlanes(pixels, channels), 3, 8, out);
      for (const k of [0, 1, 2, 8, 9]) expect(pixelOf(out, k)).toEqual({ a: [0, 0], residual: 0 });
      for (const k of [5, 6]) expect(pixelOf(out, k).a.every(Number.isNaN) && Number.isNaN(out.residual[k])).toBe(true);
      for (const k of [3, 4, 7]) expect(pixelOf(out, k).a.every(Number.isFinite)).toBe(true);
      expect([unmixer.channels, unmixer.probes]).toEqual([channels, 2]);
    },
  );
});

describe('pixelUnmixer plane types', () => {
  // A 16-bit image (TIFF 6.0, BitsPerSample 16) arrives as Uint16Array planes: the same counts as Float64Array planes
  // must unmix to the same output, by either method.
  it.each(['leastSquares', 'nnls'] as const)(
    'unmixRange (%s) gives the same output for Uint16Array planes',
    (method) => {
      const m = randomMatrix(8, 6, 41, 0, 1);
      const counts = randomMatrix(301, 8, 42, 0, 65535).map((y) => y.map(Math.round));
      const wide = toPlanes(counts, 8);
      const narrow = wide.map((plane) => Uint16Array.from(plane));
      const a = allocateUnmixOutput(6, counts.length);
      const b = allocateUnmixOutput(6, counts.length);
      const unmixer = pixelUnmixer(m, method);
      unmixer.unmixRange(wide, 0, counts.length, a);
      unmixer.unmixRange(narrow, 0, counts.length, b);
      expect(b).toEqual(a);
      expect(a.residual.some((v) => v > 0)).toBe(true);
    },
  );
});
