/**
 * Where a computation error belongs on the page: the SpectraError (or API) path ['probes', 2, 'emissionPeakNm']
 * becomes "probe 2, field emissionPeakNm", so the message shows under the input that caused it.
 */

/** An error to show, with the panel path it names (empty when it names no field). */
export interface FieldError {
  message: string;
  path: (string | number)[];
}

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
