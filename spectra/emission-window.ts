/**
 * An emission spectrum held as its nonzero window: a modelled line is exactly 0 beyond ±10σ (line-sampling.ts) and a
 * measured one beyond its table, so the overlap sums of panel evaluation need only the window and the window's
 * partial sums. Panel evaluation keeps resolved probes in this form, without a grid-long array per probe.
 */
import type { ChannelSupport } from './linalg/runs';

/**
 * An emission that is exactly 0 outside grid indices [from, to); inside, the value at index i is values[i − offset]
 * (offset = from for a window-long array, 0 for a grid-long one).
 */
export interface EmissionWindow {
  from: number;
  to: number;
  offset: number;
  values: ArrayLike<number>;
}

/** A window-long array starting at grid index `from` as an EmissionWindow. */
export function lineEmissionWindow(from: number, values: number[]): EmissionWindow {
  return { from, to: from + values.length, offset: from, values };
}

/** The nonzero window of a grid-long emission array (the array itself is kept, not copied). */
export function gridEmissionWindow(values: Float64Array): EmissionWindow {
  let from = 0;
  let to = values.length;
  while (from < to && values[from] === 0) from++;
  while (to > from && values[to - 1] === 0) to--;
  return { from, to, offset: 0, values };
}

/** The emission on the whole grid (`count` points), zeros outside the window. */
export function windowToGrid(w: EmissionWindow, count: number): Float64Array {
  const out = new Float64Array(count);
  const { from, to, offset, values } = w;
  for (let i = from; i < to; i++) out[i] = values[i - offset];
  return out;
}

// Scratch for runSums (grown to the most channels seen): the order of the cuts and the sums found at them.
let order = new Int32Array(64);
let cuts = new Int32Array(64);

/** Σ values[k − offset] over grid indices [lo, hi), four partial sums. */
function rangeSum(values: ArrayLike<number>, offset: number, lo: number, hi: number): number {
  let s0 = 0,
    s1 = 0,
    s2 = 0,
    s3 = 0;
  let i = lo | 0;
  hi |= 0;
  offset |= 0;
  for (; i + 3 < hi; i += 4) {
    s0 += values[i - offset];
    s1 += values[i + 1 - offset];
    s2 += values[i + 2 - offset];
    s3 += values[i + 3 - offset];
  }
  for (; i < hi; i++) s0 += values[i - offset];
  return s0 + s1 + s2 + s3;
}

/**
 * The emission's sum over each channel's constant runs: left[c] = Σ em below supports[c].first, accumulated from
 * the blue end, and right[c] = Σ em from supports[c].end on, accumulated from the red end, so a tiny tail is never
 * the difference of two large sums (it matters against a 10^-12 blocking floor). The zeros outside the window add
 * nothing. One walk from each end through the cuts in order, no array per emission.
 */
export function runSums(w: EmissionWindow, supports: ChannelSupport[], left: Float64Array, right: Float64Array): void {
  const n = supports.length;
  if (order.length < n) {
    order = new Int32Array(n);
    cuts = new Int32Array(n);
  }
  const { from, to, offset, values } = w;
  // Left runs: cut positions clamped into the window, channels sorted by cut (insertion sort: a handful of channels).
  for (let c = 0; c < n; c++) {
    const cut = Math.min(Math.max(supports[c].first, from), to) | 0;
    let j = c;
    while (j > 0 && cuts[j - 1] > cut) {
      cuts[j] = cuts[j - 1];
      order[j] = order[j - 1];
      j--;
    }
    cuts[j] = cut;
    order[j] = c;
  }
  let acc = 0;
  let at = from;
  for (let j = 0; j < n; j++) {
    acc += rangeSum(values, offset, at, cuts[j]);
    at = cuts[j];
    left[order[j]] = acc;
  }
  // Right runs: sorted by cut, walked from the red end.
  for (let c = 0; c < n; c++) {
    const cut = Math.min(Math.max(supports[c].end, from), to) | 0;
    let j = c;
    while (j > 0 && cuts[j - 1] < cut) {
      cuts[j] = cuts[j - 1];
      order[j] = order[j - 1];
      j--;
    }
    cuts[j] = cut;
    order[j] = c;
  }
  acc = 0;
  at = to;
  for (let j = 0; j < n; j++) {
    acc += rangeSum(values, offset, cuts[j], at);
    at = cuts[j];
    right[order[j]] = acc;
  }
}

/** Σ values[i − offset] t[i] over grid indices [lo, hi), four partial sums (independent add chains run faster). */
function windowDot(values: ArrayLike<number>, offset: number, t: Float64Array, lo: number, hi: number): number {
  let s0 = 0,
    s1 = 0,
    s2 = 0,
    s3 = 0;
  // Integer indices: a double index is converted and checked at every access.
  offset |= 0;
  hi |= 0;
  let i = lo | 0;
  for (; i + 3 < hi; i += 4) {
    s0 += values[i - offset] * t[i];
    s1 += values[i + 1 - offset] * t[i + 1];
    s2 += values[i + 2 - offset] * t[i + 2];
    s3 += values[i + 3 - offset] * t[i + 3];
  }
  for (; i < hi; i++) s0 += values[i - offset] * t[i];
  return s0 + s1 + s2 + s3;
}

/**
 * Σλ em(λ) T(λ) (no Δλ) over the whole grid, given the emission's sums over the channel's constant runs (runSums):
 * only the part of the channel's window where the emission is not 0 is summed point by point.
 */
export function windowOverlap(w: EmissionWindow, support: ChannelSupport, leftSum: number, rightSum: number): number {
  const { t, first, end, left, right } = support;
  const inside = windowDot(w.values, w.offset, t, Math.max(first, w.from), Math.min(end, w.to));
  return left * leftSum + inside + right * rightSum;
}
