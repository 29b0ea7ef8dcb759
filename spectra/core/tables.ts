/**
 * Two-column spectrum tables pasted or uploaded as text (wavelength in nm, value): filter transmission, emission,
 * extinction or background. Separators: comma, semicolon, tab or spaces; '#' starts a comment line; header lines are
 * allowed only before the data. Transmission given in percent is converted to 0–1 on import.
 */
import { SpectraError } from './errors';
import { LIMITS } from './limits';

/** What the second column holds; it decides the checks (and percent detection, for transmission only). */
export type SpectrumCsvKind = 'transmission' | 'emission' | 'extinction' | 'background';

/** Longest text accepted (characters), most lines, longest line: guards on request size, not science. */
export const CSV_LIMITS = Object.freeze({ maxChars: 1_000_000, maxLines: 20_000, maxLineChars: 200 });

// Transmission above 1.5 cannot be a 0–1 fraction (slight excursions above 1 are measurement noise): percent.
const PERCENT_THRESHOLD = 1.5;

const fail = (line: number, message: string) =>
  new SpectraError('invalid_table', `line ${line}: ${message}`, ['line', line]);

/** Splits one data line into fields; a trailing separator is tolerated. */
function fields(line: string): string[] {
  const parts = line.trim().split(/\s*[,;\t]\s*|\s+/);
  if (parts.length > 1 && parts[parts.length - 1] === '') parts.pop();
  return parts;
}

const NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

/**
 * An ascending table resampled to `count` evenly spaced wavelengths over the same range, by linear interpolation
 * (the last point is the table's own last wavelength exactly).
 */
export function resampleTable(points: readonly (readonly [number, number])[], count: number): [number, number][] {
  const first = points[0][0];
  const last = points[points.length - 1][0];
  const out: [number, number][] = [];
  let j = 0;
  for (let k = 0; k < count; k++) {
    const nm = k === count - 1 ? last : first + ((last - first) * k) / (count - 1);
    while (j < points.length - 2 && points[j + 1][0] < nm) j++;
    const [x0, y0] = points[j];
    const [x1, y1] = points[j + 1];
    const f = x1 === x0 ? 0 : Math.min(1, Math.max(0, (nm - x0) / (x1 - x0)));
    out.push([nm, y0 + (y1 - y0) * f]);
  }
  return out;
}

/**
 * Parses a two-column spectrum table. Transmission in percent (a header mentioning %, or any value above 1.5) is
 * divided by 100; small excursions below 0 or above 1 are clipped with a warning. Negative emission or background
 * values (baseline noise) are clipped to 0 with a warning; negative extinction is an error. More than 1,000 rows are
 * resampled to 1,000 evenly spaced points (with a warning).
 * Errors: SpectraError `invalid_table` with path ['line', n] (1-based) for a bad row, a row out of order, a ragged row
 * or an over-long line; path [] for an empty or oversized text.
 */
export function parseSpectrumCsv(
  text: string,
  options: { kind?: SpectrumCsvKind } = {},
): { points: [number, number][]; warnings: string[] } {
  const kind = options.kind ?? 'transmission';
  if (typeof text !== 'string') throw new SpectraError('invalid_table', 'the table must be text', []);
  if (text.length > CSV_LIMITS.maxChars)
    throw new SpectraError('invalid_table', `the table is over ${CSV_LIMITS.maxChars} characters`, []);
  const lines = text.split(/\r\n|\r|\n/);
  if (lines.length > CSV_LIMITS.maxLines)
    throw new SpectraError('invalid_table', `the table has over ${CSV_LIMITS.maxLines} lines`, []);
  const warnings: string[] = [];
  let points: [number, number][] = [];
  let headerSaysPercent = false;
  lines.forEach((raw, index) => {
    const line = index + 1;
    if (raw.length > CSV_LIMITS.maxLineChars) throw fail(line, `longer than ${CSV_LIMITS.maxLineChars} characters`);
    const trimmed = raw.trim();
    if (trimmed === '' || trimmed.startsWith('#')) return;
    const parts = fields(trimmed);
    const numeric = parts.every((p) => NUMBER.test(p));
    if (!numeric && points.length === 0 && !/^[+-]?[\d.]/.test(parts[0])) {
      if (trimmed.includes('%')) headerSaysPercent = true;
      return; // a header line
    }
    if (parts.length !== 2) throw fail(line, `expected 2 columns (wavelength nm, value), found ${parts.length}`);
    if (!numeric) throw fail(line, `not a number: ${JSON.stringify(parts.find((p) => !NUMBER.test(p)))}`);
    const [nm, value] = parts.map(Number) as [number, number];
    if (!Number.isFinite(nm) || !Number.isFinite(value)) throw fail(line, 'values must be finite numbers');
    if (nm <= 0) throw fail(line, `wavelength must be above 0 nm, got ${nm}`);
    if (points.length > 0 && nm <= points[points.length - 1][0]) {
      throw fail(
        line,
        `rows out of order: ${nm} nm does not follow ${points[points.length - 1][0]} nm (sort ascending, no repeats)`,
      );
    }
    if (kind === 'extinction' && value < 0) throw fail(line, `extinction cannot be negative, got ${value}`);
    points.push([nm, value]);
  });
  if (points.length < 2)
    throw new SpectraError('invalid_table', 'the table needs at least 2 data rows (wavelength nm, value)', []);
  if (kind === 'transmission') {
    const percent = headerSaysPercent || points.some(([, v]) => v > PERCENT_THRESHOLD);
    if (percent) {
      points = points.map(([nm, v]) => [nm, v / 100]);
      warnings.push('transmission read as percent and converted to 0–1');
    }
    const clipped = points.filter(([, v]) => v < 0 || v > 1).length;
    if (clipped > 0) {
      points = points.map(([nm, v]) => [nm, Math.min(1, Math.max(0, v))]);
      warnings.push(`${clipped} transmission values outside 0–1 were clipped`);
    }
  } else if (kind !== 'extinction') {
    const negative = points.filter(([, v]) => v < 0).length;
    if (negative > 0) {
      points = points.map(([nm, v]) => [nm, Math.max(0, v)]);
      warnings.push(`${negative} negative ${kind} values (baseline noise) were set to 0`);
    }
  }
  if (points.length > LIMITS.tablePoints) {
    warnings.push(`resampled from ${points.length} to ${LIMITS.tablePoints} evenly spaced points`);
    points = resampleTable(points, LIMITS.tablePoints);
  }
  return { points, warnings };
}
