import { describe, expect, it } from 'vitest';
import poisson from '@stdlib/random-base-poisson';
import { Matrix, pseudoInverse } from 'ml-matrix';
import { allocateUnmixOutput, pixelUnmixer } from '../../spectra/index';
import { uniformSource } from './helpers/pixels';

// An invented reference: 6 probes with Gaussian emissions over 8 neighbouring channels, heavily overlapping.
const CHANNELS = 8;
const PROBES = 6;
const M = Array.from({ length: CHANNELS }, (_, c) =>
  Array.from({ length: PROBES }, (_, p) => Math.exp(-0.5 * ((c - (0.6 + 1.25 * p)) / 1.1) ** 2)),
);
const PIXELS = 64 * 64;

/** A 64 × 64 image of known abundances (probe 6 absent from the first half), counts drawn Poisson around M a. */
function syntheticImage() {
  const next = uniformSource(7);
  const draw = poisson.factory({ seed: 20261202 });
  const truth = Array.from({ length: PIXELS }, (_, k) =>
    Array.from({ length: PROBES }, (_, p) => (p === 5 && k < PIXELS / 2 ? 0 : next(100, 1000))),
  );
  const expected = truth.map((a) => M.map((row) => row.reduce((s, v, j) => s + v * a[j], 0)));
  const planes = Array.from({ length: CHANNELS }, (_, c) => Float32Array.from(expected, (l) => draw(l[c])));
  return { truth, expected, planes };
}

describe('pixelUnmixer on a synthetic image with Poisson counts', () => {
  const { truth, expected, planes } = syntheticImage();
  const ls = allocateUnmixOutput(PROBES, PIXELS);
  pixelUnmixer(M, 'leastSquares').unmixRange(planes, 0, PIXELS, ls);
  const mm = new Matrix(M);
  const inverse = pseudoInverse(mm);
  const residualMaker = Matrix.eye(CHANNELS).sub(mm.mmul(inverse));

  // The residual r = (I − H) n of Poisson noise n (H = M M⁺) gives q = Σ r²/λ, a quadratic form nᵀAn with
  // A = (I − H) Λ⁻¹ (I − H). Its mean is tr(AΛ) and its variance 2 tr((AΛ)²) + Σ A_cc² κ₄ with κ₄ = λ for Poisson
  // (Searle, Linear Models, 1971, ch. 2.5; from memory). For equal λ in every channel the mean is the degrees of
  // freedom, pixels × (channels − probes); here λ differs between channels, so the exact mean is used and its distance
  // from the degrees of freedom (about 11 % here) bounded separately.
  it('unmixRange by least squares leaves Σ r²/λ within 4 SD of its mean, and that mean within 15 % of the dof', () => {
    let q = 0;
    let mean = 0;
    let variance = 0;
    for (let k = 0; k < PIXELS; k++) {
      const lambda = expected[k];
      let squares = 0;
      for (let c = 0; c < CHANNELS; c++) {
        const fit = M[c].reduce((s, v, j) => s + v * ls.abundances[j][k], 0);
        q += (planes[c][k] - fit) ** 2 / lambda[c];
        squares += (planes[c][k] - fit) ** 2;
      }
      expect(Math.abs(ls.residual[k] - Math.sqrt(squares / CHANNELS))).toBeLessThan(1e-3);
      const a = residualMaker.mmul(Matrix.diag(lambda.map((v) => 1 / v))).mmul(residualMaker);
      const aLambda = a.mmul(Matrix.diag(lambda));
      mean += aLambda.trace();
      variance += 2 * aLambda.mmul(aLambda).trace() + lambda.reduce((s, l, c) => s + a.get(c, c) ** 2 * l, 0);
    }
    const dof = PIXELS * (CHANNELS - PROBES);
    expect(Math.abs(q - mean)).toBeLessThan(4 * Math.sqrt(variance));
    expect(Math.abs(mean / dof - 1)).toBeLessThan(0.15);
  });

  // The least-squares estimate is unbiased with covariance M⁺ Λ M⁺ᵀ, so each probe's z = (â − a)/σ has mean 0 and
  // mean square 1 over the image; with 4,096 pixels their SDs are 1/64 and about √2/64, and 5 SD are allowed.
  it('unmixRange by least squares recovers every abundance with z-scores of mean 0 and mean square 1 (5 SD)', () => {
    for (let j = 0; j < PROBES; j++) {
      let sum = 0;
      let squares = 0;
      for (let k = 0; k < PIXELS; k++) {
        const variance = expected[k].reduce((s, l, c) => s + inverse.get(j, c) ** 2 * l, 0);
        const z = (ls.abundances[j][k] - truth[k][j]) / Math.sqrt(variance);
        sum += z;
        squares += z * z;
      }
      expect(Math.abs(sum / PIXELS)).toBeLessThan(5 / 64);
      expect(Math.abs(squares / PIXELS - 1)).toBeLessThan((5 * Math.SQRT2) / 64);
    }
  });

  // NNLS keeps abundances ≥ 0; where probe 6 is absent its NNLS estimate is 0 or a positive noise-level value
  // (under 4 SD of the least-squares noise), while least squares also gives negative values there.
  it('unmixRange by NNLS on the same image gives abundances ≥ 0 and an absent probe only noise-level values', () => {
    const nnls = allocateUnmixOutput(PROBES, PIXELS);
    pixelUnmixer(M, 'nnls').unmixRange(planes, 0, PIXELS, nnls);
    for (const plane of nnls.abundances) expect(plane.every((v) => v >= 0)).toBe(true);
    let negativeLs = 0;
    for (let k = 0; k < PIXELS / 2; k++) {
      const sd = Math.sqrt(expected[k].reduce((s, l, c) => s + inverse.get(5, c) ** 2 * l, 0));
      expect(nnls.abundances[5][k]).toBeLessThan(4 * sd);
      if (ls.abundances[5][k] < 0) negativeLs++;
    }
    expect(negativeLs).toBeGreaterThan(PIXELS / 8);
  });
});
