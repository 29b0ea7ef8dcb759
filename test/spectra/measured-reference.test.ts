// Measured reference columns in place of modelled ones. Expected values are worked by hand in each test from the
// definitions: a measured column keeps its shape and takes the model's signal in the probe's primary channel, and the
// spillover of a probe into channel c is its column's value in c over its value in its primary channel
// (common practice: single-stain controls normalised to their primary detector).
import { describe, expect, it } from 'vitest';
import { evaluatePanel, withMeasuredColumns, type PanelSpec } from '../../spectra/index';

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

  it('withMeasuredColumns keeps the model and warns when the reference was taken on other channels', () => {
    const panel = {
      ...twoByTwo,
      measuredReference: { channels: ['green', 'blue'], columns: [{ probe: 'a', values: [1, 2] }] },
    };
    const r = withMeasuredColumns(modelled, panel, [undefined, undefined]);
    expect(r.collected).toBe(modelled);
    expect(r.source).toEqual(['model', 'model']);
    expect(r.warnings[0]).toMatch(/^the measured reference was taken on channels green, blue, not on this panel's/);
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
