import { describe, expect, it } from 'vitest';
import {
  DEFAULT_GRID,
  GAUSSIAN_FWHM_PER_SIGMA,
  HC_EV_NM,
  YU_2003,
  centerEvForPeakNm,
  evaluatePanel,
  filterTransmission,
  firstExcitonNmForDiameter,
  fwhmNmOfLine,
  makeGrid,
  panelSpectra,
  peakNmOfLine,
  resolveDot,
  sampleGaussianLine,
  spectrumOnGrid,
  yuDiameterNm,
} from '../../spectra/index';
import type { PanelSpec, WavelengthGrid } from '../../spectra/index';

// The shortcuts of an evaluation (window cut-offs, the table exponential, Newton and table inversions) checked against
// the plain formulas written out here with Math.exp and bisection.

/** The Gaussian-in-energy line on every grid point with Math.exp, renormalised to unit area. */
function naiveLine(grid: WavelengthGrid, centerEv: number, fwhmEv: number): number[] {
  const sigma = fwhmEv / GAUSSIAN_FWHM_PER_SIGMA;
  const out = new Array<number>(grid.count);
  let sum = 0;
  for (let i = 0; i < grid.count; i++) {
    const nm = grid.startNm + i * grid.stepNm;
    out[i] = (Math.exp(-0.5 * ((HC_EV_NM / nm - centerEv) / sigma) ** 2) * HC_EV_NM) / (nm * nm);
    sum += out[i];
  }
  return out.map((v) => v / (sum * grid.stepNm));
}

const LINES: [number, number][] = [
  [2.05, 0.09],
  [2.6, 0.12],
  [1.7, 0.3],
  [2.9, 0.5],
  [1.3, 0.05],
  [3.6, 0.02],
];
const GRIDS = [DEFAULT_GRID, makeGrid(300, 1000, 0.25), makeGrid(400, 900, 3), makeGrid(300, 605, 0.5)];

describe('cold path: line sampling', () => {
  it.each(LINES)(
    'sampleGaussianLine(grid, %s eV, %s eV) equals the Math.exp formula at 1e-12 wherever it is above 1e-15 of its ' +
      'largest value on the grid',
    (c, w) => {
      for (const grid of GRIDS) {
        const fast = spectrumOnGrid(sampleGaussianLine(grid, c, w).spectrum, grid);
        const naive = naiveLine(grid, c, w);
        const peak = Math.max(...naive);
        if (Number.isNaN(peak)) {
          // Not a single point of the line is representable on this grid: nothing to renormalise, all zeros.
          expect(fast.every((v) => v === 0)).toBe(true);
          continue;
        }
        for (let i = 0; i < grid.count; i++) {
          // The ±10σ cut zeroes only values under 2e-22 of the line's own peak, magnified at most 1e6 times by the
          // renormalisation when a grid cuts most of the line off.
          if (naive[i] > 1e-15 * peak) expect(Math.abs(fast[i] - naive[i]) / naive[i]).toBeLessThan(1e-12);
          else expect(fast[i]).toBeLessThanOrEqual(1e-15 * peak);
        }
      }
    },
  );

  it('sampleGaussianLine for a line almost entirely off the grid samples every point, like the plain formula', () => {
    // Peak near 1030 nm on a grid ending at 700 nm: well under 1e-6 of the line lies on it.
    const grid = makeGrid(300, 700, 1);
    const fast = sampleGaussianLine(grid, 1.2, 0.15);
    const naive = naiveLine(grid, 1.2, 0.15);
    expect(fast.areaOnGrid).toBeLessThan(1e-6);
    expect(fast.areaOnGrid).toBeGreaterThan(0);
    // Compared where the values before renormalising are normal numbers (subnormals carry too few digits).
    const values = spectrumOnGrid(fast.spectrum, grid);
    for (let i = 0; i < grid.count; i++)
      if (naive[i] * fast.areaOnGrid > 1e-290) expect(Math.abs(values[i] - naive[i]) / naive[i]).toBeLessThan(1e-9);
  });

  it(
    'fwhmNmOfLine equals the distance between half-maximum wavelengths found by plain bisection, to 1e-10 ' +
      'relative',
    () => {
      const density = (nm: number, c: number, s: number) =>
        (Math.exp(-0.5 * ((HC_EV_NM / nm - c) / s) ** 2) * HC_EV_NM) / (nm * nm);
      for (const [c, w] of LINES) {
        const s = w / GAUSSIAN_FWHM_PER_SIGMA;
        const peakNm = peakNmOfLine(c, w);
        const half = density(peakNm, c, s) / 2;
        const cross = (outsideNm: number) => {
          let inside = peakNm;
          let outside = outsideNm;
          for (let k = 0; k < 200; k++) {
            const mid = 0.5 * (inside + outside);
            if (density(mid, c, s) > half) inside = mid;
            else outside = mid;
          }
          return 0.5 * (inside + outside);
        };
        const reference = cross(HC_EV_NM / Math.max(c - 10 * w, c / 100)) - cross(HC_EV_NM / (c + 10 * w));
        expect(Math.abs(fwhmNmOfLine(c, w) - reference) / reference).toBeLessThan(1e-10);
      }
    },
  );
});

describe('cold path: sizing inversion', () => {
  // The Yu–Qu–Guo–Peng polynomial D(λ) (Chem. Mater. 2003) evaluated at the returned λ must give back the diameter;
  // the CdTe curve is nearly flat near 560–610 nm, where the inversion is hardest.
  it.each([
    ['cdse', 1.5, 8],
    ['cdte', 2, 7],
    ['cds', 1.5, 5.5],
  ] as const)(
    'firstExcitonNmForDiameter(%s, d) inverts the published D(λ) to 1e-12 nm over its range',
    (material, lo, hi) => {
      for (let d = lo; d <= hi; d += 0.0137) {
        const nm = firstExcitonNmForDiameter(material, d);
        expect(Math.abs(yuDiameterNm(YU_2003[material], nm) - d)).toBeLessThan(1e-12);
      }
    },
  );

  it('firstExcitonNmForDiameter(cdte, d) agrees with a 200-step bisection of the published D(λ) to 1e-9 nm', () => {
    for (let d = 2; d <= 7; d += 0.05) {
      let [lo, hi] = YU_2003.cdte.bracketNm as readonly number[];
      for (let k = 0; k < 200; k++) {
        const mid = 0.5 * (lo + hi);
        if (yuDiameterNm(YU_2003.cdte, mid) < d) lo = mid;
        else hi = mid;
      }
      expect(Math.abs(firstExcitonNmForDiameter('cdte', d) - 0.5 * (lo + hi))).toBeLessThan(1e-9);
    }
  });
});

describe('cold path: filter edges', () => {
  const logistic = (x: number) => 1 / (1 + Math.exp(-x));
  it.each([2, 6, 12])(
    'filterTransmission(longpass, shortpass at OD %s) equals the plain logistic formula at 1e-11 relative on every ' +
      'grid point',
    (od) => {
      for (const grid of [DEFAULT_GRID, makeGrid(300, 1000, 0.2)]) {
        for (const edgeWidthNm of [0.5, 2, 10]) {
          const s = edgeWidthNm / (2 * Math.log(9));
          const floor = 10 ** -od;
          const long = filterTransmission(
            { type: 'longpass', edgeNm: 600.3, edgeWidthNm, blockingOD: od, peakTransmission: 0.9 },
            grid,
          );
          const short = filterTransmission(
            { type: 'shortpass', edgeNm: 600.3, edgeWidthNm, blockingOD: od, peakTransmission: 0.9 },
            grid,
          );
          for (let i = 0; i < grid.count; i++) {
            const nm = grid.startNm + i * grid.stepNm;
            const expectLong = floor + (0.9 - floor) * logistic((nm - 600.3) / s);
            const expectShort = floor + (0.9 - floor) * logistic((600.3 - nm) / s);
            expect(Math.abs(long[i] - expectLong) / expectLong).toBeLessThan(1e-11);
            expect(Math.abs(short[i] - expectShort) / expectShort).toBeLessThan(1e-11);
          }
        }
      }
    },
  );
});

describe('cold path: a whole evaluation', () => {
  const panel: PanelSpec = {
    version: 1,
    excitation: [{ wavelengthNm: 405 }, { wavelengthNm: 488, powerRel: 0.5 }],
    probes: [490, 525, 565, 605, 640, 680, 715].map((nm, i) => ({
      id: `p${i}`,
      material: nm <= 650 ? 'cdse' : 'cdte',
      emissionPeakNm: nm,
      quantumYield: 0.5,
    })),
    channels: [490, 525, 565, 605, 640, 680, 715, 800].map((nm, i) => ({
      id: `c${i}`,
      filters: [{ type: 'bandpass', centerNm: nm, widthNm: 20, blockingOD: 12 }],
    })),
  };

  it(
    'evaluatePanel collected at OD 12 equals a naive full-grid sum of panelSpectra arrays × ε × QY, each line ' +
      'seeing the emission cut at its wavelength and renormalised, to 1e-12 relative',
    () => {
      const ev = evaluatePanel(panel, { sensitivity: false });
      const spectra = panelSpectra(panel);
      ev.probes.forEach((probe, p) => {
        const em = spectra.emission[p].values;
        spectra.channels.forEach((channel, c) => {
          let naive = 0;
          panel.excitation.forEach((line, l) => {
            let kept = 0;
            let collected = 0;
            for (let i = 0; i < spectra.count; i++) {
              if (spectra.startNm + i * spectra.stepNm <= line.wavelengthNm) continue;
              kept += em[i];
              collected += em[i] * channel.values[i];
            }
            const weight = (line.powerRel ?? 1) * probe.extinctionAtLines[l] * probe.quantumYield;
            if (kept > 0) naive += (weight * collected) / kept;
          });
          expect(Math.abs(ev.collected[c][p] - naive) / naive).toBeLessThan(1e-12);
        });
      });
    },
  );

  it(
    'resolveDot(cdse 605 nm) puts its per-nm emission peak at 605 nm to 0.5 nm on the grid (centre placed from the ' +
      'peak)',
    () => {
      const dot = resolveDot({ material: 'cdse', emissionPeakNm: 605 });
      let k = 0;
      dot.emission.values.forEach((v, i) => {
        if (v > dot.emission.values[k]) k = i;
      });
      expect(Math.abs(dot.emission.startNm + k * dot.emission.stepNm - 605)).toBeLessThanOrEqual(0.5);
      expect(peakNmOfLine(centerEvForPeakNm(605, 0.1), 0.1)).toBeCloseTo(605, 9);
    },
  );
});
