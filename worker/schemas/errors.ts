/**
 * The contract's one error shape: `{"error": {"code", "message", "path"}}`, with up to eleven validation issues under
 * `issues` (its schema, ErrorBody, is in responses.ts). ApiError carries it as a thrown error, on the server (turned
 * into the response in one place) and in the page (an answer of the API, or "network" when the server could not be
 * reached). No zod here, so the page can import it without loading the schemas.
 */
import type { SpectraErrorCode } from '../../spectra/index';

/** Every machine code an API error can carry: the spectral library's codes plus the HTTP layer's own. */
export type ApiErrorCode =
  | SpectraErrorCode
  | 'invalid_json'
  | 'unsupported_media_type'
  | 'payload_too_large'
  | 'unknown_filter_type'
  | 'duplicate_id'
  | 'unknown_instrument'
  | 'not_found'
  | 'method_not_allowed'
  | 'rate_limited'
  | 'request_too_large'
  | 'internal_error'
  /** The page's own: the server could not be reached. */
  | 'network';

/** An error in the contract's shape, with its HTTP status (0: no answer) and any headers it must be sent with. */
export class ApiError extends Error {
  readonly status: number;
  readonly code: ApiErrorCode;
  readonly path: (string | number)[];
  readonly headers: Record<string, string>;

  constructor(
    status: number,
    code: ApiErrorCode,
    message: string,
    path: (string | number)[] = [],
    headers: Record<string, string> = {},
  ) {
    super(message);
    this.name = 'ApiError';
    this.status = status;
    this.code = code;
    this.path = path;
    this.headers = headers;
  }
}
