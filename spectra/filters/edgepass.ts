/**
 * Longpass and shortpass filters: one logistic edge (see edge.ts) at edgeNm, where the transmission is halfway
 * between the blocking floor and the peak. A longpass passes wavelengths above its edge, a shortpass those below.
 */
import type { WavelengthGrid } from '../grid';
import type { ConstantEnds } from '../linalg/runs';
import { FILTER_DEFAULTS, fillPassband, logisticScaleNm, requireWavelengthNm, resolveEdgeOptions } from './edge';
import type { FilterDefaults } from './defaults';

/** A longpass or shortpass filter as the panel carries it. */
export interface EdgePassSpec {
  type: 'longpass' | 'shortpass';
  edgeNm: number;
  peakTransmission?: number;
  edgeWidthNm?: number;
  blockingOD?: number;
}

/**
 * Transmission (0–1) of a single-edge filter passing wavelengths above (`passesAbove`) or below its edge; shared by
 * longpass, shortpass and dichroic, which differ only in their defaults. Errors name the field under `path`.
 */
export function singleEdgeTransmission(
  filter: { edgeNm: number; peakTransmission?: number; edgeWidthNm?: number; blockingOD?: number },
  passesAbove: boolean,
  defaults: Readonly<FilterDefaults>,
  grid: WavelengthGrid,
  path: (string | number)[],
  ends?: ConstantEnds,
  out?: Float64Array,
): Float64Array {
  const edgeNm = requireWavelengthNm(filter.edgeNm, 'edgeNm', path);
  const options = resolveEdgeOptions(filter, defaults, path);
  const span = options.peakTransmission - options.floor;
  const scaleNm = logisticScaleNm(options.edgeWidthNm);
  return passesAbove
    ? fillPassband(grid, edgeNm, Infinity, scaleNm, options.floor, span, ends, out)
    : fillPassband(grid, -Infinity, edgeNm, scaleNm, options.floor, span, ends, out);
}

/** Transmission (0–1) of a longpass or shortpass filter on a grid. */
export function edgePassTransmission(
  filter: EdgePassSpec,
  grid: WavelengthGrid,
  path: (string | number)[] = [],
  ends?: ConstantEnds,
  out?: Float64Array,
): Float64Array {
  return singleEdgeTransmission(filter, filter.type === 'longpass', FILTER_DEFAULTS.edgepass, grid, path, ends, out);
}
