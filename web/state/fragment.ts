/**
 * The page state in the URL fragment: `#v1.<data>`, where data is the JSON of {panel, ui} compressed with raw DEFLATE
 * (RFC 1951) and written in base64url (RFC 4648 §5), so a reload or back/forward keeps the work without a server.
 */
import { deflateSync, Inflate, strFromU8, strToU8 } from 'fflate';
import type { PanelSpec } from '../../spectra/index';
import type { PanelExclusion } from './exclusions';
import { LINK_TOO_LARGE, MAX_STATE_BYTES } from './state-size';

/** What the fragment carries besides the panel: view options that are not part of the stored panel. */
export interface ViewOptions {
  /** Material classes the user excludes: probes containing them are flagged and block share/export. */
  exclude: PanelExclusion[];
  /** The id of the instrument profile the panel is on (the panel itself holds the profile's parts written out). */
  instrument?: string;
  /** True when bandpass sizes dragged or typed land on the nearest stock size (absent: off). */
  snapStock?: boolean;
}

/** Everything the fragment holds. */
export interface PageState {
  panel: PanelSpec;
  view: ViewOptions;
}

const PREFIX = 'v1.';

function toBase64Url(bytes: Uint8Array): string {
  let binary = '';
  for (let i = 0; i < bytes.length; i++) binary += String.fromCharCode(bytes[i]);
  return btoa(binary).replace(/\+/g, '-').replace(/\//g, '_').replace(/=+$/, '');
}

function fromBase64Url(text: string): Uint8Array {
  const b64 = text.replace(/-/g, '+').replace(/_/g, '/');
  const binary = atob(b64 + '='.repeat((4 - (b64.length % 4)) % 4));
  const out = new Uint8Array(binary.length);
  for (let i = 0; i < binary.length; i++) out[i] = binary.charCodeAt(i);
  return out;
}

/** Raised when a link's state inflates past MAX_STATE_BYTES: the message is the page's notice. */
export class LinkTooLargeError extends Error {
  constructor() {
    super(LINK_TOO_LARGE);
    this.name = 'LinkTooLargeError';
  }
}

/**
 * Compressed bytes given to the inflater at a time. DEFLATE writes at most 1032 bytes per compressed byte (RFC 1951:
 * a match is at most 258 bytes, and its length and distance codes can take one bit each), so one push writes at most
 * about 1 MiB past the running count before it is checked.
 */
const INFLATE_CHUNK = 1024;

/**
 * Inflates raw DEFLATE data, counting the output as it comes and stopping with LinkTooLargeError as soon as it passes
 * `maxBytes`: a small link that would inflate to gigabytes costs at most `maxBytes` and a few milliseconds per MB.
 */
export function inflateCapped(data: Uint8Array, maxBytes = MAX_STATE_BYTES): Uint8Array {
  const parts: Uint8Array[] = [];
  let total = 0;
  const inflater = new Inflate((chunk) => {
    total += chunk.length;
    if (total > maxBytes) throw new LinkTooLargeError();
    parts.push(chunk);
  });
  for (let at = 0; at < data.length; at += INFLATE_CHUNK) {
    const end = Math.min(at + INFLATE_CHUNK, data.length);
    inflater.push(data.subarray(at, end), end === data.length);
  }
  if (data.length === 0) inflater.push(data, true);
  const out = new Uint8Array(total);
  let offset = 0;
  for (const part of parts) {
    out.set(part, offset);
    offset += part.length;
  }
  return out;
}

/** Encodes the page state as a fragment string, without the leading '#'. */
export function encodeFragment(state: PageState): string {
  const json = JSON.stringify({ panel: state.panel, view: state.view });
  return PREFIX + toBase64Url(deflateSync(strToU8(json), { level: 9 }));
}

/**
 * Decodes a fragment (with or without '#') into raw JSON: the caller validates it. Returns null for an empty
 * fragment; throws an Error with a plain message for one that is not a version-1 state, and LinkTooLargeError for
 * one that inflates past MAX_STATE_BYTES (stopped there, never inflated whole).
 */
export function decodeFragment(fragment: string): unknown {
  const text = fragment.replace(/^#/, '');
  if (text === '') return null;
  if (!text.startsWith(PREFIX)) throw new Error('The link is from another version of this page and cannot be read.');
  // base64 writes 4 characters for 3 bytes, and DEFLATE's stored blocks add 5 bytes per 65,535 (RFC 1951): a longer
  // text cannot hold a state within the cap.
  if (text.length > ((MAX_STATE_BYTES * (1 + 5 / 65535) + 1024) * 4) / 3) throw new LinkTooLargeError();
  try {
    return JSON.parse(strFromU8(inflateCapped(fromBase64Url(text.slice(PREFIX.length)))));
  } catch (e) {
    if (e instanceof LinkTooLargeError) throw e;
    throw new Error('The link is damaged (its panel data cannot be decompressed).');
  }
}

/**
 * Longest fragment the page writes into the address, characters: 32 KiB (common practice: Chromium takes addresses
 * up to 2 MB, but other browsers' address bars, and the mail and chat tools links travel through, cut far shorter
 * ones; 32 KiB is within what current desktop browsers keep).
 */
export const MAX_LINK_CHARS = 32 * 1024;

const DRAFT_PREFIX = 'd1.';

/** What the page says when a panel is too large for the address: it is kept in this browser, Share sends it. */
export const KEPT_IN_BROWSER =
  `This panel is too large for the page address (over ${MAX_LINK_CHARS / 1024} KB), so the address points to its ` +
  'copy kept in this browser (My panels), unchanged. To send it to someone, use Share.';

/** What the page says of a draft address whose panel this browser does not hold. */
export const DRAFT_NOT_HERE =
  'This address points to a panel kept in the browser it was edited in, and this browser does not have it: ' +
  'open it there and use Share to send it.';

/** The fragment of a state kept in this browser's saved panels under entry `savedId`, without the leading '#'. */
export function draftFragment(savedId: string): string {
  return DRAFT_PREFIX + savedId;
}

/** The saved entry id a draft fragment (with or without '#') names, or undefined for any other fragment. */
export function draftIdOf(fragment: string): string | undefined {
  const text = fragment.replace(/^#/, '');
  return text.startsWith(DRAFT_PREFIX) ? text.slice(DRAFT_PREFIX.length) : undefined;
}
