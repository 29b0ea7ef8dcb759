/**
 * The measured spillover of single-stain controls (docs/api.md, "POST /api/v1/controls/spillover"): the unstained
 * sample subtracted from each control, then each control divided by its signal in its primary channel, the same
 * orientation and definition as the evaluation's spillover[c][p] (spectra/signal/crosstalk.ts). The primary channel
 * is the panel probe's assigned channel when the controls measure it, else the brightest after subtraction.
 */
import type { PanelSpec } from '../core/panel';
import { checkMeasurement, probeName } from './checks';
import { checkNegatives, checkPrimary } from './signal-checks';
import { differenceStandardError, ratioStandardError } from './ratio-error';
import { sdToSe, summariseReplicates } from './replicates';
import type { ControlRow, ControlsMeasurement, MeasuredSpillover } from './types';

/** The measured spillover, its standard errors and primary channels. Bad input throws SpectraError naming the field. */
export function measuredSpillover(m: ControlsMeasurement, panel?: PanelSpec): MeasuredSpillover {
  checkMeasurement(m, panel);
  const warnings: string[] = [];
  const groups = groupRows(m.controls, panel);
  if (panel) {
    for (const p of panel.probes) {
      if (!groups.has(p.id)) warnings.push(`probe ${probeName(p.id, panel)} has no control: its column is left out`);
    }
  }
  const unstainedSe = sdToSe(m.unstainedSd, m.unstainedN, m.channels.length);
  const probes = [...groups.keys()];
  const columns = probes.map((probe) => {
    const { rows, first } = groups.get(probe)!;
    const summary = summariseReplicates(rows);
    const signal = summary.mean.map((v, c) => v - m.unstained[c]);
    const se = summary.se.map((s, c) => {
      const u = unstainedSe[c];
      // An unknown unstained error counts as 0 when the control's own is known (the unstained is usually many pixels).
      return s === null ? null : differenceStandardError(s, u ?? 0);
    });
    const primary = primaryOf(probe, signal, m, panel, warnings);
    const at = { probe, first, panel, channels: m.channels };
    checkPrimary(signal, primary, at);
    checkNegatives(signal, se, primary, at, warnings);
    const d = signal[primary];
    const spill = signal.map((n) => n / d);
    const spillSe = signal.map((n, c) =>
      c === primary
        ? 0
        : se[c] === null || se[primary] === null
          ? null
          : ratioStandardError(n, d, se[c]!, se[primary]!),
    );
    return { signal, spill, spillSe, primary, count: summary.count };
  });
  const byChannel = <T>(pick: (col: (typeof columns)[number], c: number) => T) =>
    m.channels.map((_, c) => columns.map((col) => pick(col, c)));
  return {
    channels: [...m.channels],
    probes,
    signal: byChannel((col, c) => col.signal[c]),
    spillover: byChannel((col, c) => col.spill[c]),
    se: byChannel((col, c) => col.spillSe[c]),
    primaryChannel: columns.map((col) => col.primary),
    replicates: columns.map((col) => col.count),
    warnings,
  };
}

/** Rows grouped by probe, in panel order (else first appearance), with the index of each probe's first row. */
function groupRows(rows: readonly ControlRow[], panel: PanelSpec | undefined) {
  const groups = new Map<string, { rows: ControlRow[]; first: number }>();
  const order = panel ? panel.probes.map((p) => p.id) : [];
  for (const id of order) if (rows.some((r) => r.probe === id)) groups.set(id, { rows: [], first: -1 });
  rows.forEach((row, i) => {
    const g = groups.get(row.probe) ?? { rows: [], first: i };
    if (g.first < 0) g.first = i;
    g.rows.push(row);
    groups.set(row.probe, g);
  });
  return groups;
}

function primaryOf(
  probe: string,
  signal: number[],
  m: ControlsMeasurement,
  panel: PanelSpec | undefined,
  warnings: string[],
) {
  const assigned = panel?.probes.find((p) => p.id === probe)?.channel;
  if (assigned !== undefined) {
    const c = m.channels.indexOf(assigned);
    if (c >= 0) return c;
    warnings.push(
      `probe ${probeName(probe, panel)} is assigned to channel ${assigned}, which the controls do not measure: ` +
        `its brightest channel is taken as its primary`,
    );
  }
  let best = 0;
  signal.forEach((v, c) => (best = v > signal[best] ? c : best));
  return best;
}
