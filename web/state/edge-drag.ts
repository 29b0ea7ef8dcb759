/**
 * Applies a dragged filter edge to the panel: a bandpass keeps its other edge fixed (so centre and width both move),
 * an edge filter moves its edge. The numbers in the channel editor follow because they read the same panel.
 */
import type { PanelSpec } from '../../spectra/index';
import type { ChartHandle } from '../chart/types';
import { setFilter } from './panel-edit';

/** Narrowest passband a drag can make, nm. */
export const MIN_BAND_WIDTH_NM = 1;

/** The panel with the handle's edge at `wavelengthNm` (whole nm for bandpass edges, so typed numbers stay tidy). */
export function moveEdge(panel: PanelSpec, h: ChartHandle): PanelSpec {
  const f = panel.channels[h.channelIndex]?.filters[h.filterIndex];
  if (!f) return panel;
  const nm = h.wavelengthNm;
  if (f.type === 'bandpass' && (h.edge === 'low' || h.edge === 'high')) {
    const lo = f.centerNm - f.widthNm / 2;
    const hi = f.centerNm + f.widthNm / 2;
    const [newLo, newHi] =
      h.edge === 'low' ? [Math.min(nm, hi - MIN_BAND_WIDTH_NM), hi] : [lo, Math.max(nm, lo + MIN_BAND_WIDTH_NM)];
    return setFilter(panel, h.channelIndex, h.filterIndex, {
      ...f,
      centerNm: (newLo + newHi) / 2,
      widthNm: newHi - newLo,
    });
  }
  if ((f.type === 'longpass' || f.type === 'shortpass' || f.type === 'dichroic') && h.edge === 'edge') {
    return setFilter(panel, h.channelIndex, h.filterIndex, { ...f, edgeNm: nm });
  }
  return panel;
}
