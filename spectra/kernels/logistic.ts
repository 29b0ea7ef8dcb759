/**
 * Samples of the logistic L(x) = 1/(1 + e^−x) at x0, x0 + dx, x0 + 2dx, …: the edges of every analytic filter on a
 * uniform grid (light/filters/edge.ts), computed for every channel of every evaluation. The exponential is walked
 * geometrically, e^−(x0 + k dx) = e^−x0 · (e^−dx)^k, one product per sample instead of one exp(); the walk adds about
 * one rounding per step (at most a few hundred ulps over an edge's reach). `logisticSamplesReference` is the plain
 * formula; test/spectra/kernels.test.ts holds the two together to 1e-12.
 */

/** L(x0 + k dx) for k = 0 … count − 1, by the geometric walk. */
export function logisticSamples(x0: number, dx: number, count: number): number[] {
  const out = new Array<number>(Math.max(0, count));
  let e = Math.exp(-x0);
  const q = Math.exp(-dx);
  for (let k = 0; k < count; k++, e *= q) out[k] = 1 / (1 + e);
  return out;
}

/** The plain formula: L(x0 + k dx) with one exp() per sample. */
export function logisticSamplesReference(x0: number, dx: number, count: number): number[] {
  return Array.from({ length: Math.max(0, count) }, (_, k) => 1 / (1 + Math.exp(-(x0 + k * dx))));
}
