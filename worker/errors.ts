/**
 * The one place thrown errors become responses (app.onError), always in the contract's error shape.
 */
import type { Context } from 'hono';
import { HTTPException } from 'hono/http-exception';
import { SpectraError } from '../spectra/index';
import { ApiError, type ApiErrorCode, type ErrorBody } from './schemas/index';

/** A JSON error response in the contract's shape. */
export function errorResponse(
  status: number,
  code: ApiErrorCode,
  message: string,
  path: (string | number)[] = [],
  headers: Record<string, string> = {},
): Response {
  const body: ErrorBody = { error: { code, message, path } };
  return new Response(JSON.stringify(body), {
    status,
    headers: { 'content-type': 'application/json; charset=utf-8', ...headers },
  });
}

/**
 * A model's refusal from the spectral library is a 400 with its code and path; an ApiError keeps its own status;
 * anything unexpected is a generic JSON 500 with no detail (the tests show no input reaches it).
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
