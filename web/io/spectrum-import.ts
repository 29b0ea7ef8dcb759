/**
 * Reads a measured spectrum (two-column CSV: wavelength nm, value) from a file or pasted text, through the spectral
 * library's parser, and thins it for links. Errors come back as the library's SpectraError message.
 */
import { parseSpectrumCsv, type SpectrumPoints } from '../../spectra/index';
import { resamplePoints } from '../state/thin-table';

/** The parsed table (≤ 200 points) and the parser's warnings, or an error message for the user. */
export type ImportResult = { ok: true; points: SpectrumPoints; warnings: string[] } | { ok: false; message: string };

/** What the values mean: a relative emission, a 0–1 transmission, or an extinction in M⁻¹ cm⁻¹. */
export type ImportKind = 'emission' | 'transmission' | 'extinction' | 'background';

/** Parses CSV text; never throws. */
export function importSpectrumText(text: string, kind: ImportKind): ImportResult {
  try {
    const { points, warnings } = parseSpectrumCsv(text, { kind });
    const thin = resamplePoints(points as SpectrumPoints);
    const note =
      thin.length < points.length
        ? [`resampled from ${points.length} to ${thin.length} points to keep links short`]
        : [];
    return { ok: true, points: thin, warnings: [...warnings, ...note] };
  } catch (e) {
    return { ok: false, message: e instanceof Error ? e.message : String(e) };
  }
}

/** Reads a chosen file as text and parses it. */
export async function importSpectrumFile(file: File, kind: ImportKind): Promise<ImportResult> {
  if (file.size > 2_000_000)
    return { ok: false, message: `${file.name} is over 2 MB; a two-column spectrum is far smaller.` };
  return importSpectrumText(await file.text(), kind);
}
