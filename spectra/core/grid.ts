/**
 * Uniform wavelength grids and the spectra sampled on them. Every sampled spectrum in the library lives on the points
 * of a grid (point i at startNm + i × stepNm), as plain arrays of numbers. A spectrum that is exactly 0 over most of
 * the
 * grid (a dot's emission line) is held only where it is not: its own startNm is then a grid point past the grid's.
 */

/** A uniform wavelength grid. */
export interface WavelengthGrid {
  startNm: number;
  stepNm: number;
  count: number;
}

/** A sampled spectrum: `values[i]` belongs to wavelength startNm + i × stepNm, and it is 0 beyond its values. */
export interface SampledSpectrum {
  startNm: number;
  stepNm: number;
  values: number[];
}

/** A two-column table [[nm, value], ...], wavelengths strictly ascending. */
export type Table = readonly (readonly [number, number])[];

/**
 * 300–1000 nm at 1 nm: UV excitation through the near infrared where the reddest dots emit.
 */
export const DEFAULT_GRID: WavelengthGrid = Object.freeze({ startNm: 300, stepNm: 1, count: 701 });

/**
 * Number of points of a grid from startNm to endNm in steps of stepNm, both ends included when the step divides the
 * span. The 1e-9 keeps 300–1000 nm at 0.1 nm at 7,001 points despite the binary rounding of the step.
 */
export function gridPointCount(startNm: number, endNm: number, stepNm: number): number {
  return Math.floor((endNm - startNm) / stepNm + 1e-9) + 1;
}

/** A grid from its ends (see gridPointCount); the caller has checked the numbers (the API's schema does). */
export function makeGrid(startNm: number, endNm: number, stepNm: number): WavelengthGrid {
  return { startNm, stepNm, count: gridPointCount(startNm, endNm, stepNm) };
}

/** Last wavelength on the grid, nm. */
export function gridEndNm(grid: WavelengthGrid): number {
  return grid.startNm + (grid.count - 1) * grid.stepNm;
}

/**
 * Linear interpolation of a table at one wavelength. Beyond the table's ends: `outside`, or the end values when
 * `outside` is 'hold'.
 */
export function interpolateTable(points: Table, wavelengthNm: number, outside: number | 'hold' = 0): number {
  const n = points.length;
  if (n === 0) return outside === 'hold' ? 0 : outside;
  if (wavelengthNm < points[0][0]) return outside === 'hold' ? points[0][1] : outside;
  if (wavelengthNm > points[n - 1][0]) return outside === 'hold' ? points[n - 1][1] : outside;
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

/** A table sampled onto every point of a grid by linear interpolation (see interpolateTable for `outside`). */
export function sampleTable(points: Table, grid: WavelengthGrid, outside: number | 'hold' = 0): number[] {
  const out = new Array<number>(grid.count);
  for (let i = 0; i < grid.count; i++) out[i] = interpolateTable(points, grid.startNm + i * grid.stepNm, outside);
  return out;
}

/** Value of a sampled spectrum at any wavelength: linear between its points, 0 outside them. */
export function spectrumAtNm(
  spectrum: { startNm: number; stepNm: number; values: ArrayLike<number> },
  nm: number,
): number {
  const x = (nm - spectrum.startNm) / spectrum.stepNm;
  const n = spectrum.values.length;
  if (!(x >= 0) || x > n - 1) return 0;
  const i = Math.min(Math.floor(x), n - 2);
  if (i < 0) return spectrum.values[0];
  const f = x - i;
  return spectrum.values[i] * (1 - f) + spectrum.values[i + 1] * f;
}

/** Index of the grid point at `wavelengthNm` (which must be one of the grid's points, up to rounding). */
export function gridIndex(grid: WavelengthGrid, wavelengthNm: number): number {
  return Math.round((wavelengthNm - grid.startNm) / grid.stepNm);
}

/** A spectrum held on part of a grid, written out on every point of the grid (0 elsewhere). */
export function spectrumOnGrid(spectrum: SampledSpectrum, grid: WavelengthGrid): number[] {
  const out = new Array<number>(grid.count).fill(0);
  const from = gridIndex(grid, spectrum.startNm);
  spectrum.values.forEach((v, k) => {
    if (from + k >= 0 && from + k < grid.count) out[from + k] = v;
  });
  return out;
}
