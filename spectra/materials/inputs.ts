import { SpectraError, requireFinite } from '../errors';

/** Reads an optional number field: undefined stays undefined; otherwise finite and within [min, max] or a typed error. */
export function optionalNumber(
  input: Record<string, unknown>,
  field: string,
  min: number,
  max: number,
  unit: string,
  opts: { minExclusive?: boolean } = {},
): number | undefined {
  const value = input[field];
  if (value === undefined) return undefined;
  const x = requireFinite(value, field);
  const tooLow = opts.minExclusive ? x <= min : x < min;
  if (tooLow) {
    throw new SpectraError(
      'invalid_input',
      `${field} must be ${opts.minExclusive ? 'above' : 'at least'} ${min}${unit}, got ${x}`,
      [field],
    );
  }
  if (x > max) throw new SpectraError('out_of_range', `${field} must be at most ${max}${unit}, got ${x}`, [field]);
  return x;
}
