/**
 * How the spectra chart draws each kind of layer, said once for the plot and its legend: probe curves in their
 * wavelength colour (color.ts), channel passbands as grey shading, the shared light path as dark dash-dot lines on
 * the transmission axis, the sample background as a tan fill. Each layer has a key (kind and id) under which the
 * user's hide/show choice is kept, so it survives a recomputation of the panel.
 */

/** A channel's passband: light shading under a dashed outline. */
export const BAND_LOOK = { fill: '#8a94a6', fillOpacity: 0.16, stroke: '#5b6475', dash: '3 2' } as const;

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
