/**
 * The smooth edge every analytic filter is built from: a logistic step in wavelength,
 *   L(λ) = 1 / (1 + exp(-(λ - edgeNm) / s)),
 * with edgeWidthNm defined as the 10–90 % rise distance, so s = edgeWidthNm / (2 ln 9)
 * (L = 0.1 and 0.9 lie at ∓ s ln 9 from the edge). An edge width of 0 is an ideal step (0.5 exactly on the edge).
 */
import type { WavelengthGrid } from '../grid';
import { SpectraError } from '../errors';
import { FILTER_DEFAULTS, MAX_BLOCKING_OD, type FilterDefaults } from './defaults';
import type { ConstantEnds } from '../linalg/runs';

/** Logistic scale s (nm) of an edge whose 10–90 % rise takes `edgeWidthNm`. */
export function logisticScaleNm(edgeWidthNm: number): number {
  return edgeWidthNm / (2 * Math.log(9));
}

// An edge is computed only where it still moves the transmission by more than 1e-12 of its value; beyond, the value
// is exactly the floor (blocked side) or the plateau (open side). Open side: 1/(1 + e^−z) differs from 1 by < e^−z,
// so z > ln 1e12 ≈ 27.6 scale lengths. Blocked side: floor + span·e^−z is within 1e-12 of the floor once
// z > ln(span/floor) + ln 1e12 (41 scale lengths at OD 6, 55 at OD 12).
const OPEN_SIDE_SCALES = Math.log(1e12);

function blockedSideScales(floor: number, span: number): number {
  return span > 0 ? Math.max(OPEN_SIDE_SCALES, OPEN_SIDE_SCALES + Math.log(span / floor)) : OPEN_SIDE_SCALES;
}

/** Index range [first, last] of grid points from `belowScales` below an edge to `aboveScales` above it. */
function window(
  grid: WavelengthGrid,
  edgeNm: number,
  scaleNm: number,
  belowScales: number,
  aboveScales: number,
): [number, number] {
  return [
    Math.ceil((edgeNm - belowScales * scaleNm - grid.startNm) / grid.stepNm),
    Math.floor((edgeNm + aboveScales * scaleNm - grid.startNm) / grid.stepNm),
  ];
}

/**
 * Writes floor + span × L(λ − riseNm) × L(fallNm − λ) on the grid into `out` (every point; a new array by default): a passband between a rising edge
 * at riseNm (−Infinity: none) and a falling edge at fallNm (+Infinity: none), both of logistic scale s. Near an edge
 * (where it changes the value by more than 1e-12 relative, see blockedSideScales) the exponential is stepped by a
 * constant ratio per grid point rather than one exp() per point (this runs for every channel of every evaluation);
 * the ratio walk adds at most a few hundred ulps of relative error. Elsewhere the floor or plateau is filled in.
 */
export function fillPassband(
  grid: WavelengthGrid,
  riseNm: number,
  fallNm: number,
  scaleNm: number,
  floor: number,
  span: number,
  ends?: ConstantEnds,
  out: Float64Array = new Float64Array(grid.count),
): Float64Array {
  const { startNm, stepNm, count } = grid;
  if (ends) {
    ends.first = 0;
    ends.end = count;
  }
  if (scaleNm === 0) {
    for (let i = 0; i < count; i++) {
      const nm = startNm + i * stepNm;
      const rise = nm > riseNm ? 1 : nm === riseNm ? 0.5 : 0;
      const fall = nm < fallNm ? 1 : nm === fallNm ? 0.5 : 0;
      out[i] = floor + span * rise * fall;
    }
    return out;
  }
  const blocked = blockedSideScales(floor, span);
  const [riseFirst, riseLast] = window(grid, riseNm, scaleNm, blocked, OPEN_SIDE_SCALES);
  const [fallFirst, fallLast] = window(grid, fallNm, scaleNm, OPEN_SIDE_SCALES, blocked);
  // Integer indices (|0) for the loops below: a double index is converted and checked at every access. The window
  // ends are clamped to the grid first (a missing edge puts them at ±Infinity).
  const from = Math.min(count, Math.max(0, riseFirst)) | 0;
  const to = Math.max(-1, Math.min(count - 1, fallLast)) | 0;
  // Also when the floor is 0: `out` may be a reused buffer.
  out.fill(floor, 0, Math.min(Math.max(from, 0), count));
  out.fill(floor, Math.max(to + 1, 0), count);
  if (ends) {
    // Outside [from, to] the array is the floor, or the plateau beyond a missing edge: constant either way.
    ends.first = Math.min(Math.max(from, 0), count);
    ends.end = Math.max(Math.min(to + 1, count), ends.first);
  }
  if (from > to) return out;
  // e1 = exp(−(λ − rise)/s) shrinks by q per step; e2 = exp((λ − fall)/s) grows by 1/q. Each is walked only inside
  // its own window (so neither overflows nor crawls through subnormal numbers): rising edge alone, both edges where
  // the windows overlap, falling edge alone, and the plateau between windows that do not overlap.
  const q = Math.exp(-stepNm / scaleNm);
  // The growth factor as its own exp, not 1/q: a product per step instead of a division (each rounds to half an ulp).
  const grow = Math.exp(stepNm / scaleNm);
  const riseEnd = Math.max(from - 1, Math.min(riseLast, to)) | 0;
  const fallStart = Math.min(to + 1, Math.max(fallFirst, from)) | 0;
  let e1 = from <= riseEnd ? Math.exp(-(startNm + from * stepNm - riseNm) / scaleNm) : 0;
  let e2 = fallStart <= to ? Math.exp((startNm + fallStart * stepNm - fallNm) / scaleNm) : 0;
  const riseOnlyEnd = Math.min(riseEnd, fallStart - 1);
  let i = from;
  for (; i <= riseOnlyEnd; i++, e1 *= q) out[i] = floor + span / (1 + e1);
  if (i < fallStart) {
    out.fill(floor + span, i, fallStart);
    i = fallStart;
  }
  for (; i <= riseEnd; i++, e1 *= q, e2 *= grow) out[i] = floor + span / ((1 + e1) * (1 + e2));
  for (; i <= to; i++, e2 *= grow) out[i] = floor + span / (1 + e2);
  return out;
}

/** Resolved edge options of one analytic filter, defaults filled in and checked. */
export interface EdgeOptions {
  peakTransmission: number;
  edgeWidthNm: number;
  floor: number;
}

/** Fills in and checks peakTransmission (0–1], edgeWidthNm in [0, 200] and blockingOD in [0, 12]; errors name the field. */
export function resolveEdgeOptions(
  filter: { peakTransmission?: unknown; edgeWidthNm?: unknown; blockingOD?: unknown },
  defaults: Readonly<FilterDefaults>,
  path: (string | number)[],
): EdgeOptions {
  const peak = filter.peakTransmission ?? defaults.peakTransmission;
  const edge = filter.edgeWidthNm ?? defaults.edgeWidthNm;
  const od = filter.blockingOD ?? defaults.blockingOD;
  if (typeof peak !== 'number' || !(peak > 0 && peak <= 1)) {
    throw new SpectraError('invalid_input', `peakTransmission must be a number in (0, 1], got ${String(peak)}`, [
      ...path,
      'peakTransmission',
    ]);
  }
  if (typeof edge !== 'number' || !(edge >= 0 && edge <= 200)) {
    throw new SpectraError('invalid_input', `edgeWidthNm must be a number from 0 to 200 nm, got ${String(edge)}`, [
      ...path,
      'edgeWidthNm',
    ]);
  }
  if (typeof od !== 'number' || !(od >= 0 && od <= MAX_BLOCKING_OD)) {
    throw new SpectraError(
      'invalid_input',
      `blockingOD must be a number from 0 to ${MAX_BLOCKING_OD}, got ${String(od)}`,
      [...path, 'blockingOD'],
    );
  }
  return { peakTransmission: peak, edgeWidthNm: edge, floor: Math.min(10 ** -od, peak) };
}

/** Checks a wavelength field (finite, above 0 nm) without allocating its path unless it is wrong. */
export function requireWavelengthNm(value: unknown, field: string, path: (string | number)[]): number {
  if (typeof value !== 'number' || !Number.isFinite(value) || value <= 0) {
    throw new SpectraError('invalid_input', `${field} must be a number above 0 nm, got ${String(value)}`, [
      ...path,
      field,
    ]);
  }
  return value;
}

export { FILTER_DEFAULTS };
