/**
 * The detection strip under the plot: each channel as a window on the wavelength axis, from its lower to its upper
 * editable edge (or, for a measured table, where it passes at least half its best transmission), stacked into lanes
 * so that windows which overlap or nearly touch never share a lane.
 */
import type { ChartPassband } from './types';

/** A channel's window on the strip, nm, and the lane it is drawn in (0 is the top lane). */
export interface DetectionWindow {
  id: string;
  label: string;
  loNm: number;
  hiNm: number;
  lane: number;
}

/** Most lanes the strip grows to; past it, windows share the least crowded lane (our convention). */
export const MAX_LANES = 3;

/** Where a transmission passes at least half its highest value, nm, or null when it passes nothing. */
export function halfMaximumSpanNm(t: ChartPassband['transmission']): [number, number] | null {
  let top = 0;
  for (const v of t.values) if (v > top) top = v;
  if (!(top > 0)) return null;
  let first = -1;
  let last = -1;
  t.values.forEach((v, i) => {
    if (v >= top / 2) {
      if (first < 0) first = i;
      last = i;
    }
  });
  return [t.startNm + first * t.stepNm, t.startNm + last * t.stepNm];
}

/** A channel's span, nm: its handles' outermost edges, or its half-maximum span; null when it passes nothing. */
export function windowSpanNm(p: ChartPassband): [number, number] | null {
  if (p.handles.length >= 2) {
    const edges = p.handles.map((h) => h.wavelengthNm);
    return [Math.min(...edges), Math.max(...edges)];
  }
  return halfMaximumSpanNm(p.transmission);
}

/**
 * Each channel's window with its lane: by increasing start, the first lane whose last window ends at least `gapNm`
 * before this one starts (so neighbours stay apart), else a new lane up to MAX_LANES, else the lane that frees first.
 */
export function detectionWindows(passbands: readonly ChartPassband[], gapNm: number): DetectionWindow[] {
  const spans = passbands
    .map((p) => ({ p, span: windowSpanNm(p) }))
    .filter((s): s is { p: ChartPassband; span: [number, number] } => s.span !== null)
    .sort((a, b) => a.span[0] - b.span[0]);
  const laneEndNm: number[] = [];
  return spans.map(({ p, span: [loNm, hiNm] }) => {
    let lane = laneEndNm.findIndex((end) => end + gapNm <= loNm);
    if (lane < 0 && laneEndNm.length < MAX_LANES) lane = laneEndNm.length;
    if (lane < 0) lane = laneEndNm.indexOf(Math.min(...laneEndNm));
    laneEndNm[lane] = Math.max(laneEndNm[lane] ?? -Infinity, hiNm);
    return { id: p.id, label: p.label, loNm, hiNm, lane };
  });
}

/** How many lanes the windows use (at least 1, so the strip keeps its place when empty). */
export function laneCount(windows: readonly DetectionWindow[]): number {
  return Math.max(1, ...windows.map((w) => w.lane + 1));
}
