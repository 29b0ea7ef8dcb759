/**
 * The files the controls section writes: a spillover matrix as CSV (rows channels, columns probes, as the evaluation's
 * spillover[c][p]; with a second block of standard errors when known), the unmixing matrix as CSV (rows probes,
 * columns channels) and the FCS 3.1 $SPILLOVER keyword value as text. CSV cells go through csvText, which guards
 * against formula injection and quotes as RFC 4180 asks.
 */
import { csvText, type CsvValue } from './csv-export';

/** Significant digits of each written value. */
export const CONTROLS_DIGITS = 6;

const value = (v: number | null | undefined): CsvValue =>
  v === null || v === undefined || !Number.isFinite(v) ? null : Number(v.toPrecision(CONTROLS_DIGITS));

/** The spillover [c][p] as CSV: a header of probe names, one row per channel, then an SE block when given. */
export function spilloverCsv(
  channels: readonly string[],
  probes: readonly string[],
  spillover: readonly (readonly (number | null)[])[],
  se?: readonly (readonly (number | null)[])[],
): string {
  const rows: CsvValue[][] = [['spillover (rows channels, columns probes)', ...probes]];
  channels.forEach((c, i) => rows.push([c, ...spillover[i].map(value)]));
  if (se && se.some((row) => row.some((v) => v !== null))) {
    rows.push([], ['standard error', ...probes]);
    channels.forEach((c, i) => rows.push([c, ...se[i].map(value)]));
  }
  return csvText(rows);
}

/** The unmixing matrix [p][c] as CSV: a header of channel names, one row per probe. */
export function unmixingCsv(
  probes: readonly string[],
  channels: readonly string[],
  unmixing: readonly (readonly number[])[],
): string {
  const rows: CsvValue[][] = [['unmixing (rows probes, columns channels)', ...channels]];
  probes.forEach((p, i) => rows.push([p, ...unmixing[i].map(value)]));
  return csvText(rows);
}
