/**
 * The smooth edge every analytic filter is built from: a logistic step in wavelength,
 *   L(λ) = 1 / (1 + exp(−(λ − edgeNm) / s)),
 * with edgeWidthNm defined as the 10–90 % rise distance, so s = edgeWidthNm / (2 ln 9)
 * (L = 0.1 and 0.9 lie at ∓ s ln 9 from the edge). An edge width of 0 is an ideal step (0.5 exactly on the edge).
 */
import type { WavelengthGrid } from '../../core/grid';
import { logisticSamples } from '../../kernels/logistic';
import type { FilterDefaults } from './defaults';

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

/**
 * True when every point of the grid lies beyond the blocked-side reach of a passband whose edges lie within
 * [innerLoNm, innerHiNm] and whose span is at most `spanMax`: passbandTransmission is then exactly the floor on it
 * (a line far from a band, read without placing the band's edges).
 */
export function gridBeyondPassband(
  grid: WavelengthGrid,
  innerLoNm: number,
  innerHiNm: number,
  scaleNm: number,
  floor: number,
  spanMax: number,
): boolean {
  const reachNm = blockedSideScales(floor, spanMax) * scaleNm;
  const lastNm = grid.startNm + (grid.count - 1) * grid.stepNm;
  return lastNm < innerLoNm - reachNm || grid.startNm > innerHiNm + reachNm;
}

/**
 * floor + span × L(λ − riseNm) × L(fallNm − λ) on the grid: a passband between a rising edge at riseNm (−Infinity:
 * none) and a falling edge at fallNm (+Infinity: none), both of logistic scale `scaleNm`. Each edge's factor is
 * computed within its reach (see blockedSideScales) and is exactly 0 before it or 1 past it.
 */
export function passbandTransmission(
  grid: WavelengthGrid,
  riseNm: number,
  fallNm: number,
  scaleNm: number,
  floor: number,
  span: number,
): number[] {
  const { startNm, stepNm, count } = grid;
  const out = new Array<number>(count).fill(floor);
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
  // Reach of each edge, in nm: the rising edge from riseNm − blocked·s (below: blocked) to riseNm + open·s (above:
  // open); the falling edge mirrored. Outside [first, last] the filter blocks: the floor.
  const riseToNm = riseNm + OPEN_SIDE_SCALES * scaleNm;
  const fallFromNm = fallNm - OPEN_SIDE_SCALES * scaleNm;
  const first = Math.max(0, Math.ceil((riseNm - blocked * scaleNm - startNm) / stepNm));
  const last = Math.min(count - 1, Math.floor((fallNm + blocked * scaleNm - startNm) / stepNm));

  // Each edge's factor over the points within its reach (1 past it), walked along the grid.
  const riseLast = Math.min(last, Math.floor((riseToNm - startNm) / stepNm));
  const fallFirst = Math.max(first, Math.ceil((fallFromNm - startNm) / stepNm));
  const rise = logisticSamples((startNm + first * stepNm - riseNm) / scaleNm, stepNm / scaleNm, riseLast - first + 1);
  const fall = logisticSamples(
    (fallNm - startNm - fallFirst * stepNm) / scaleNm,
    -stepNm / scaleNm,
    last - fallFirst + 1,
  );
  for (let i = first; i <= last; i++) {
    const r = i <= riseLast ? rise[i - first] : 1;
    const f = i >= fallFirst ? fall[i - fallFirst] : 1;
    out[i] = floor + span * r * f;
  }
  return out;
}

/** An analytic filter's edge options with the defaults of its kind filled in. */
export interface EdgeOptions {
  peakTransmission: number;
  edgeWidthNm: number;
  /** Out-of-band transmission 10^−blockingOD (never above the peak). */
  floor: number;
}

/** Fills in the defaults of one analytic filter's edge options. */
export function edgeOptions(
  filter: { peakTransmission?: number; edgeWidthNm?: number; blockingOD?: number },
  defaults: Readonly<FilterDefaults>,
): EdgeOptions {
  const peakTransmission = filter.peakTransmission ?? defaults.peakTransmission;
  const edgeWidthNm = filter.edgeWidthNm ?? defaults.edgeWidthNm;
  const od = filter.blockingOD ?? defaults.blockingOD;
  return { peakTransmission, edgeWidthNm, floor: Math.min(10 ** -od, peakTransmission) };
}
