/**
 * The ordering sheet as CSV (RFC 4180 quoting): one row per probe with what a supplier needs (material, core
 * diameter, emission peak, FWHM) and one row per channel with its filters written as ordered ("bandpass 605/20").
 */
import { DEFAULT_DETECTOR_ID, type PanelSpec, type ProbeEvaluation } from '../../spectra/index';
import { describeChannel, describeChannelExcitation } from './filter-text';

/** What the sheet takes from an evaluation for each probe (the page's or the API's resolved probe). */
export type ResolvedForSheet = Pick<ProbeEvaluation, 'diameterNm' | 'emissionPeakNm' | 'fwhmNm' | 'firstExcitonNm'>;

/**
 * One CSV cell. Text starting with =, +, -, @, tab or carriage return is prefixed with ' so a spreadsheet shows it
 * instead of running it as a formula (common practice, the OWASP "CSV injection" advice); then RFC 4180 quoting.
 */
export function csvCell(value: string | number | null | undefined): string {
  if (value === null || value === undefined) return '';
  let text = typeof value === 'number' ? (Number.isFinite(value) ? String(value) : '') : value;
  if (/^[=+\-@\t\r]/.test(text)) text = `'${text}`;
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

const round = (v: number | null | undefined, digits: number) =>
  v === null || v === undefined || !Number.isFinite(v) ? null : Number(v.toFixed(digits));

/** The whole sheet, CRLF line ends (RFC 4180). `resolved[i]` belongs to `panel.probes[i]`. */
export function orderingSheetCsv(panel: PanelSpec, resolved: readonly (ResolvedForSheet | undefined)[]): string {
  const rows: (string | number | null | undefined)[][] = [];
  rows.push(['panel', panel.title ?? '']);
  rows.push(['excitation lines nm', panel.excitation.map((e) => e.wavelengthNm).join(' + ')]);
  rows.push([]);
  rows.push([
    'probe',
    'label',
    'target',
    'material',
    'core diameter nm',
    'emission peak nm',
    'FWHM nm',
    'first exciton nm',
    'quantum yield',
    'relative abundance',
    'spectrum',
  ]);
  panel.probes.forEach((p, i) => {
    const r: Partial<ResolvedForSheet> = resolved[i] ?? {};
    rows.push([
      p.id,
      p.label ?? '',
      p.target ?? '',
      p.material,
      round(r.diameterNm ?? p.diameterNm, 2),
      round(r.emissionPeakNm ?? p.emissionPeakNm, 1),
      round(r.fwhmNm ?? p.fwhmNm, 1),
      round(r.firstExcitonNm, 1),
      p.quantumYield ?? null,
      p.abundance ?? 1,
      p.measuredEmission ? 'measured' : 'model',
    ]);
  });
  rows.push([]);
  rows.push(['channel', 'label', 'filters', 'excitation on', 'detector']);
  for (const c of panel.channels) {
    rows.push([
      c.id,
      c.label ?? '',
      describeChannel(c),
      describeChannelExcitation(c),
      c.detector ?? DEFAULT_DETECTOR_ID,
    ]);
  }
  return rows.map((r) => r.map(csvCell).join(',')).join('\r\n') + '\r\n';
}
