/**
 * The one error type the spectral library throws for bad input. `code` is machine-readable and maps 1:1 onto the
 * API's error codes; `path` names the offending field (as in the API contract's error shape) where there is one.
 */
export type SpectraErrorCode =
  | 'invalid_input'
  | 'out_of_range'
  | 'unknown_material'
  | 'invalid_table'
  | 'unknown_detector'
  | 'unknown_channel'
  | 'unknown_dye';

export class SpectraError extends Error {
  readonly code: SpectraErrorCode;
  readonly path: (string | number)[];

  constructor(code: SpectraErrorCode, message: string, path: (string | number)[] = []) {
    super(message);
    this.name = 'SpectraError';
    this.code = code;
    this.path = path;
  }
}
