/**
 * Dot products of long vectors that are constant at both ends. A channel's transmission sits at its exact blocking
 * floor far from its edges (or at 0 beyond a detector's range), so most of the grid lies in a constant run on the
 * left and one on the right; the overlap with an emission is then two partial sums and a short window, exactly the
 * same sum regrouped (only the rounding differs).
 */

/** Σ a[i] b[i] × stepNm, four partial sums (independent add chains run about twice as fast). */
export function overlap(a: Float64Array, b: Float64Array, stepNm: number): number {
  return windowDot(a, b, 0, a.length) * stepNm;
}

/** Σ a[i] b[i] over [from, to), four partial sums. */
export function windowDot(a: Float64Array, b: Float64Array, from: number, to: number): number {
  let s0 = 0,
    s1 = 0,
    s2 = 0,
    s3 = 0;
  let i = from;
  for (; i + 3 < to; i += 4) {
    s0 += a[i] * b[i];
    s1 += a[i + 1] * b[i + 1];
    s2 += a[i + 2] * b[i + 2];
    s3 += a[i + 3] * b[i + 3];
  }
  for (; i < to; i++) s0 += a[i] * b[i];
  return s0 + s1 + s2 + s3;
}

/**
 * A channel's transmission split into a constant run on the left (value `left` below index `first`), a window
 * [first, end) and a constant run on the right (`right` from `end` on). Filters sit at their exact blocking floor far
 * from their edges, so most of the grid lies in the two runs, whose overlap with any emission is one partial sum.
 */
export interface ChannelSupport {
  t: Float64Array;
  first: number;
  end: number;
  left: number;
  right: number;
}

/**
 * A promise about an array from whoever filled it: it is constant on [0, first) and on [end, n). Lets the run
 * search below start at the edges of a filter's window instead of walking the whole grid.
 */
export interface ConstantEnds {
  first: number;
  end: number;
}

/**
 * Finds the constant runs at both ends of a transmission (exact equality: the split changes no result). `known`
 * (from the code that filled `t`) lets the search start inside the window; the runs found are the same.
 */
export function channelSupport(t: Float64Array, known?: ConstantEnds): ChannelSupport {
  const n = t.length;
  const left = t[0];
  const right = t[n - 1];
  let first = Math.max(1, known ? known.first : 1);
  while (first < n && t[first] === left) first++;
  let end = Math.min(n - 1, known ? Math.max(known.end, first) : n - 1);
  while (end > first && t[end - 1] === right) end--;
  return { t, first: Math.min(first, n), end: Math.max(end, Math.min(first, n)), left, right };
}
