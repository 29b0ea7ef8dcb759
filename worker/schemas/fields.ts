import { z } from 'zod';
import { MAX_BLOCKING_OD, MAX_FILTERS_PER_CHANNEL, MAX_GRID_POINTS, MAX_TABLE_POINTS } from '../../spectra/index';

/**
 * Limits of the API's input, in one place. Ranges are physical plausibility bounds (common practice for
 * fluorescence microscopy: UV to short-wave infrared light, colloidal dots from clusters to large shells), not
 * validity ranges of any model: a model with a narrower range answers `out_of_range` itself.
 */
export const LIMITS = {
  wavelengthNm: [200, 2000],
  diameterNm: [0.5, 30],
  sizeDispersionPct: [0, 50],
  fwhmNm: [1, 500],
  filterWidthNm: [0.1, 1000],
  edgeWidthNm: [0, 200],
  blockingOD: [0, MAX_BLOCKING_OD],
  powerRel: [0, 1e6],
  abundance: [0, 1e6],
  backgroundLevel: [0, 1e6],
  maxSpectralValue: 1e15,
  maxExtinction: 1e9,
  maxProbes: 16,
  maxChannels: 64,
  maxExcitationLines: 16,
  // The spectral library's own guards, taken from it so the two never disagree.
  maxFiltersPerChannel: MAX_FILTERS_PER_CHANNEL,
  maxTablePoints: MAX_TABLE_POINTS,
  maxGridPoints: MAX_GRID_POINTS,
  maxIdLength: 64,
  maxTextLength: 200,
} as const;

function numberError(issue: { input?: unknown }): string {
  return issue.input === undefined ? 'is required (a number)' : 'must be a finite number';
}

/** A finite number in [min, max] (or (min, max] with `exclusiveMin`), with a message that names the unit. */
export function ranged(min: number, max: number, unit = '', exclusiveMin = false) {
  const suffix = unit ? ` ${unit}` : '';
  const message = exclusiveMin
    ? `must be greater than ${min} and at most ${max}${suffix}`
    : `must be between ${min} and ${max}${suffix}`;
  const base = z.number({ error: numberError });
  return (exclusiveMin ? base.gt(min, { error: message }) : base.min(min, { error: message })).max(max, {
    error: message,
  });
}

/** A wavelength in nm within LIMITS.wavelengthNm. */
export const wavelengthNm = () => ranged(LIMITS.wavelengthNm[0], LIMITS.wavelengthNm[1], 'nm');

/** A fraction 0–1 (transmission, quantum yield). */
export const fraction = () => ranged(0, 1);

/** A free-text field (title, label, target) of bounded length. */
export const text = () =>
  z
    .string({ error: 'must be a string' })
    .max(LIMITS.maxTextLength, { error: `must be at most ${LIMITS.maxTextLength} characters` });

/** An id that other fields refer to (probe and channel ids): 1–64 characters. */
export const identifier = () =>
  z
    .string({ error: (issue) => (issue.input === undefined ? 'is required (a string id)' : 'must be a string') })
    .min(1, { error: 'must not be empty' })
    .max(LIMITS.maxIdLength, { error: `must be at most ${LIMITS.maxIdLength} characters` });
