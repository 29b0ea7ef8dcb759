/**
 * The light path of one detection channel: every filter in it, in series, times the detector's quantum efficiency.
 */
import type { ChannelSpec } from '../panel';
import type { WavelengthGrid } from '../grid';
import { SpectraError } from '../errors';
import { detectorQe } from '../detectors';
import { filterTransmission } from './factory';

/** Most filters one channel may stack (a guard on request size, not a physical limit). */
export const MAX_FILTERS_PER_CHANNEL = 8;

/**
 * Fraction (0–1) of the photons at each grid wavelength that reach the channel's detector and are detected:
 * Π filters(λ) × QE(λ). Without a detector the QE is 1 (an ideal detector). Errors name the field under `path`,
 * e.g. ['channels', 2, 'filters', 0, 'widthNm'] or ['channels', 2, 'detector'].
 */
export function channelTransmission(channel: ChannelSpec, grid: WavelengthGrid, path: (string | number)[] = []): Float64Array {
  if (!Array.isArray(channel?.filters)) {
    throw new SpectraError('invalid_input', 'a channel needs a filters array (it may be empty)', [...path, 'filters']);
  }
  if (channel.filters.length > MAX_FILTERS_PER_CHANNEL) {
    throw new SpectraError('invalid_input', `a channel may stack at most ${MAX_FILTERS_PER_CHANNEL} filters`, [...path, 'filters']);
  }
  const { filters } = channel;
  // The first filter's fresh array becomes the product, multiplied in place by the others and the QE.
  const out = filters.length === 0 ? new Float64Array(grid.count).fill(1) : filterTransmission(filters[0], grid, [...path, 'filters', 0]);
  for (let f = 1; f < filters.length; f++) {
    const t = filterTransmission(filters[f], grid, [...path, 'filters', f]);
    for (let i = 0; i < out.length; i++) out[i] *= t[i];
  }
  if (channel.detector !== undefined) {
    const qe = detectorQe(channel.detector, grid, [...path, 'detector']);
    for (let i = 0; i < out.length; i++) out[i] *= qe[i];
  }
  return out;
}
