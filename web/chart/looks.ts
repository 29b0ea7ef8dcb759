/**
 * How the spectra chart draws each kind of layer, said once for the plot and its legend (all our own choices): probe
 * curves as soft filled areas under a coloured, dashed outline (curve-looks.ts), each channel as a window in the
 * detection strip under the plot with its transmission as a thin tinted line above, the shared light path as dark
 * dash-dot lines on the transmission axis, the sample background as a tan fill. Each layer has a key (kind and id)
 * under which the user's hide/show choice is kept, so it survives a recomputation of the panel.
 */

/**
 * A channel: a window in the detection strip (light tint, tinted outline) and its transmission as a thin line of the
 * same tint on the plot.
 */
export const CHANNEL_LOOK = {
  stroke: '#2f6f7e',
  fill: '#2f6f7e',
  fillOpacity: 0.12,
  lineOpacity: 0.4,
  text: '#1d4751',
} as const;

/** A probe's curve: the outline's width and the opacity of the soft fill under it. */
export const CURVE_LOOK = { width: 2, fillOpacity: 0.08 } as const;

/** Excitation lines: one dark violet for every line (a marker, not the colour of the light). */
export const EXCITATION_LOOK = { stroke: '#4b2e83', width: 1.5, text: '#3b2467' } as const;

/** The near-infrared stretch of the axis (from nir.ts NIR_START_NM): a faint tint behind the plot. */
export const NIR_LOOK = { fill: '#ece8f3', text: '#5b4f70' } as const;

/** Each part of the shared light path: a line on the transmission axis, told apart by colour and dash pattern. */
export const SHARED_LOOK = {
  emission: { stroke: '#1f3b4d', dash: '10 3 2 3', width: 2.2 },
  excitation: { stroke: '#6a4c93', dash: '2 3', width: 2 },
} as const;

/** The sample background: a tan fill with a darker edge. */
export const BACKGROUND_LOOK = { fill: '#b08d57', fillOpacity: 0.22, stroke: '#8a6a35' } as const;

/** The chart's one font family: the page sets it in CSS, the exported SVG on its root. */
export const CHART_FONT_FAMILY = 'system-ui, sans-serif';

/** The key of a layer's hide/show choice. */
export const layerKey = {
  probe: (id: string) => `probe:${id}`,
  channel: (id: string) => `channel:${id}`,
  shared: (id: string) => `shared:${id}`,
  background: 'background',
} as const;

/** One line of the legend: what it shows, how it is drawn, and whether it is hidden. */
export interface LegendEntry {
  key: string;
  label: string;
  mark: 'curve' | 'band' | 'shared' | 'background';
  stroke: string;
  dash: string;
  /** Drawn in the near-infrared style (gets the NIR mark). */
  nir?: boolean;
  hidden: boolean;
}
