/**
 * Test data for the pixel unmixer: seeded random matrices and pixels, pixels laid out as channel planes, and one
 * unmixed pixel read back. A 32-bit LCG (Numerical Recipes constants) keeps every failure reproducible.
 */
import type { PixelUnmixOutput } from '../../../spectra/index';

/** A seeded uniform source on [lo, hi). */
export function uniformSource(seed: number): (lo: number, hi: number) => number {
  let state = seed >>> 0;
  return (lo, hi) => lo + ((state = (Math.imul(state, 1664525) + 1013904223) >>> 0) / 2 ** 32) * (hi - lo);
}

/** A rows × cols matrix with entries uniform on [lo, hi). */
export function randomMatrix(rows: number, cols: number, seed: number, lo = -1, hi = 1): number[][] {
  const next = uniformSource(seed);
  return Array.from({ length: rows }, () => Array.from({ length: cols }, () => next(lo, hi)));
}

/** M · a for a row-major M. */
export function mix(m: readonly (readonly number[])[], a: readonly number[]): number[] {
  return m.map((row) => row.reduce((s, v, j) => s + v * a[j], 0));
}

/** Pixels (each a vector over channels) as one Float64Array plane per channel. */
export function toPlanes(pixels: readonly (readonly number[])[], channels: number): Float64Array[] {
  return Array.from({ length: channels }, (_, c) => Float64Array.from(pixels, (y) => y[c]));
}

/** Pixel k of an unmixed output: its abundances and residual. */
export function pixelOf(out: PixelUnmixOutput, k: number): { a: number[]; residual: number } {
  return { a: out.abundances.map((plane) => plane[k]), residual: out.residual[k] };
}

/** Largest absolute value of a vector. */
export const maxAbs = (v: readonly number[]) => v.reduce((s, x) => Math.max(s, Math.abs(x)), 0);

/** Root-mean-square over channels of y − M a. */
export function rmsResidual(m: readonly (readonly number[])[], y: readonly number[], a: readonly number[]): number {
  const fit = mix(m, a);
  return Math.sqrt(y.reduce((s, v, i) => s + (v - fit[i]) ** 2, 0) / y.length);
}
