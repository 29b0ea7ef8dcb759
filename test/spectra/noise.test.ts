import { describe, expect, it } from 'vitest';
import { Matrix, pseudoInverse as mlPseudoInverse, inverse as mlInverse } from 'ml-matrix';
import { photonMixing, predictUnmixingNoise, simulateUnmixing, type NoiseInput } from '../../spectra/index';

// A 4-channel, 3-probe design with real overlap, a background, read noise and an EMCCD-like excess factor.
const design: NoiseInput = {
  mixingPhotons: [
    [900, 120, 10],
    [150, 700, 60],
    [20, 180, 500],
    [5, 40, 260],
  ],
  abundance: [1, 0.3, 0.6],
  backgroundPhotons: [40, 25, 30, 20],
  readNoiseElectrons: [3, 3, 4, 4],
  excessNoiseFactor: 2,
};

/** The noise formula of docs/science.md through ml-matrix: M⁺ diag(F (M a + b) + σ²) M⁺ᵀ. */
function referenceCovariance(input: NoiseInput): number[][] {
  const m = new Matrix(input.mixingPhotons);
  const pinv = mlPseudoInverse(m);
  const signal = m.mmul(Matrix.columnVector(input.abundance)).to1DArray();
  const f = input.excessNoiseFactor as number;
  const read = input.readNoiseElectrons as number[];
  const v = signal.map((s, c) => f * (s + input.backgroundPhotons![c]) + read[c] ** 2);
  return pinv.mmul(Matrix.diag(v)).mmul(pinv.transpose()).to2DArray();
}

describe('unmixing noise prediction', () => {
  it('predictUnmixingNoise(design).covariance matches M⁺ diag(v) M⁺ᵀ built with ml-matrix to 1e-10 relative', () => {
    const predicted = predictUnmixingNoise(design).covariance;
    const reference = referenceCovariance(design);
    reference.forEach((row, i) =>
      row.forEach((x, j) => expect(Math.abs(predicted[i][j]! - x)).toBeLessThan(1e-10 * Math.abs(reference[i][i]))),
    );
  });

  it('predictUnmixingNoise with white noise only reduces to σ² (MᵀM)⁻¹ (ml-matrix inverse)', () => {
    const sigma = 7;
    const zero = {
      ...design,
      abundance: [0, 0, 0],
      backgroundPhotons: undefined,
      excessNoiseFactor: 1,
      readNoiseElectrons: sigma,
    };
    const m = new Matrix(design.mixingPhotons);
    const reference = mlInverse(m.transpose().mmul(m))
      .mul(sigma * sigma)
      .to2DArray();
    const predicted = predictUnmixingNoise(zero).covariance;
    reference.forEach((row, i) => row.forEach((x, j) => expect(predicted[i][j]!).toBeCloseTo(x, 12)));
  });

  it(
    'predictUnmixingNoise agrees with simulateUnmixing (40,000 seeded draws) within 4.5 standard errors of each ' +
      'sample covariance',
    () => {
      const predicted = predictUnmixingNoise(design).covariance;
      const mc = simulateUnmixing(design, { draws: 40_000, seed: 12345 });
      // Standard error of a sample covariance from the same draws: √((m₂₂ − s²)/N) (large-sample theory of moments).
      mc.covariance!.forEach((row, i) =>
        row.forEach((s, j) =>
          expect(Math.abs(s - predicted[i][j]!)).toBeLessThan(4.5 * mc.covarianceStandardError![i][j]),
        ),
      );
      // The unmixed mean is unbiased: within 4.5 standard errors of the true abundance.
      mc.mean!.forEach((x, i) =>
        expect(Math.abs(x - design.abundance[i])).toBeLessThan(4.5 * Math.sqrt(predicted[i][i]! / 40_000)),
      );
    },
  );

  it('simulateUnmixing with the same seed gives the same figures, and a different seed different ones', () => {
    const a = simulateUnmixing(design, { draws: 500, seed: 3 });
    const b = simulateUnmixing(design, { draws: 500, seed: 3 });
    const c = simulateUnmixing(design, { draws: 500, seed: 4 });
    expect(b.covariance).toEqual(a.covariance);
    expect(c.covariance).not.toEqual(a.covariance);
  });

  it('predictUnmixingNoise variance grows with the excess noise factor as F·shot + read²', () => {
    const one = predictUnmixingNoise({ ...design, excessNoiseFactor: 1, readNoiseElectrons: 0 });
    const two = predictUnmixingNoise({ ...design, excessNoiseFactor: 2, readNoiseElectrons: 0 });
    one.sd.forEach((s, i) => expect(two.sd[i]!).toBeCloseTo(Math.SQRT2 * s!, 10));
  });

  it(
    'predictUnmixingNoise spreading is 1 on the diagonal and 0 off it for perfectly separated probes (ideal ' +
      'detector)',
    () => {
      const separated = predictUnmixingNoise({
        mixingPhotons: [
          [500, 0],
          [0, 80],
          [0, 0],
        ],
        abundance: [1, 1],
      });
      expect(separated.spreading[0][0]).toBeCloseTo(1, 12);
      expect(separated.spreading[1][1]).toBeCloseTo(1, 12);
      expect(separated.spreading[0][1]).toBeCloseTo(0, 12);
    },
  );

  it('predictUnmixingNoise spreading predicts the extra SD that adding target j brings to target i', () => {
    const without = predictUnmixingNoise({ ...design, abundance: [1, 0, 0.6] });
    const withJ = predictUnmixingNoise(design);
    const i = 2;
    const j = 1;
    const primaryI = withJ.primaryChannel[i];
    const primaryJ = withJ.primaryChannel[j];
    // Extra variance of target i in its primary-channel photons², per the definition SS² · S_j.
    const scale = design.mixingPhotons[primaryI][i] ** 2;
    const extra = (withJ.covariance[i][i]! - without.covariance[i][i]!) * scale;
    const sj = design.mixingPhotons[primaryJ][j] * design.abundance[j];
    expect(extra).toBeCloseTo(withJ.spreading[i][j]! ** 2 * sj, 8);
  });

  it('predictUnmixingNoise of a rank-deficient design gives nulls and a warning, never NaN', () => {
    const result = predictUnmixingNoise({
      mixingPhotons: [
        [1, 2],
        [2, 4],
        [3, 6],
      ],
      abundance: [1, 1],
    });
    expect(result.covariance.flat().every((x) => x === null)).toBe(true);
    expect(result.warnings.join(' ')).toMatch(/linearly dependent/);
  });

  it.each([
    [{ ...design, abundance: [1, -1, 0] }, ['abundance', 1]],
    [{ ...design, excessNoiseFactor: 0.5 }, ['excessNoiseFactor']],
    [{ ...design, backgroundPhotons: [1, 2] }, ['backgroundPhotons']],
    [
      {
        ...design,
        mixingPhotons: [
          [1, 2, 3],
          [1, Number.NaN, 3],
        ],
      },
      ['mixingPhotons', 1, 1],
    ],
  ])('predictUnmixingNoise(bad input %#) throws invalid_input naming the field', (input, path) => {
    expect(() => predictUnmixingNoise(input as NoiseInput)).toThrow(
      expect.objectContaining({ code: 'invalid_input', path }),
    );
  });

  it('photonMixing scales each probe so its primary channel holds the stated photons', () => {
    const m = photonMixing(
      [
        [2, 0.1],
        [0.5, 4],
      ],
      [0, 1],
      [1000, 300],
    );
    expect(m[0][0]).toBeCloseTo(1000, 9);
    expect(m[1][1]).toBeCloseTo(300, 9);
    expect(m[1][0] / m[0][0]).toBeCloseTo(0.25, 12);
  });
});
