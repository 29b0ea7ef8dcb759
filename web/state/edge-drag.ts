/**
 * Applies a dragged filter edge to the panel: a bandpass keeps its other edge fixed (so centre and width both move),
 * an edge filter moves its edge. With `snapStock`, the bandpass then lands on the nearest stock size (both edges may
 * move to get there). The numbers in the channel editor follow because they read the same panel.
 */
import type { FilterSpec, PanelSpec } from '../../spectra/index';
import type { ChartHandle } from '../chart/types';
import { setFilter } from './panel-edit';
import { snapToStock } from './stock-snap';

type BandpassSpec = Extract<FilterSpec, { type: 'bandpass' }>;

/** Narrowest passband a drag can make, nm. */
export const MIN_BAND_WIDTH_NM = 1;

/** A bandpass with one edge moved to `nm`, the other kept (at least MIN_BAND_WIDTH_NM apart). */
function withEdge(f: BandpassSpec, edge: 'low' | 'high', nm: number): BandpassSpec {
  const lo = f.centerNm - f.widthNm / 2;
  const hi = f.centerNm + f.widthNm / 2;
  const [newLo, newHi] =
    edge === 'low' ? [Math.min(nm, hi - MIN_BAND_WIDTH_NM), hi] : [lo, Math.max(nm, lo + MIN_BAND_WIDTH_NM)];
  return { ...f, centerNm: (newLo + newHi) / 2, widthNm: newHi - newLo };
}

/** Farthest a key step looks for the next stock size, nm: past the widest gap between neighbouring stock sizes. */
const STEP_SEARCH_NM = 100;

/**
 * The panel with the handle's edge at `wavelengthNm` (whole nm for bandpass edges, so typed numbers stay tidy). With
 * `snapStock`, a key step (`byKey`) that would snap back to the same size goes on to the next stock size that way.
 */
export function moveEdge(
  panel: PanelSpec,
  h: ChartHandle & { byKey?: boolean },
  options: { snapStock?: boolean } = {},
): PanelSpec {
  const f = panel.channels[h.channelIndex]?.filters[h.filterIndex];
  if (!f) return panel;
  const nm = h.wavelengthNm;
  if (f.type === 'bandpass' && (h.edge === 'low' || h.edge === 'high')) {
    const edge = h.edge;
    if (!options.snapStock) return setFilter(panel, h.channelIndex, h.filterIndex, withEdge(f, edge, nm));
    const current = edge === 'low' ? f.centerNm - f.widthNm / 2 : f.centerNm + f.widthNm / 2;
    const way = Math.sign(nm - current);
    const same = (g: FilterSpec) => g.type === 'bandpass' && g.centerNm === f.centerNm && g.widthNm === f.widthNm;
    let snapped = snapToStock(withEdge(f, edge, nm));
    for (let k = 1; h.byKey && way !== 0 && same(snapped) && k <= STEP_SEARCH_NM; k++)
      snapped = snapToStock(withEdge(f, edge, nm + way * k));
    return setFilter(panel, h.channelIndex, h.filterIndex, snapped);
  }
  if ((f.type === 'longpass' || f.type === 'shortpass' || f.type === 'dichroic') && h.edge === 'edge') {
    return setFilter(panel, h.channelIndex, h.filterIndex, { ...f, edgeNm: nm });
  }
  return panel;
}
