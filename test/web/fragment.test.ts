import { describe, expect, it } from 'vitest';
import { decodeFragment, encodeFragment, type PageState } from '../../web/state/fragment';
import { resamplePoints } from '../../web/state/thin-table';

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

  it('resamplePoints(points, 5) interpolates linearly between the original samples', () => {
    const line: [number, number][] = Array.from({ length: 11 }, (_, i) => [500 + i * 10, i * 2]);
    const five = resamplePoints(line, 5);
    expect(five.map((p) => p[0])).toEqual([500, 525, 550, 575, 600]);
    // y = (nm - 500) / 5 on this straight line.
    five.forEach(([nm, v]) => expect(v).toBeCloseTo((nm - 500) / 5, 9));
  });
});
