/**
 * The standard error of a ratio of two differences, r = (x − u) / (y − v), by first-order error propagation for
 * independent uncertainties: (σr / r)² = (σN / N)² + (σD / D)², with σN² = σx² + σu² and σD² = σy² + σv² (Taylor,
 * An Introduction to Error Analysis, 2nd ed. 1997, ch. 3, sums and differences §3.6 and the general formula for a
 * function of several variables §3.11; section numbers from memory, unverified). Written as
 * σr = sqrt(σN² + r² σD²) / |D|, which stays defined when N is 0.
 * Independence holds for per-channel detector noise (shot and read noise are independent between channels: common
 * practice); a shared fluctuation of a whole sample (e.g. staining intensity between replicates) is correlated between
 * channels and makes this an overestimate of the ratio's error.
 */

/** The standard error of (x − u) / (y − v) from the standard errors of x, u, y and v (independent). */
export function ratioStandardError(
  numerator: number,
  denominator: number,
  numeratorSe: number,
  denominatorSe: number,
): number {
  const r = numerator / denominator;
  return Math.sqrt(numeratorSe ** 2 + r * r * denominatorSe ** 2) / Math.abs(denominator);
}

/** The standard error of a difference of two independent means. */
export function differenceStandardError(a: number, b: number): number {
  return Math.sqrt(a * a + b * b);
}
