/**
 * The smooth edge every analytic filter is built from: a logistic step in wavelength,
 *   L(λ) = 1 / (1 + exp(-(λ - edgeNm) / s)),
 * with edgeWidthNm defined as the 10–90 % rise distance, so s = edgeWidthNm / (2 ln 9)
 * (L = 0.1 and 0.9 lie at ∓ s ln 9 from the edge). An edge width of 0 is an ideal step (0.5 exactly on the edge).
 */
import type { WavelengthGrid } from '../grid';
import { SpectraError } from '../errors';
import { FILTER_DEFAULTS, MAX_BLOCKING_OD, type FilterDefaults } from './defaults';

/** Logistic scale s (nm) of an edge whose 10–90 % rise takes `edgeWidthNm`. */
export function logisticScaleNm(edgeWidthNm: number): number {
  return edgeWidthNm / (2 * Math.log(9));
}

// Beyond 70 scale lengths from the edge exp(-70) ≈ 4e-31: below a 10^-12 floor by 18 decades, so treating the
// edge as fully closed or open there changes no transmission by more than 1e-18 relative.
const TAIL_SCALES = 70;

/**
 * Multiplies `shape` in place by a rising (or falling) logistic edge sampled on `grid`. Inside ±70 s of the edge the
 * exponential is stepped by a constant ratio per grid point instead of one exp() per point (the edge is evaluated
 * for every channel of every evaluation); the ratio walk adds at most a few hundred ulps of relative error.
 */
export function multiplyLogisticEdge(shape: Float64Array, grid: WavelengthGrid, edgeNm: number, scaleNm: number, rising: boolean): void {
  const { startNm, stepNm, count } = grid;
  if (scaleNm === 0) {
    for (let i = 0; i < count; i++) {
      const d = startNm + i * stepNm - edgeNm;
      const v = d === 0 ? 0.5 : (d > 0) === rising ? 1 : 0;
      if (v !== 1) shape[i] *= v;
    }
    return;
  }
  const loNm = edgeNm - TAIL_SCALES * scaleNm;
  const hiNm = edgeNm + TAIL_SCALES * scaleNm;
  const first = Math.max(0, Math.ceil((loNm - startNm) / stepNm));
  const last = Math.min(count - 1, Math.floor((hiNm - startNm) / stepNm));
  // The closed side: zero below a rising edge's window, zero above a falling one's.
  const closedFrom = rising ? 0 : Math.max(last + 1, 0);
  const closedTo = rising ? Math.min(first, count) : count;
  for (let i = closedFrom; i < closedTo; i++) shape[i] = 0;
  if (first > last) return;
  // e = exp(∓(λ - edge)/s): the term in 1/(1 + e); it shrinks by q per step on a rising edge, grows on a falling one.
  const sign = rising ? -1 : 1;
  let e = Math.exp((sign * (startNm + first * stepNm - edgeNm)) / scaleNm);
  const q = Math.exp((sign * stepNm) / scaleNm);
  for (let i = first; i <= last; i++) {
    shape[i] /= 1 + e;
    e *= q;
  }
}

/** Resolved edge options of one analytic filter, defaults filled in and checked. */
export interface EdgeOptions {
  peakTransmission: number;
  edgeWidthNm: number;
  floor: number;
}

/** Fills in and checks peakTransmission (0–1], edgeWidthNm ≥ 0 and blockingOD in [0, 12]; errors name the field. */
export function resolveEdgeOptions(
  filter: { peakTransmission?: unknown; edgeWidthNm?: unknown; blockingOD?: unknown },
  defaults: Readonly<FilterDefaults>,
  path: (string | number)[],
): EdgeOptions {
  const peak = filter.peakTransmission ?? defaults.peakTransmission;
  const edge = filter.edgeWidthNm ?? defaults.edgeWidthNm;
  const od = filter.blockingOD ?? defaults.blockingOD;
  if (typeof peak !== 'number' || !(peak > 0 && peak <= 1)) {
    throw new SpectraError('invalid_input', `peakTransmission must be a number in (0, 1], got ${String(peak)}`, [...path, 'peakTransmission']);
  }
  if (typeof edge !== 'number' || !Number.isFinite(edge) || edge < 0 || edge > 200) {
    throw new SpectraError('invalid_input', `edgeWidthNm must be a number from 0 to 200 nm, got ${String(edge)}`, [...path, 'edgeWidthNm']);
  }
  if (typeof od !== 'number' || !(od >= 0 && od <= MAX_BLOCKING_OD)) {
    throw new SpectraError('invalid_input', `blockingOD must be a number from 0 to ${MAX_BLOCKING_OD}, got ${String(od)}`, [...path, 'blockingOD']);
  }
  return { peakTransmission: peak, edgeWidthNm: edge, floor: Math.min(10 ** -od, peak) };
}

/** Turns a 0–1 passband shape into transmission in place: floor out of band, peakTransmission at the top. */
export function applyPeakAndFloor(shape: Float64Array, options: EdgeOptions, scale = 1): Float64Array {
  const span = (options.peakTransmission - options.floor) * scale;
  const floor = options.floor;
  for (let i = 0; i < shape.length; i++) shape[i] = floor + span * shape[i];
  return shape;
}

export { FILTER_DEFAULTS };
