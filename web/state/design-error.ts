/**
 * A design's refusal in the words of the "Propose a panel" form: the path of the error, e.g. ['windowNm'] or
 * ['targets', 1, 'abundance'], becomes the label of the field it concerns ("Window, nm", target “CD8”), so the message
 * points at what the user typed; a refusal about a target (its lock, or the owned part it locks), the lines or the
 * microscope's filters is shown beside that field.
 */
import type { PRACTICE_DEFAULTS } from '../../spectra/index';
import { pathText, type DesignRequest } from '../../worker/schemas';
import type { FieldError } from './error-map';

/** The form's labels that an error may point at (the form shows the same words). */
export const FORM_WORDS = {
  target: 'Target',
  abundance: 'Abundance',
  excitation: 'Excitation lines, nm',
  window: 'Window, nm',
  materials: 'Materials',
  candidates: "the current panel's probes and channels",
  mode: 'The search proposes',
  modeCatalog: "only the current panel's probes and channels",
  modeFree: 'new dots and filters',
  lockProbe: 'Use my probe',
  lockChannel: 'Use my channel',
  microscope: "Choose among my microscope's filters",
} as const;

/** A practice check or verdict threshold the form lets the user set. */
export type CheckKey = keyof typeof PRACTICE_DEFAULTS;

/** The label and unit of each check the form lets the user set, in the form's order. */
export const CHECK_WORDS: Readonly<Record<CheckKey, readonly [label: string, unit: string]>> = {
  minBlockingOD: ['Each channel blocks its lines by at least (OD)', ''],
  minChannelShare: ["Share of a probe's light its channel passes, at least (0–1)", ''],
  lineClearanceNm: ['Emission peak at least this far from every line', 'nm'],
  minSignalToNoise: ['Signal-to-noise after unmixing, at least', ''],
  maxInterference: ["Another probe's light in a channel, at most (× the target's own)", ''],
};

const isCheckKey = (key: unknown): key is CheckKey => typeof key === 'string' && Object.hasOwn(CHECK_WORDS, key);

/**
 * Where the form shows a refusal: beside a target's row, the lines, the choice of what the search proposes, the
 * microscope choice, the materials, the window or one check; or below the buttons.
 */
export type FormSpot =
  | { at: 'target'; index: number }
  | { at: 'excitation' }
  | { at: 'mode' }
  | { at: 'microscope' }
  | { at: 'materials' }
  | { at: 'window' }
  | { at: 'check'; key: CheckKey }
  | { at: 'form' };

/** True when `a` and `b` are the same place in the form. */
export function sameSpot(a: FormSpot, b: FormSpot): boolean {
  if (a.at === 'target' && b.at === 'target') return a.index === b.index;
  if (a.at === 'check' && b.at === 'check') return a.key === b.key;
  return a.at === b.at;
}

/** The target whose lock names the owned part at `path` (['owned', 'probes' | 'channels', i, …]), or -1. */
function lockingTarget(path: FieldError['path'], request: DesignRequest): number {
  const [, list, index] = path;
  if ((list !== 'probes' && list !== 'channels') || typeof index !== 'number') return -1;
  const id = request.owned?.[list]?.[index]?.id;
  const kind = list === 'probes' ? 'probe' : 'channel';
  return id === undefined ? -1 : request.targets.findIndex((t) => t.lock?.[kind] === id);
}

/** Where the form shows a refusal of `request` whose path is `path`. */
export function formSpot(path: FieldError['path'], request: DesignRequest): FormSpot {
  const [head, index] = path;
  if (head === 'targets' && typeof index === 'number') return { at: 'target', index };
  if (head === 'owned') {
    const t = lockingTarget(path, request);
    return t >= 0 ? { at: 'target', index: t } : { at: 'form' };
  }
  if (head === 'excitation') return { at: 'excitation' };
  if (head === 'instrument' || head === 'channelChoices') return { at: 'microscope' };
  if (head === 'windowNm') return { at: 'window' };
  if (head === 'allowedMaterials' || head === 'exclude') return { at: 'materials' };
  if (head === 'options' && isCheckKey(index)) return { at: 'check', key: index };
  // The count of the panel's probes or channels; a refused part of one is marked in the panel itself.
  if (head === 'candidates' && path.length === 2) return { at: 'mode' };
  return { at: 'form' };
}

/** The label of the part of a target's row (or of the field) a refusal is about, for the text beside it. */
function spotWord(path: FieldError['path']): string {
  const [head, second, third, fourth] = path;
  if (head === 'targets') {
    if (third === 'abundance') return 'Abundance';
    if (third === 'name') return 'Name';
    if (third === 'lock') return fourth === 'channel' ? FORM_WORDS.lockChannel : FORM_WORDS.lockProbe;
    return '';
  }
  if (head === 'owned') return second === 'channels' ? FORM_WORDS.lockChannel : FORM_WORDS.lockProbe;
  if (head === 'excitation') return FORM_WORDS.excitation;
  if (head === 'instrument' || head === 'channelChoices') return FORM_WORDS.microscope;
  if (head === 'windowNm') return FORM_WORDS.window;
  if (head === 'allowedMaterials' || head === 'exclude') return FORM_WORDS.materials;
  if (head === 'options' && isCheckKey(second)) return CHECK_WORDS[second][0];
  return '';
}

/**
 * A refusal of `request` as the form shows it beside its field: the label of the part it is about, then the message
 * without the API's name for the field (the place already says it). A refusal inside an owned part names the part by
 * its id and keeps the field within it, e.g. "Use my probe 'p4': emissionPeakNm must be …".
 */
export function spotText(error: Pick<FieldError, 'message' | 'path'>, request: DesignRequest): string {
  const [head, list, index] = error.path;
  const whole = `${pathText(error.path)} `;
  if (head === 'owned' && (list === 'probes' || list === 'channels') && typeof index === 'number') {
    const part = `${pathText(error.path.slice(0, 3))}.`;
    const message = error.message.startsWith(part) ? error.message.slice(part.length) : error.message;
    return `${spotWord(error.path)} '${request.owned?.[list]?.[index]?.id ?? index}': ${message}`;
  }
  const message = error.message.startsWith(whole) ? error.message.slice(whole.length) : error.message;
  if (formSpot(error.path, request).at === 'mode')
    return `The current panel ${message}: choose “${FORM_WORDS.modeFree}”, or fewer targets`;
  const word = spotWord(error.path);
  return word ? `${word}: ${message}` : message;
}

/** What the form calls the place an error's path names; '' when the form has no field for it. */
export function formPlace(path: FieldError['path'], targetNames: readonly string[]): string {
  const [head, index, field] = path;
  switch (head) {
    case undefined:
    case 'options':
      return '';
    case 'targets': {
      if (typeof index !== 'number') return 'Targets';
      const name = targetNames[index]?.trim();
      const target = name ? `target “${name}”` : `target ${index + 1}`;
      return field === 'abundance' ? `${target}, abundance` : target;
    }
    case 'excitation':
      return FORM_WORDS.excitation;
    case 'windowNm':
      return FORM_WORDS.window;
    case 'allowedMaterials':
    case 'exclude':
      return FORM_WORDS.materials;
    case 'candidates':
      if (index === 'probes') return "the current panel's probes";
      if (index === 'channels') return "the current panel's channels";
      return FORM_WORDS.candidates;
    case 'scatterLevel':
    case 'waterRaman':
      return "the panel's sample background";
    default:
      return pathText(path);
  }
}

/** "No proposal: <the answer's message> (<the form's label for its path>)". */
export function designErrorText(error: Pick<FieldError, 'message' | 'path'>, targetNames: readonly string[]): string {
  const place = formPlace(error.path, targetNames);
  return `No proposal: ${error.message}${place ? ` (${place})` : ''}`;
}

/**
 * A design answer's sentence (why no panel was found, a warning) in the form's words: an option the form sets is
 * named by its label, the signal floor (which only the API sets) by what it is, and references to the API's fields
 * and routes become the page's (the proof is stated beside, the material cautions are a section of the page).
 */
export function answerText(text: string): string {
  return text
    .replace(/options\.(\w+)/g, (whole, key: string) =>
      isCheckKey(key)
        ? `“${CHECK_WORDS[key][0]}”`
        : key === 'minSignalFraction'
          ? 'the signal floor (set through the API only)'
          : whole,
    )
    .replace(' (see stats.bound)', '')
    .replace('(GET /api/v1/materials)', '(see Material cautions)');
}
