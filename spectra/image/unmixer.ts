/**
 * `pixelUnmixer`: a reference matrix checked and factorised once, then unmixed pixel by pixel over any run of an
 * image's pixels, by least squares or by NNLS; `allocateUnmixOutput` makes the planes it writes into.
 */
import { SpectraError } from '../core/errors';
import { checkPlanes, checkRange } from './checks';
import { leastSquaresRange, readPixel, writeMissing, writePixel } from './least-squares';
import { KERNEL_CHANNELS, leastSquaresRange8 } from '../kernels/unmix8';
import { pixelNnls } from './nnls-pixel';
import { prepareReference, type PreparedReference } from './reference';
import type { PixelUnmixMethod, PixelUnmixOutput, PixelUnmixer } from './types';

function nnlsRange(ref: PreparedReference) {
  const solve = pixelNnls(ref);
  const y = new Float64Array(ref.channels);
  const a = new Float64Array(ref.probes);
  return (planes: readonly ArrayLike<number>[], from: number, to: number, out: PixelUnmixOutput): void => {
    for (let k = from; k < to; k++) {
      if (!readPixel(planes, k, y)) {
        writeMissing(ref.probes, k, out);
        continue;
      }
      solve(y, a);
      writePixel(ref, y, a, k, out);
    }
  };
}

/**
 * Prepares the unmixing of images against `referenceByChannel` ([channel][probe]: each probe's signal in each
 * channel). Throws SpectraError when the reference is empty, ragged or not finite, has more probes than channels, or
 * its probes' signatures are linearly dependent; `unmixRange` throws when planes, range or output do not fit.
 * @example pixelUnmixer([[1, 0.2], [0.1, 1], [0, 0.3]], 'nnls').unmixRange(planes, 0, width * height, out)
 */
export function pixelUnmixer(
  referenceByChannel: readonly (readonly number[])[],
  method: PixelUnmixMethod,
): PixelUnmixer {
  if (method !== 'nnls' && method !== 'leastSquares') {
    throw new SpectraError(
      'invalid_input',
      `Unknown unmixing method '${String(method)}': use 'nnls' or 'leastSquares'`,
      ['method'],
    );
  }
  const ref = prepareReference(referenceByChannel);
  const run =
    method === 'nnls'
      ? nnlsRange(ref)
      : ref.channels <= KERNEL_CHANNELS
        ? leastSquaresRange8(ref)
        : leastSquaresRange(ref);
  return {
    channels: ref.channels,
    probes: ref.probes,
    unmixRange(planes, from, to, out) {
      const pixels = checkPlanes(planes, ref.channels);
      checkRange(from, to, pixels, ref.probes, out);
      run(planes, from, to, out);
    },
  };
}

/** Zeroed output planes for `probes` abundances and the residual over `pixels` pixels. */
export function allocateUnmixOutput(probes: number, pixels: number): PixelUnmixOutput {
  if (!Number.isInteger(probes) || probes < 1 || !Number.isInteger(pixels) || pixels < 0) {
    throw new SpectraError(
      'invalid_input',
      `An unmixed image needs a whole number of probes (at least 1) and of pixels, got ${probes} and ${pixels}`,
      ['out'],
    );
  }
  return {
    abundances: Array.from({ length: probes }, () => new Float32Array(pixels)),
    residual: new Float32Array(pixels),
  };
}
