/**
 * A raw DEFLATE stream (RFC 1951) of `bytes` spaces written by hand with the fixed Huffman codes: one literal, then
 * matches of 258 bytes at distance 1 (13 bits each), so 64 MiB take about 420 KB. Built in milliseconds, unlike
 * compressing the spaces themselves.
 */
export function deflateBomb(bytes: number): Uint8Array {
  const out = new Uint8Array(Math.ceil(((bytes / 258 + 2) * 13 + 258 * 8 + 16) / 8) + 8);
  let bit = 0;
  /** Writes `count` bits of `value`, least significant first (RFC 1951 §3.1.1). */
  const bits = (value: number, count: number) => {
    for (let i = 0; i < count; i++, bit++) if ((value >> i) & 1) out[bit >> 3] |= 1 << (bit & 7);
  };
  /** Writes a Huffman code, most significant bit first. */
  const code = (value: number, count: number) => {
    for (let i = count - 1; i >= 0; i--, bit++) if ((value >> i) & 1) out[bit >> 3] |= 1 << (bit & 7);
  };
  bits(1, 1); // last block
  bits(1, 2); // fixed Huffman codes
  code(0x30 + 0x20, 8); // literal ' ' (codes 0–143: 0x30 + value, 8 bits)
  let left = bytes - 1;
  for (; left >= 258; left -= 258) {
    code(0b11000101, 8); // length code 285: 258 bytes (codes 280–287: 0b11000000 + n, 8 bits)
    code(0, 5); // distance code 0: distance 1
  }
  for (; left > 0; left--) code(0x30 + 0x20, 8);
  code(0, 7); // end of block (code 256: 7 zero bits)
  return out.subarray(0, (bit + 7) >> 3);
}
