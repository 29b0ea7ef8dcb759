/**
 * Single-edge filters: longpass and shortpass filters, and the dichroic mirror in the emission path. One logistic
 * edge (see edge.ts) at edgeNm, where the transmission is halfway between the blocking floor and the peak. A
 * longpass passes wavelengths above its edge, a shortpass those below; a dichroic, seen from the channel's detector,
 * passes the side named by `passes` (whether the mirror transmits or reflects that side does not matter here). They
 * differ only in their defaults (FILTER_DEFAULTS).
 */
import type { WavelengthGrid } from '../../core/grid';
import type { EdgeFilterOptions } from '../../core/panel';
import { FILTER_DEFAULTS } from './defaults';
import { edgeOptions, logisticScaleNm, passbandTransmission } from './edge';

/** A longpass or shortpass filter, or a dichroic, as the panel carries it. */
export type SingleEdgeSpec = EdgeFilterOptions & { edgeNm: number } & (
    { type: 'longpass' | 'shortpass' } | { type: 'dichroic'; passes: 'above' | 'below' }
  );

/** Transmission (0–1) of a longpass, shortpass or dichroic on a grid. */
export function singleEdgeTransmission(filter: SingleEdgeSpec, grid: WavelengthGrid): number[] {
  const dichroic = filter.type === 'dichroic';
  const passesAbove = dichroic ? filter.passes === 'above' : filter.type === 'longpass';
  const options = edgeOptions(filter, dichroic ? FILTER_DEFAULTS.dichroic : FILTER_DEFAULTS.edgepass);
  const span = options.peakTransmission - options.floor;
  const scaleNm = logisticScaleNm(options.edgeWidthNm);
  return passesAbove
    ? passbandTransmission(grid, filter.edgeNm, Infinity, scaleNm, options.floor, span)
    : passbandTransmission(grid, -Infinity, filter.edgeNm, scaleNm, options.floor, span);
}
