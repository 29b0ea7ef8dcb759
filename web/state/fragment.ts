/**
 * The page state in the URL fragment: `#v1.<data>`, where data is the JSON of {panel, ui} compressed with raw DEFLATE
 * (RFC 1951) and written in base64url (RFC 4648 §5), so a reload or back/forward keeps the work without a server.
 */
import { deflateSync, inflateSync, strFromU8, strToU8 } from 'fflate';
import type { PanelSpec } from '../../spectra/index';
import type { PanelExclusion } from './exclusions';
import { thinTable } from './thin-table';

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

/** Copy of the panel with every measured table thinned to the link limit (MAX_LINK_POINTS). */
export function thinPanel(panel: PanelSpec): PanelSpec {
  const thin = (t?: { points: [number, number][] }) => (t ? { ...t, points: thinTable(t.points) } : t);
  return {
    ...panel,
    probes: panel.probes.map((p) => {
      const q = { ...p };
      if (p.measuredEmission) q.measuredEmission = thin(p.measuredEmission);
      if (p.extinction) q.extinction = thin(p.extinction);
      return q;
    }),
    channels: panel.channels.map((c) => ({
      ...c,
      filters: c.filters.map((f) => (f.type === 'table' ? { ...f, points: thinTable(f.points) } : f)),
    })),
    ...(panel.background?.points
      ? { background: { ...panel.background, points: thinTable(panel.background.points) } }
      : {}),
  };
}

/** Encodes the page state as a fragment string, without the leading '#'. */
export function encodeFragment(state: PageState): string {
  const json = JSON.stringify({ panel: thinPanel(state.panel), view: state.view });
  return PREFIX + toBase64Url(deflateSync(strToU8(json), { level: 9 }));
}

/**
 * Decodes a fragment (with or without '#') into raw JSON: the caller validates it. Returns null for an empty
 * fragment; throws an Error with a plain message for one that is not a version-1 state.
 */
export function decodeFragment(fragment: string): unknown {
  const text = fragment.replace(/^#/, '');
  if (text === '') return null;
  if (!text.startsWith(PREFIX)) throw new Error('The link is from another version of this page and cannot be read.');
  try {
    return JSON.parse(strFromU8(inflateSync(fromBase64Url(text.slice(PREFIX.length)))));
  } catch {
    throw new Error('The link is damaged (its panel data cannot be decompressed).');
  }
}
