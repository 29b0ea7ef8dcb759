/**
 * The checks one call of `unmixRange` makes before its loop: planes against the reference, the pixel range against
 * the image, the output against both. Each costs O(channels + probes), nothing per pixel.
 */
import { SpectraError } from '../core/errors';
import type { PixelUnmixOutput } from './types';

/** Checks one plane per channel, all of one length; returns that length (the image's pixel count). */
export function checkPlanes(planes: readonly ArrayLike<number>[], channels: number): number {
  if (!Array.isArray(planes) || planes.length !== channels) {
    const given = Array.isArray(planes) ? planes.length : 0;
    throw new SpectraError(
      'invalid_input',
      `${given} image planes were given but the reference has ${channels} channels: give one plane per channel`,
      ['planes'],
    );
  }
  return checkSameSize(planes);
}

/** Checks that every plane has plane 1's length; returns it. */
export function checkSameSize(planes: readonly ArrayLike<number>[]): number {
  const pixels = planes[0].length;
  planes.forEach((plane, i) => {
    if (plane.length !== pixels) {
      throw new SpectraError(
        'invalid_input',
        `Image plane ${i + 1} has ${plane.length} pixels but plane 1 has ${pixels}: ` +
          'every channel plane must be the same size',
        ['planes', i],
      );
    }
  });
  return pixels;
}

/** Checks 0 ≤ from ≤ to ≤ pixels (integers) and an output with one plane per probe, each reaching pixel `to`. */
export function checkRange(from: number, to: number, pixels: number, probes: number, out: PixelUnmixOutput): void {
  if (!Number.isInteger(from) || !Number.isInteger(to) || from < 0 || from > to || to > pixels) {
    throw new SpectraError('out_of_range', `Pixel range ${from} to ${to} is not within the image's ${pixels} pixels`, [
      'range',
    ]);
  }
  if (out.abundances.length !== probes) {
    throw new SpectraError(
      'invalid_input',
      `The output has ${out.abundances.length} abundance planes but the reference has ${probes} probes`,
      ['out'],
    );
  }
  const shortest = Math.min(out.residual.length, ...out.abundances.map((plane) => plane.length));
  if (shortest < to) {
    throw new SpectraError('invalid_input', `The output holds ${shortest} pixels but the range ends at pixel ${to}`, [
      'out',
    ]);
  }
}
