/**
 * Share ids: a stored panel's key is derived from its content, so the same panel always gets the same link, but only
 * the server can derive it. The panel's canonical JSON text is the JSON Canonicalization Scheme of RFC 8785 (object
 * keys sorted by UTF-16 code unit, no white space, numbers as ECMAScript writes them), made by the `canonicalize`
 * package; the id is the base64url (RFC 4648 §5) of the first 18 bytes of its HMAC-SHA-256 (RFC 2104, FIPS 180-4)
 * under the deployment's secret SHARE_ID_KEY. Without the key nobody can compute an id from a guessed content, so
 * nobody without a link can look up whether a panel is stored. Ids are storage keys: they must never change
 * (test/worker/share-id.test.ts pins them for the local key).
 *
 * Ids issued before the key (the same bytes of plain SHA-256, {@link unkeyedShareIdOf}) are still read: they are
 * keys in the same store of the same form. The example instrument profiles keep such ids: they are public anyway, and
 * stored panels name them.
 */
import canonicalize from 'canonicalize';
import { SHARE_ID_PATTERN } from './schemas/limits';

/** The canonical JSON text of a validated value (finite numbers only: the schema guarantees it). */
export function canonicalJson(value: unknown): string {
  return canonicalize(value)!;
}

/** Bytes of the digest kept in a share id: 18 bytes = 144 bits, 24 base64url characters (no padding). */
export const SHARE_ID_BYTES = 18;

/**
 * Fewest characters of a share-id key (our convention: 32 random bytes in base64 are 44 characters, e.g.
 * `openssl rand -base64 32`; a shorter text is taken for a mistake).
 */
export const SHARE_ID_KEY_MIN_CHARS = 32;

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

/** The first {@link SHARE_ID_BYTES} bytes of a digest in base64url without padding. */
function idOfDigest(digest: ArrayBuffer): string {
  let binary = '';
  for (const byte of new Uint8Array(digest).subarray(0, SHARE_ID_BYTES)) binary += String.fromCharCode(byte);
  return btoa(binary).replaceAll('+', '-').replaceAll('/', '_').replaceAll('=', '');
}

const importedKeys = new Map<string, Promise<CryptoKey>>();

/** The HMAC-SHA-256 key of a key text (imported once per isolate). */
function hmacKey(keyText: string): Promise<CryptoKey> {
  let key = importedKeys.get(keyText);
  if (key === undefined) {
    const raw = new TextEncoder().encode(keyText);
    key = crypto.subtle.importKey('raw', raw, { name: 'HMAC', hash: 'SHA-256' }, false, ['sign']);
    importedKeys.set(keyText, key);
  }
  return key;
}

/**
 * The key text of share ids from the worker's SHARE_ID_KEY binding. A missing or short key is a deployment error,
 * never the client's: it throws, and the request ends in the contract's 500 with nothing stored.
 */
export function shareIdKeyOf(binding: string | undefined): string {
  if (binding === undefined || binding.length < SHARE_ID_KEY_MIN_CHARS) {
    throw new Error(
      `SHARE_ID_KEY is missing or shorter than ${SHARE_ID_KEY_MIN_CHARS} characters: set it with ` +
        '`npx wrangler secret put SHARE_ID_KEY` (local runs read local.env)',
    );
  }
  return binding;
}

/** The share id of a canonical text under a key: its HMAC-SHA-256, first 18 bytes, base64url. */
export async function shareIdOf(canonical: string, keyText: string): Promise<string> {
  const mac = await crypto.subtle.sign('HMAC', await hmacKey(keyText), new TextEncoder().encode(canonical));
  return idOfDigest(mac);
}

/** The id the same text had before ids were keyed (plain SHA-256): still read, given now only to public examples. */
export async function unkeyedShareIdOf(canonical: string): Promise<string> {
  return idOfDigest(await crypto.subtle.digest('SHA-256', new TextEncoder().encode(canonical)));
}
