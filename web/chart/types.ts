/**
 * What the spectra chart draws, as plain data: the app builds these from the panel and its evaluation. Every curve is
 * a spectral library SampledSpectrum (values[i] at startNm + i × stepNm).
 */
import type { SampledSpectrum } from '../../spectra/index';

/** One probe's emission, already scaled as the chart should show it. */
export interface ChartCurve {
  id: string;
  label: string;
  /** Where the curve peaks, nm: sets its colour (and the near-infrared style beyond 700 nm). */
  peakNm: number;
  spectrum: SampledSpectrum;
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
  transmission: SampledSpectrum;
  handles: ChartHandle[];
}

/**
 * One part of the light path every channel shares, on its own: the emission-side filters in front of every detector
 * (already included in each channel's passband) or the excitation clean-up filters every line passes.
 */
export interface ChartSharedPath {
  id: 'emission' | 'excitation';
  label: string;
  transmission: SampledSpectrum;
}

/** Detail of the `edge-drag` event the chart fires while a handle moves (by pointer or arrow keys). */
export interface EdgeDragDetail extends ChartHandle {
  /** True on the last event of a drag (pointer released), so the app can record a history step. */
  done: boolean;
  /** True for a step by an arrow key rather than a pointer position. */
  byKey?: boolean;
}
