// The few loops kept for speed (spectra/kernels/) against their plain references, written beside them: each must agree
// to 1e-12 relative over the inputs the library gives it. These are units of the library, imported directly.
import { describe, expect, it } from 'vitest';
import { dotAt, dotReference } from '../../spectra/kernels/dot';
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

describe('kernels/dot', () => {
  // An emission held over n points against a transmission on a 701-point grid, read from an offset: every length
  // from 0 to 9 (the tail of the four-way loop) and the lengths of real lines (10σ each side on a 1 nm grid).
  const transmission = Array.from({ length: 701 }, (_, i) => 1e-6 + 0.93 / (1 + Math.exp(-(i - 300) / 1.5)));
  it.each([0, 1, 2, 3, 4, 5, 6, 7, 8, 9, 151, 230, 331])(
    'dotAt over %s emission points equals the one-sum loop to 1e-12 relative',
    (n) => {
      const emission = Array.from({ length: n }, (_, k) => Math.exp(-(((k - n / 2) / (n / 8 + 1)) ** 2)));
      const offset = 701 - n - 17 > 0 ? 200 : 0;
      const fast = dotAt(emission, transmission, offset);
      const plain = dotReference(emission, transmission, offset);
      if (n === 0) expect(fast).toBe(0);
      else expect(relative(fast, plain)).toBeLessThan(1e-12);
    },
  );

  it('dotAt of [1, 2, 3, 4, 5] with [10, 20, 30, 40, 50] read from 0 is 550 (worked by hand)', () => {
    expect(dotAt([1, 2, 3, 4, 5], [10, 20, 30, 40, 50], 0)).toBe(550);
    expect(dotAt([1, 1], [10, 20, 30, 40, 50], 3)).toBe(90);
  });
});
