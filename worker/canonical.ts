/**
 * The canonical JSON text of a value: object keys sorted by UTF-16 code unit, no insignificant white space, arrays in
 * their order. Two panels that differ only in key order or spacing have the same canonical text, hence the same
 * share id. Only for validated JSON data (finite numbers, no undefined inside arrays).
 */
export function canonicalJson(value: unknown): string {
  if (Array.isArray(value)) return `[${value.map(canonicalJson).join(',')}]`;
  if (value !== null && typeof value === 'object') {
    const record = value as Record<string, unknown>;
    const members = Object.keys(record)
      .filter((key) => record[key] !== undefined)
      .sort()
      .map((key) => `${JSON.stringify(key)}:${canonicalJson(record[key])}`);
    return `{${members.join(',')}}`;
  }
  return JSON.stringify(value);
}

/** Bytes of SHA-256 kept in a share id: 18 bytes = 144 bits (the contract asks for at least 128), 24 base64url chars. */
export const SHARE_ID_BYTES = 18;

/** A share id: exactly 24 base64url characters (no padding). */
export const SHARE_ID_PATTERN = /^[A-Za-z0-9_-]{24}$/;

/** True if `id` has the form of a share id (length and alphabet); says nothing about whether it is stored. */
export function isShareId(id: string): boolean {
  return SHARE_ID_PATTERN.test(id);
}

/** The share id of a canonical text: base64url of the first SHARE_ID_BYTES bytes of its SHA-256 (FIPS 180-4). */
export async function shareIdOf(canonical: string): Promise<string> {
  const digest = new Uint8Array(await crypto.subtle.digest('SHA-256', new TextEncoder().encode(canonical)));
  let binary = '';
  for (const byte of digest.subarray(0, SHARE_ID_BYTES)) binary += String.fromCharCode(byte);
  return btoa(binary).replaceAll('+', '-').replaceAll('/', '_');
}
