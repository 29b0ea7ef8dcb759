/**
 * What the spectra chart draws, as plain data: the app builds these from the panel and its evaluation.
 */

/** A curve sampled on a uniform grid: values[i] at startNm + i * stepNm. */
export interface GridCurve {
  startNm: number;
  stepNm: number;
  values: ArrayLike<number>;
}

/** One probe's emission, already scaled as the chart should show it. */
export interface ChartCurve {
  id: string;
  label: string;
  /** Where the curve peaks, nm: sets its colour (and the near-infrared style beyond 700 nm). */
  peakNm: number;
  spectrum: GridCurve;
}

/** A draggable edge of a filter: 'low'/'high' are a bandpass's half-maximum edges, 'edge' an edge filter's. */
export interface ChartHandle {
  channelIndex: number;
  filterIndex: number;
  edge: 'low' | 'high' | 'edge';
  wavelengthNm: number;
}

/** One channel's combined transmission (0–1) with the handles of its editable filters. */
export interface ChartPassband {
  id: string;
  label: string;
  transmission: GridCurve;
  handles: ChartHandle[];
}

/** Detail of the `edge-drag` event the chart fires while a handle moves (by pointer or arrow keys). */
export interface EdgeDragDetail extends ChartHandle {
  /** True on the last event of a drag (pointer released), so the app can record a history step. */
  done: boolean;
}

/** Value of a grid curve at a wavelength (linear between samples, 0 outside). */
export function curveAtNm(curve: GridCurve, wavelengthNm: number): number {
  const x = (wavelengthNm - curve.startNm) / curve.stepNm;
  const n = curve.values.length;
  if (!(x >= 0) || x > n - 1 || n === 0) return 0;
  const i = Math.min(Math.floor(x), Math.max(0, n - 2));
  const f = x - i;
  return n === 1 ? curve.values[0] : curve.values[i] * (1 - f) + curve.values[i + 1] * f;
}
