/**
 * Mean, sample standard deviation and pixel count of a rectangle in every plane of an image: how a single-stain
 * control or the unstained sample is measured from a pilot image (one value per channel, as the controls input takes).
 */
import { SpectraError } from '../core/errors';
import { checkSameSize } from './checks';

/** A rectangle in pixels, (x, y) its top-left corner, rows of `width` pixels from the image's first. */
export interface PixelRegion {
  x: number;
  y: number;
  width: number;
  height: number;
}

const fail = (message: string) => {
  throw new SpectraError('out_of_range', message, ['region']);
};

/** The region clipped to the image; throws when it is not whole numbers or holds no pixel of the image. */
function clip(region: PixelRegion, width: number, height: number) {
  const { x, y } = region;
  if (![x, y, region.width, region.height].every(Number.isInteger) || region.width < 1 || region.height < 1) {
    fail('The region needs whole-number x and y and a width and height of at least 1 pixel');
  }
  const x0 = Math.max(0, x);
  const y0 = Math.max(0, y);
  const x1 = Math.min(width, x + region.width);
  const y1 = Math.min(height, y + region.height);
  if (x0 >= x1 || y0 >= y1) fail(`The region lies outside the ${width} × ${height} pixel image`);
  return { x0, y0, x1, y1 };
}

/**
 * Per plane, the mean and sample standard deviation (n − 1; 0 for a single pixel) over the region clipped to the
 * image, with n the pixels counted. Sums in two passes, mean first, so large offsets lose no precision.
 * @example regionMeans([plane], 512, { x: 10, y: 20, width: 5, height: 5 }) // { mean: [..], sd: [..], n: 25 }
 */
export function regionMeans(
  planes: readonly ArrayLike<number>[],
  width: number,
  region: PixelRegion,
): { mean: number[]; sd: number[]; n: number } {
  if (!Array.isArray(planes) || planes.length === 0) {
    throw new SpectraError('invalid_input', 'The image has no planes: give one plane per channel', ['planes']);
  }
  const pixels = checkSameSize(planes);
  if (!Number.isInteger(width) || width < 1 || pixels % width !== 0) {
    throw new SpectraError(
      'invalid_input',
      `An image width of ${width} does not divide its ${pixels} pixels into rows`,
      ['width'],
    );
  }
  const { x0, y0, x1, y1 } = clip(region, width, pixels / width);
  const n = (x1 - x0) * (y1 - y0);
  const mean: number[] = [];
  const sd: number[] = [];
  for (const plane of planes) {
    let sum = 0;
    for (let row = y0; row < y1; row++) for (let k = row * width + x0; k < row * width + x1; k++) sum += plane[k];
    const m = sum / n;
    let squares = 0;
    for (let row = y0; row < y1; row++) {
      for (let k = row * width + x0; k < row * width + x1; k++) squares += (plane[k] - m) ** 2;
    }
    mean.push(m);
    sd.push(n > 1 ? Math.sqrt(squares / (n - 1)) : 0);
  }
  return { mean, sd, n };
}
