import { describe, expect, it } from 'vitest';
import {
  SpectraError,
  diameterForEmissionPeakNm,
  emissionPeakForDiameterNm,
  emissionRangeForMaterialNm,
  firstExcitonNmForDiameter,
  listMaterials,
  resolveDot,
  type MaterialId,
} from '../../spectra/index';

// Yu, Qu, Guo, Peng, Chem. Mater. 2003, 15, 2854: D(λ) polynomials and ε = A·D^k, written out here independently of
// the library (status T: secondary copies of the coefficients agree digit for digit).
const paperD = {
  cdte: (l: number) => 9.8127e-7 * l ** 3 - 1.7147e-3 * l ** 2 + 1.0064 * l - 194.84,
  cdse: (l: number) => 1.6122e-9 * l ** 4 - 2.6575e-6 * l ** 3 + 1.6242e-3 * l ** 2 - 0.4277 * l + 41.57,
  cds: (l: number) => -6.6521e-8 * l ** 3 + 1.9557e-4 * l ** 2 - 9.2352e-2 * l + 13.29,
};
const paperEps = {
  cdte: (d: number) => 10043 * d ** 2.12,
  cdse: (d: number) => 5857 * d ** 2.65,
  cds: (d: number) => 21536 * d ** 2.3,
};
const sizes = { cdse: [1.5, 2, 3, 4, 5, 6, 7, 8], cdte: [2, 3, 3.5, 4, 5, 6, 7], cds: [1.5, 2, 3, 4, 5, 5.5] };
const SIZED: MaterialId[] = ['cdse', 'cdte', 'cds', 'inp', 'gaas', 'cspbbr3'];

function catchError(fn: () => unknown): SpectraError {
  try {
    fn();
  } catch (err) {
    if (err instanceof SpectraError) return err;
    throw err;
  }
  throw new Error('expected a SpectraError');
}

describe('Yu–Qu–Guo–Peng 2003 curves', () => {
  for (const m of ['cdse', 'cdte', 'cds'] as const) {
    it.each(sizes[m])(`firstExcitonNmForDiameter('${m}', %s nm) satisfies the paper's D(λ) to 1e-6 nm`, (d) => {
      expect(Math.abs(paperD[m](firstExcitonNmForDiameter(m, d)) - d)).toBeLessThan(1e-6);
    });
    it.each(sizes[m])(
      `resolveDot(${m}, %s nm).extinctionFirstExciton equals the paper's power law to 1e-9 relative`,
      (d) => {
        const dot = resolveDot({ material: m, diameterNm: d });
        expect(Math.abs(dot.extinctionFirstExciton! / paperEps[m](d) - 1)).toBeLessThan(1e-9);
      },
    );
  }

  it(
    'firstExcitonNmForDiameter(cdte) jumps by over 40 nm between 3.3 and 3.8 nm, where the published curve is ' +
      'nearly flat in D',
    () => {
      expect(firstExcitonNmForDiameter('cdte', 3.8) - firstExcitonNmForDiameter('cdte', 3.3)).toBeGreaterThan(40);
    },
  );
});

describe('size ↔ emission peak', () => {
  it.each(SIZED)('diameterForEmissionPeakNm(%s, emissionPeakForDiameterNm(d)) returns d across the range', (m) => {
    const [lo, hi] = listMaterials().find((x) => x.id === m)!.diameterRangeNm!;
    for (let i = 0; i <= 10; i++) {
      const d = lo + ((hi - lo) * i) / 10;
      expect(diameterForEmissionPeakNm(m, emissionPeakForDiameterNm(m, d))).toBeCloseTo(d, 6);
    }
  });

  it.each(SIZED)('emissionPeakForDiameterNm(%s) rises with size: smaller dots emit bluer (common practice)', (m) => {
    const [lo, hi] = listMaterials().find((x) => x.id === m)!.diameterRangeNm!;
    let prev = -Infinity;
    for (let i = 0; i <= 50; i++) {
      const peak = emissionPeakForDiameterNm(m, lo + ((hi - lo) * i) / 50);
      expect(peak).toBeGreaterThan(prev);
      prev = peak;
    }
  });

  it(
    'emissionPeakForDiameterNm(cdse, d) − firstExcitonNmForDiameter lies in 10–25 nm and shrinks with size (Stokes ' +
      'shift, from memory)',
    () => {
      const shifts = [2, 3, 4, 5, 6, 7, 8].map(
        (d) => emissionPeakForDiameterNm('cdse', d) - firstExcitonNmForDiameter('cdse', d),
      );
      for (const s of shifts) {
        expect(s).toBeGreaterThanOrEqual(10);
        expect(s).toBeLessThanOrEqual(25);
      }
      expect(shifts[0]).toBeGreaterThan(shifts[shifts.length - 1]);
    },
  );

  it(
    'emissionPeakForDiameterNm(cdse, 4 nm) lies between 590 and 610 nm (Yu curve: first exciton ≈ 585 nm, plus the ' +
      'Stokes shift)',
    () => {
      const p = emissionPeakForDiameterNm('cdse', 4);
      expect(p).toBeGreaterThan(590);
      expect(p).toBeLessThan(610);
    },
  );

  it(
    'diameter ranges lie within about 1–16 nm and each overlaps 2–10 nm (common practice: colloidal dots span about ' +
      '2–10 nm)',
    () => {
      for (const m of listMaterials().filter((x) => x.diameterRangeNm)) {
        const [lo, hi] = m.diameterRangeNm!;
        expect(lo).toBeGreaterThanOrEqual(1);
        expect(hi).toBeLessThanOrEqual(16);
        expect(Math.min(hi, 10) - Math.max(lo, 2)).toBeGreaterThan(0);
      }
    },
  );

  it(
    'emissionRangeForMaterialNm over CdSe, CdTe, CdS and InP together covers 450–650 nm (common practice: they ' +
      'cover the visible)',
    () => {
      const ranges = (['cdse', 'cdte', 'cds', 'inp'] as const).map((m) => emissionRangeForMaterialNm(m));
      for (let nm = 450; nm <= 650; nm += 5) expect(ranges.some(([lo, hi]) => lo <= nm && nm <= hi)).toBe(true);
    },
  );

  it(
    'emissionRangeForMaterialNm(cspbbr3) sits in the blue-green, within 460–540 nm (common practice; Protesescu et ' +
      'al. 2015)',
    () => {
      const [lo, hi] = emissionRangeForMaterialNm('cspbbr3');
      expect(lo).toBeGreaterThanOrEqual(460);
      expect(hi).toBeLessThanOrEqual(540);
    },
  );
});

describe('sizing errors', () => {
  it('diameterForEmissionPeakNm(cdse, 700) throws out_of_range naming the reachable range in nm', () => {
    const err = catchError(() => diameterForEmissionPeakNm('cdse', 700));
    const [lo, hi] = emissionRangeForMaterialNm('cdse');
    expect(err.code).toBe('out_of_range');
    expect(err.path).toEqual(['emissionPeakNm']);
    expect(err.message).toContain(`${Math.ceil(lo)}–${Math.floor(hi)} nm`);
  });

  it('emissionPeakForDiameterNm(cdse, 12) throws out_of_range naming the diameter range', () => {
    const err = catchError(() => emissionPeakForDiameterNm('cdse', 12));
    expect([err.code, err.path, err.message.includes('1.5–8 nm')]).toEqual(['out_of_range', ['diameterNm'], true]);
  });

  it.each([-3, 0, NaN, Infinity])('emissionPeakForDiameterNm(cdse, %s) throws out_of_range on diameterNm', (d) => {
    const err = catchError(() => emissionPeakForDiameterNm('cdse', d));
    expect([err.code, err.path]).toEqual(['out_of_range', ['diameterNm']]);
  });

  it('emissionPeakForDiameterNm(carbon, 3) throws invalid_input on material: no size law', () => {
    const err = catchError(() => emissionPeakForDiameterNm('carbon', 3));
    expect([err.code, err.path]).toEqual(['invalid_input', ['material']]);
  });

  it('diameterForEmissionPeakNm(custom, 600) throws invalid_input on material: no size law', () => {
    const err = catchError(() => diameterForEmissionPeakNm('custom' as MaterialId, 600));
    expect([err.code, err.path, /no size law/.test(err.message)]).toEqual(['invalid_input', ['material'], true]);
  });
});
