/**
 * The controls CSV the page reads (its help text says the same): one row per sample, one column per channel.
 * - The header row: a first cell (any name, e.g. "sample"), then the channels by id or label, optionally `sd:<channel>`
 *   columns (the standard deviation of the readings behind each mean) and an `n` column (how many readings).
 * - One or more rows named "unstained"; every other row names a probe by label or id (case and spaces at the ends
 *   ignored). Several rows of one probe are replicates; several unstained rows are too (their mean, with the spread
 *   of the rows as sd and their count as n). Lines starting with # and empty lines are skipped.
 * Every refusal names the line and column in the user's words, e.g. 'Line 4, channel "Red": "" is not a number'.
 */
import type { ControlsMeasurement, PanelSpec } from '../../spectra/index';

/** The measurement read from a file, and for each control the file's line it came from (for messages). */
export type ControlsCsvResult =
  { ok: true; measurement: ControlsMeasurement; lines: number[] } | { ok: false; message: string };

/** The cells of one CSV line (RFC 4180 quoting; a quoted cell may hold commas, not line breaks). */
export function csvCells(line: string): string[] {
  const cells: string[] = [];
  let cell = '';
  let quoted = false;
  for (let i = 0; i < line.length; i++) {
    const ch = line[i];
    if (quoted) {
      if (ch === '"' && line[i + 1] === '"') {
        cell += '"';
        i++;
      } else if (ch === '"') quoted = false;
      else cell += ch;
    } else if (ch === '"') quoted = true;
    else if (ch === ',') {
      cells.push(cell);
      cell = '';
    } else cell += ch;
  }
  cells.push(cell);
  return cells.map((c) => c.trim());
}

const key = (text: string) => text.trim().toLowerCase();

function finder<T extends { id: string; label?: string }>(items: readonly T[]) {
  return (name: string) =>
    items.find((i) => key(i.id) === key(name)) ?? items.find((i) => key(i.label ?? '') === key(name));
}

/** Reads a controls CSV against the panel (its channels and probes name the columns and rows). */
export function readControlsCsv(text: string, panel: PanelSpec): ControlsCsvResult {
  const lines = text.split(/\r\n|\n|\r/).map((l, i) => ({ no: i + 1, cells: csvCells(l) }));
  const rows = lines.filter((l) => l.cells.some((c) => c !== '') && !l.cells[0].startsWith('#'));
  if (rows.length < 2)
    return { ok: false, message: 'The file needs a header row, an "unstained" row and a control row' };
  const [header, ...body] = rows;
  const channel = finder(panel.channels);
  const probe = finder(panel.probes);
  const valueCols: { col: number; id: string }[] = [];
  const sdCols = new Map<string, number>();
  let nCol = -1;
  for (let col = 1; col < header.cells.length; col++) {
    const name = header.cells[col];
    if (key(name) === 'n') nCol = col;
    else if (key(name).startsWith('sd:')) {
      const c = channel(name.slice(3));
      if (!c) return { ok: false, message: `Line ${header.no}: "${name}" names no channel of this panel` };
      sdCols.set(c.id, col);
    } else {
      const c = channel(name);
      if (!c) {
        const known = panel.channels.map((ch) => ch.label || ch.id).join(', ');
        return { ok: false, message: `Line ${header.no}: column "${name}" is not a channel of this panel (${known})` };
      }
      valueCols.push({ col, id: c.id });
    }
  }
  if (valueCols.length === 0) return { ok: false, message: `Line ${header.no}: the header names no channel` };
  const channels = valueCols.map((v) => v.id);
  const number = (row: (typeof body)[number], col: number, what: string): number | string => {
    const cell = row.cells[col] ?? '';
    const v = cell === '' ? Number.NaN : Number(cell);
    return Number.isFinite(v) ? v : `Line ${row.no}, ${what}: "${cell}" is not a number; give the channel's mean`;
  };
  const measurement: ControlsMeasurement = { channels, unstained: [], controls: [] };
  const controlLines: number[] = [];
  const unstained: { values: number[]; sd?: number[]; n?: number }[] = [];
  for (const row of body) {
    const values: number[] = [];
    for (const { col } of valueCols) {
      const v = number(row, col, `channel "${header.cells[col]}"`);
      if (typeof v === 'string') return { ok: false, message: v };
      values.push(v);
    }
    const sdList: number[] = [];
    if (sdCols.size > 0) {
      for (const id of channels) {
        const col = sdCols.get(id);
        const v = col === undefined ? Number.NaN : number(row, col, `column "sd:${id}"`);
        if (typeof v === 'string' || Number.isNaN(v))
          return { ok: false, message: `Line ${row.no}: every channel needs an sd column and value (sd:${id})` };
        sdList.push(v);
      }
    }
    const n = nCol >= 0 ? number(row, nCol, 'column "n"') : undefined;
    if (typeof n === 'string') return { ok: false, message: n };
    const spread = sdCols.size > 0 && n !== undefined ? { sd: sdList, n } : {};
    if (key(row.cells[0]) === 'unstained') {
      unstained.push({ values, ...spread });
      continue;
    }
    const p = probe(row.cells[0]);
    if (!p) {
      const known = panel.probes.map((q) => q.label || q.id).join(', ');
      return {
        ok: false,
        message: `Line ${row.no}: "${row.cells[0]}" is not a probe of this panel (${known}), nor "unstained"`,
      };
    }
    measurement.controls.push({ probe: p.id, values, ...spread });
    controlLines.push(row.no);
  }
  if (unstained.length === 0) {
    return { ok: false, message: 'The file has no row named "unstained": add the unstained sample' };
  }
  Object.assign(measurement, unstainedOf(unstained));
  if (measurement.controls.length === 0)
    return { ok: false, message: 'The file has no control row: add one per probe' };
  return { ok: true, measurement, lines: controlLines };
}

/** One unstained row as it is, or several as their mean with the rows' sample sd and their count. */
function unstainedOf(rows: { values: number[]; sd?: number[]; n?: number }[]) {
  if (rows.length === 1) {
    const [{ values, sd, n }] = rows;
    return sd && n !== undefined ? { unstained: values, unstainedSd: sd, unstainedN: n } : { unstained: values };
  }
  const k = rows.length;
  const mean = rows[0].values.map((_, c) => rows.reduce((a, r) => a + r.values[c], 0) / k);
  const sd = mean.map((m, c) => Math.sqrt(rows.reduce((a, r) => a + (r.values[c] - m) ** 2, 0) / (k - 1)));
  return { unstained: mean, unstainedSd: sd, unstainedN: k };
}
