/**
 * Least-squares unmixing of a run of pixels: â = M⁺ y per pixel with the pseudo-inverse computed once, and the
 * residual's root-mean-square over channels. Works through preallocated Float64 scratch, so a pixel allocates nothing.
 */
import { residualSquares } from './complement';
import type { PreparedReference } from './reference';
import type { PixelUnmixOutput } from './types';

/** Reads pixel `k` of every plane into y; false when any value is not finite. */
export function readPixel(planes: readonly ArrayLike<number>[], k: number, y: Float64Array): boolean {
  let sum = 0;
  for (let c = 0; c < y.length; c++) {
    const v = planes[c][k];
    y[c] = v;
    sum += v;
  }
  // NaN and ±Infinity both make sum − sum NaN; a finite sum gives 0.
  return sum - sum === 0;
}

/** a = M⁺ y for one pixel. */
export function projectPixel(ref: PreparedReference, y: Float64Array, a: Float64Array): void {
  const { channels, probes, pseudoInverse } = ref;
  for (let p = 0; p < probes; p++) {
    let sum = 0;
    const row = p * channels;
    for (let c = 0; c < channels; c++) sum += pseudoInverse[row + c] * y[c];
    a[p] = sum;
  }
}

/** Writes abundances a and the residual RMS of ‖y − M a‖ for pixel k. */
export function writePixel(ref: PreparedReference, y: Float64Array, a: Float64Array, k: number, out: PixelUnmixOutput) {
  const { channels, probes, matrix } = ref;
  let squares = 0;
  for (let c = 0; c < channels; c++) {
    let fit = 0;
    const row = c * probes;
    for (let p = 0; p < probes; p++) fit += matrix[row + p] * a[p];
    const r = y[c] - fit;
    squares += r * r;
  }
  for (let p = 0; p < probes; p++) out.abundances[p][k] = a[p];
  out.residual[k] = Math.sqrt(squares / channels);
}

/** Marks pixel k as unmeasured: NaN abundances and residual. */
export function writeMissing(probes: number, k: number, out: PixelUnmixOutput): void {
  for (let p = 0; p < probes; p++) out.abundances[p][k] = NaN;
  out.residual[k] = NaN;
}

/**
 * A least-squares unmixer of pixel runs over a prepared reference. The residual comes from the complement basis when
 * that is the cheaper route (fewer spare channels than probes), else from y − M â.
 */
export function leastSquaresRange(ref: PreparedReference) {
  const { channels, probes, complement } = ref;
  const y = new Float64Array(channels);
  const a = new Float64Array(probes);
  const viaComplement = complement.length < channels * probes;
  return (planes: readonly ArrayLike<number>[], from: number, to: number, out: PixelUnmixOutput): void => {
    for (let k = from; k < to; k++) {
      if (!readPixel(planes, k, y)) {
        writeMissing(probes, k, out);
        continue;
      }
      projectPixel(ref, y, a);
      if (!viaComplement) {
        writePixel(ref, y, a, k, out);
        continue;
      }
      for (let p = 0; p < probes; p++) out.abundances[p][k] = a[p];
      out.residual[k] = Math.sqrt(residualSquares(complement, channels, y) / channels);
    }
  };
}
