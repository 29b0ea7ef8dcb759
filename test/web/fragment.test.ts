import { describe, expect, it } from 'vitest';
import { decodeFragment, encodeFragment, type PageState } from '../../web/state/fragment';
import { thinTable } from '../../web/state/thin-table';

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

  it('encodeFragment(state) thins a 2,000-point measured spectrum to 200 points', () => {
    const points: [number, number][] = Array.from({ length: 2000 }, (_, i) => [
      400 + i * 0.2,
      Math.exp(-(((i - 1000) / 300) ** 2)),
    ]);
    const big: PageState = {
      ...state,
      panel: { ...state.panel, probes: [{ id: 'p1', material: 'custom', measuredEmission: { points } }] },
    };
    const back = decodeFragment(encodeFragment(big)) as PageState;
    const thin = back.panel.probes[0].measuredEmission!.points;
    expect(thin.length).toBe(200);
    expect(thin[0][0]).toBeCloseTo(400, 6);
    expect(thin[199][0]).toBeCloseTo(points[1999][0], 2);
  });

  it('decodeFragment("") gives null and decodeFragment of a damaged link throws a plain message', () => {
    expect(decodeFragment('')).toBeNull();
    expect(() => decodeFragment('#v1.notdeflate')).toThrow(/damaged/);
    expect(() => decodeFragment('#v9.abc')).toThrow(/another version/);
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

  // Recorded from encodeFragment as the page wrote it before its thinning moved onto the library's resampleTable:
  // the same panel must keep the same link text.
  it('encodeFragment(panel with four long tables) is byte for byte the link text the page wrote before', async () => {
    const curve = (n: number, from: number, step: number, f: (i: number) => number): [number, number][] =>
      Array.from({ length: n }, (_, i) => [Number((from + i * step).toFixed(4)), f(i)]);
    const long: PageState = {
      panel: {
        version: 1,
        title: 'Thinning check',
        excitation: [{ wavelengthNm: 405 }],
        probes: [
          {
            id: 'p1',
            material: 'custom',
            measuredEmission: { points: curve(2000, 400.013, 0.1731, (i) => Math.exp(-(((i - 1000) / 310) ** 2))) },
            extinction: {
              points: curve(1500, 300.5, 0.2, (i) => 60000 * Math.exp(-(((i - 400) / 200) ** 2)) + i / 7),
            },
          },
        ],
        channels: [
          {
            id: 'c1',
            filters: [
              { type: 'table', points: curve(1203, 500, 0.25, (i) => 0.9 / (1 + Math.exp((i % 601) / 37 - 8))) },
            ],
          },
        ],
        background: { level: 0.1, points: curve(999, 350, 0.5, (i) => Math.sin(i / 90) ** 2 + 0.01) },
      },
      view: { exclude: ['lead'] },
    };
    const text = encodeFragment(long);
    const digest = await crypto.subtle.digest('SHA-256', new TextEncoder().encode(text));
    const hex = [...new Uint8Array(digest)].map((b) => b.toString(16).padStart(2, '0')).join('');
    expect(text.length).toBe(8410);
    expect(hex).toBe('f5aed0df95e7fb5a03b5c7fd2e098a839f5fe5294f944c864bcc0f1542c1de09');
  });
});
