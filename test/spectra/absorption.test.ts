import { describe, expect, it } from 'vitest';
import * as math from 'mathjs';
import {
  extinctionAtNm,
  firstExcitonNmForDiameter,
  intrinsicExtinction,
  makeGrid,
  resolveDot,
  type ResolvedDot,
  sampleExtinction,
} from '../../spectra/index';

// Leatherdale, Woo, Mikulec, Bawendi, J. Phys. Chem. B 2002, 106, 7619 (abstract, P): CdSe absorption cross-section at
// 350 nm C_abs = 5.501e5 · a³ cm² (a = radius in cm); ε = N_A · C_abs / (1000 ln 10) (Beer–Lambert, base 10).
const NA = (math.avogadro as unknown as math.Unit).toNumber('mol^-1');
const leatherdaleEps350 = (diameterNm: number) => (NA * 5.501e5 * ((diameterNm / 2) * 1e-7) ** 3) / (1000 * Math.LN10);

describe('absorption model', () => {
  it.each([3, 4, 6])(
    'extinctionAtNm(cdse %s nm, 350 nm) equals the Leatherdale et al. 2002 volume law within 0.5 %',
    (d) => {
      const dot = resolveDot({ material: 'cdse', diameterNm: d });
      expect(Math.abs(extinctionAtNm(dot, 350) / leatherdaleEps350(d) - 1)).toBeLessThan(0.005);
    },
  );

  it('extinctionAtNm(cdse 4 nm, 350 nm) is about 1.2e6 M⁻¹ cm⁻¹ (docs/science.md, C)', () => {
    expect(extinctionAtNm(resolveDot({ material: 'cdse', diameterNm: 4 }), 350) / 1.2e6).toBeCloseTo(1, 1);
  });

  it('intrinsicExtinction(V, μi) is N_A·V·μi/(1000 ln 10) with V converted from nm³ to cm³', () => {
    expect(intrinsicExtinction(1000, 1e5)).toBeCloseTo((NA * 1e-18 * 1e5) / (1000 * Math.LN10), 6);
  });

  it.each(['cdse', 'cdte', 'cds', 'inp', 'gaas', 'cspbbr3'] as const)(
    'extinctionAtNm(%s) is zero a few line widths beyond the first exciton',
    (m) => {
      const dot = resolveDot({
        material: m,
        diameterNm: { cdse: 4, cdte: 4, cds: 3, inp: 2.5, gaas: 8, cspbbr3: 8 }[m],
      });
      const beyond =
        1239.84 /
        (1239.84 / dot.firstExcitonNm! -
          5 * (1239.84 / dot.firstExcitonNm! - 1239.84 / (dot.firstExcitonNm! + dot.fwhmNm)));
      expect(extinctionAtNm(dot, beyond)).toBe(0);
      expect(extinctionAtNm(dot, dot.firstExcitonNm!)).toBeGreaterThan(0);
    },
  );

  it(
    'extinctionAtNm(cdse 4 nm) has its first-exciton maximum near the Yu first exciton and rises again towards the ' +
      'UV',
    () => {
      const dot = resolveDot({ material: 'cdse', diameterNm: 4 });
      const l1 = firstExcitonNmForDiameter('cdse', 4);
      // A local maximum: the largest value over l1 − 8 … l1 + 25 nm sits within 3 nm of l1.
      let best = l1 - 8;
      for (let nm = l1 - 8; nm <= l1 + 25; nm += 0.1)
        if (extinctionAtNm(dot, nm) > extinctionAtNm(dot, best)) best = nm;
      expect(Math.abs(best - l1)).toBeLessThan(3);
      expect(extinctionAtNm(dot, 400)).toBeGreaterThan(2 * dot.extinctionFirstExciton!);
    },
  );

  it(
    'extinctionAtNm(cdse) changes smoothly: no step between neighbouring 0.1 nm points exceeds 1 % of the 350 nm ' +
      'value',
    () => {
      const dot = resolveDot({ material: 'cdse', diameterNm: 5 });
      const scale = extinctionAtNm(dot, 350);
      for (let nm = 340; nm < 700; nm += 0.1)
        expect(Math.abs(extinctionAtNm(dot, nm + 0.1) - extinctionAtNm(dot, nm))).toBeLessThan(0.01 * scale);
    },
  );

  it('extinctionAtNm works off the grid from the model, which is plain data that survives a JSON round trip', () => {
    const dot = resolveDot({ material: 'cdse', diameterNm: 4 }, { grid: makeGrid(400, 800, 1) });
    expect(extinctionAtNm(dot, 350)).toBeGreaterThan(1e6);
    const copy = { absorption: JSON.parse(JSON.stringify(dot.absorption)) as ResolvedDot['absorption'] };
    for (const nm of [350, 488.5, 601.25]) expect(extinctionAtNm(copy, nm)).toBe(extinctionAtNm(dot, nm));
  });

  it('resolveDot with a measured extinction replaces the model and says so', () => {
    const dot = resolveDot({
      material: 'cdse',
      diameterNm: 4,
      excitationNm: 450,
      extinction: {
        points: [
          [400, 5e5],
          [500, 3e5],
          [600, 1e5],
        ],
      },
    });
    expect(dot.measured.extinction).toBe(true);
    expect(extinctionAtNm(dot, 450)).toBeCloseTo(4e5, 6);
    expect(dot.extinctionAtExcitation).toBeCloseTo(4e5, 6);
    expect(extinctionAtNm(dot, 650)).toBe(0);
    expect(sampleExtinction(dot.absorption, dot.grid).values[500 - 300]).toBeCloseTo(3e5, 6);
  });
});
