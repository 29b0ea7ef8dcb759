// Measured reference columns in place of modelled ones. Expected values are worked by hand in each test from the
// definitions: a measured column keeps its shape and takes the model's signal in the probe's primary channel, and the
// spillover of a probe into channel c is its column's value in c over its value in its primary channel
// (common practice: single-stain controls normalised to their primary detector).
import { describe, expect, it } from 'vitest';
import { evaluatePanel, runDesign, withMeasuredColumns, type PanelSpec } from '../../spectra/index';

const twoByTwo: Pick<PanelSpec, 'probes' | 'channels'> = {
  probes: [
    { id: 'a', material: 'cdse', emissionPeakNm: 540 },
    { id: 'b', material: 'cdse', emissionPeakNm: 600 },
  ],
  channels: [
    { id: 'green', filters: [{ type: 'bandpass', centerNm: 540, widthNm: 20 }] },
    { id: 'red', filters: [{ type: 'bandpass', centerNm: 600, widthNm: 20 }] },
  ],
};
/** collected[c][p]: a gives 10 in green and 2 in red; b gives 1 in green and 8 in red. */
const modelled = [
  [10, 1],
  [2, 8],
];

describe('withMeasuredColumns', () => {
  it('withMeasuredColumns(a measured [100, 50]) gives a the column [10, 5]: measured shape, modelled green', () => {
    const panel = {
      ...twoByTwo,
      measuredReference: { channels: ['green', 'red'], columns: [{ probe: 'a', values: [100, 50] }] },
    };
    const r = withMeasuredColumns(modelled, panel, [undefined, undefined]);
    // Primary of a: its brightest measured channel, green (100). Scale 10 / 100: [100, 50] → [10, 5].
    expect(r.collected).toEqual([
      [10, 1],
      [5, 8],
    ]);
    expect(r.source).toEqual(['measured', 'model']);
    expect(r.warnings).toEqual([]);
    expect(modelled[1][0]).toBe(2); // the input matrix is not changed
  });

  it("withMeasuredColumns reads values in the reference's channel order and scales on the assigned channel", () => {
    // Channels listed red first; b assigned to green (index 0 of the panel): b's green value 40 takes the model's 1.
    const panel = {
      ...twoByTwo,
      measuredReference: { channels: ['red', 'green'], columns: [{ probe: 'b', values: [120, 40] }] },
    };
    const r = withMeasuredColumns(modelled, panel, [undefined, 0]);
    expect(r.collected[0][1]).toBeCloseTo(1, 12);
    expect(r.collected[1][1]).toBeCloseTo(3, 12); // 120 × 1 / 40
  });

  it('withMeasuredColumns counts a negative value after subtraction as 0', () => {
    const panel = {
      ...twoByTwo,
      measuredReference: { channels: ['green', 'red'], columns: [{ probe: 'a', values: [100, -3] }] },
    };
    expect(withMeasuredColumns(modelled, panel, [undefined, undefined]).collected[1][0]).toBe(0);
  });

  it('withMeasuredColumns keeps the model and warns when the reference lacks a channel of the panel', () => {
    const panel = {
      ...twoByTwo,
      measuredReference: { channels: ['green', 'blue'], columns: [{ probe: 'a', values: [1, 2] }] },
    };
    const r = withMeasuredColumns(modelled, panel, [undefined, undefined]);
    expect(r.collected).toBe(modelled);
    expect(r.source).toEqual(['model', 'model']);
    expect(r.warnings[0]).toMatch(
      /^the measured reference has no values for channel red \(it was taken on green, blue\)/,
    );
  });

  it("withMeasuredColumns reads only the panel's channels of a reference taken on more channels", () => {
    const panel = {
      ...twoByTwo,
      measuredReference: { channels: ['blue', 'red', 'green'], columns: [{ probe: 'a', values: [70, 30, 60] }] },
    };
    // Blue is not in the panel: a's primary is green (60 of its own channels), scale 10 / 60: red 30 → 5.
    const r = withMeasuredColumns(modelled, panel, [undefined, undefined]);
    expect(r.source).toEqual(['measured', 'model']);
    expect(r.collected[0][0]).toBeCloseTo(10, 12);
    expect(r.collected[1][0]).toBeCloseTo(5, 12);
  });

  it('withMeasuredColumns skips with a warning a column of an unknown probe and one dark in its channel', () => {
    const columns = [
      { probe: 'gone', values: [1, 2] },
      { probe: 'b', values: [5, 0] },
    ];
    const panel = { ...twoByTwo, measuredReference: { channels: ['green', 'red'], columns } };
    // b assigned to red, where its control measured 0: it cannot be scaled.
    const r = withMeasuredColumns(modelled, panel, [undefined, 1]);
    expect(r.source).toEqual(['model', 'model']);
    expect(r.warnings).toEqual([
      'the measured column of probe gone is not used: the panel has no such probe',
      'the measured column of probe b is not used: it is dark in its channel red',
    ]);
  });
});

describe('evaluatePanel with a measured reference', () => {
  const panel: PanelSpec = { version: 1, excitation: [{ wavelengthNm: 405 }], ...twoByTwo };

  it('evaluatePanel: a measured column 3 × the modelled one changes no figure and is marked measured', () => {
    const plain = evaluatePanel(panel, { sensitivity: false });
    const a = plain.collected.map((row) => 3 * row[0]);
    const measured = evaluatePanel(
      { ...panel, measuredReference: { channels: ['green', 'red'], columns: [{ probe: 'a', values: a }] } },
      { sensitivity: false },
    );
    expect(measured.referenceColumns).toEqual(['measured', 'model']);
    expect(plain.referenceColumns).toEqual(['model', 'model']);
    for (let c = 0; c < 2; c++)
      for (let p = 0; p < 2; p++) expect(measured.collected[c][p]).toBeCloseTo(plain.collected[c][p], 9);
    measured.noiseAmplification.forEach((g, p) => expect(g).toBeCloseTo(plain.noiseAmplification[p]!, 9));
  });

  it('evaluatePanel: a measured column spilling 25 % into red gives spillover 0.25 there and more noise for b', () => {
    const plain = evaluatePanel(panel, { sensitivity: false });
    const measured = evaluatePanel(
      { ...panel, measuredReference: { channels: ['green', 'red'], columns: [{ probe: 'a', values: [400, 100] }] } },
      { sensitivity: false },
    );
    expect(measured.primaryChannel[0]).toBe(0);
    expect(measured.spillover[1][0]).toBeCloseTo(0.25, 12);
    expect(plain.spillover[1][0]!).toBeLessThan(0.05);
    expect(measured.noiseAmplification[1]!).toBeGreaterThan(plain.noiseAmplification[1]!);
  });
});

describe('runDesign with a measured reference (catalog mode)', () => {
  // Two targets and the two-colour panel's probes and channels as candidates: a's control spills 60 % into red.
  const request = {
    targets: [
      { name: 'first', abundance: 'high' as const, lock: { probe: 'a', channel: 'green' } },
      { name: 'second', abundance: 'high' as const, lock: { probe: 'b', channel: 'red' } },
    ],
    excitation: [{ wavelengthNm: 405 }],
    candidates: { probes: twoByTwo.probes, channels: twoByTwo.channels },
    options: { maxInterference: 1 },
  };
  const reference = { channels: ['green', 'red'], columns: [{ probe: 'a', values: [500, 300] }] };

  it('runDesign: the locked probe a keeps its measured column; the proposal evaluates a spilling 60 % into red', () => {
    const plain = runDesign(request);
    const measured = runDesign({ ...request, measuredReference: reference });
    expect(plain.evaluation!.spillover[1][0]!).toBeLessThan(0.05);
    // 300 / 500, worked by hand.
    expect(measured.evaluation!.spillover[1][0]).toBeCloseTo(0.6, 9);
    expect(measured.evaluation!.referenceColumns).toEqual(['measured', 'model']);
    expect(measured.panel!.measuredReference).toEqual(reference);
  });

  it('runDesign in free mode with a measured reference says it is not used', () => {
    const free = runDesign({
      targets: [{ name: 'only', abundance: 'high' }],
      excitation: [{ wavelengthNm: 405 }],
      measuredReference: reference,
      options: { nodeBudget: 200 },
    });
    expect(free.warnings.some((w) => w.startsWith('the measured reference columns are not used: free mode'))).toBe(
      true,
    );
  });
});
