import type { MiddlewareHandler } from 'hono';
import { ApiError, LIMITS } from '../schemas/index';

const JSON_MEDIA_TYPE = /^application\/([\w.-]+\+)?json$/;

/**
 * Middleware factory for POST routes: requires a JSON content type (else 415), limits the body to `maxBytes`
 * (413: by Content-Length up front and by counting bytes while reading, so a chunked body is limited too) and
 * rejects malformed JSON (400 `invalid_json`) before any validator runs.
 */
export function jsonBody(maxBytes: number = LIMITS.bodyBytes): MiddlewareHandler {
  return async function readJsonBody(c, next) {
    const contentType = c.req.header('content-type') ?? '';
    const mediaType = contentType.split(';')[0].trim().toLowerCase();
    if (!JSON_MEDIA_TYPE.test(mediaType)) {
      const got = contentType ? `'${contentType.slice(0, 100)}'` : 'none';
      throw new ApiError(415, 'unsupported_media_type', `the body must be sent as application/json (got ${got})`);
    }
    const declared = Number(c.req.header('content-length'));
    if (Number.isFinite(declared) && declared > maxBytes) throw tooLarge(maxBytes);
    const text = await readText(c.req.raw.body, maxBytes);
    try {
      JSON.parse(text);
    } catch (err) {
      const detail = text.trim() === '' ? 'the body is empty' : (err as Error).message;
      throw new ApiError(400, 'invalid_json', `the body is not valid JSON: ${detail}`);
    }
    // The stream is spent: hand the checked text on to the validator, which reads it through c.req.json().
    c.req.raw = new Request(c.req.raw.url, { method: c.req.method, headers: c.req.raw.headers, body: text });
    await next();
  };
}

function tooLarge(maxBytes: number): ApiError {
  return new ApiError(413, 'payload_too_large', `the body is larger than the limit of ${maxBytes} bytes`);
}

/** Bytes of an oversized body read and dropped before giving up on it (see discardRest). */
const MAX_DISCARD_BYTES = 16 * 1024 * 1024;

/**
 * Reads and drops the rest of an oversized body, up to MAX_DISCARD_BYTES, before answering 413. Cancelling the stream
 * halfway instead leaves the local runtime's HTTP proxy (wrangler dev) with a broken connection, and the client's
 * next request on it fails with a 503; draining keeps the connection usable. Past the cap the stream is cancelled.
 */
async function discardRest(reader: ReadableStreamDefaultReader<Uint8Array>): Promise<void> {
  let dropped = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) return;
    dropped += value.byteLength;
    if (dropped > MAX_DISCARD_BYTES) {
      await reader.cancel().catch(() => undefined);
      return;
    }
  }
}

/** Reads a body stream as UTF-8, giving up (413) as soon as more than `maxBytes` arrived. */
async function readText(body: ReadableStream<Uint8Array> | null, maxBytes: number): Promise<string> {
  if (body === null) return '';
  const reader = body.getReader();
  const chunks: Uint8Array[] = [];
  let total = 0;
  for (;;) {
    const { done, value } = await reader.read().catch(() => {
      // The client stopped sending before the declared length arrived (connection closed or reset mid-body).
      throw new ApiError(400, 'invalid_json', 'the body ended before all of it arrived (connection closed mid-body)');
    });
    if (done) break;
    total += value.byteLength;
    if (total > maxBytes) {
      await discardRest(reader);
      throw tooLarge(maxBytes);
    }
    chunks.push(value);
  }
  const bytes = new Uint8Array(total);
  let offset = 0;
  for (const chunk of chunks) {
    bytes.set(chunk, offset);
    offset += chunk.byteLength;
  }
  try {
    return new TextDecoder('utf-8', { fatal: true, ignoreBOM: false }).decode(bytes);
  } catch {
    throw new ApiError(400, 'invalid_json', 'the body is not valid UTF-8 text');
  }
}
