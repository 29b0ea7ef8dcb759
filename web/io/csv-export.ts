/**
 * The ordering sheet as CSV (RFC 4180 quoting): one row per probe with what a supplier needs (material, shell, core
 * diameter, emission peak, FWHM), a hazard caution, and blank supplier, catalogue number and amount columns for the
 * user to fill; then one row per channel with its filters written as ordered ("bandpass 605/20").
 */
import {
  DEFAULT_DETECTOR_ID,
  exclusionsOf,
  listMaterials,
  SHELL_MATERIALS,
  type PanelSpec,
  type ProbeEvaluation,
  type ProbeSpec,
} from '../../spectra/index';
import { describeChannel, describeChannelExcitation } from './filter-text';

/** What the sheet takes from an evaluation for each probe (the page's or the API's resolved probe). */
export type ResolvedForSheet = Pick<ProbeEvaluation, 'diameterNm' | 'emissionPeakNm' | 'fwhmNm' | 'firstExcitonNm'>;

/** One cell of a CSV row: text, a number, or nothing (an empty cell). */
export type CsvValue = string | number | null | undefined;

/**
 * One CSV cell. Text starting with =, +, -, @, tab or carriage return, also after any leading white space (spaces,
 * no-break spaces, newlines), is prefixed with ' so a spreadsheet shows it instead of running it as a formula
 * (common practice, the OWASP "CSV injection" advice);
 * then RFC 4180 quoting. Numbers are written as numbers (a negative one keeps its minus sign); non-finite ones as
 * an empty cell.
 */
export function csvCell(value: CsvValue): string {
  if (value === null || value === undefined) return '';
  if (typeof value === 'number') return Number.isFinite(value) ? String(value) : '';
  const text = /^\s*[=+\-@\t\r]/.test(value) ? `'${value}` : value;
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

/** Rows as CSV text with CRLF line ends (RFC 4180). */
export function csvText(rows: readonly (readonly CsvValue[])[]): string {
  return rows.map((r) => r.map(csvCell).join(',')).join('\r\n') + '\r\n';
}

const MATERIALS_BY_ID = new Map(listMaterials().map((m) => [m.id, m]));

/** A probe's shell as ordered, innermost first: "ZnS 1.5 nm; CdS 0.4 nm", or '' for a bare core. */
export function shellText(probe: Pick<ProbeSpec, 'shell'>): string {
  return (probe.shell ?? [])
    .map((l) => `${SHELL_MATERIALS[l.material].name} ${Number(l.thicknessNm.toFixed(2))} nm`)
    .join('; ');
}

/**
 * The sheet's hazard cell: the regulated elements the core and shell contain (the classes a user can exclude) and the
 * core material's hazard level from its toxicity summary, always with a caution that defers to local rules; never a
 * statement that a probe is harmless.
 */
export function hazardText(probe: Pick<ProbeSpec, 'material' | 'shell'>): string {
  const material = MATERIALS_BY_ID.get(probe.material);
  const elements = [
    ...(material?.elements ?? []),
    ...(probe.shell ?? []).flatMap((l) => SHELL_MATERIALS[l.material].elements),
  ];
  const classes = exclusionsOf({ elements });
  const level = material ? `material hazard level ${material.toxicity.level}; ` : '';
  const rule = 'handle per local rules and your institution';
  return classes.length
    ? `contains ${classes.join(' and ')}; ${level}${rule}`
    : `${level}see its hazard notes and the supplier safety data sheet; ${rule}`;
}

const round = (v: number | null | undefined, digits: number) =>
  v === null || v === undefined || !Number.isFinite(v) ? null : Number(v.toFixed(digits));

/** Column headings of the sheet that the printed report's tables use too. */
export const SHEET_COLUMNS = {
  label: 'label',
  target: 'target / conjugate',
  material: 'material',
  shell: 'shell',
  emissionPeak: 'emission peak nm',
  fwhm: 'FWHM nm',
  quantumYield: 'quantum yield',
  abundance: 'relative abundance',
  filters: 'filters',
  excitation: 'excitation on',
  detector: 'detector',
} as const;

/** The probe columns the tool cannot fill, left blank for the user. */
export const USER_FILLED_COLUMNS = ['supplier', 'catalogue number', 'amount'] as const;

/** The whole sheet, CRLF line ends (RFC 4180). `resolved[i]` belongs to `panel.probes[i]`. */
export function orderingSheetCsv(panel: PanelSpec, resolved: readonly (ResolvedForSheet | undefined)[]): string {
  const rows: CsvValue[][] = [];
  rows.push(['panel', panel.title ?? '']);
  rows.push(['excitation lines nm', panel.excitation.map((e) => e.wavelengthNm).join(' + ')]);
  rows.push([]);
  rows.push([
    'probe',
    SHEET_COLUMNS.label,
    SHEET_COLUMNS.target,
    SHEET_COLUMNS.material,
    SHEET_COLUMNS.shell,
    'core diameter nm',
    SHEET_COLUMNS.emissionPeak,
    SHEET_COLUMNS.fwhm,
    'first exciton nm',
    SHEET_COLUMNS.quantumYield,
    SHEET_COLUMNS.abundance,
    'spectrum',
    ...USER_FILLED_COLUMNS,
    'hazard',
  ]);
  panel.probes.forEach((p, i) => {
    const r: Partial<ResolvedForSheet> = resolved[i] ?? {};
    rows.push([
      p.id,
      p.label ?? '',
      p.target ?? '',
      p.material,
      shellText(p),
      round(r.diameterNm ?? p.diameterNm, 2),
      round(r.emissionPeakNm ?? p.emissionPeakNm, 1),
      round(r.fwhmNm ?? p.fwhmNm, 1),
      round(r.firstExcitonNm, 1),
      p.quantumYield ?? null,
      p.abundance ?? 1,
      p.measuredEmission ? 'measured' : 'model',
      ...USER_FILLED_COLUMNS.map(() => ''),
      hazardText(p),
    ]);
  });
  rows.push([]);
  rows.push(['channel', SHEET_COLUMNS.label, SHEET_COLUMNS.filters, SHEET_COLUMNS.excitation, SHEET_COLUMNS.detector]);
  for (const c of panel.channels) {
    rows.push([
      c.id,
      c.label ?? '',
      describeChannel(c),
      describeChannelExcitation(c),
      c.detector ?? DEFAULT_DETECTOR_ID,
    ]);
  }
  return csvText(rows);
}
