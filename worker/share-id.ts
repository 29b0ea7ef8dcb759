/**
 * Share ids: a stored panel's key is derived from its content, so the same panel always gets the same link. The
 * panel's canonical JSON text is the JSON Canonicalization Scheme of RFC 8785 (object keys sorted by UTF-16 code
 * unit, no white space, numbers as ECMAScript writes them), made by the `canonicalize` package; the id is the
 * base64url (RFC 4648 §5) of the first 18 bytes of its SHA-256 (FIPS 180-4). Ids are storage keys: they must never
 * change (test/worker/share-id.test.ts pins them).
 */
import canonicalize from 'canonicalize';
import { SHARE_ID_PATTERN } from './schemas/limits';

/** The canonical JSON text of a validated value (finite numbers only: the schema guarantees it). */
export function canonicalJson(value: unknown): string {
  return canonicalize(value)!;
}

/** Bytes of SHA-256 kept in a share id: 18 bytes = 144 bits, 24 base64url characters (no padding). */
export const SHARE_ID_BYTES = 18;

export { SHARE_ID_PATTERN };

/**
 * The route pattern of an id path segment: only well-formed ids reach an id route, so a malformed id is a plain 404
 * that never reads KV, and fixed sub-paths such as /panels/evaluate are never taken for an id.
 */
export const ID_PATH = `/:id{${SHARE_ID_PATTERN.source.slice(1, -1)}}`;

/** True if `id` has the form of a share id (length and alphabet); says nothing about whether it is stored. */
export function isShareId(id: string): boolean {
  return SHARE_ID_PATTERN.test(id);
}

/** The share id of a canonical text. */
export async function shareIdOf(canonical: string): Promise<string> {
  const digest = new Uint8Array(await crypto.subtle.digest('SHA-256', new TextEncoder().encode(canonical)));
  let binary = '';
  for (const byte of digest.subarray(0, SHARE_ID_BYTES)) binary += String.fromCharCode(byte);
  return btoa(binary).replaceAll('+', '-').replaceAll('/', '_');
}
