/**
 * A refusal of the API's schema said in the user's words: the row named by its label ("Channel 'Far red'"), the field
 * as a microscopist says it, and the value typed: "Channel 'Far red': a centre of 5000 nm is outside 200–2000 nm".
 * Paths the page has no words for keep the API's message after the row's name.
 */
import type { PanelSpec } from '../../spectra/index';
import type { FieldError } from './error-map';

/** Field names as a microscopist says them. */
const FIELD_WORDS: Readonly<Record<string, string>> = Object.freeze({
  centerNm: 'centre',
  widthNm: 'width',
  edgeNm: 'edge',
  cutOnNm: 'cut-on',
  cutOffNm: 'cut-off',
  edgeWidthNm: 'edge width',
  blockingOD: 'blocking OD',
  peakTransmission: 'peak transmission',
  emissionPeakNm: 'emission peak',
  diameterNm: 'diameter',
  sizeDispersionPct: 'size spread',
  quantumYield: 'quantum yield',
  abundance: 'abundance',
  thicknessNm: 'shell thickness',
  wavelengthNm: 'wavelength',
  powerRel: 'relative power',
  excitationNm: 'line',
  material: 'material',
  dye: 'dye',
  label: 'label',
  id: 'id',
});

/** "a centre", "an edge". */
const withArticle = (noun: string) => `${/^[aeiou]/.test(noun) ? 'an' : 'a'} ${noun}`;

/** The value at `path` in `root` (undefined when the path leads nowhere). */
function valueAt(root: unknown, path: readonly (string | number)[]): unknown {
  let node = root;
  for (const key of path) {
    if (node === null || typeof node !== 'object') return undefined;
    node = (node as Record<string | number, unknown>)[key];
  }
  return node;
}

/** "Channel 'Far red'", "Probe 'p2'", "Excitation line 2", or '' for a path outside the rows. */
function rowName(panel: PanelSpec, path: readonly (string | number)[]): string {
  const [head, index] = path;
  if (typeof index !== 'number') return '';
  if (head === 'probes' || head === 'channels') {
    const row = panel[head][index];
    const name = row?.label || row?.id || `${index + 1}`;
    return `${head === 'probes' ? 'Probe' : 'Channel'} '${name}'`;
  }
  if (head === 'excitation') return `Excitation line ${index + 1}`;
  return '';
}

/** The refusal in the user's words (see the file's comment). */
export function inUserWords(error: FieldError, panel: PanelSpec): string {
  const row = rowName(panel, error.path);
  // The API's message starts with the path it refers to ("channels[2].filters[0].centerNm must be …").
  const bare = error.message.replace(/^[\w.[\]]+ (?=must|needs|has|is|names|are)/, '');
  // A model's refusal is already a sentence about the field ("an emission peak of 990 nm is out of …").
  if (bare === error.message) return row ? `${row}: ${error.message}` : error.message;
  const field = String(error.path[error.path.length - 1] ?? '');
  if (row && field === 'measuredEmission' && bare.startsWith('is required'))
    return (
      `${row} needs data: load its measured emission spectrum (a CSV of wavelength in nm and intensity) in its ` +
      'row, or choose a material the model knows'
    );
  const words = FIELD_WORDS[field];
  const value = valueAt(panel, error.path);
  const range = /^must be between (\S+) and (\S+?)(?: (nm|%))?$/.exec(bare);
  if (row && words && range && typeof value === 'number') {
    const unit = range[3] ? (range[3] === '%' ? ' %' : ` ${range[3]}`) : '';
    return `${row}: ${withArticle(words)} of ${value}${unit} is outside ${range[1]}–${range[2]}${unit}`;
  }
  if (row && words) return `${row}: the ${words} ${bare}`;
  return row ? `${row}: ${bare}` : error.message;
}
