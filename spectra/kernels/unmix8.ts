/**
 * Least squares for images of up to 8 channels, the common case of a multi-channel pilot image (its plain reference
 * is `leastSquaresRange` in image/least-squares.ts): the pixel's 8 values live in local variables and each of M⁺'s
 * rows and of the residual basis's rows (image/complement.ts) is one unrolled dot product, summed pairwise. Missing
 * channels (fewer than 8) get zero coefficients and read plane 1 again, so a non-finite value there still marks the
 * pixel as unmeasured.
 */
import type { PreparedReference } from '../image/reference';
import type { PixelUnmixOutput } from '../image/types';

/** The widest image this kernel unmixes. */
export const KERNEL_CHANNELS = 8;

/** M⁺'s rows then the residual basis's rows, each padded with zeros to 8 coefficients. */
function paddedRows(ref: PreparedReference): Float64Array {
  const { channels, probes, pseudoInverse, complement } = ref;
  const spare = complement.length / channels;
  const rows = new Float64Array((probes + spare) * KERNEL_CHANNELS);
  for (let r = 0; r < probes + spare; r++) {
    for (let c = 0; c < channels; c++) {
      rows[r * KERNEL_CHANNELS + c] =
        r < probes ? pseudoInverse[r * channels + c] : complement[(r - probes) * channels + c];
    }
  }
  return rows;
}

/** A least-squares unmixer of pixel runs for a reference of at most 8 channels. */
export function leastSquaresRange8(ref: PreparedReference) {
  const { channels, probes } = ref;
  const w = paddedRows(ref);
  return (planes: readonly ArrayLike<number>[], from: number, to: number, out: PixelUnmixOutput): void => {
    const plane = (c: number) => planes[c < channels ? c : 0];
    const [p0, p1, p2, p3, p4, p5, p6, p7] = Array.from({ length: KERNEL_CHANNELS }, (_, c) => plane(c));
    const { abundances, residual } = out;
    for (let k = from; k < to; k++) {
      const y0 = p0[k],
        y1 = p1[k],
        y2 = p2[k],
        y3 = p3[k],
        y4 = p4[k],
        y5 = p5[k],
        y6 = p6[k],
        y7 = p7[k];
      const sum = y0 + y1 + y2 + y3 + y4 + y5 + y6 + y7;
      // NaN and ±Infinity make sum − sum NaN: the pixel is unmeasured.
      if (sum - sum !== 0) {
        for (let p = 0; p < probes; p++) abundances[p][k] = NaN;
        residual[k] = NaN;
        continue;
      }
      let i = 0;
      for (let r = 0; r < probes; r++, i += KERNEL_CHANNELS) {
        abundances[r][k] =
          w[i] * y0 +
          w[i + 1] * y1 +
          (w[i + 2] * y2 + w[i + 3] * y3) +
          (w[i + 4] * y4 + w[i + 5] * y5 + (w[i + 6] * y6 + w[i + 7] * y7));
      }
      let squares = 0;
      for (; i < w.length; i += KERNEL_CHANNELS) {
        const s =
          w[i] * y0 +
          w[i + 1] * y1 +
          (w[i + 2] * y2 + w[i + 3] * y3) +
          (w[i + 4] * y4 + w[i + 5] * y5 + (w[i + 6] * y6 + w[i + 7] * y7));
        squares += s * s;
      }
      residual[k] = Math.sqrt(squares / channels);
    }
  };
}
