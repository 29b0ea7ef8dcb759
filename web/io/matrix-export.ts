/**
 * The panel's matrices as one CSV file (RFC 4180) with three labelled blocks, each opened by a row
 * `matrix,<name>,<what rows and columns hold>`, then a header row of column names, then one row per row name, and a
 * blank row after it:
 * - "collected signal": rows channels, columns probes; each probe's reference signal in each channel (relative
 *   detected photons, the target's abundance included);
 * - "spillover": rows channels, columns probes; signal in the channel relative to the probe's own primary channel;
 * - "unmixing": rows probes, columns channels; the least-squares unmixing matrix, the pseudo-inverse of the collected
 *   signal per unit abundance (as the page's shot-noise reading unmixes), giving each probe's abundance from the
 *   channel signals. Left out, with a line saying why, when it is not defined.
 * Rows and columns are named by the user's labels (the id when a label is empty).
 */
import { pseudoInverse, type PanelEvaluation, type PanelSpec } from '../../spectra/index';
import { csvText, type CsvValue } from './csv-export';

/** Significant digits written for each matrix value. */
export const MATRIX_DIGITS = 6;

/** The block names of the matrices file, in file order. */
export const MATRIX_BLOCKS = { collected: 'collected signal', spillover: 'spillover', unmixing: 'unmixing' } as const;

const value = (v: number | null | undefined): CsvValue =>
  v === null || v === undefined || !Number.isFinite(v) ? null : Number(v.toPrecision(MATRIX_DIGITS));

/** The unmixing matrix (probes × channels), or null when least squares cannot tell the probes apart. */
export function unmixingMatrix(
  panel: Pick<PanelSpec, 'probes'>,
  ev: Pick<PanelEvaluation, 'collected'>,
): number[][] | null {
  const abundance = panel.probes.map((p) => p.abundance ?? 1);
  const channels = ev.collected.length;
  if (channels === 0 || abundance.length > channels || abundance.some((a) => !(a > 0))) return null;
  const mixing = ev.collected.map((row) => row.map((x, p) => x / abundance[p]));
  const pinv = pseudoInverse(mixing);
  // A rank-deficient mixing matrix has a pseudo-inverse too, but it does not give back each probe: require
  // pinv · mixing = identity.
  const recovers = pinv?.every((row, i) =>
    abundance.every((_, j) => {
      const sum = row.reduce((a, v, c) => a + v * mixing[c][j], 0);
      return Math.abs(sum - (i === j ? 1 : 0)) < 1e-6;
    }),
  );
  return recovers ? pinv : null;
}

/** The matrices CSV of a panel and its evaluation (collected, spillover, unmixing). */
export function matricesCsv(panel: PanelSpec, ev: Pick<PanelEvaluation, 'collected' | 'spillover'>): string {
  const probes = panel.probes.map((p) => p.label || p.id);
  const channels = panel.channels.map((c) => c.label || c.id);
  const rows: CsvValue[][] = [['panel', panel.title ?? ''], []];
  const block = (name: string, about: string, corner: string, cols: string[], names: string[], m: CsvValue[][]) => {
    rows.push(['matrix', name, about], [corner, ...cols]);
    names.forEach((n, i) => rows.push([n, ...m[i]]));
    rows.push([]);
  };
  const byChannel = 'rows: channels; columns: probes';
  block(
    MATRIX_BLOCKS.collected,
    `${byChannel}; relative detected photons, abundance included`,
    'channel \\ probe',
    probes,
    channels,
    ev.collected.map((r) => r.map(value)),
  );
  block(
    MATRIX_BLOCKS.spillover,
    `${byChannel}; signal relative to the probe's primary channel`,
    'channel \\ probe',
    probes,
    channels,
    ev.spillover.map((r) => r.map(value)),
  );
  const unmix = unmixingMatrix(panel, ev);
  const aboutUnmix = 'rows: probes; columns: channels; abundance per unit signal (least squares)';
  if (unmix)
    block(
      MATRIX_BLOCKS.unmixing,
      aboutUnmix,
      'probe \\ channel',
      channels,
      probes,
      unmix.map((r) => r.map(value)),
    );
  else
    rows.push([
      'matrix',
      MATRIX_BLOCKS.unmixing,
      'not defined: needs at least as many channels as probes, each probe present and telling apart from the others',
    ]);
  return csvText(rows);
}
