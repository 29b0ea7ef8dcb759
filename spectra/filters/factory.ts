/**
 * One entry point for every filter kind: an exhaustive switch on `type`, so adding a kind to FilterSpec without
 * handling it here fails to compile.
 */
import type { FilterSpec } from '../panel';
import type { WavelengthGrid } from '../grid';
import { SpectraError } from '../errors';
import { bandpassTransmission } from './bandpass';
import { edgePassTransmission } from './edgepass';
import { dichroicTransmission } from './dichroic';
import { tableTransmission } from './table';
import type { ConstantEnds } from '../linalg/runs';

/**
 * Transmission (0–1) of one filter on a grid. Analytic kinds use a logistic edge whose `edgeWidthNm` is the 10–90 %
 * rise distance, a floor of 10^-blockingOD out of band and `peakTransmission` in band (defaults: FILTER_DEFAULTS).
 * Errors are SpectraError naming the field under `path`, e.g. ['channels', 2, 'filters', 0, 'widthNm']. If given,
 * `ends` receives the index range outside which the result is constant (for the overlap integrals).
 * @example filterTransmission({ type: 'bandpass', centerNm: 605, widthNm: 20 }, DEFAULT_GRID)
 */
export function filterTransmission(
  filter: FilterSpec,
  grid: WavelengthGrid,
  path: (string | number)[] = [],
  ends?: ConstantEnds,
): Float64Array {
  return filterTransmissionInto(filter, grid, path, ends);
}

/** filterTransmission written into `out` (every point) when given, else into a new array. */
export function filterTransmissionInto(
  filter: FilterSpec,
  grid: WavelengthGrid,
  path: (string | number)[],
  ends: ConstantEnds | undefined,
  out?: Float64Array,
): Float64Array {
  if (filter === null || typeof filter !== 'object') {
    throw new SpectraError('invalid_input', 'a filter must be an object with a type', path);
  }
  switch (filter.type) {
    case 'bandpass':
      return bandpassTransmission(filter, grid, path, ends, out);
    case 'longpass':
    case 'shortpass':
      return edgePassTransmission(filter, grid, path, ends, out);
    case 'dichroic':
      return dichroicTransmission(filter, grid, path, ends, out);
    case 'table':
      return tableTransmission(filter, grid, path, ends, out);
    default: {
      const unknown: never = filter;
      throw new SpectraError(
        'invalid_input',
        `unknown filter type ${JSON.stringify((unknown as { type?: unknown }).type)}; expected bandpass, longpass, shortpass, dichroic or table`,
        [...path, 'type'],
      );
    }
  }
}
