import type { Context } from 'hono';
import { HTTPException } from 'hono/http-exception';
import { SpectraError, type SpectraErrorCode } from '../spectra/index';

/** Every machine code an API error can carry: the spectral library's codes plus the HTTP layer's own. */
export type ApiErrorCode =
  | SpectraErrorCode
  | 'invalid_json'
  | 'unsupported_media_type'
  | 'payload_too_large'
  | 'unknown_filter_type'
  | 'duplicate_id'
  | 'not_found'
  | 'method_not_allowed'
  | 'rate_limited'
  | 'internal_error';

/** The contract's error body: `{"error": {"code", "message", "path"}}` (shared/api-v1.md, "Errors"). */
export interface ApiErrorBody {
  error: { code: ApiErrorCode; message: string; path: (string | number)[] };
}

/** An error the HTTP layer throws on purpose; `onApiError` turns it into the contract's shape. */
export class ApiError extends Error {
  readonly status: 400 | 404 | 405 | 413 | 415 | 429;
  readonly code: ApiErrorCode;
  readonly path: (string | number)[];
  readonly headers: Record<string, string>;

  constructor(
    status: ApiError['status'],
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

/** A JSON error response in the contract's shape. */
export function errorResponse(
  status: number,
  code: ApiErrorCode,
  message: string,
  path: (string | number)[] = [],
  headers: Record<string, string> = {},
): Response {
  const body: ApiErrorBody = { error: { code, message, path } };
  return new Response(JSON.stringify(body), {
    status,
    headers: { 'content-type': 'application/json; charset=utf-8', ...headers },
  });
}

/**
 * The one place thrown errors become responses (app.onError). Bad input from the spectral library is a 400 with its
 * code and path; anything unexpected is a generic JSON 500 with no detail (the tests show no input reaches it).
 */
export function onApiError(err: Error, c: Context): Response {
  if (err instanceof SpectraError) return errorResponse(400, err.code, err.message, err.path);
  if (err instanceof ApiError) return errorResponse(err.status, err.code, err.message, err.path, err.headers);
  if (err instanceof HTTPException && err.status < 500) {
    return errorResponse(err.status, 'invalid_input', err.message || 'the request was not understood');
  }
  console.error(`unhandled error on ${c.req.method} ${c.req.path}:`, err);
  return errorResponse(500, 'internal_error', 'an unexpected error occurred; the request was not completed');
}
