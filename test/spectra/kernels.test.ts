// The few loops kept for speed (spectra/kernels/) against their plain references, written beside them: each must agree
// to 1e-12 relative over the inputs the library gives it. These are units of the library, imported directly.
import { describe, expect, it } from 'vitest';
import { EXP_TABLE_REACH, expNonPositive } from '../../spectra/kernels/exp';
import { logisticSamples, logisticSamplesReference } from '../../spectra/kernels/logistic';

const relative = (a: number, b: number) => Math.abs(a - b) / Math.max(Math.abs(a), Math.abs(b), Number.MIN_VALUE);

describe('kernels/exp', () => {
  it('expNonPositive(x) equals Math.exp(x) to 1e-15 relative for 200,000 points of [−64, 0]', () => {
    let worst = 0;
    for (let k = 0; k <= 200_000; k++) {
      const x = -(EXP_TABLE_REACH * k) / 200_000;
      worst = Math.max(worst, relative(expNonPositive(x), Math.exp(x)));
    }
    expect(worst).toBeLessThan(1e-15);
  });

  it('expNonPositive(x) is Math.exp(x) itself beyond the table: below −64, above 0 and for NaN', () => {
    for (const x of [-64.5, -700, 0.5, 3]) expect(expNonPositive(x)).toBe(Math.exp(x));
    expect(Number.isNaN(expNonPositive(Number.NaN))).toBe(true);
  });
});

describe('kernels/logistic', () => {
  // A filter edge on a grid: from 55 scale lengths on the blocked side to 28 on the open side (blocking OD 12), at
  // steps of 0.05–2 scale lengths (edge widths of 0.5–10 nm on 0.2–1 nm grids).
  it.each([0.05, 0.2, 0.66, 1, 2])(
    'logisticSamples(x0, %s, n) equals the one-exp-per-point formula to 1e-12 relative over an edge',
    (dx) => {
      const count = Math.ceil(83 / dx);
      const fast = logisticSamples(-55, dx, count);
      const plain = logisticSamplesReference(-55, dx, count);
      expect(fast).toHaveLength(count);
      fast.forEach((v, k) => expect(relative(v, plain[k])).toBeLessThan(1e-12));
    },
  );

  it('logisticSamples walking downhill (a falling edge, negative step) equals the plain formula to 1e-12', () => {
    const fast = logisticSamples(28, -0.5, 170);
    const plain = logisticSamplesReference(28, -0.5, 170);
    fast.forEach((v, k) => expect(relative(v, plain[k])).toBeLessThan(1e-12));
  });
});
