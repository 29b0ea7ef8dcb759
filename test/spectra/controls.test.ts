import { describe, expect, it } from 'vitest';
import { Matrix, pseudoInverse as mlPseudoInverse } from 'ml-matrix';
import { errorOf } from './helpers/errors';
import {
  createRandom,
  evaluateLotShift,
  evaluatePanel,
  fcsSpillover,
  measuredSpillover,
  predictedBands,
  compareSpillover,
  ratioStandardError,
  unmixingMatrix,
  type ControlsMeasurement,
  type PanelSpec,
} from '../../spectra/index';

const panel = (): PanelSpec => ({
  version: 1,
  excitation: [{ wavelengthNm: 405, powerRel: 1 }],
  probes: [
    { id: 'g', label: 'Green dot', material: 'cdse', emissionPeakNm: 560, quantumYield: 0.5, channel: 'c560' },
    { id: 'r', label: 'Red dot', material: 'cdse', emissionPeakNm: 620, quantumYield: 0.5, channel: 'c620' },
  ],
  channels: [
    { id: 'c560', label: 'Green', filters: [{ type: 'bandpass', centerNm: 560, widthNm: 40 }] },
    { id: 'c620', label: 'Red', filters: [{ type: 'bandpass', centerNm: 620, widthNm: 40 }] },
  ],
});

/**
 * Hand-worked example (Taylor 1997, ch. 3, quotient of independent uncertainties): unstained [10, 20, 5] with
 * SE [1, 2, 1]; control values [110, 40, 15] with sd [20, 10, 5] over n = 25, so SE [4, 2, 1]. Subtracted:
 * N = [100, 20, 10]. Primary a. Spill into b: 20 / 100 = 0.2; σN² = 4 + 4 = 8, σD² = 16 + 1 = 17;
 * σr = 0.2 · sqrt(8/400 + 17/10000) = 0.2 · sqrt(0.0217) = 0.029462. Into c: 0.1, σN² = 2,
 * σr = 0.1 · sqrt(2/100 + 0.0017) = 0.014731.
 */
const handWorked = (): ControlsMeasurement => ({
  channels: ['a', 'b', 'c'],
  unstained: [10, 20, 5],
  unstainedSd: [5, 10, 5],
  unstainedN: 25,
  controls: [{ probe: 'x', values: [110, 40, 15], sd: [20, 10, 5], n: 25 }],
});

describe('measuredSpillover', () => {
  it('measuredSpillover(hand-worked controls) gives spill 0.2 and 0.1 with SE 0.029462 and 0.014731', () => {
    const m = measuredSpillover(handWorked());
    expect(m.primaryChannel).toEqual([0]);
    expect(m.spillover.map((row) => row[0])).toEqual([1, 0.2, 0.1]);
    expect(m.se[0][0]).toBe(0);
    expect(m.se[1][0]).toBeCloseTo(0.029462, 6);
    expect(m.se[2][0]).toBeCloseTo(0.014731, 6);
  });

  it('measuredSpillover(two replicate rows) takes their mean and s/√k (k = 2: SE = |a − b| / 2 per channel)', () => {
    const m = measuredSpillover({
      channels: ['a', 'b'],
      unstained: [0, 0],
      controls: [
        { probe: 'x', values: [110, 30] },
        { probe: 'x', values: [90, 10] },
      ],
    });
    // Hand-worked: means [100, 20]; SE [10, 10]; spill 0.2; σr = sqrt(100 + 0.04·100) / 100 = 0.10198.
    expect(m.replicates).toEqual([2]);
    expect(m.signal.map((row) => row[0])).toEqual([100, 20]);
    expect(m.se[1][0]).toBeCloseTo(0.10198, 5);
  });

  it('measuredSpillover SE agrees within 5 % with a seeded Monte Carlo of 4000 noisy measurements', () => {
    // Independent check: draw normal noise with the stated SEs (createRandom, Box–Muller) and take the sample spread.
    const truth = { u: [10, 20, 5], x: [110, 40, 15], seU: [1, 2, 1], seX: [4, 2, 1] };
    const rng = createRandom(2026);
    const spills: number[][] = [[], []];
    for (let t = 0; t < 4000; t++) {
      const unstained = truth.u.map((v, c) => v + truth.seU[c] * rng.normal());
      const values = truth.x.map((v, c) => v + truth.seX[c] * rng.normal());
      const m = measuredSpillover({ channels: ['a', 'b', 'c'], unstained, controls: [{ probe: 'x', values }] });
      spills[0].push(m.spillover[1][0]);
      spills[1].push(m.spillover[2][0]);
    }
    const sd = (xs: number[]) => {
      const mean = xs.reduce((a, v) => a + v, 0) / xs.length;
      return Math.sqrt(xs.reduce((a, v) => a + (v - mean) ** 2, 0) / (xs.length - 1));
    };
    const predicted = measuredSpillover(handWorked()).se;
    expect(Math.abs(sd(spills[0]) / predicted[1][0]! - 1)).toBeLessThan(0.05);
    expect(Math.abs(sd(spills[1]) / predicted[2][0]! - 1)).toBeLessThan(0.05);
  });

  it('ratioStandardError(20, 100, √8, √17) is 0.2 · sqrt(8/20² + 17/100²) (Taylor 1997, ch. 3)', () => {
    expect(ratioStandardError(20, 100, Math.sqrt(8), Math.sqrt(17))).toBeCloseTo(0.2 * Math.sqrt(0.0217), 12);
  });

  it('measuredSpillover with a panel takes the assigned channel as primary even when another is brighter', () => {
    const p = panel();
    const m = measuredSpillover(
      {
        channels: ['c560', 'c620'],
        unstained: [0, 0],
        controls: [
          { probe: 'g', values: [50, 100] },
          { probe: 'r', values: [5, 100] },
        ],
      },
      p,
    );
    expect(m.primaryChannel).toEqual([0, 1]);
    expect(m.spillover[1][0]).toBe(2);
  });
});

describe('measuredSpillover refusals and warnings', () => {
  const base = (): ControlsMeasurement => ({
    channels: ['c560', 'c620'],
    unstained: [10, 10],
    controls: [
      { probe: 'g', values: [110, 20] },
      { probe: 'r', values: [12, 210] },
    ],
  });

  it('measuredSpillover with a missing value names the probe and the channel', () => {
    const m = base();
    m.controls[1].values[0] = Number.NaN;
    const e = errorOf(() => measuredSpillover(m, panel()));
    expect(e.path).toEqual(['controls', 1, 'values', 0]);
    expect(e.message).toBe('the control of Red dot (r) has no value for channel Green (c560)');
  });

  it('measuredSpillover with a probe not in the panel refuses it at controls.i.probe', () => {
    const m = base();
    m.controls[0].probe = 'blue';
    const e = errorOf(() => measuredSpillover(m, panel()));
    expect(e.path).toEqual(['controls', 0, 'probe']);
    expect(e.message).toMatch(/probe blue is not a probe of the panel/);
  });

  it('measuredSpillover with three values for two channels says so at controls.i.values', () => {
    const m = base();
    m.controls[0].values = [1, 2, 3];
    const e = errorOf(() => measuredSpillover(m, panel()));
    expect(e.path).toEqual(['controls', 0, 'values']);
    expect(e.message).toMatch(/has 3 values for 2 channels/);
  });

  it('measuredSpillover with a value far under the unstained and no SE refuses it naming probe and channel', () => {
    const m = base();
    m.controls[0].values[1] = 5; // −5 against a primary of 100: past 0.5 %
    const e = errorOf(() => measuredSpillover(m, panel()));
    expect(e.path).toEqual(['controls', 0, 'values', 1]);
    expect(e.message).toMatch(/Green dot \(g\) in channel Red \(c620\) is below the unstained sample by 5/);
  });

  it('measuredSpillover keeps a negative within 2 SE as a warning and refuses one beyond 2 SE', () => {
    const m = base();
    m.controls[0] = { probe: 'g', values: [110, 7], sd: [10, 10], n: 25 }; // −3 with SE 2: 1.5 SE
    const kept = measuredSpillover(m, panel());
    expect(kept.spillover[1][0]).toBeCloseTo(-0.03, 12);
    expect(kept.warnings.join(' ')).toMatch(/below the unstained sample by 3, within 2 SE: kept as noise/);
    m.controls[0].values[1] = 5; // −5 with SE 2: 2.5 SE, and 5 % of the primary
    expect(errorOf(() => measuredSpillover(m, panel())).path).toEqual(['controls', 0, 'values', 1]);
  });

  it('measuredSpillover keeps a negative past 2 SE but within 0.5 % of the primary signal as a warning', () => {
    const m = base();
    m.controls[0] = { probe: 'g', values: [1010, 5.5], sd: [10, 10], n: 25 }; // −4.5 (2.25 SE) on a primary of 1000
    const kept = measuredSpillover(m, panel());
    expect(kept.warnings.join(' ')).toMatch(/by 4\.5, within 0\.5 % of its primary signal: kept as noise/);
  });

  it('measuredSpillover refuses a control no brighter than the unstained in its primary channel', () => {
    const m = base();
    m.controls[1].values = [200, 10];
    const e = errorOf(() => measuredSpillover(m, panel()));
    expect(e.message).toMatch(/Red dot \(r\) is no brighter than the unstained sample in its primary channel Red/);
  });

  it('measuredSpillover refuses a primary channel under 10 % of the control’s brightest channel', () => {
    const m = base();
    m.controls[1].values = [210, 15];
    expect(errorOf(() => measuredSpillover(m, panel())).message).toMatch(/is dark in its primary channel Red/);
  });

  it('measuredSpillover warns for a panel probe without a control and refuses an empty control list', () => {
    const m = base();
    m.controls.pop();
    expect(measuredSpillover(m, panel()).warnings).toContain(
      'probe Red dot (r) has no control: its column is left out',
    );
    m.controls.pop();
    expect(errorOf(() => measuredSpillover(m, panel())).path).toEqual(['controls']);
  });
});

describe('predictedBands and compareSpillover', () => {
  it('predictedBands at no shift equals evaluatePanel’s spillover for assigned probes', () => {
    const p = panel();
    const ev = evaluatePanel(p, { sensitivity: false });
    const bands = predictedBands(p, ['c560', 'c620'], ['g', 'r'], [0, 1]);
    expect(bands[1][0].predicted).toBeCloseTo(ev.spillover[1][0]!, 12);
    expect(bands[0][1].predicted).toBeCloseTo(ev.spillover[0][1]!, 12);
  });

  it('predictedBands’ largest off-primary band top equals evaluateLotShift’s worst spillover', () => {
    const p = panel();
    const bands = predictedBands(p, ['c560', 'c620'], ['g', 'r'], [0, 1]);
    const top = Math.max(bands[1][0].band![1], bands[0][1].band![1]);
    expect(top).toBeCloseTo(evaluateLotShift(p).worstSpillover!.spillover, 12);
  });

  it('compareSpillover flags an entry 3 SE and outside its band, with its numbers, not one within 1e-3 of it', () => {
    const p = panel();
    const predicted = evaluatePanel(p, { sensitivity: false }).spillover[1][0]!;
    const measured = predicted + 0.06; // 6 points above, SE 0.02: 3 SE
    const m = {
      channels: ['c560', 'c620'],
      probes: ['g', 'r'],
      signal: [],
      spillover: [
        [1, 0],
        [measured, 1],
      ],
      se: [
        [0, null],
        [0.02, 0],
      ],
      primaryChannel: [0, 1],
      replicates: [1, 1],
      warnings: [],
    };
    const result = compareSpillover(m, p);
    const entry = result.entries[1][0];
    expect(entry.flagged).toBe(true);
    expect(entry.sentence).toMatch(
      new RegExp(
        `^Green dot spills ${(measured * 100).toFixed(1)} % into Red; predicted ${(predicted * 100).toFixed(1)}`,
      ),
    );
    expect(entry.sentence).toMatch(/: 6\.0 points above, 3\.0 SE$/);
    expect(result.sentences).toEqual([entry.sentence]);
    // The same distance with an SE of 0.04: 6 points from the prediction but within 2 SE of the band's top.
    m.se[1][0] = 0.04;
    expect(compareSpillover(m, p).entries[1][0].flagged).toBe(false);
  });
});

/** A minimal reader of the FCS 3.1 $SPILLOVER value (Spidlen et al. 2010, section 3.2): n, n names, n² values. */
function parseSpillover(text: string): { names: string[]; rows: number[][] } {
  const parts = text.split(',');
  const n = Number(parts[0]);
  expect(parts).toHaveLength(1 + n + n * n);
  const values = parts.slice(1 + n).map(Number);
  return { names: parts.slice(1, 1 + n), rows: Array.from({ length: n }, (_, i) => values.slice(i * n, i * n + n)) };
}

describe('fcsSpillover and unmixingMatrix', () => {
  const matrix = {
    channels: ['c1', 'c2', 'c3'],
    probes: ['x', 'y'],
    spillover: [
      [0.1, 1],
      [1, 0.2],
      [0.05, 0.3],
    ],
    primaryChannel: [1, 0],
  };

  it('fcsSpillover writes n, the primaries’ names and row i = probe i’s spill into each primary (FCS 3.1)', () => {
    const result = fcsSpillover(matrix);
    if (!result.ok) throw new Error(result.reason);
    // Hand-worked: parameters c2 (x) then c1 (y); x row [1, 0.1], y row [0.2, 1].
    expect(parseSpillover(result.text)).toEqual({
      names: ['c2', 'c1'],
      rows: [
        [1, 0.1],
        [0.2, 1],
      ],
    });
  });

  it('fcsSpillover refuses two probes sharing a primary channel and a name containing a comma', () => {
    expect(fcsSpillover({ ...matrix, primaryChannel: [0, 0] })).toEqual({
      ok: false,
      reason: 'probes x and y share the primary channel c1: the matrix cannot be square',
    });
    const named = fcsSpillover({ ...matrix, channels: ['c,1', 'c2', 'c3'] });
    expect(named.ok).toBe(false);
  });

  it('unmixingMatrix(reference) equals ml-matrix pseudoInverse within 1e-12', () => {
    const expected = mlPseudoInverse(new Matrix(matrix.spillover)).to2DArray();
    const u = unmixingMatrix(matrix.spillover);
    expect(u).toHaveLength(2);
    u.forEach((row, i) => row.forEach((v, j) => expect(Math.abs(v - expected[i][j])).toBeLessThan(1e-12)));
  });

  it('unmixingMatrix refuses a reference with an undefined entry', () => {
    expect(errorOf(() => unmixingMatrix([[1, null]])).message).toMatch(/undefined entry/);
  });
});
