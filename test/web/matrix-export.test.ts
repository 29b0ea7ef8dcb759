import { describe, expect, it } from 'vitest';
import { pinv } from 'mathjs';
import { DEFAULT_GRID, evaluatePanel, type PanelSpec } from '../../spectra/index';
import { MATRIX_BLOCKS, MATRIX_DIGITS, matricesCsv } from '../../web/io/matrix-export';
import { demoPanel } from '../../web/state/demo-panel';
import { parseCsv } from './helpers/parse-csv';

/** The demo panel with one target at half the abundance, so the unmixing must undo abundance. */
function panel(): PanelSpec {
  const p = demoPanel();
  p.probes[2] = { ...p.probes[2], abundance: 0.5 };
  return p;
}

/** A block of the file: its header row and its rows, each as [row name, ...numbers or null for an empty cell]. */
function block(rows: string[][], name: string) {
  const start = rows.findIndex((r) => r[0] === 'matrix' && r[1] === name);
  if (start < 0) return null;
  const end = rows.findIndex((r, i) => i > start && r.length === 1 && r[0] === '');
  const body = rows.slice(start + 2, end).map((r) => [r[0], ...r.slice(1).map((v) => (v === '' ? null : Number(v)))]);
  return {
    about: rows[start][2],
    header: rows[start + 1],
    names: body.map((r) => r[0]),
    values: body.map((r) => r.slice(1)),
  };
}

/** Relative agreement to the digits the file writes. */
function expectClose(actual: (number | string | null)[][], expected: (number | null)[][]): void {
  expect(actual.length).toBe(expected.length);
  actual.forEach((row, i) =>
    row.forEach((v, j) => {
      const want = expected[i][j];
      if (want === null) return expect(v).toBeNull();
      expect(Math.abs((v as number) - want)).toBeLessThanOrEqual(Math.abs(want) * 10 ** (1 - MATRIX_DIGITS) + 1e-300);
    }),
  );
}

describe('matrices CSV', () => {
  const spec = panel();
  const ev = evaluatePanel(spec, { grid: DEFAULT_GRID });
  const rows = parseCsv(matricesCsv(spec, ev));
  const probeNames = spec.probes.map((p) => p.label || p.id);
  const channelNames = spec.channels.map((c) => c.label || c.id);

  it('matricesCsv names collected and spillover rows by channel labels and columns by probe labels', () => {
    for (const name of [MATRIX_BLOCKS.collected, MATRIX_BLOCKS.spillover]) {
      const b = block(rows, name)!;
      expect(b.header).toEqual(['channel \\ probe', ...probeNames]);
      expect(b.names).toEqual(channelNames);
      expect(b.about).toMatch(/^rows: channels; columns: probes/);
    }
  });

  it("matricesCsv's collected block is the evaluation's collected signal, probe by channel, to 6 digits", () => {
    expectClose(block(rows, MATRIX_BLOCKS.collected)!.values, ev.collected);
  });

  it('matricesCsv spillover is collected divided by the probe signal in its primary channel (recomputed here)', () => {
    const want = ev.collected.map((row) => row.map((x, p) => x / ev.collected[ev.primaryChannel[p]!][p]));
    // Spillover undefined for a probe with no light (none in the demo) would be an empty cell.
    expectClose(block(rows, MATRIX_BLOCKS.spillover)!.values, want);
  });

  it('matricesCsv unmixing is mathjs pinv of collected per unit abundance, rows probes, columns channels', () => {
    const b = block(rows, MATRIX_BLOCKS.unmixing)!;
    expect(b.header).toEqual(['probe \\ channel', ...channelNames]);
    expect(b.names).toEqual(probeNames);
    const perUnit = ev.collected.map((row) => row.map((x, p) => x / (spec.probes[p].abundance ?? 1)));
    expectClose(b.values, pinv(perUnit) as number[][]);
    // Unmixing the panel's own reference signals gives back each probe's abundance.
    const signal = ev.collected.map((row) => row.reduce((a, v) => a + v, 0));
    const unmixed = b.values.map((row) => row.reduce((a: number, u, c) => a + (u as number) * signal[c], 0));
    unmixed.forEach((a, p) => expect(a).toBeCloseTo(spec.probes[p].abundance ?? 1, 4));
  });

  it('matricesCsv with more probes than channels writes no unmixing block and a line saying it is not defined', () => {
    const few = { ...spec, channels: spec.channels.slice(0, 3) };
    const fewEv = evaluatePanel(few, { grid: DEFAULT_GRID });
    const fewRows = parseCsv(matricesCsv(few, fewEv));
    expect(fewRows.some((r) => r[0] === 'probe \\ channel')).toBe(false);
    const line = fewRows.find((r) => r[0] === 'matrix' && r[1] === MATRIX_BLOCKS.unmixing)!;
    expect(line[2]).toMatch(/^not defined: needs at least as many channels as probes/);
    expect(block(fewRows, MATRIX_BLOCKS.collected)!.names).toHaveLength(3);
  });

  it('matricesCsv prefixes a quote to labels and title that a spreadsheet would run as formulas', () => {
    const evil: PanelSpec = {
      ...spec,
      title: '=HYPERLINK("x")',
      probes: spec.probes.map((p, i) => (i === 0 ? { ...p, label: ' +cmd' } : p)),
      channels: spec.channels.map((c, i) => (i === 0 ? { ...c, label: '@SUM(A1)' } : c)),
    };
    const evilRows = parseCsv(matricesCsv(evil, evaluatePanel(evil, { grid: DEFAULT_GRID })));
    expect(evilRows[0]).toEqual(['panel', `'=HYPERLINK("x")`]);
    const b = block(evilRows, MATRIX_BLOCKS.collected)!;
    expect(b.header[1]).toBe("' +cmd");
    expect(b.names[0]).toBe("'@SUM(A1)");
  });
});
