import { z } from 'zod';
import { LIMITS, RANGES } from './limits';

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

/** A wavelength in nm within RANGES.wavelengthNm. */
export const wavelengthNm = () => ranged(RANGES.wavelengthNm[0], RANGES.wavelengthNm[1], 'nm');

/** A fraction 0–1 (transmission, quantum yield). */
export const fraction = () => ranged(0, 1);

/** A free-text field (title, label, target) of bounded length. */
export const text = () =>
  z
    .string({ error: 'must be a string' })
    .max(LIMITS.textLength, { error: `must be at most ${LIMITS.textLength} characters` });

/** An id that other fields refer to (probe and channel ids): 1–64 characters. */
export const identifier = () =>
  z
    .string({ error: (issue) => (issue.input === undefined ? 'is required (a string id)' : 'must be a string') })
    .min(1, { error: 'must not be empty' })
    .max(LIMITS.idLength, { error: `must be at most ${LIMITS.idLength} characters` });
