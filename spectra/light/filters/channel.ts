/**
 * The light path of one detection channel: every filter in it, in series, times the detector's quantum efficiency.
 */
import type { ChannelSpec } from '../../core/panel';
import type { WavelengthGrid } from '../../core/grid';
import { detectorQe } from '../detectors';
import { filterTransmission } from './filter';

/**
 * Fraction (0–1) of the photons at each grid wavelength that reach the channel's detector and are detected:
 * Π filters(λ) × QE(λ). Without a detector the QE is 1 (an ideal detector). `path` names the channel in a model error,
 * e.g. ['channels', 2].
 */
export function channelTransmission(
  channel: ChannelSpec,
  grid: WavelengthGrid,
  path: (string | number)[] = [],
): number[] {
  const transmissions = channel.filters.map((filter, f) => filterTransmission(filter, grid, [...path, 'filters', f]));
  // The first filter's own array becomes the product.
  const out = transmissions[0] ?? new Array<number>(grid.count).fill(1);
  for (const t of transmissions.slice(1)) for (let i = 0; i < out.length; i++) out[i] *= t[i];
  if (channel.detector !== undefined) {
    const qe = detectorQe(channel.detector, grid);
    for (let i = 0; i < out.length; i++) out[i] *= qe[i];
  }
  return out;
}
