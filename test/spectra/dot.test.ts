import { describe, expect, it } from 'vitest';
import {
  DEFAULT_GRID,
  SpectraError,
  emissionPeakForDiameterNm,
  emissionRangeForMaterialNm,
  listMaterials,
  makeGrid,
  resolveDot,
  sampleExtinction,
  spectrumOnGrid,
  type DotInput,
  type ResolvedDot,
} from '../../spectra/index';

function catchError(fn: () => unknown): SpectraError {
  try {
    fn();
  } catch (err) {
    if (err instanceof SpectraError) return err;
    throw err;
  }
  throw new Error('expected a SpectraError');
}
const area = (d: ResolvedDot) => d.emission.values.reduce((a, b) => a + b, 0) * d.emission.stepNm;
const argmaxNm = (d: ResolvedDot) => {
  let k = 0;
  d.emission.values.forEach((v, i) => {
    if (v > d.emission.values[k]) k = i;
  });
  return d.emission.startNm + k * d.emission.stepNm;
};
const allFinite = (d: ResolvedDot) =>
  [
    d.emissionPeakNm,
    d.fwhmNm,
    d.quantumYield,
    ...d.emission.values,
    ...sampleExtinction(d.absorption, d.grid).values,
  ].every(Number.isFinite);

describe('resolveDot: model spectra', () => {
  it.each(['cdse', 'cdte', 'cds', 'inp', 'gaas', 'cspbbr3'] as const)(
    'resolveDot(%s) across its size range gives unit-area, finite spectra peaking at emissionPeakNm',
    (m) => {
      const [lo, hi] = listMaterials().find((x) => x.id === m)!.diameterRangeNm!;
      for (const d of [lo, (lo + hi) / 2, hi]) {
        const dot = resolveDot({ material: m, diameterNm: d });
        expect(allFinite(dot)).toBe(true);
        expect(area(dot)).toBeCloseTo(1, 10);
        expect(Math.abs(argmaxNm(dot) - dot.emissionPeakNm)).toBeLessThanOrEqual(0.5 + 1e-9);
        expect(dot.emissionPeakNm).toBeCloseTo(emissionPeakForDiameterNm(m, d), 9);
      }
    },
  );

  it('resolveDot(cdse, 605 nm) returns a 4.0–4.4 nm core whose emission peaks at 605 nm', () => {
    const dot = resolveDot({ material: 'cdse', emissionPeakNm: 605 });
    expect(dot.diameterNm!).toBeGreaterThan(4);
    expect(dot.diameterNm!).toBeLessThan(4.4);
    expect(dot.emissionPeakNm).toBeCloseTo(605, 9);
    expect(dot.model).toContain('Yu–Qu–Guo–Peng 2003');
  });

  it(
    'resolveDot(cdte) FWHM is smooth and finite across 2–7 nm, without a spike where the published curve is flat ' +
      '(~3.3–3.8 nm)',
    () => {
      const widths: number[] = [];
      for (let d = 2; d <= 7 + 1e-9; d += 0.02) widths.push(resolveDot({ material: 'cdte', diameterNm: d }).fwhmNm);
      expect(widths.every(Number.isFinite)).toBe(true);
      for (let i = 1; i < widths.length; i++)
        expect(Math.abs(widths[i] - widths[i - 1])).toBeLessThan(0.01 * widths[i - 1]);
      for (let i = 1; i < widths.length - 1; i++)
        expect(Math.abs(widths[i + 1] - 2 * widths[i] + widths[i - 1])).toBeLessThan(0.02);
    },
  );

  it('resolveDot(cdse) FWHM grows with sizeDispersionPct and equals the homogeneous width alone at 0 %', () => {
    const w = [0, 5, 10, 15].map((p) => resolveDot({ material: 'cdse', diameterNm: 4, sizeDispersionPct: p }).fwhmNm);
    for (let i = 1; i < w.length; i++) expect(w[i]).toBeGreaterThan(w[i - 1]);
    // 70 meV single-dot width at the 601 nm peak ≈ 20.4 nm (params.ts; from memory).
    expect(w[0]).toBeCloseTo(20.4, 0);
  });

  it.each([
    ['cdse', 30],
    ['cdte', 42],
    ['inp', 45],
    ['cspbbr3', 20],
  ] as const)(
    'resolveDot(%s) mid-range at typical dispersion has a FWHM within 35 percent of the typical %s nm (science ' +
      'notes, mostly from memory)',
    (m, typical) => {
      const mat = listMaterials().find((x) => x.id === m)!;
      const [lo, hi] = mat.emissionRangeNm!;
      const dot = resolveDot({ material: m, emissionPeakNm: (lo + hi) / 2 });
      expect(Math.abs(dot.fwhmNm / typical - 1)).toBeLessThan(0.35);
    },
  );

  it('resolveDot with fwhmNm overrides the predicted width exactly', () => {
    expect(resolveDot({ material: 'inp', emissionPeakNm: 620, fwhmNm: 38 }).fwhmNm).toBeCloseTo(38, 6);
  });

  it('resolveDot on a custom grid samples both spectra on it with unit emission area', () => {
    const grid = makeGrid(400, 800, 2);
    const dot = resolveDot({ material: 'cdse', emissionPeakNm: 605 }, { grid });
    const onGrid = [spectrumOnGrid(dot.emission, grid).length, sampleExtinction(dot.absorption, grid).values.length];
    expect([...onGrid, dot.emission.stepNm, (dot.emission.startNm - 400) % 2]).toEqual([201, 201, 2, 0]);
    expect(area(dot)).toBeCloseTo(1, 10);
  });

  it('resolveDot without excitationNm leaves extinctionAtExcitation null; with 405 nm it is positive', () => {
    expect(resolveDot({ material: 'cdse', emissionPeakNm: 605 }).extinctionAtExcitation).toBeNull();
    expect(
      resolveDot({ material: 'cdse', emissionPeakNm: 605, excitationNm: 405 }).extinctionAtExcitation!,
    ).toBeGreaterThan(0);
  });
});

describe('resolveDot: carbon dots', () => {
  it('resolveDot(carbon) always warns that emission depends on excitation and uses a broad default width', () => {
    const dot = resolveDot({ material: 'carbon', emissionPeakNm: 450 });
    expect(dot.warnings.join(' ')).toMatch(/depends on the excitation wavelength/);
    expect(dot.fwhmNm).toBeCloseTo(90, 6);
    expect([dot.diameterNm, dot.firstExcitonNm]).toEqual([null, null]);
  });

  it('resolveDot(carbon) moves the emission peak to the red as the excitation moves to the red', () => {
    const peaks = [350, 405, 488, 532].map(
      (x) => resolveDot({ material: 'carbon', emissionPeakNm: 450, excitationNm: x }).emissionPeakNm,
    );
    expect(peaks[0]).toBe(450);
    for (let i = 1; i < peaks.length; i++) expect(peaks[i]).toBeGreaterThan(peaks[i - 1]);
  });
});

describe('resolveDot: measured data first', () => {
  // A Gaussian in wavelength, 30 nm FWHM at 560 nm, as a spectrometer table with 0.5 nm spacing.
  const points: [number, number][] = [];
  for (let nm = 450; nm <= 700; nm += 0.5) points.push([nm, 1000 * Math.exp(-4 * Math.LN2 * ((nm - 560) / 30) ** 2)]);

  it('resolveDot(custom) takes peak and FWHM from the measured emission and renormalises it to unit area', () => {
    const dot = resolveDot({ material: 'custom', measuredEmission: { points }, quantumYield: 0.8 });
    expect(dot.emissionPeakNm).toBeCloseTo(560, 1);
    expect(dot.fwhmNm).toBeCloseTo(30, 0);
    expect(area(dot)).toBeCloseTo(1, 10);
    expect([dot.model, dot.measured.emission, dot.measured.extinction]).toEqual(['measured', true, false]);
    expect(dot.warnings.join(' ')).toMatch(/log-normal absorption band .* nominal Stokes shift .* nominal peak ε/);
  });

  it('resolveDot(cdse) with a measured emission and no size input sizes the core from the measured peak', () => {
    const dot = resolveDot({ material: 'cdse', measuredEmission: { points } });
    expect(dot.diameterNm!).toBeCloseTo(
      resolveDot({ material: 'cdse', emissionPeakNm: dot.emissionPeakNm }).diameterNm!,
      6,
    );
    expect(dot.model.startsWith('measured emission')).toBe(true);
  });

  it(
    'resolveDot(cdse, 620 nm) with a measured emission at 560 nm keeps the measured shape and warns about the ' +
      'mismatch',
    () => {
      const dot = resolveDot({ material: 'cdse', emissionPeakNm: 620, measuredEmission: { points } });
      expect(dot.emissionPeakNm).toBeCloseTo(560, 1);
      expect(dot.warnings.join(' ')).toMatch(/measured emission peaks at/);
    },
  );
});

// Input the API's schema refuses (both sizes, negative or NaN numbers, unknown materials, bad tables) never reaches
// the library: test/worker/schemas.test.ts checks those. Here: what only the models decide.
describe('resolveDot: what the models refuse', () => {
  const cases: [string, DotInput, string, (string | number)[]][] = [
    ['neither diameterNm nor emissionPeakNm', { material: 'cdse' }, 'invalid_input', ['emissionPeakNm']],
    ['a peak out of reach', { material: 'cspbbr3', emissionPeakNm: 620 }, 'out_of_range', ['emissionPeakNm']],
    ['a diameter outside the size law', { material: 'cdse', diameterNm: 12 }, 'out_of_range', ['diameterNm']],
    ['custom without measuredEmission', { material: 'custom' }, 'invalid_input', ['measuredEmission']],
    ['carbon without a peak', { material: 'carbon' }, 'invalid_input', ['emissionPeakNm']],
    [
      'carbon with a peak out of reach',
      { material: 'carbon', emissionPeakNm: 900 },
      'out_of_range',
      ['emissionPeakNm'],
    ],
    [
      'a measured emission with nothing on the grid',
      {
        material: 'custom',
        measuredEmission: {
          points: [
            [1200, 1],
            [1300, 2],
          ],
        },
      },
      'invalid_table',
      ['measuredEmission', 'points'],
    ],
  ];
  it.each(cases)('resolveDot with %s throws a SpectraError naming the field', (_what, input, code, path) => {
    const err = catchError(() => resolveDot(input));
    expect([err.code, err.path]).toEqual([code, path]);
    expect(err.message.length).toBeGreaterThan(10);
  });

  it('resolveDot with a peak out of reach names the reachable range in nm', () => {
    const [lo, hi] = emissionRangeForMaterialNm('cspbbr3');
    expect(catchError(() => resolveDot({ material: 'cspbbr3', emissionPeakNm: 620 })).message).toContain(
      `${Math.ceil(lo)}–${Math.floor(hi)} nm`,
    );
  });

  it('resolveDot works on DEFAULT_GRID (300–1000 nm, 1 nm) when no grid is given', () => {
    expect(resolveDot({ material: 'cdse', emissionPeakNm: 605 }).grid).toEqual(DEFAULT_GRID);
  });
});
