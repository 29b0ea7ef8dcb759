import { describe, expect, it } from 'vitest';
import { mean, std } from 'mathjs';
import { regionMeans } from '../../spectra/index';
import { errorOf } from './helpers/errors';

// A 4 × 3 image (width 4), two planes; plane 2 sits on an offset of 1e8 to check precision.
const PLANE_1 = Float32Array.from([1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12]);
const PLANE_2 = Float64Array.from(PLANE_1, (v) => 1e8 + v * v);

describe('regionMeans', () => {
  // Hand-worked: the 2 × 2 region at (1, 1) holds pixels 6, 7, 10, 11: mean 8.5; deviations ±2.5, ±1.5, so the
  // sample variance is (2 · 6.25 + 2 · 2.25) / 3 = 17/3. Plane 2 is checked against mathjs mean and std (n − 1).
  it('regionMeans of a 2 × 2 region gives mean 8.5, sample SD √(17/3), n 4, and mathjs figures on plane 2', () => {
    const got = regionMeans([PLANE_1, PLANE_2], 4, { x: 1, y: 1, width: 2, height: 2 });
    expect(got.n).toBe(4);
    expect(got.mean[0]).toBeCloseTo(8.5, 12);
    expect(got.sd[0]).toBeCloseTo(Math.sqrt(17 / 3), 12);
    const values = [6, 7, 10, 11].map((v) => 1e8 + v * v);
    expect(got.mean[1]).toBeCloseTo(mean(values), 6);
    expect(got.sd[1]).toBeCloseTo(std(values) as unknown as number, 6);
  });

  it('regionMeans clips a region that overhangs the image to the pixels inside it', () => {
    // x from 2 to 5 and y from -1 to 0 clip to columns 2–3 of row 0: pixels 3 and 4.
    const got = regionMeans([PLANE_1], 4, { x: 2, y: -1, width: 4, height: 2 });
    expect(got).toEqual({ mean: [3.5], sd: [Math.SQRT1_2], n: 2 });
  });

  it('regionMeans of a single pixel gives its value with SD 0 and n 1', () => {
    expect(regionMeans([PLANE_1], 4, { x: 3, y: 2, width: 1, height: 1 })).toEqual({ mean: [12], sd: [0], n: 1 });
  });

  it.each([
    [{ x: 4, y: 0, width: 2, height: 2 }, 'The region lies outside the 4 × 3 pixel image', ['region']],
    [{ x: -3, y: 0, width: 3, height: 1 }, 'The region lies outside the 4 × 3 pixel image', ['region']],
    [
      { x: 0, y: 0, width: 0, height: 2 },
      'The region needs whole-number x and y and a width and height of at least 1 pixel',
      ['region'],
    ],
    [
      { x: 0.5, y: 0, width: 2, height: 2 },
      'The region needs whole-number x and y and a width and height of at least 1 pixel',
      ['region'],
    ],
  ])('regionMeans(%j) throws "%s"', (region, message, path) => {
    const err = errorOf(() => regionMeans([PLANE_1], 4, region));
    expect([err.message, err.path]).toEqual([message, path]);
  });

  it('regionMeans refuses no planes, a width that does not divide the pixels, and planes of different sizes', () => {
    const region = { x: 0, y: 0, width: 1, height: 1 };
    expect(errorOf(() => regionMeans([], 4, region)).message).toBe(
      'The image has no planes: give one plane per channel',
    );
    expect(errorOf(() => regionMeans([PLANE_1], 5, region)).message).toBe(
      'An image width of 5 does not divide its 12 pixels into rows',
    );
    expect(errorOf(() => regionMeans([PLANE_1, new Float32Array(8)], 4, region)).message).toBe(
      'Image plane 2 has 8 pixels but plane 1 has 12: every channel plane must be the same size',
    );
  });
});
