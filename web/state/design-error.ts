/**
 * A design's refusal in the words of the "Propose a panel" form: the path of the error, e.g. ['windowNm'] or
 * ['targets', 1, 'abundance'], becomes the label of the field it concerns ("Window, nm", target “CD8”), so the message
 * points at what the user typed; a refusal about a target (its lock, or the owned part it locks), the lines or the
 * microscope's filters is shown beside that field.
 */
import { pathText, type DesignRequest } from '../../worker/schemas';
import type { FieldError } from './error-map';

/** The form's labels that an error may point at (the form shows the same words). */
export const FORM_WORDS = {
  excitation: 'Excitation lines, nm',
  window: 'Window, nm',
  materials: 'Materials',
  candidates: "the current panel's probes and channels",
  lockProbe: 'Use my probe',
  lockChannel: 'Use my channel',
  microscope: "Choose among my microscope's filters",
} as const;

/** Where the form shows a refusal: beside a target's row, the lines, the microscope choice, or below the buttons. */
export type FormSpot = { at: 'target'; index: number } | { at: 'excitation' } | { at: 'microscope' } | { at: 'form' };

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
