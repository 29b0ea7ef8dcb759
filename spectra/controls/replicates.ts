/**
 * The rows of one probe's control reduced to a mean and a standard error per channel. Several rows are replicates:
 * their mean, and the standard error of the mean s / √k from the replicates' sample standard deviation s (k ≥ 2;
 * common practice). One row with `sd` and `n` gives sd / √n. Otherwise the error is unknown (null).
 */
import type { ControlRow } from './types';

/** Mean and standard error (null: unknown) per channel of one probe's control rows. */
export interface ReplicateSummary {
  mean: number[];
  se: (number | null)[];
  count: number;
}

/** The mean and standard error per channel of a probe's control rows (at least one, all of the same length). */
export function summariseReplicates(rows: readonly ControlRow[]): ReplicateSummary {
  const k = rows.length;
  const channels = rows[0].values.length;
  const mean = new Array<number>(channels).fill(0);
  for (const row of rows) row.values.forEach((v, c) => (mean[c] += v / k));
  if (k >= 2) {
    const se = mean.map((m, c) => {
      const ss = rows.reduce((a, row) => a + (row.values[c] - m) ** 2, 0);
      return Math.sqrt(ss / (k - 1) / k);
    });
    return { mean, se, count: k };
  }
  const { sd, n } = rows[0];
  return { mean, se: sdToSe(sd, n, channels), count: 1 };
}

/** sd / √n per channel, or nulls when either is missing. */
export function sdToSe(sd: readonly number[] | undefined, n: number | undefined, channels: number): (number | null)[] {
  if (sd === undefined || n === undefined || n < 1) return new Array<null>(channels).fill(null);
  return sd.map((s) => s / Math.sqrt(n));
}
