import { SpectraError, requireFinite } from './errors';

/**
 * A uniform wavelength grid: point i lies at startNm + i * stepNm. Every sampled spectrum in the library lives on one.
 * The default, 300–1000 nm at 1 nm, covers UV excitation through the near infrared where the reddest dots emit.
 */
export interface WavelengthGrid {
  startNm: number;
  stepNm: number;
  count: number;
}

/** A spectrum sampled on a grid: `values[i]` belongs to wavelength startNm + i * stepNm. */
export interface SampledSpectrum {
  startNm: number;
  stepNm: number;
  values: Float64Array;
}

/** Largest grid the API accepts (api-v1: at most 4,001 points). */
export const MAX_GRID_POINTS = 4001;

/** 300–1000 nm at 1 nm. */
export const DEFAULT_GRID: WavelengthGrid = Object.freeze({ startNm: 300, stepNm: 1, count: 701 });

/** Builds a grid from its ends (both included when the step divides the span). */
export function makeGrid(startNm: number, endNm: number, stepNm: number): WavelengthGrid {
  requireFinite(startNm, 'startNm', ['grid', 'startNm']);
  requireFinite(endNm, 'endNm', ['grid', 'endNm']);
  requireFinite(stepNm, 'stepNm', ['grid', 'stepNm']);
  if (startNm <= 0) throw new SpectraError('invalid_input', 'grid startNm must be above 0 nm', ['grid', 'startNm']);
  if (stepNm <= 0) throw new SpectraError('invalid_input', 'grid stepNm must be above 0 nm', ['grid', 'stepNm']);
  if (endNm <= startNm) throw new SpectraError('invalid_input', 'grid endNm must be above startNm', ['grid', 'endNm']);
  const count = Math.floor((endNm - startNm) / stepNm + 1e-9) + 1;
  if (count > MAX_GRID_POINTS) {
    throw new SpectraError('invalid_input', `grid has ${count} points; at most ${MAX_GRID_POINTS} are allowed`, [
      'grid',
    ]);
  }
  return { startNm, stepNm, count };
}

/** Wavelength of grid point i, in nm. */
export function gridWavelengthNm(grid: WavelengthGrid, i: number): number {
  return grid.startNm + i * grid.stepNm;
}

/** Last wavelength on the grid, in nm. */
export function gridEndNm(grid: WavelengthGrid): number {
  return grid.startNm + (grid.count - 1) * grid.stepNm;
}

/** All wavelengths of a grid, in nm. */
export function gridWavelengthsNm(grid: WavelengthGrid): Float64Array {
  const out = new Float64Array(grid.count);
  for (let i = 0; i < grid.count; i++) out[i] = grid.startNm + i * grid.stepNm;
  return out;
}

/**
 * Linear interpolation of an ascending table [[nm, value], ...] at one wavelength; `outside` beyond its ends.
 */
export function interpolateTable(
  points: readonly (readonly [number, number])[],
  wavelengthNm: number,
  outside = 0,
): number {
  const n = points.length;
  if (n === 0 || wavelengthNm < points[0][0] || wavelengthNm > points[n - 1][0]) return outside;
  let lo = 0;
  let hi = n - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (points[mid][0] <= wavelengthNm) lo = mid;
    else hi = mid;
  }
  const [x0, y0] = points[lo];
  const [x1, y1] = points[hi];
  if (x1 === x0) return y0;
  return y0 + ((y1 - y0) * (wavelengthNm - x0)) / (x1 - x0);
}

/** Samples an ascending table onto a grid by linear interpolation; zero (or `outside`) beyond the table's ends. */
export function sampleTable(
  points: readonly (readonly [number, number])[],
  grid: WavelengthGrid,
  outside = 0,
): Float64Array {
  const out = new Float64Array(grid.count);
  for (let i = 0; i < grid.count; i++) out[i] = interpolateTable(points, grid.startNm + i * grid.stepNm, outside);
  return out;
}

/** Value of a sampled spectrum at any wavelength (linear between grid points, 0 outside). */
export function spectrumAtNm(spectrum: SampledSpectrum, wavelengthNm: number): number {
  const x = (wavelengthNm - spectrum.startNm) / spectrum.stepNm;
  const n = spectrum.values.length;
  if (!(x >= 0) || x > n - 1) return 0;
  const i = Math.min(Math.floor(x), n - 2);
  if (i < 0) return spectrum.values[0];
  const f = x - i;
  return spectrum.values[i] * (1 - f) + spectrum.values[i + 1] * f;
}
