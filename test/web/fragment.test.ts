import { describe, expect, it } from 'vitest';
import { deflateSync } from 'fflate';
import {
  decodeFragment,
  draftFragment,
  draftIdOf,
  encodeFragment,
  inflateCapped,
  LinkTooLargeError,
  type PageState,
} from '../../web/state/fragment';
import { MAX_STATE_BYTES } from '../../web/state/state-size';
import { thinTable } from '../../web/state/thin-table';
import { readPageState } from '../../web/state/checks';
import { computePanel } from '../../web/state/compute';
import { deflateBomb as bomb } from './helpers/deflate-bomb';
import type { PanelSpec } from '../../spectra/index';

/** The fragment text of raw DEFLATE `bytes` (base64url), as a link writes it. */
function linkOf(bytes: Uint8Array): string {
  let binary = '';
  for (let i = 0; i < bytes.length; i += 0x8000) binary += String.fromCharCode(...bytes.subarray(i, i + 0x8000));
  return 'v1.' + btoa(binary).replace(/\+/g, '-').replace(/\//g, '_').replace(/=+$/, '');
}

/** A panel with one probe and two channels, the first a 1,000-point measured filter table. */
function tablePanel(): PanelSpec {
  const points: [number, number][] = Array.from({ length: 1000 }, (_, i) => {
    const nm = 500 + i * 0.2137;
    return [nm, 0.93 / (1 + Math.exp(-(nm - 560) / 3.1)) / (1 + Math.exp((nm - 640) / 2.7)) + i * 1e-7];
  });
  return {
    version: 1,
    title: 'Measured filter',
    excitation: [{ wavelengthNm: 405 }],
    probes: [
      { id: 'p1', material: 'cdse', emissionPeakNm: 605 },
      { id: 'p2', material: 'cdse', emissionPeakNm: 655 },
    ],
    channels: [
      { id: 'c1', filters: [{ type: 'table', points }] },
      { id: 'c2', filters: [{ type: 'bandpass', centerNm: 655, widthNm: 20 }] },
    ],
  };
}

const state: PageState = {
  panel: {
    version: 1,
    title: 'Round trip <b>&</b> ünïcode',
    excitation: [{ wavelengthNm: 405 }],
    probes: [{ id: 'p1', material: 'cdse', emissionPeakNm: 605, target: 'membrane marker' }],
    channels: [{ id: 'c1', filters: [{ type: 'bandpass', centerNm: 605, widthNm: 20 }] }],
  },
  view: { exclude: ['lead'] },
};

describe('URL fragment', () => {
  it('encodeFragment(state) then decodeFragment gives back the same state', () => {
    const text = encodeFragment(state);
    expect(text.startsWith('v1.')).toBe(true);
    expect(decodeFragment('#' + text)).toEqual(state);
  });

  it('encodeFragment(state) uses only URL-safe characters (base64url, RFC 4648 §5)', () => {
    expect(encodeFragment(state)).toMatch(/^v1\.[A-Za-z0-9_-]+$/);
  });

  it('decodeFragment("") gives null and decodeFragment of a damaged link throws a plain message', () => {
    expect(decodeFragment('')).toBeNull();
    expect(() => decodeFragment('#v1.notdeflate')).toThrow(/damaged/);
    expect(() => decodeFragment('#v9.abc')).toThrow(/another version/);
  });

  it('encodeFragment keeps a 1,000-point measured filter table whole: every point comes back exactly', () => {
    const panel = tablePanel();
    const back = decodeFragment(encodeFragment({ panel, view: { exclude: [] } })) as PageState;
    expect(back.panel).toEqual(panel);
  });

  it('a panel with a 1,000-point filter table read back from its link gives identical spillover numbers', () => {
    const panel = tablePanel();
    const r = readPageState(decodeFragment(encodeFragment({ panel, view: { exclude: [] } })));
    if (!r.ok) throw new Error(r.message);
    const before = computePanel(panel, { byBrightness: true });
    const after = computePanel(r.state.panel, { byBrightness: true });
    if (!before.ok || !after.ok) throw new Error('the panel was not computed');
    expect(after.value.evaluation.spillover).toEqual(before.value.evaluation.spillover);
    expect(after.value.evaluation.collected).toEqual(before.value.evaluation.collected);
  });

  it('decodeFragment refuses a link inflating to 400 MiB with LinkTooLargeError in under 1000 ms', () => {
    const text = linkOf(bomb(400 * 1024 * 1024));
    const started = performance.now();
    expect(() => decodeFragment('#' + text)).toThrow(LinkTooLargeError);
    expect(performance.now() - started).toBeLessThan(1000);
  });

  it('the refusal of a too-large link says it holds more than the cap and was not opened', () => {
    expect(() => decodeFragment(linkOf(bomb(MAX_STATE_BYTES + 1)))).toThrow(
      /^This link holds more than 31 MB of panel data.* — it was not opened\.$/,
    );
  });

  it('inflateCapped gives back data of exactly the cap and refuses one byte more', () => {
    const data = new Uint8Array(5000).map((_, i) => (i * 7919) % 251);
    expect(inflateCapped(deflateSync(data), 5000)).toEqual(data);
    expect(() => inflateCapped(deflateSync(data), 4999)).toThrow(LinkTooLargeError);
  });

  it('decodeFragment refuses a fragment text longer than any state within the cap, before decoding it', () => {
    expect(() => decodeFragment('v1.' + 'A'.repeat(Math.ceil((MAX_STATE_BYTES * 4) / 3) + 8192))).toThrow(
      LinkTooLargeError,
    );
  });

  it('draftFragment(id) names the saved entry that draftIdOf reads back; a link names none', () => {
    expect(draftIdOf('#' + draftFragment('abc-123'))).toBe('abc-123');
    expect(draftIdOf(encodeFragment(state))).toBeUndefined();
  });

  it('thinTable(points, 5) interpolates linearly between the samples at five evenly spaced wavelengths', () => {
    const line: [number, number][] = Array.from({ length: 11 }, (_, i) => [500 + i * 10, i * 2]);
    const five = thinTable(line, 5);
    expect(five.map((p) => p[0])).toEqual([500, 525, 550, 575, 600]);
    // y = (nm - 500) / 5 on this straight line.
    five.forEach(([nm, v]) => expect(v).toBeCloseTo((nm - 500) / 5, 9));
  });

  it(
    'thinTable(points, 3) writes wavelengths to 0.01 nm and ' +
      'values to 5 significant digits, and keeps a short table',
    () => {
      const table: [number, number][] = [
        [400.123, 1.234567],
        [450.5, 2.2222222],
        [500.001, 3.3333333],
        [600.4567, 4.4444444],
      ];
      // Evenly spaced: 400.123, 500.28985 and 600.4567 nm; 500.28985 nm lies 0.28885 nm past the 500.001 nm row.
      expect(thinTable(table, 3)).toEqual([
        [400.12, 1.2346],
        [500.29, Number((3.3333333 + (4.4444444 - 3.3333333) * (0.28885 / 100.4557)).toPrecision(5))],
        [600.46, 4.4444],
      ]);
      expect(thinTable(table, 4)).toBe(table);
    },
  );
});
