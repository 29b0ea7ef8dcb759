/**
 * The wavelength range the spectra chart shows by default: wide enough for every probe's emission down to a small
 * fraction of its peak, every channel's passband edges and every excitation line, padded and rounded to 10 nm, and
 * never wider than the part of the model grid worth reading. A panel of visible probes gets a narrower range than
 * 380–800 nm (the chart zooms in on it); a near-infrared probe widens it towards 900 nm.
 */
import type { SampledSpectrum } from '../../spectra/index';
import type { ChartPassband } from './types';

/**
 * Widest range the chart follows a panel to, nm: inside the model grid (300–1000 nm, DEFAULT_GRID) with room to spare
 * at both ends, where emission tails and filter edges are still worth reading (our convention).
 */
export const FOLLOW_LIMITS_NM: readonly [number, number] = [350, 900];

/** Range of a panel with nothing to show (no probe, channel or line), nm: the visible spectrum (common practice). */
export const EMPTY_RANGE_NM: readonly [number, number] = [380, 800];

/** An emission counts out to where it falls to this fraction of its own peak (1 %: our convention). */
export const TAIL_FRACTION = 0.01;

/** Room left beyond the outermost feature, nm (our convention). */
export const PAD_NM = 10;

/** Narrowest range the chart follows a panel to, nm, so one narrow curve is not blown up to the full width. */
export const MIN_SPAN_NM = 100;

/** Ends are rounded outwards to this step, nm, so the axis starts and ends on a tick. */
const ROUND_NM = 10;

/** First and last wavelength where a spectrum reaches `fraction` of its maximum, or null when it is all zero. */
function reachNm(s: SampledSpectrum, fraction: number): [number, number] | null {
  let max = 0;
  for (const v of s.values) if (v > max) max = v;
  if (!(max > 0)) return null;
  const floor = max * fraction;
  let first = -1;
  let last = -1;
  s.values.forEach((v, i) => {
    if (v >= floor) {
      if (first < 0) first = i;
      last = i;
    }
  });
  return [s.startNm + first * s.stepNm, s.startNm + last * s.stepNm];
}

/**
 * The default range, nm, of a chart of these emission curves, passbands and excitation lines. A passband's edges are
 * its filters' editable edges, or (a measured table) where it reaches half its maximum.
 */
export function autoRangeNm(
  curves: readonly { spectrum: SampledSpectrum }[],
  passbands: readonly ChartPassband[],
  excitationNm: readonly number[],
): [number, number] {
  const points: number[] = [...excitationNm];
  for (const c of curves) points.push(...(reachNm(c.spectrum, TAIL_FRACTION) ?? []));
  for (const p of passbands)
    points.push(...(p.handles.length ? p.handles.map((h) => h.wavelengthNm) : (reachNm(p.transmission, 0.5) ?? [])));
  const finite = points.filter(Number.isFinite);
  if (!finite.length) return [...EMPTY_RANGE_NM];
  const [minNm, maxNm] = FOLLOW_LIMITS_NM;
  let lo = Math.floor((Math.min(...finite) - PAD_NM) / ROUND_NM) * ROUND_NM;
  let hi = Math.ceil((Math.max(...finite) + PAD_NM) / ROUND_NM) * ROUND_NM;
  if (hi - lo < MIN_SPAN_NM) {
    const grow = (MIN_SPAN_NM - (hi - lo)) / 2;
    lo = Math.floor((lo - grow) / ROUND_NM) * ROUND_NM;
    hi = Math.ceil((hi + grow) / ROUND_NM) * ROUND_NM;
    // Near a limit, the span is kept by sliding away from it.
    if (lo < minNm) [lo, hi] = [minNm, hi + (minNm - lo)];
    if (hi > maxNm) [lo, hi] = [lo - (hi - maxNm), maxNm];
  }
  return [Math.max(minNm, lo), Math.min(maxNm, hi)];
}
