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

/**
 * A least-squares unmixer of pixel runs for a reference of at most 8 channels. Pixels go in pairs, so each
 * coefficient loaded serves two dot products; a pair holding a non-finite value, and an odd last pixel, go singly.
 */
export function leastSquaresRange8(ref: PreparedReference) {
  const { channels, probes } = ref;
  const w = paddedRows(ref);
  const rows = w.length;
  return (planes: readonly ArrayLike<number>[], from: number, to: number, out: PixelUnmixOutput): void => {
    const plane = (c: number) => planes[c < channels ? c : 0];
    const [p0, p1, p2, p3, p4, p5, p6, p7] = Array.from({ length: KERNEL_CHANNELS }, (_, c) => plane(c));
    const { abundances, residual } = out;
    const single = (k: number) => {
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
        return;
      }
      let squares = 0;
      for (let r = 0, i = 0; i < rows; r++, i += KERNEL_CHANNELS) {
        const s =
          w[i] * y0 +
          w[i + 1] * y1 +
          (w[i + 2] * y2 + w[i + 3] * y3) +
          (w[i + 4] * y4 + w[i + 5] * y5 + (w[i + 6] * y6 + w[i + 7] * y7));
        if (r < probes) abundances[r][k] = s;
        else squares += s * s;
      }
      residual[k] = Math.sqrt(squares / channels);
    };
    let k = from;
    for (; k + 1 < to; k += 2) {
      const a0 = p0[k],
        a1 = p1[k],
        a2 = p2[k],
        a3 = p3[k],
        a4 = p4[k],
        a5 = p5[k],
        a6 = p6[k],
        a7 = p7[k];
      const b0 = p0[k + 1],
        b1 = p1[k + 1],
        b2 = p2[k + 1],
        b3 = p3[k + 1];
      const b4 = p4[k + 1],
        b5 = p5[k + 1],
        b6 = p6[k + 1],
        b7 = p7[k + 1];
      const sum = a0 + a1 + a2 + a3 + a4 + a5 + a6 + a7 + (b0 + b1 + b2 + b3 + b4 + b5 + b6 + b7);
      if (sum - sum !== 0) {
        single(k);
        single(k + 1);
        continue;
      }
      let i = 0;
      for (let r = 0; r < probes; r++, i += KERNEL_CHANNELS) {
        const w0 = w[i],
          w1 = w[i + 1],
          w2 = w[i + 2],
          w3 = w[i + 3];
        const w4 = w[i + 4],
          w5 = w[i + 5],
          w6 = w[i + 6],
          w7 = w[i + 7];
        const target = abundances[r];
        target[k] = w0 * a0 + w1 * a1 + (w2 * a2 + w3 * a3) + (w4 * a4 + w5 * a5 + (w6 * a6 + w7 * a7));
        target[k + 1] = w0 * b0 + w1 * b1 + (w2 * b2 + w3 * b3) + (w4 * b4 + w5 * b5 + (w6 * b6 + w7 * b7));
      }
      let squaresA = 0;
      let squaresB = 0;
      for (; i < rows; i += KERNEL_CHANNELS) {
        const w0 = w[i],
          w1 = w[i + 1],
          w2 = w[i + 2],
          w3 = w[i + 3];
        const w4 = w[i + 4],
          w5 = w[i + 5],
          w6 = w[i + 6],
          w7 = w[i + 7];
        const ra = w0 * a0 + w1 * a1 + (w2 * a2 + w3 * a3) + (w4 * a4 + w5 * a5 + (w6 * a6 + w7 * a7));
        const rb = w0 * b0 + w1 * b1 + (w2 * b2 + w3 * b3) + (w4 * b4 + w5 * b5 + (w6 * b6 + w7 * b7));
        squaresA += ra * ra;
        squaresB += rb * rb;
      }
      residual[k] = Math.sqrt(squaresA / channels);
      residual[k + 1] = Math.sqrt(squaresB / channels);
    }
    if (k < to) single(k);
  };
}
