/**
 * The light path of one detection channel: every filter in it, in series, times the detector's quantum efficiency.
 */
import type { ChannelSpec } from '../panel';
import type { WavelengthGrid } from '../grid';
import { SpectraError } from '../errors';
import { detectorQe } from '../detectors';
import { filterTransmission, filterTransmissionInto } from './factory';
import type { ConstantEnds } from '../linalg/runs';

/** Most filters one channel may stack (a guard on request size, not a physical limit). */
export const MAX_FILTERS_PER_CHANNEL = 8;

/**
 * Fraction (0–1) of the photons at each grid wavelength that reach the channel's detector and are detected:
 * Π filters(λ) × QE(λ). Without a detector the QE is 1 (an ideal detector). Errors name the field under `path`,
 * e.g. ['channels', 2, 'filters', 0, 'widthNm'] or ['channels', 2, 'detector']. If given, `ends` receives the index
 * range outside which the result is constant (a product of arrays constant outside their own windows is constant
 * outside the union of the windows; a detector curve is not assumed constant anywhere).
 */
export function channelTransmission(
  channel: ChannelSpec,
  grid: WavelengthGrid,
  path: (string | number)[] = [],
  ends?: ConstantEnds,
): Float64Array {
  return channelTransmissionInto(channel, grid, path, ends);
}

/**
 * channelTransmission written into `target` (every point) when given, else into a new array: panel evaluation
 * reuses its buffers, since a grid-long typed array per channel costs more to collect than to fill.
 */
export function channelTransmissionInto(
  channel: ChannelSpec,
  grid: WavelengthGrid,
  path: (string | number)[],
  ends: ConstantEnds | undefined,
  target?: Float64Array,
): Float64Array {
  if (!Array.isArray(channel?.filters)) {
    throw new SpectraError('invalid_input', 'a channel needs a filters array (it may be empty)', [...path, 'filters']);
  }
  if (channel.filters.length > MAX_FILTERS_PER_CHANNEL) {
    throw new SpectraError('invalid_input', `a channel may stack at most ${MAX_FILTERS_PER_CHANNEL} filters`, [
      ...path,
      'filters',
    ]);
  }
  const { filters } = channel;
  // The first filter's fresh array becomes the product, multiplied in place by the others and the QE.
  const window: ConstantEnds = { first: filters.length === 0 ? grid.count : 0, end: 0 };
  const own: ConstantEnds = { first: 0, end: grid.count };
  const out =
    filters.length === 0
      ? (target ?? new Float64Array(grid.count)).fill(1)
      : filterTransmissionInto(filters[0], grid, [...path, 'filters', 0], own, target);
  if (filters.length > 0) Object.assign(window, own);
  for (let f = 1; f < filters.length; f++) {
    const t = filterTransmission(filters[f], grid, [...path, 'filters', f], own);
    for (let i = 0; i < out.length; i++) out[i] *= t[i];
    window.first = Math.min(window.first, own.first);
    window.end = Math.max(window.end, own.end);
  }
  if (channel.detector !== undefined) {
    const qe = detectorQe(channel.detector, grid, [...path, 'detector']);
    for (let i = 0; i < out.length; i++) out[i] *= qe[i];
    window.first = 0;
    window.end = grid.count;
  }
  if (ends) {
    ends.first = window.first;
    ends.end = Math.max(window.end, window.first);
  }
  return out;
}
