import { describe, expect, it } from 'vitest';
import {
  DEFAULT_GRID,
  collectedMatrix,
  crosstalkFigures,
  evaluateLotShift,
  evaluatePanel,
  filterTransmission,
  shiftEmission,
} from '../../spectra/index';
import type { PanelSpec } from '../../spectra/index';
import { gaussianProbe } from './helpers/probes';

// Emissions held on the whole grid (a tiny floor everywhere), so a shift moves every point.
const wholeGrid = { reachSigmas: Infinity, floor: 1e-300 };

const gaussian = (peakNm: number, sigmaNm: number) =>
  Array.from({ length: DEFAULT_GRID.count }, (_, i) =>
    Math.exp(-0.5 * ((DEFAULT_GRID.startNm + i - peakNm) / sigmaNm) ** 2),
  );

describe('crosstalkFigures', () => {
  // Worked by hand: column sums and ratios of a 3 × 3 matrix.
  it('crosstalkFigures on a hand-made matrix gives the hand-computed spillover, purity and worst pair', () => {
    const collected = [
      [100, 10, 0],
      [5, 50, 20],
      [1, 2, 40],
    ];
    const f = crosstalkFigures(collected, [undefined, undefined, undefined], ['a', 'b', 'c'], ['x', 'y', 'z']);
    expect(f.primaryChannel).toEqual([0, 1, 2]);
    expect(f.spillover[1][0]).toBeCloseTo(0.05, 15);
    expect(f.spillover[0][1]).toBeCloseTo(0.2, 15);
    expect(f.spillover[1][2]).toBeCloseTo(0.5, 15);
    expect(f.purity).toEqual([100 / 110, 50 / 75, 40 / 43].map((v) => expect.closeTo(v, 15)));
    // interference(c → b) = collected[y][c] / collected[y][b] = 20 / 50 is the largest of the six pairs.
    expect(f.worst).toEqual({ from: 'c', into: 'b', interference: 0.4 });
    expect(f.belowResolution[0][2]).toBe(true); // spillover 0
    expect(f.warnings).toEqual([]);
  });

  it('crosstalkFigures reports a channel with no probe signal as null purity with a warning', () => {
    const f = crosstalkFigures(
      [
        [1, 0],
        [0, 1],
        [0, 0],
      ],
      [undefined, undefined],
      ['a', 'b'],
      ['x', 'y', 'z'],
    );
    expect(f.purity[2]).toBeNull();
    expect(f.warnings[0]).toMatch(/channel z collects no probe signal/);
  });
});

describe('collectedMatrix', () => {
  it('collectedMatrix matches a naive full-grid sum to 1e-12 relative, even against a 10^-12 blocking floor', () => {
    const transmissions = [
      filterTransmission({ type: 'longpass', edgeNm: 700, blockingOD: 12 }, DEFAULT_GRID),
      filterTransmission({ type: 'shortpass', edgeNm: 450, blockingOD: 12 }, DEFAULT_GRID),
      filterTransmission({ type: 'bandpass', centerNm: 605, widthNm: 20 }, DEFAULT_GRID),
      filterTransmission(
        {
          type: 'table',
          points: [
            [400, 0],
            [600, 0.9],
            [800, 0],
          ],
        },
        DEFAULT_GRID,
      ),
    ];
    const emissions = [gaussian(480, 10), gaussian(600, 12), gaussian(760, 20)];
    const probes = emissions.map((emission) => [{ emission, from: 0, weightByChannel: [1, 2, 3, 4] }]);
    const collected = collectedMatrix(probes, transmissions, 1);
    transmissions.forEach((t, c) =>
      emissions.forEach((em, p) => {
        let naive = 0;
        for (let i = 0; i < t.length; i++) naive += em[i] * t[i];
        naive *= c + 1;
        expect(Math.abs(collected[c][p] - naive) / naive).toBeLessThan(1e-12);
      }),
    );
  });

  it('collectedMatrix with a line held on part of the grid equals the naive sum of its grid-long form', () => {
    const transmission = filterTransmission({ type: 'bandpass', centerNm: 605, widthNm: 20 }, DEFAULT_GRID);
    const full = gaussian(600, 10);
    const held = { emission: full.slice(200, 400), from: 200, weightByChannel: [2] };
    const naive = 2 * full.reduce((sum, v, i) => sum + v * transmission[i], 0);
    expect(Math.abs(collectedMatrix([[held]], [transmission], 1)[0][0] - naive) / naive).toBeLessThan(1e-9);
  });

  it('collectedMatrix handles constant, two-level and single-step transmissions exactly like a naive sum', () => {
    const n = DEFAULT_GRID.count;
    const step = Array.from({ length: n }, (_, i) => (i < 300 ? 0.25 : 1));
    const spike = Array.from({ length: n }, (_, i) => (i === 350 ? 1 : 1e-6));
    const transmissions = [
      new Array<number>(n).fill(1),
      step,
      spike,
      Array.from({ length: n }, (_, i) => (i === 0 ? 0.5 : 0)),
    ];
    const emission = gaussian(560, 30);
    const collected = collectedMatrix([[{ emission, from: 0, weightByChannel: [1, 1, 1, 1] }]], transmissions, 1);
    transmissions.forEach((t, c) => {
      const naive = t.reduce((sum, v, i) => sum + v * emission[i], 0);
      expect(Math.abs(collected[c][0] - naive) / naive).toBeLessThan(1e-12);
    });
  });
});

describe('lot-shift sensitivity', () => {
  it('shiftEmission moves a spectrum by whole grid steps exactly and by fractions linearly', () => {
    const em = { startNm: 300, stepNm: 1, values: gaussian(600, 10) };
    const moved = shiftEmission(em, 5);
    expect(moved.startNm).toBe(305);
    for (let k = 0; k < em.values.length; k++) expect(moved.values[k]).toBe(em.values[k]);
    const half = shiftEmission(em, 0.5);
    expect(half.startNm).toBe(300);
    expect(half.values[300]).toBeCloseTo((em.values[300] + em.values[299]) / 2, 15);
  });

  // Independent route: build the shifted panels explicitly (the measured tables moved by ±5 nm) and evaluate them.
  it('evaluatePanel lotShiftSensitivity and evaluateLotShift equal the worst of the explicitly shifted panels', () => {
    const probes = [
      gaussianProbe('a', 560, 12, wholeGrid),
      gaussianProbe('b', 600, 12, wholeGrid),
      gaussianProbe('c', 640, 14, wholeGrid),
    ];
    const channels = [560, 600, 640].map((nm, i) => ({
      id: `c${i}`,
      filters: [{ type: 'bandpass' as const, centerNm: nm, widthNm: 20 }],
    }));
    const panel: PanelSpec = { version: 1, excitation: [{ wavelengthNm: 405 }], probes, channels };
    const ev = evaluatePanel(panel);
    let worst = -1;
    let worstCase = '';
    probes.forEach((probe, p) => {
      for (const shift of [5, -5]) {
        const moved = {
          ...probe,
          measuredEmission: {
            points: probe.measuredEmission!.points.map(([nm, v]) => [nm + shift, v] as [number, number]),
          },
        };
        const shifted = evaluatePanel(
          { ...panel, probes: probes.map((q, k) => (k === p ? moved : q)) },
          { sensitivity: false },
        );
        if (shifted.worst.interference! > worst) {
          worst = shifted.worst.interference!;
          worstCase = `${probe.id} ${shift}`;
        }
      }
    });
    const lot = ev.lotShiftSensitivity!;
    // The check on its own (as the page adds it after the rest) gives the same figures, explicit shifts included.
    const alone = evaluateLotShift(panel);
    expect(alone.worstInterference!.interference).toBeCloseTo(worst, 6);
    expect(`${alone.worstInterference!.shiftedProbe} ${alone.worstInterference!.shiftNm}`).toBe(worstCase);
    expect(alone.baseline.worstInterference).toBe(ev.worst.interference);
    expect(lot.shiftNm).toBe(5);
    expect(lot.baseline.worstInterference).toBe(ev.worst.interference);
    expect(lot.worstInterference!.interference).toBeCloseTo(worst, 6);
    expect(`${lot.worstInterference!.shiftedProbe} ${lot.worstInterference!.shiftNm}`).toBe(worstCase);
    expect(lot.worstInterference!.interference).toBeGreaterThan(ev.worst.interference!);
  });
});
