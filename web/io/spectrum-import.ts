/**
 * Reads a measured spectrum (two-column CSV: wavelength nm, value) from a file or pasted text, through the spectral
 * library's parser; a table longer than a panel holds is resampled, and the warnings say so. Errors come back as the
 * library's SpectraError message.
 */
import { CSV_LIMITS, parseSpectrumCsv, type SpectrumCsvKind, type SpectrumPoints } from '../../spectra/index';
import { MAX_TABLE_POINTS, thinTable } from '../state/thin-table';

/** The parsed table (≤ MAX_TABLE_POINTS points) and the parser's warnings, or an error message for the user. */
export type ImportResult = { ok: true; points: SpectrumPoints; warnings: string[] } | { ok: false; message: string };

/** What the values mean: relative emission or background, 0–1 transmission, or extinction in M⁻¹ cm⁻¹. */
export type ImportKind = SpectrumCsvKind;

/** Largest file read, bytes: twice the parser's character limit (CSV_LIMITS.maxChars), refused before reading. */
const MAX_FILE_BYTES = 2 * CSV_LIMITS.maxChars;

/** Parses CSV text; never throws. */
export function importSpectrumText(text: string, kind: ImportKind): ImportResult {
  try {
    const { points, warnings } = parseSpectrumCsv(text, { kind });
    const thin = thinTable(points);
    const note =
      thin.length < points.length
        ? [`resampled from ${points.length} to ${thin.length} points, the most a panel holds (${MAX_TABLE_POINTS})`]
        : [];
    return { ok: true, points: thin, warnings: [...warnings, ...note] };
  } catch (e) {
    return { ok: false, message: e instanceof Error ? e.message : String(e) };
  }
}

/** Reads a chosen file as text and parses it. */
export async function importSpectrumFile(file: File, kind: ImportKind): Promise<ImportResult> {
  if (file.size > MAX_FILE_BYTES) {
    const mb = MAX_FILE_BYTES / 1e6;
    return { ok: false, message: `${file.name} is over ${mb} MB; a two-column spectrum is far smaller.` };
  }
  return importSpectrumText(await file.text(), kind);
}
