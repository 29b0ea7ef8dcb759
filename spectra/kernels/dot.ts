/**
 * Σ a[k] · b[offset + k]: the overlap of an emission with a channel's transmission, 64 times per 8 × 8 evaluation
 * and the largest cost of the crosstalk matrix. A single running sum waits on each addition before the next (the
 * chain of additions, not the multiplications, sets the pace); four independent partial sums let the processor
 * overlap them. The order of the additions changes, so the result differs from the plain loop by rounding only
 * (a few ulps of Σ|a·b|). `dotReference` is the plain loop; test/spectra/kernels.test.ts holds the two together
 * to 1e-12.
 */

/** Σ over k < a.length of a[k] · b[offset + k], in four partial sums. */
export function dotAt(a: readonly number[], b: readonly number[], offset: number): number {
  let s0 = 0;
  let s1 = 0;
  let s2 = 0;
  let s3 = 0;
  const n = a.length;
  let k = 0;
  for (; k + 3 < n; k += 4) {
    s0 += a[k] * b[offset + k];
    s1 += a[k + 1] * b[offset + k + 1];
    s2 += a[k + 2] * b[offset + k + 2];
    s3 += a[k + 3] * b[offset + k + 3];
  }
  for (; k < n; k++) s0 += a[k] * b[offset + k];
  return s0 + s1 + (s2 + s3);
}

/** The plain loop: one running sum. */
export function dotReference(a: readonly number[], b: readonly number[], offset: number): number {
  let sum = 0;
  for (let k = 0; k < a.length; k++) sum += a[k] * b[offset + k];
  return sum;
}
