/**
 * A filter given as a measured table [[nm, transmission 0–1], ...], linearly interpolated onto the grid. Beyond the
 * table's ends the end values are held: a measured curve usually stops where the filter is already blocking or fully
 * open, and holding is the least surprising guess.
 */
import { sampleTable, type WavelengthGrid } from '../../core/grid';
import type { SpectrumPoints } from '../../core/panel';

/** A measured filter as the panel carries it. */
export interface TableFilterSpec {
  type: 'table';
  points: SpectrumPoints;
}

/** Transmission (0–1) of a measured filter on a grid, end values held beyond the table. */
export function tableTransmission(filter: TableFilterSpec, grid: WavelengthGrid): number[] {
  return sampleTable(filter.points, grid, 'hold');
}
