/**
 * A dichroic mirror in the emission path, seen from the detector: with `passes: 'above'` the channel gets the light
 * above the edge (the mirror transmits it, or reflects it, depending on the side the detector sits on; only the
 * passed band matters here). Same logistic edge as a longpass/shortpass, with a dichroic's softer defaults.
 */
import type { WavelengthGrid } from '../grid';
import { SpectraError } from '../errors';
import { FILTER_DEFAULTS } from './edge';
import { singleEdgeTransmission } from './edgepass';
import type { ConstantEnds } from '../linalg/runs';

/** A dichroic as the panel carries it. */
export interface DichroicSpec {
  type: 'dichroic';
  edgeNm: number;
  passes: 'above' | 'below';
  peakTransmission?: number;
  edgeWidthNm?: number;
  blockingOD?: number;
}

/** Transmission (0–1) towards the channel's detector of a dichroic mirror on a grid. */
export function dichroicTransmission(
  filter: DichroicSpec,
  grid: WavelengthGrid,
  path: (string | number)[] = [],
  ends?: ConstantEnds,
  out?: Float64Array,
): Float64Array {
  if (filter.passes !== 'above' && filter.passes !== 'below') {
    throw new SpectraError('invalid_input', `passes must be "above" or "below", got ${String(filter.passes)}`, [
      ...path,
      'passes',
    ]);
  }
  return singleEdgeTransmission(filter, filter.passes === 'above', FILTER_DEFAULTS.dichroic, grid, path, ends, out);
}
