import { describe, expect, it } from 'vitest';
import { lgamma } from 'mathjs';
import { createRandom } from '../../spectra/index';
// The log-factorial table behind the Poisson sampler, checked on its own (an internal unit of core/random).
import { logFactorial } from '../../spectra/core/random';

/** Sample mean and unbiased variance. */
function moments(xs: number[]): { mean: number; variance: number } {
  const mean = xs.reduce((s, x) => s + x, 0) / xs.length;
  const variance = xs.reduce((s, x) => s + (x - mean) ** 2, 0) / (xs.length - 1);
  return { mean, variance };
}

/** Poisson pmf from its definition, through mathjs' lgamma (an outside reference). */
const poissonPmf = (k: number, mean: number) => Math.exp(-mean + k * Math.log(mean) - lgamma(k + 1));

describe('seeded random source', () => {
  it('createRandom(seed) repeats its sequence for the same seed and differs for another', () => {
    const a = createRandom(42);
    const b = createRandom(42);
    const c = createRandom(43);
    const xa = Array.from({ length: 5 }, () => a.uniform());
    expect(Array.from({ length: 5 }, () => b.uniform())).toEqual(xa);
    expect(Array.from({ length: 5 }, () => c.uniform())).not.toEqual(xa);
  });

  it('createRandom(7).uniform() has mean 1/2 and variance 1/12 within 5 standard errors over 200,000 draws', () => {
    const rng = createRandom(7);
    const n = 200_000;
    const xs = Array.from({ length: n }, () => rng.uniform());
    const { mean, variance } = moments(xs);
    expect(xs.reduce((m, x) => Math.min(m, x), 1)).toBeGreaterThan(0);
    expect(xs.reduce((m, x) => Math.max(m, x), 0)).toBeLessThan(1);
    // Uniform(0,1): SD of the mean √(1/12/n); SD of the sample variance √((1/80 − 1/144)/n) (fourth central moment
    // 1/80).
    expect(Math.abs(mean - 0.5)).toBeLessThan(5 * Math.sqrt(1 / 12 / n));
    expect(Math.abs(variance - 1 / 12)).toBeLessThan(5 * Math.sqrt((1 / 80 - 1 / 144) / n));
  });

  it('createRandom(9).normal() has mean 0 and variance 1 within 5 standard errors (normal: SE of s² is √(2/n))', () => {
    const rng = createRandom(9);
    const n = 200_000;
    const { mean, variance } = moments(Array.from({ length: n }, () => rng.normal()));
    expect(Math.abs(mean)).toBeLessThan(5 / Math.sqrt(n));
    expect(Math.abs(variance - 1)).toBeLessThan(5 * Math.sqrt(2 / n));
  });

  it.each([0.5, 3, 9.9, 10, 37, 1000])(
    'createRandom().poisson(%s) has mean and variance equal to the mean within 5 standard errors',
    (lambda) => {
      const rng = createRandom(Math.round(lambda * 100));
      const n = 100_000;
      const { mean, variance } = moments(Array.from({ length: n }, () => rng.poisson(lambda)));
      // Poisson: Var(x̄) = λ/n; Var(s²) ≈ (μ4 − λ²)/n with μ4 = λ(1 + 3λ).
      expect(Math.abs(mean - lambda)).toBeLessThan(5 * Math.sqrt(lambda / n));
      expect(Math.abs(variance - lambda)).toBeLessThan(5 * Math.sqrt((lambda * (1 + 3 * lambda) - lambda ** 2) / n));
    },
  );

  it.each([4, 10, 30, 100])(
    'createRandom().poisson(%s) histogram passes a chi-square test against the exact pmf (99.9 % level)',
    (lambda) => {
      const rng = createRandom(2024 + lambda);
      const n = 100_000;
      const counts = new Map<number, number>();
      for (let i = 0; i < n; i++) {
        const k = rng.poisson(lambda);
        counts.set(k, (counts.get(k) ?? 0) + 1);
      }
      // Bins with expectation ≥ 5; the tails pooled into the two end bins.
      const lo = Math.max(0, Math.floor(lambda - 4 * Math.sqrt(lambda)));
      const hi = Math.ceil(lambda + 4 * Math.sqrt(lambda));
      let chi2 = 0;
      let bins = 0;
      let pLow = 0;
      for (let k = 0; k < lo; k++) pLow += poissonPmf(k, lambda);
      let pHigh = 1 - pLow;
      for (let k = lo; k <= hi; k++) pHigh -= poissonPmf(k, lambda);
      const observe = (observed: number, p: number) => {
        if (n * p < 5) return;
        chi2 += (observed - n * p) ** 2 / (n * p);
        bins++;
      };
      observe(
        [...counts].filter(([k]) => k < lo).reduce((s, [, c]) => s + c, 0),
        pLow,
      );
      for (let k = lo; k <= hi; k++) observe(counts.get(k) ?? 0, poissonPmf(k, lambda));
      observe(
        [...counts].filter(([k]) => k > hi).reduce((s, [, c]) => s + c, 0),
        pHigh,
      );
      // 99.9 % point of chi-square with ν dof, Wilson–Hilferty approximation (Wilson & Hilferty, PNAS 1931).
      const nu = bins - 1;
      const critical = nu * (1 - 2 / (9 * nu) + 3.0902 * Math.sqrt(2 / (9 * nu))) ** 3;
      expect(chi2).toBeLessThan(critical);
    },
  );

  it.each([0, 1, 5, 20, 255, 256, 1000, 1e6])(
    'logFactorial(%s) matches mathjs lgamma(k + 1) to 1e-12 relative',
    (k) => {
      const expected = lgamma(k + 1);
      expect(Math.abs(logFactorial(k) - expected)).toBeLessThanOrEqual(1e-12 * Math.max(1, Math.abs(expected)));
    },
  );

  it('createRandom(1).poisson(-1) throws invalid_input naming mean', () => {
    expect(() => createRandom(1).poisson(-1)).toThrow(
      expect.objectContaining({ code: 'invalid_input', path: ['mean'] }),
    );
  });
});
