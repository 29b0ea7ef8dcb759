import { describe, expect, it } from 'vitest';
import * as math from 'mathjs';
import { BULK_PARAMS, brusDiameterNm, brusGapEv, firstExcitonNmForDiameter, nmToEv } from '../../spectra/index';

// Brus, J. Chem. Phys. 1984; Kayanuma, Phys. Rev. B 1988: E = Eg + ħ²π²/(2R²μ) − 1.786 e²/(4πε0εrR) − 0.248 Ry μ/εr²,
// recomputed here in SI from CODATA 2018 (mathjs), independently of the library's constants.
function brusSi(eg: number, mu: number, epsR: number, diameterNm: number): number {
  const num = (n: string, u: string) => (math[n as keyof typeof math] as unknown as math.Unit).toNumber(u);
  const [h, e, me, eps0, c, ryd] = [
    num('planckConstant', 'J s'),
    num('elementaryCharge', 'C'),
    num('electronMass', 'kg'),
    num('electricConstant', 'F / m'),
    num('speedOfLight', 'm / s'),
    num('rydberg', 'm^-1'),
  ];
  const r = (diameterNm / 2) * 1e-9;
  const hbar = h / (2 * Math.PI);
  const kinetic = (hbar ** 2 * Math.PI ** 2) / (2 * r * r * mu * me) / e;
  const coulomb = (1.786 * e) / (4 * Math.PI * eps0 * epsR * r);
  const corr = (0.248 * ryd * h * c * mu) / (epsR * epsR) / e;
  return eg + kinetic - coulomb - corr;
}

describe('brusGapEv', () => {
  it.each([
    ['cdse', 4],
    ['gaas', 8],
    ['cspbbr3', 10],
    ['inp', 3],
  ] as const)('brusGapEv(%s, %s nm) matches the equation recomputed in SI from CODATA 2018 to 1e-9 eV', (m, d) => {
    const p = BULK_PARAMS[m];
    expect(brusGapEv(m, d)).toBeCloseTo(brusSi(p.bandGapEv, p.reducedMassRel, p.dielectricConstant, d), 9);
  });

  // docs/science.md §3 (C): Brus minus the Yu CdSe curve, +1.5 eV at 2.5 nm … +0.09 eV at 6 nm.
  it.each([
    [2.5, 1.5],
    [3, 0.96],
    [4, 0.43],
    [5, 0.2],
    [6, 0.09],
  ])('brusGapEv(cdse, %s nm) overestimates the empirical gap by about %s eV (±0.05 eV)', (d, excess) => {
    expect(Math.abs(brusGapEv('cdse', d) - nmToEv(firstExcitonNmForDiameter('cdse', d)) - excess)).toBeLessThan(0.05);
  });

  it(
    'brusGapEv(cdse) agrees with the empirical curve within 0.25 eV at 5–6 nm and the gap between them shrinks with ' +
      'size',
    () => {
      const excess = [2.5, 3, 4, 5, 5.5, 6].map(
        (d) => brusGapEv('cdse', d) - nmToEv(firstExcitonNmForDiameter('cdse', d)),
      );
      expect(Math.max(...excess.slice(3))).toBeLessThan(0.25);
      for (let i = 1; i < excess.length; i++) expect(excess[i]).toBeLessThan(excess[i - 1]);
    },
  );

  it('brusDiameterNm(m, brusGapEv(m, d)) returns d on the confined branch', () => {
    for (const [m, d] of [
      ['gaas', 6],
      ['cspbbr3', 12],
      ['cdse', 3],
    ] as const)
      expect(brusDiameterNm(m, brusGapEv(m, d))).toBeCloseTo(d, 9);
  });

  it('brusDiameterNm(gaas, 1 eV) is NaN: no dot has an energy below the bulk limit of the formula', () => {
    expect(brusDiameterNm('gaas', 1)).toBeNaN();
  });
});
