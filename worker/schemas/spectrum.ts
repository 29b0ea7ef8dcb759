import { z } from 'zod';
import { LIMITS } from './limits';
import { wavelengthNm } from './fields';

/**
 * A measured table `{"points": [[nm, value], ...]}`: 2 to LIMITS.tablePoints points, wavelengths strictly
 * ascending, values finite in [0, maxValue]. `what` names the value in messages (e.g. "transmission").
 */
export function pointsTable(maxValue: number, what: string) {
  const value = z
    .number({ error: (issue) => (issue.input === undefined ? `is required (${what})` : 'must be a finite number') })
    .min(0, { error: `${what} must be between 0 and ${maxValue}` })
    .max(maxValue, { error: `${what} must be between 0 and ${maxValue}` });
  const point = z.tuple([wavelengthNm(), value], { error: 'must be a pair [wavelength in nm, value]' });
  const points = z
    .array(point, { error: 'must be an array of [nm, value] pairs' })
    .min(2, { error: 'needs at least 2 points' })
    .max(LIMITS.tablePoints, { error: `has more than ${LIMITS.tablePoints} points` })
    .superRefine((pairs, ctx) => {
      for (let i = 1; i < pairs.length; i++) {
        if (!(pairs[i][0] > pairs[i - 1][0])) {
          ctx.addIssue({
            code: 'custom',
            message: 'wavelengths must be strictly ascending',
            path: [i, 0],
            params: { apiCode: 'invalid_table' },
          });
          return;
        }
      }
    });
  return z.strictObject({ points });
}
