/**
 * An emission spectrum held as its nonzero window: a modelled line is exactly 0 beyond ±10σ (line-sampling.ts) and a
 * measured one beyond its table, so the overlap sums of panel evaluation need only the window and the window's
 * partial sums. Panel evaluation keeps resolved probes in this form, without a grid-long array per probe.
 */
import type { ChannelSupport } from './linalg/runs';

/**
 * An emission that is exactly 0 outside grid indices [from, to); inside, the value at index i is values[i − offset]
 * (offset = from for a window-long array, 0 for a grid-long one). `sums` is filled on first use (see windowSums).
 */
export interface EmissionWindow {
  from: number;
  to: number;
  offset: number;
  values: ArrayLike<number>;
  sums: number[] | null;
}

/** A window-long array starting at grid index `from` as an EmissionWindow. */
export function lineEmissionWindow(from: number, values: number[]): EmissionWindow {
  return { from, to: from + values.length, offset: from, values, sums: null };
}

/** The nonzero window of a grid-long emission array (the array itself is kept, not copied). */
export function gridEmissionWindow(values: Float64Array): EmissionWindow {
  let from = 0;
  let to = values.length;
  while (from < to && values[from] === 0) from++;
  while (to > from && values[to - 1] === 0) to--;
  return { from, to, offset: 0, values, sums: null };
}

/** The emission on the whole grid (`count` points), zeros outside the window. */
export function windowToGrid(w: EmissionWindow, count: number): Float64Array {
  const out = new Float64Array(count);
  const { from, to, offset, values } = w;
  for (let i = from; i < to; i++) out[i] = values[i - offset];
  return out;
}

/**
 * Partial sums over the window, kept on it: sums[k] = Σ em[from .. from+k) summed from the blue end, and
 * sums[n + 1 + k] = Σ em[from+k .. to) summed from the red end (n = to − from). The zeros outside add nothing, so these
 * are the sums over the whole grid, exactly. A plain array: most die young (a cold evaluation), and a JS-heap store is
 * cheaper to make and collect than a typed array's.
 */
export function windowSums(w: EmissionWindow): number[] {
  if (w.sums) return w.sums;
  const { from, to, offset, values } = w;
  const n = to - from;
  const sums = new Array<number>(2 * n + 2);
  const base = n + 1;
  let acc = 0;
  sums[0] = 0;
  for (let k = 0; k < n; k++) sums[k + 1] = acc += values[from - offset + k];
  acc = 0;
  sums[base + n] = 0;
  for (let k = n - 1; k >= 0; k--) sums[base + k] = acc += values[from - offset + k];
  w.sums = sums;
  return sums;
}

/** Σ values[i − offset] t[i] over grid indices [lo, hi), four partial sums (independent add chains run faster). */
function windowDot(values: ArrayLike<number>, offset: number, t: Float64Array, lo: number, hi: number): number {
  let s0 = 0, s1 = 0, s2 = 0, s3 = 0;
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
 * Σλ em(λ) T(λ) (no Δλ) over the whole grid, for an emission window and a channel split into constant runs and a
 * window: the emission's sum over the left run is accumulated from the blue end, over the right run from the red
 * end, so a tiny tail is never the difference of two large sums (it matters against a 10^-12 blocking floor); only
 * the part of the channel's window where the emission is not 0 is summed point by point.
 */
export function windowOverlap(w: EmissionWindow, support: ChannelSupport): number {
  const sums = windowSums(w);
  const { from, to } = w;
  const n = to - from;
  const { t, first, end, left, right } = support;
  const leftSum = sums[Math.min(Math.max(first - from, 0), n)];
  const rightSum = sums[n + 1 + Math.min(Math.max(end - from, 0), n)];
  const inside = windowDot(w.values, w.offset, t, Math.max(first, from), Math.min(end, to));
  return left * leftSum + inside + right * rightSum;
}
