/**
 * Where an error belongs on the page: the path of an API schema issue or of a model's refusal, e.g.
 * ['probes', 2, 'emissionPeakNm'], becomes "probe 2, field emissionPeakNm", so the message shows under that input.
 */
import type { ApiError } from '../../worker/schemas';

/** An error to show in the API's shape: its code, its message and the panel path it names (empty: no field). */
export type FieldError = Pick<ApiError, 'code' | 'message' | 'path'>;

/** Errors grouped for the editors: by probe index and field, by channel index and field path, and the rest. */
export interface ErrorsByPlace {
  probes: Record<number, Record<string, string>>;
  channels: Record<number, Record<string, string>>;
  other: Record<string, string>;
}

/** Sorts one error into the editor that shows it. */
export function placeError(error: FieldError | undefined): ErrorsByPlace {
  const out: ErrorsByPlace = { probes: {}, channels: {}, other: {} };
  if (!error) return out;
  const [head, index, ...rest] = error.path;
  if ((head === 'probes' || head === 'channels') && typeof index === 'number') {
    out[head][index] = { [rest.join('.')]: error.message };
  } else {
    out.other[error.path.join('.')] = error.message;
  }
  return out;
}

/** The messages an editor has no field for (its fields show `shown`): the editor lists them together. */
export function messagesBesides(errors: Record<string, string>, shown: readonly string[]): string[] {
  return Object.entries(errors)
    .filter(([key]) => !shown.includes(key))
    .map(([, message]) => message);
}
