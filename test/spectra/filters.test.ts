import { describe, expect, it } from 'vitest';
import { errorOf } from './helpers/errors';
import erf from '@stdlib/math-base-special-erf';
import { DEFAULT_GRID, FILTER_DEFAULTS, channelTransmission, filterTransmission, makeGrid } from '../../spectra/index';
import type { FilterSpec, WavelengthGrid } from '../../spectra/index';

const at = (t: number[], grid: WavelengthGrid, nm: number) => t[Math.round((nm - grid.startNm) / grid.stepNm)];

/** Wavelength (by linear interpolation on the rising side) where a rising curve first reaches `level`. */
function crossingNm(t: number[], grid: WavelengthGrid, level: number, rising = true): number {
  for (let i = 1; i < t.length; i++) {
    const [a, b] = [t[i - 1], t[i]];
    if (rising ? a < level && b >= level : a >= level && b < level) {
      return grid.startNm + (i - 1 + (level - a) / (b - a)) * grid.stepNm;
    }
  }
  return NaN;
}

describe('filterTransmission', () => {
  // Closed form: ∫ N(μ, σ²) over [a, b] = ½[erf((b−μ)/σ√2) − erf((a−μ)/σ√2)]; erf from @stdlib/math-base-special-erf.
  it('filterTransmission(ideal 605/20) passes a Gaussian (in wavelength) exactly as the erf closed form says', () => {
    const grid = makeGrid(480, 730, 0.0625); // 1/16 nm: the band edges fall exactly on grid points
    const t = filterTransmission(
      { type: 'bandpass', centerNm: 605, widthNm: 20, edgeWidthNm: 0, peakTransmission: 1, blockingOD: 12 },
      grid,
    );
    for (const [meanNm, sigmaNm] of [
      [600, 12],
      [560, 15],
      [612, 4],
    ]) {
      let sum = 0;
      for (let i = 0; i < grid.count; i++) {
        const z = (grid.startNm + i * grid.stepNm - meanNm) / sigmaNm;
        sum += (t[i] * Math.exp(-0.5 * z * z)) / (sigmaNm * Math.sqrt(2 * Math.PI));
      }
      const expected =
        0.5 * (erf((615 - meanNm) / (sigmaNm * Math.SQRT2)) - erf((595 - meanNm) / (sigmaNm * Math.SQRT2)));
      // The grid sum is the trapezoid rule (the step's value is exactly ½ on each edge): error ≈ h²/12 · |Δf'| ≲ 2e-6.
      expect(Math.abs(sum * grid.stepNm - expected) / expected).toBeLessThan(1e-5);
    }
  });

  it(
    'filterTransmission(bandpass) peaks at peakTransmission and is half of it at centre ± width/2 (common practice: ' +
      'width = FWHM)',
    () => {
      const grid = makeGrid(560, 640, 0.02);
      for (const [widthNm, edgeWidthNm] of [
        [20, 2],
        [10, 2],
        [3, 3],
        [40, 8],
      ]) {
        const t = filterTransmission(
          { type: 'bandpass', centerNm: 600, widthNm, edgeWidthNm, peakTransmission: 0.9 },
          grid,
        );
        expect(at(t, grid, 600)).toBeCloseTo(0.9, 9);
        expect(Math.max(...t)).toBeCloseTo(0.9, 9);
        const floor = 1e-6;
        expect(at(t, grid, 600 - widthNm / 2)).toBeCloseTo(floor + (0.9 - floor) / 2, 9);
        expect(at(t, grid, 600 + widthNm / 2)).toBeCloseTo(floor + (0.9 - floor) / 2, 9);
      }
    },
  );

  it('filterTransmission(longpass) rises from 10 % to 90 % over exactly edgeWidthNm, centred on edgeNm', () => {
    const grid = makeGrid(580, 620, 0.01);
    for (const edgeWidthNm of [1, 2, 5]) {
      const t = filterTransmission(
        { type: 'longpass', edgeNm: 600, edgeWidthNm, peakTransmission: 1, blockingOD: 12 },
        grid,
      );
      const rise = crossingNm(t, grid, 0.9) - crossingNm(t, grid, 0.1);
      expect(rise).toBeCloseTo(edgeWidthNm, 3);
      expect(at(t, grid, 600)).toBeCloseTo(0.5, 9);
    }
  });

  it('filterTransmission uses the documented defaults: bandpass peak 0.93 and floor 10^-6 out of band', () => {
    const t = filterTransmission({ type: 'bandpass', centerNm: 605, widthNm: 20 }, DEFAULT_GRID);
    expect(FILTER_DEFAULTS.bandpass).toEqual({ peakTransmission: 0.93, edgeWidthNm: 2, blockingOD: 6 });
    expect(at(t, DEFAULT_GRID, 605)).toBeCloseTo(0.93, 12);
    expect(at(t, DEFAULT_GRID, 400) / 1e-6).toBeCloseTo(1, 9);
    expect(at(t, DEFAULT_GRID, 900) / 1e-6).toBeCloseTo(1, 9);
    expect(t.every((v) => v >= 1e-6 && v <= 0.93 + 1e-15)).toBe(true);
  });

  it(
    'filterTransmission(shortpass) mirrors a longpass about its edge, and a dichroic passing above matches a ' +
      'longpass',
    () => {
      const grid = makeGrid(500, 700, 0.5);
      const options = { edgeWidthNm: 3, peakTransmission: 0.9, blockingOD: 4 };
      const lp = filterTransmission({ type: 'longpass', edgeNm: 600, ...options }, grid);
      const sp = filterTransmission({ type: 'shortpass', edgeNm: 600, ...options }, grid);
      for (let k = 0; k <= 200; k++) expect(sp[200 - k]).toBeCloseTo(lp[200 + k], 12);
      const di = filterTransmission({ type: 'dichroic', edgeNm: 600, passes: 'above', ...options }, grid);
      expect(Array.from(di)).toEqual(Array.from(lp));
      const diDefault = filterTransmission({ type: 'dichroic', edgeNm: 600, passes: 'below' }, grid);
      expect(at(diDefault, grid, 500)).toBeCloseTo(0.95, 12);
      expect(at(diDefault, grid, 700)).toBeCloseTo(0.01, 12); // dichroic default OD 2
    },
  );

  it('filterTransmission(table) interpolates linearly and holds the end values beyond the table', () => {
    const grid = makeGrid(400, 800, 1);
    const t = filterTransmission(
      {
        type: 'table',
        points: [
          [500, 0.1],
          [600, 0.9],
          [700, 0.5],
        ],
      },
      grid,
    );
    expect(at(t, grid, 450)).toBe(0.1);
    expect(at(t, grid, 550)).toBeCloseTo(0.5, 12);
    expect(at(t, grid, 650)).toBeCloseTo(0.7, 12);
    expect(at(t, grid, 790)).toBe(0.5);
  });

  it('filterTransmission refuses a bandpass narrower than its own edges (the logistic model cannot make one)', () => {
    const path = ['channels', 2, 'filters', 0];
    const err = errorOf(() =>
      filterTransmission({ type: 'bandpass', centerNm: 600, widthNm: 3, edgeWidthNm: 4 }, DEFAULT_GRID, path),
    );
    expect([err.code, err.path]).toEqual(['invalid_input', [...path, 'edgeWidthNm']]);
  });
});

describe('channelTransmission', () => {
  it('channelTransmission multiplies every filter in series with the detector QE', () => {
    const bp: FilterSpec = { type: 'bandpass', centerNm: 605, widthNm: 20 };
    const lp: FilterSpec = { type: 'longpass', edgeNm: 590 };
    const t = channelTransmission({ id: 'c', filters: [bp, lp] }, DEFAULT_GRID);
    const a = filterTransmission(bp, DEFAULT_GRID);
    const b = filterTransmission(lp, DEFAULT_GRID);
    for (let i = 0; i < t.length; i += 7) expect(t[i]).toBeCloseTo(a[i] * b[i], 15);
  });
});

describe('a bandpass read at one wavelength', () => {
  it('gives the full grid value there: the floor exactly far from the band, to 1e-12 near it', () => {
    const grid = { startNm: 300, stepNm: 1, count: 701 };
    const filters = [
      { type: 'bandpass' as const, centerNm: 605, widthNm: 20 },
      { type: 'bandpass' as const, centerNm: 605, widthNm: 24, edgeWidthNm: 6.6 },
      { type: 'bandpass' as const, centerNm: 420, widthNm: 20, blockingOD: 12, peakTransmission: 0.5 },
      { type: 'bandpass' as const, centerNm: 700, widthNm: 5, edgeWidthNm: 5, blockingOD: 2 },
      { type: 'bandpass' as const, centerNm: 500, widthNm: 30, edgeWidthNm: 0 },
    ];
    for (const filter of filters) {
      const full = filterTransmission(filter, grid);
      for (let nm = 300; nm <= 1000; nm++) {
        const one = filterTransmission(filter, { startNm: nm, stepNm: 1, count: 1 })[0];
        const expected = full[nm - 300];
        const floor = Math.min(10 ** -(filter.blockingOD ?? FILTER_DEFAULTS.bandpass.blockingOD), 1);
        // A point beyond the band's reach is the floor itself; near the band the two walk the edge differently.
        if (expected === floor) expect(one, `${JSON.stringify(filter)} at ${nm} nm`).toBe(floor);
        else
          expect(Math.abs(one - expected), `${JSON.stringify(filter)} at ${nm} nm`).toBeLessThanOrEqual(
            1e-12 * expected,
          );
      }
    }
  });
});
