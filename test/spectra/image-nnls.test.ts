import { describe, expect, it } from 'vitest';
import { fcnnlsVector } from 'ml-fcnnls';
import { allocateUnmixOutput, pixelUnmixer, type PixelUnmixMethod } from '../../spectra/index';
import { maxAbs, mix, pixelOf, randomMatrix, rmsResidual, toPlanes, uniformSource } from './helpers/pixels';

function unmix(m: number[][], pixels: number[][], method: PixelUnmixMethod) {
  const out = allocateUnmixOutput(m[0].length, pixels.length);
  pixelUnmixer(m, method).unmixRange(toPlanes(pixels, m.length), 0, pixels.length, out);
  return out;
}

/** Pixels M a + noise with abundances drawn on [lo, 1): a negative lo makes some constraints active. */
function noisyPixels(m: number[][], count: number, seed: number, lo: number, noise: number, repeat = 1): number[][] {
  const next = uniformSource(seed);
  const pixels: number[][] = [];
  while (pixels.length < count) {
    const a = m[0].map(() => next(lo, 1));
    const y = mix(m, a);
    for (let r = 0; r < repeat; r++) pixels.push(y.map((v) => v + next(-noise, noise)));
  }
  return pixels;
}

describe('pixelUnmixer NNLS', () => {
  // Independent reference: ml-fcnnls 3.0 (fast combinatorial NNLS, Van Benthem & Keenan 2004), per pixel, with its
  // gradient tolerance tightened to 1e-12. Agreement to 1e-6 of the pixel's largest abundance (float32 output).
  // `repeat` sends runs of near-identical pixels (pixels of one region look alike).
  it.each([
    [8, 6, 1, -0.6, 1],
    [8, 6, 2, -0.6, 3],
    [16, 10, 3, -0.3, 1],
    [4, 4, 4, -1, 1],
    [32, 16, 5, -0.5, 2],
  ])('unmixRange by NNLS on %i channels × %i probes (seed %i, a from %f) matches ml-fcnnls per pixel', (...args) => {
    const [rows, cols, seed, lo, repeat] = args;
    const m = randomMatrix(rows, cols, seed, 0, 1);
    const pixels = noisyPixels(m, 600, seed + 50, lo, 0.05, repeat);
    const out = unmix(m, pixels, 'nnls');
    let active = 0;
    pixels.forEach((y, k) => {
      const expected = fcnnlsVector(m, y, { gradientTolerance: 1e-12, maxIterations: 100 }).K.to1DArray();
      const { a, residual } = pixelOf(out, k);
      const scale = Math.max(maxAbs(expected), 1e-3);
      a.forEach((v, j) => expect(Math.abs(v - expected[j]), `pixel ${k} probe ${j}`).toBeLessThanOrEqual(1e-6 * scale));
      expect(Math.abs(residual - rmsResidual(m, y, expected))).toBeLessThanOrEqual(1e-6 * Math.max(scale, residual));
      if (expected.some((v) => v === 0)) active++;
    });
    // The comparison must cover pixels where the constraints bind, not only all-positive ones.
    expect(active).toBeGreaterThan(pixels.length / 4);
  });

  // Invariant: with abundances ≥ 0 (some exactly 0) and no noise, M a is fitted exactly, so NNLS gives back a.
  it('unmixRange by NNLS recovers noiseless pixels M a with a ≥ 0 (a third of them 0) to float32', () => {
    const m = randomMatrix(8, 6, 21, 0, 1);
    const next = uniformSource(22);
    const truth = Array.from({ length: 500 }, () => Array.from({ length: 6 }, () => Math.max(0, next(-500, 1000))));
    const out = unmix(
      m,
      truth.map((a) => mix(m, a)),
      'nnls',
    );
    truth.forEach((a, k) => {
      const got = pixelOf(out, k);
      got.a.forEach((v, j) => expect(Math.abs(v - a[j])).toBeLessThanOrEqual(1e-6 * maxAbs(a)));
      expect(got.residual).toBeLessThanOrEqual(1e-6 * maxAbs(a));
    });
  });

  // Invariants of NNLS (Lawson & Hanson 1974, ch. 23): the solution is ≥ 0, and where the unconstrained least-squares
  // solution is already all positive, it is the NNLS solution.
  it('unmixRange by NNLS gives abundances ≥ 0 and equals least squares wherever least squares is all positive', () => {
    const m = randomMatrix(8, 6, 31, 0, 1);
    const pixels = noisyPixels(m, 2000, 32, -0.4, 0.1);
    const nnls = unmix(m, pixels, 'nnls');
    const ls = unmix(m, pixels, 'leastSquares');
    let positive = 0;
    pixels.forEach((_, k) => {
      const a = pixelOf(nnls, k).a;
      expect(a.every((v) => v >= 0)).toBe(true);
      const b = pixelOf(ls, k);
      if (b.a.every((v) => v > 0)) {
        positive++;
        a.forEach((v, j) => expect(Math.abs(v - b.a[j])).toBeLessThanOrEqual(1e-6 * maxAbs(b.a)));
        expect(Math.abs(pixelOf(nnls, k).residual - b.residual)).toBeLessThanOrEqual(1e-6 * maxAbs(b.a));
      }
    });
    expect(positive).toBeGreaterThan(100);
    expect(positive).toBeLessThan(pixels.length);
  });
});
