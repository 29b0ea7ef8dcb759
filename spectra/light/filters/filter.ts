/**
 * One entry point for every filter kind: an exhaustive switch on `type`, so adding a kind to FilterSpec without
 * handling it here fails to compile.
 */
import type { FilterSpec } from '../../core/panel';
import type { WavelengthGrid } from '../../core/grid';
import { bandpassTransmission } from './bandpass';
import { singleEdgeTransmission } from './edgepass';
import { tableTransmission } from './table';

/**
 * Transmission (0–1) of one filter on a grid. Analytic kinds use a logistic edge whose `edgeWidthNm` is the 10–90 %
 * rise distance, a floor of 10^−blockingOD out of band and `peakTransmission` in band (defaults: FILTER_DEFAULTS).
 * `path` names the filter in a model error (a bandpass narrower than its edges).
 * @example filterTransmission({ type: 'bandpass', centerNm: 605, widthNm: 20 }, DEFAULT_GRID)
 */
export function filterTransmission(filter: FilterSpec, grid: WavelengthGrid, path: (string | number)[] = []): number[] {
  switch (filter.type) {
    case 'bandpass':
      return bandpassTransmission(filter, grid, path);
    case 'longpass':
    case 'shortpass':
    case 'dichroic':
      return singleEdgeTransmission(filter, grid);
    case 'table':
      return tableTransmission(filter, grid);
    default: {
      const unknown: never = filter;
      throw new Error(`unknown filter type ${JSON.stringify((unknown as { type?: unknown }).type)}`);
    }
  }
}
