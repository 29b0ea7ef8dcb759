// The unrolled least-squares kernel for images of up to 8 channels (spectra/kernels/unmix8.ts) against its plain
// reference, the general per-pixel loop: units of the library, imported directly.
import { describe, expect, it } from 'vitest';
import { allocateUnmixOutput } from '../../spectra/index';
import { leastSquaresRange } from '../../spectra/image/least-squares';
import { prepareReference } from '../../spectra/image/reference';
import { leastSquaresRange8 } from '../../spectra/kernels/unmix8';
import { randomMatrix, toPlanes } from './helpers/pixels';

/** Float32 planes hold 24 significant bits: both routes must round to within one unit of the last place. */
const FLOAT32_ULP = 2 ** -23;

describe('kernels/unmix8', () => {
  it.each([1, 2, 3, 5, 7, 8])(
    'leastSquaresRange8 on %i channels equals the plain loop to one float32 unit, NaN pixels included',
    (channels) => {
      for (let probes = 1; probes <= channels; probes++) {
        const ref = prepareReference(randomMatrix(channels, probes, 100 * channels + probes, 0, 1));
        const pixels = randomMatrix(401, channels, probes, -10, 1000); // odd: the last pixel goes singly
        pixels[17][channels - 1] = NaN;
        pixels[18][0] = -Infinity;
        const planes = toPlanes(pixels, channels);
        const fast = allocateUnmixOutput(probes, pixels.length);
        const plain = allocateUnmixOutput(probes, pixels.length);
        leastSquaresRange8(ref)(planes, 0, pixels.length, fast);
        leastSquaresRange(ref)(planes, 0, pixels.length, plain);
        const scale = Math.max(...plain.abundances.flatMap((plane) => Array.from(plane).filter(Number.isFinite)));
        [...plain.abundances, plain.residual].forEach((plane, p) => {
          const other = p < probes ? fast.abundances[p] : fast.residual;
          plane.forEach((v, k) => {
            if (Number.isNaN(v)) expect(other[k]).toBeNaN();
            else
              expect(Math.abs(other[k] - v)).toBeLessThanOrEqual(2 * FLOAT32_ULP * Math.max(Math.abs(v), scale * 1e-6));
          });
        });
      }
    },
  );
});
