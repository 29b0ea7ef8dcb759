/**
 * How large a page state may be: the largest panel the API's limits allow, written as JSON, and a little more. Every
 * link the page decodes and every file it reads stops at this size, so a crafted link or file cannot hold the page.
 */
import { LIMITS } from '../../spectra/index';

/**
 * Characters of the longest number JSON.stringify writes for a double, e.g. "-2.2250738585072014e-308" (24): the
 * ECMAScript Number::toString form at 17 significant digits, sign and exponent.
 */
const NUMBER_CHARS = 24;

/** Bytes of one table point `[nm,value],` at its longest: two numbers, brackets and two commas. */
const POINT_BYTES = 2 * NUMBER_CHARS + 4;

/**
 * Measured tables one panel can hold at most: two per probe (emission and extinction), every filter of every channel,
 * the shared light path's emission and excitation filters, and the sample background.
 */
const MAX_TABLES = LIMITS.probes * 2 + LIMITS.channels * LIMITS.filtersPerChannel + 2 * LIMITS.filtersPerChannel + 1;

/**
 * Everything a panel holds besides its tables, bytes, with room to spare (our convention): at most 16 probes, 64
 * channels, 16 lines and 8 shared filters, each with a few fields and texts of LIMITS.textLength characters written
 * as \uXXXX escapes (6 bytes a character) come to well under 1 MiB.
 */
const OTHER_BYTES = 1024 * 1024;

/**
 * Largest page state the page reads, bytes of JSON: every table at LIMITS.tablePoints points of the longest numbers,
 * plus OTHER_BYTES: (16 × 2 + 64 × 8 + 2 × 8 + 1) × 1000 × 52 B + 1 MiB ≈ 30.3 MB. A link that inflates past it, or a
 * file larger than it, is refused before it is read further.
 */
export const MAX_STATE_BYTES = MAX_TABLES * LIMITS.tablePoints * POINT_BYTES + OTHER_BYTES;

/** The size in the user's words, e.g. "30 MB" (decimal megabytes, rounded up). */
export function sizeInWords(bytes: number): string {
  return bytes >= 1e6 ? `${Math.ceil(bytes / 1e6)} MB` : `${Math.ceil(bytes / 1e3)} KB`;
}

/** What the page says of a link larger than MAX_STATE_BYTES. */
export const LINK_TOO_LARGE =
  `This link holds more than ${sizeInWords(MAX_STATE_BYTES)} of panel data, more than the largest panel can ` +
  'hold — it was not opened.';

/** What the page says of a file larger than MAX_STATE_BYTES. */
export function fileTooLarge(name: string): string {
  const size = sizeInWords(MAX_STATE_BYTES);
  return `${name} is larger than ${size}, more than the largest panel can hold — it was not opened.`;
}
