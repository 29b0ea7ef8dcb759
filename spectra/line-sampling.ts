/**
 * Sampling an emission line (a Gaussian in photon energy, see lineshape.ts) on a wavelength grid as a photon density
 * per nm: f(λ) = g(hc/λ) · hc/λ², renormalised to unit area on the grid. This runs once per probe of every panel
 * evaluated from scratch, so it computes only where the line is not negligible and reads hc/λ and hc/λ² from
 * per-grid tables.
 */
import { GAUSSIAN_FWHM_PER_SIGMA, HC_EV_NM } from './constants';
import { expNonPositive } from './fast-exp';
import type { SampledSpectrum, WavelengthGrid } from './grid';

const HC = HC_EV_NM;
const FWHM_PER_SIGMA = GAUSSIAN_FWHM_PER_SIGMA;
const SQRT_2PI = Math.sqrt(2 * Math.PI);

/**
 * A line is sampled only within ±10σ of its centre in energy; beyond, it is set to exactly 0. There the density is
 * exp(−10²/2) = exp(−50) ≈ 2e-22 of the peak and the dropped tails hold under 1e-22 of the line's area: against the
 * smallest signal the model can carry (a 10^-12 blocking floor times a unit-area line) that is 1e-10 relative, and the
 * tails of a Gaussian model are no physics that far out.
 */
export const LINE_CUTOFF_SIGMAS = 10;

/** Photon energy hc/λ (eV) and Jacobian hc/λ² (eV per nm) at every point of one grid. */
interface GridTables {
  energyEv: Float64Array;
  jacobianEvPerNm: Float64Array;
}

// A few grids at most are in use at once (the default, a request's own): keep the last ones, oldest out first. Up to
// 2 × 4,001 doubles each. The values are exactly what the loop would compute (same divisions), only done once.
const MAX_GRIDS = 8;
const tablesByGrid = new Map<string, GridTables>();

// The last grid asked for, by value (the same grid comes back for every probe of a panel): no key text to build.
let lastStartNm = NaN;
let lastStepNm = NaN;
let lastCount = -1;
let lastTables: GridTables | null = null;

function gridTables(grid: WavelengthGrid): GridTables {
  if (lastTables && grid.startNm === lastStartNm && grid.stepNm === lastStepNm && grid.count === lastCount)
    return lastTables;
  lastTables = tablesFor(grid);
  lastStartNm = grid.startNm;
  lastStepNm = grid.stepNm;
  lastCount = grid.count;
  return lastTables;
}

function tablesFor(grid: WavelengthGrid): GridTables {
  const key = `${grid.startNm} ${grid.stepNm} ${grid.count}`;
  let tables = tablesByGrid.get(key);
  if (!tables) {
    const energyEv = new Float64Array(grid.count);
    const jacobianEvPerNm = new Float64Array(grid.count);
    for (let i = 0; i < grid.count; i++) {
      const nm = grid.startNm + i * grid.stepNm;
      energyEv[i] = HC / nm;
      jacobianEvPerNm[i] = HC / (nm * nm);
    }
    tables = { energyEv, jacobianEvPerNm };
    tablesByGrid.set(key, tables);
    if (tablesByGrid.size > MAX_GRIDS) tablesByGrid.delete(tablesByGrid.keys().next().value!);
  }
  return tables;
}

// Writes the line's per-nm shape, without the 1/(σ√2π) factor, at grid points [from, to] into values[i − from];
// returns their sum. Every point of the window is written, so `values` may be a fresh plain array.
function fillLine(
  values: number[],
  tables: GridTables,
  from: number,
  to: number,
  centerEv: number,
  sigma: number,
): number {
  const { energyEv, jacobianEvPerNm } = tables;
  const negHalfInvVar = -0.5 / (sigma * sigma);
  // Integer loop bounds (|0): the bounds come from Math.floor/ceil as doubles, and a double index is converted and
  // checked at every access (measured: about twice the time per point).
  const first = from | 0;
  const last = to | 0;
  let sum = 0;
  for (let i = first; i <= last; i++) {
    const d = energyEv[i] - centerEv;
    const v = expNonPositive(d * d * negHalfInvVar) * jacobianEvPerNm[i];
    values[i - first] = v;
    sum += v;
  }
  return sum;
}

// Below this share of the line on the grid the renormalisation would magnify the dropped tails (2e-22 of the peak)
// by more than 1e6: the whole grid is sampled instead (a line almost entirely off the grid: rare, and warned about).
const WINDOW_AREA_FLOOR = 1e-6;

/**
 * A sampled line as its nonzero window: the value at grid index i is values[i − from] for from ≤ i < to, exactly 0
 * elsewhere. A plain array (a JS-heap store is cheaper to make and to collect than a typed array's separate one).
 */
export interface LineWindow {
  from: number;
  to: number;
  values: number[];
}

/**
 * sampleGaussianLine's result as its window only (see LineWindow), with the fraction of the line's exact area on
 * the grid: the form panel evaluation uses, without a grid-long array per probe.
 */
export function sampleGaussianWindow(
  grid: WavelengthGrid,
  centerEv: number,
  fwhmEv: number,
): { window: LineWindow; areaOnGrid: number } {
  const { startNm, stepNm, count } = grid;
  const tables = gridTables(grid);
  const sigma = fwhmEv / FWHM_PER_SIGMA;
  const reach = LINE_CUTOFF_SIGMAS * sigma;
  // 1/(σ√2π) is applied once to the sum, not per point; the renormalisation below absorbs it in the values.
  const peakDensity = 1 / (sigma * SQRT_2PI);
  // Blue end of the window from the high-energy cut; red end from the low-energy cut (none when it is at or below 0 eV).
  const blueNm = HC / (centerEv + reach);
  const redNm = centerEv - reach > 0 ? HC / (centerEv - reach) : Infinity;
  // Clamped to the grid, then integers (|0): the loops index with them.
  let from = Math.min(count, Math.max(0, Math.floor((blueNm - startNm) / stepNm))) | 0;
  let to = Math.max(-1, Math.min(count - 1, Math.ceil((redNm - startNm) / stepNm))) | 0;
  let values = new Array<number>(Math.max(0, to - from + 1));
  let sum = fillLine(values, tables, from, to, centerEv, sigma);
  let areaOnGrid = sum * peakDensity * stepNm;
  if (!(areaOnGrid >= WINDOW_AREA_FLOOR)) {
    from = 0;
    to = count - 1;
    values = new Array<number>(count);
    sum = fillLine(values, tables, from, to, centerEv, sigma);
    areaOnGrid = sum * peakDensity * stepNm;
  }
  if (sum > 0) {
    const inverse = 1 / (sum * stepNm); // one division; the products differ from quotients by at most an ulp
    for (let k = 0; k < values.length; k++) values[k] *= inverse;
  }
  return { window: { from, to: to + 1, values }, areaOnGrid };
}

/**
 * Samples the line on `grid` as photon counts per nm, renormalised so that sum(values) × stepNm = 1 on the grid.
 * Also returns the fraction of the line's exact area that lies on the grid (1 when the grid covers it). Only the
 * points within ±LINE_CUTOFF_SIGMAS of the centre (in energy) are computed and the rest are exactly 0, unless less
 * than 1e-6 of the line falls in that window (a line almost entirely off the grid): then every point is computed.
 */
export function sampleGaussianLine(
  grid: WavelengthGrid,
  centerEv: number,
  fwhmEv: number,
): { spectrum: SampledSpectrum; areaOnGrid: number } {
  const { window, areaOnGrid } = sampleGaussianWindow(grid, centerEv, fwhmEv);
  const values = new Float64Array(grid.count);
  values.set(window.values, window.from);
  return { spectrum: { startNm: grid.startNm, stepNm: grid.stepNm, values }, areaOnGrid };
}
