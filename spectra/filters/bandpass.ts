/**
 * Bandpass filter in the trade's centre/width notation: 605/20 passes 595–615 nm, widthNm being the FWHM of the
 * passband (common practice). The passband is the product of a rising and a falling logistic edge (see edge.ts),
 * scaled so the top is exactly peakTransmission and the half-maximum points lie exactly at centerNm ± widthNm / 2.
 */
import type { WavelengthGrid } from '../grid';
import { SpectraError } from '../errors';
import type { ConstantEnds } from '../linalg/runs';
import { FILTER_DEFAULTS, fillPassband, logisticScaleNm, requireWavelengthNm, resolveEdgeOptions } from './edge';

/** A bandpass filter as the panel carries it (see spectra/panel.ts FilterSpec). */
export interface BandpassSpec {
  type: 'bandpass';
  centerNm: number;
  widthNm: number;
  peakTransmission?: number;
  edgeWidthNm?: number;
  blockingOD?: number;
}

const logistic = (z: number) => 1 / (1 + Math.exp(-z));

// ln L(z) and 1 − L(z) of the logistic L(z) = 1/(1 + e^−z) from one exp, without cancellation on either side
// (written into `out` to return both without an object per call).
function logAndComplement(z: number, out: Float64Array, at: number): void {
  if (z >= 0) {
    const t = Math.exp(-z);
    out[at] = -Math.log1p(t);
    out[at + 1] = t / (1 + t);
  } else {
    const t = Math.exp(z);
    out[at] = z - Math.log1p(t);
    out[at + 1] = 1 / (1 + t);
  }
}

const parts = new Float64Array(6);

/**
 * Half distance h (nm) between the two logistic edges that puts half the peak exactly at ±widthNm/2. Newton's method
 * on g(h) = ln shape(w/2) − ln shape(0) + ln 2 (edges at ±h), kept inside the bracket [0, w/2] where g changes sign
 * (w ≥ edge width). g′ is made of the same three logistics: 1 − L at each argument, over s.
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
    logAndComplement((half + h) / scaleNm, parts, 0);
    logAndComplement((h - half) / scaleNm, parts, 2);
    logAndComplement(h / scaleNm, parts, 4);
    const value = parts[0] + parts[2] - 2 * parts[4] + Math.LN2;
    if (value > 0) hi = h;
    else lo = h;
    const slope = (parts[1] + parts[3] - 2 * parts[5]) / scaleNm;
    let next = h - value / slope;
    if (!(next > lo && next < hi)) next = (lo + hi) / 2;
    if (Math.abs(next - h) <= 1e-13 * widthNm) return next;
    h = next;
  }
  return h;
}

/** Transmission (0–1) of a bandpass filter on a grid. Errors name the field under `path`. */
export function bandpassTransmission(
  filter: BandpassSpec,
  grid: WavelengthGrid,
  path: (string | number)[] = [],
  ends?: ConstantEnds,
  out?: Float64Array,
): Float64Array {
  const centerNm = requireWavelengthNm(filter.centerNm, 'centerNm', path);
  const widthNm = filter.widthNm;
  if (typeof widthNm !== 'number' || !Number.isFinite(widthNm) || widthNm <= 0) {
    throw new SpectraError('invalid_input', `widthNm must be above 0 nm, got ${String(widthNm)}`, [...path, 'widthNm']);
  }
  const options = resolveEdgeOptions(filter, FILTER_DEFAULTS.bandpass, path);
  if (options.edgeWidthNm > widthNm) {
    throw new SpectraError(
      'invalid_input',
      `a bandpass must be at least as wide as its edges: widthNm ${widthNm} < edgeWidthNm ${options.edgeWidthNm}`,
      [...path, 'edgeWidthNm'],
    );
  }
  const scaleNm = logisticScaleNm(options.edgeWidthNm);
  const h = edgeHalfDistanceNm(widthNm, scaleNm);
  // The two edges overlap a little at the centre: divide by the shape's own top so the peak is exactly peakTransmission.
  const top = scaleNm === 0 ? 1 : logistic(h / scaleNm) ** 2;
  return fillPassband(
    grid,
    centerNm - h,
    centerNm + h,
    scaleNm,
    options.floor,
    (options.peakTransmission - options.floor) / top,
    ends,
    out,
  );
}
