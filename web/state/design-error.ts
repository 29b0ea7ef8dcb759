/**
 * A design search's refusal in the words of the "Propose a panel" form: the path of the design answer's error, e.g.
 * ['windowNm'] or ['targets', 1, 'abundance'], becomes the label of the field it concerns ("Window, nm", target
 * “CD8”), so the message points at what the user typed.
 */
import { pathText } from '../../worker/schemas';
import type { FieldError } from './error-map';

/** The form's labels that an error may point at (the form shows the same words). */
export const FORM_WORDS = {
  excitation: 'Excitation lines, nm',
  window: 'Window, nm',
  materials: 'Materials',
  candidates: "the current panel's probes and channels",
} as const;

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
