/**
 * Bandpass filter in the trade's centre/width notation: 605/20 passes 595–615 nm, widthNm being the FWHM of the
 * passband (common practice). The passband is the product of a rising and a falling logistic edge (see edge.ts),
 * scaled so the top is exactly peakTransmission and the half-maximum points lie exactly at centerNm ± widthNm / 2.
 */
import type { WavelengthGrid } from '../../core/grid';
import { SpectraError } from '../../core/errors';
import type { EdgeFilterOptions } from '../../core/panel';
import { FILTER_DEFAULTS } from './defaults';
import { edgeOptions, gridBeyondPassband, logisticScaleNm, passbandTransmission } from './edge';

/** A bandpass filter as the panel carries it. */
export interface BandpassSpec extends EdgeFilterOptions {
  type: 'bandpass';
  centerNm: number;
  widthNm: number;
}

/** ln L(z) of the logistic L(z) = 1/(1 + e^−z), without overflow or cancellation on either side. */
function logLogistic(z: number): number {
  return z >= 0 ? -Math.log1p(Math.exp(-z)) : z - Math.log1p(Math.exp(z));
}

/** 1 − L(z) = L(−z), the slope of ln L(z). */
function logisticComplement(z: number): number {
  return 1 / (1 + Math.exp(z));
}

/**
 * Half distance h (nm) between the two logistic edges that puts half the peak exactly at ±widthNm/2. Newton's method
 * on g(h) = ln L((w/2 + h)/s) + ln L((h − w/2)/s) − 2 ln L(h/s) + ln 2 (the shape at w/2 over the shape at the
 * centre, minus one half, in logs), kept inside the bracket [0, w/2] where g changes sign (w ≥ edge width).
 */
function edgeHalfDistanceNm(widthNm: number, scaleNm: number): number {
  const half = widthNm / 2;
  // With the edges 50 scale lengths apart or more, the half-maximum points sit at ±w/2 to within 2e-11 scale
  // lengths (the error is about 2s·exp(−w/2s)): no need to solve.
  if (scaleNm === 0 || half > 25 * scaleNm) return half;
  let lo = 0;
  let hi = half;
  let h = half;
  for (let k = 0; k < 60; k++) {
    const a = (half + h) / scaleNm;
    const b = (h - half) / scaleNm;
    const c = h / scaleNm;
    const value = logLogistic(a) + logLogistic(b) - 2 * logLogistic(c) + Math.LN2;
    if (value > 0) hi = h;
    else lo = h;
    const slope = (logisticComplement(a) + logisticComplement(b) - 2 * logisticComplement(c)) / scaleNm;
    let next = h - value / slope;
    if (!(next > lo && next < hi)) next = (lo + hi) / 2;
    if (Math.abs(next - h) <= 1e-13 * widthNm) return next;
    h = next;
  }
  return h;
}

/**
 * Transmission (0–1) of a bandpass filter on a grid. The logistic model cannot make a passband narrower than its
 * own edges: that is an `invalid_input` naming edgeWidthNm under `path`.
 */
export function bandpassTransmission(
  filter: BandpassSpec,
  grid: WavelengthGrid,
  path: (string | number)[] = [],
): number[] {
  const { centerNm, widthNm } = filter;
  const options = edgeOptions(filter, FILTER_DEFAULTS.bandpass);
  if (options.edgeWidthNm > widthNm) {
    throw new SpectraError(
      'invalid_input',
      `a bandpass must be at least as wide as its edges: widthNm ${widthNm} < edgeWidthNm ${options.edgeWidthNm}`,
      [...path, 'edgeWidthNm'],
    );
  }
  const scaleNm = logisticScaleNm(options.edgeWidthNm);
  // The edges sit within ±w/2 of the centre (h ≤ w/2) and the span is at most 4 × (peak − floor) (top > 1/4): a grid
  // beyond that reach is all floor, with no need to place the edges.
  const spanMax = 4 * (options.peakTransmission - options.floor);
  if (gridBeyondPassband(grid, centerNm - widthNm / 2, centerNm + widthNm / 2, scaleNm, options.floor, spanMax)) {
    return new Array<number>(grid.count).fill(options.floor);
  }
  const h = edgeHalfDistanceNm(widthNm, scaleNm);
  // The two edges overlap a little at the centre: divide by the shape's own top so the peak is exactly
  // peakTransmission.
  const top = scaleNm === 0 ? 1 : (1 / (1 + Math.exp(-h / scaleNm))) ** 2;
  const span = (options.peakTransmission - options.floor) / top;
  return passbandTransmission(grid, centerNm - h, centerNm + h, scaleNm, options.floor, span);
}
