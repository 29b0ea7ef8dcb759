/**
 * "Snap to stock sizes": a bandpass placed by a drag or by typing lands on the nearest stock size (spectra's stock
 * rule). Other filter kinds have no stock sizes and stay where they were put; with snapping off, any size is kept and
 * the channel card marks it custom.
 */
import { nearestStockBandpass, type FilterSpec } from '../../spectra/index';

/** The filter at the nearest stock size when it is a bandpass, otherwise the filter itself. */
export function snapToStock(filter: FilterSpec): FilterSpec {
  if (filter.type !== 'bandpass') return filter;
  return { ...filter, ...nearestStockBandpass(filter.centerNm, filter.widthNm) };
}
