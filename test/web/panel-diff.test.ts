import { describe, expect, it } from 'vitest';
import type { PanelSpec } from '../../spectra/index';
import { panelDifferences, panelFigures, type EvaluationFigures } from '../../web/state/panel-diff';

/** A two-probe, two-channel panel; `edit` changes it. */
function panel(edit: (p: PanelSpec) => PanelSpec = (p) => p): PanelSpec {
  return edit({
    version: 1,
    title: 'Two targets',
    excitation: [{ wavelengthNm: 405 }],
    probes: [
      { id: 'p1', label: 'Green dot', material: 'cdse', emissionPeakNm: 525 },
      { id: 'p2', label: 'Red dot', material: 'cdse', emissionPeakNm: 645 },
    ],
    channels: [
      { id: 'c1', label: 'Green', filters: [{ type: 'bandpass', centerNm: 525, widthNm: 20 }] },
      { id: 'c2', label: 'Red', filters: [{ type: 'bandpass', centerNm: 645, widthNm: 20 }] },
    ],
  });
}

/** Evaluation figures written by hand. */
function figures(worst: number, condition: number, gains: number[], peaks = [525, 645]): EvaluationFigures {
  return {
    worst: { from: 'p1', into: 'p2', interference: worst },
    conditionNumber: condition,
    noiseAmplification: gains,
    probes: peaks.map((emissionPeakNm) => ({ emissionPeakNm })),
  };
}

describe('panel figures', () => {
  it('lists probes with material and peak, channels with filter text, and the worst pair by label', () => {
    const f = panelFigures(panel(), figures(0.25, 1.4, [1.1, 1.3], [526.4, 644.6]));
    expect(f.name).toBe('Two targets');
    expect(f.probes).toEqual([
      { label: 'Green dot', material: 'cdse', peakNm: 526.4, noiseGain: 1.1 },
      { label: 'Red dot', material: 'cdse', peakNm: 644.6, noiseGain: 1.3 },
    ]);
    expect(f.channels).toEqual([
      { label: 'Green', filters: 'bandpass 525/20' },
      { label: 'Red', filters: 'bandpass 645/20' },
    ]);
    expect(f.worst).toEqual({ from: 'Green dot', into: 'Red dot', value: 0.25 });
    expect(f.conditionNumber).toBe(1.4);
  });

  it('a panel without a title is named "Untitled panel"; without an evaluation it has no numbers', () => {
    const f = panelFigures(panel((p) => ({ ...p, title: '' })));
    expect(f.name).toBe('Untitled panel');
    expect(f.worst).toBeNull();
    expect(f.conditionNumber).toBeNull();
    expect(f.probes[0].peakNm).toBeNull();
    expect(f.computed).toBe(false);
  });
});

describe('panel differences in words', () => {
  it('two identical panels with the same figures have no differences', () => {
    const ev = figures(0.25, 1.4, [1.1, 1.3]);
    expect(panelDifferences(panelFigures(panel(), ev), panelFigures(panel(), ev))).toEqual([]);
  });

  it('a changed band, an added probe and lower crosstalk read as three sentences in that order', () => {
    const a = panelFigures(panel(), figures(1.21, 3.2, [2.0, 2.5]));
    const edited = panel((p) => ({
      ...p,
      probes: [...p.probes, { id: 'p3', label: 'Yellow dot', material: 'inp', emissionPeakNm: 570 }],
      channels: [p.channels[0], { ...p.channels[1], filters: [{ type: 'bandpass', centerNm: 640, widthNm: 30 }] }],
    }));
    const b = panelFigures(edited, figures(0.38, 3.2, [2.0, 2.5, 1.0], [525, 645, 570]));
    expect(panelDifferences(a, b)).toEqual([
      "Probe 'Yellow dot' added",
      "Channel 'Red': bandpass 645/20 → 640/30",
      'worst crosstalk 121 % → 38 %',
    ]);
  });

  it('a removed channel, a new title, a moved peak, a noise gain and the condition number are each said', () => {
    const a = panelFigures(panel(), figures(0.25, 1.4, [1.1, 1.3]));
    const b = panelFigures(
      panel((p) => ({ ...p, title: 'Renamed', channels: [p.channels[0]] })),
      figures(0.25, 12.3, [1.1, 4.0], [525, 650]),
    );
    expect(panelDifferences(a, b)).toEqual([
      "Title 'Two targets' → 'Renamed'",
      "Probe 'Red dot': peak 645 nm → 650 nm",
      "Probe 'Red dot': unmixing noise 1.3× → 4.0×",
      "Channel 'Red' removed",
      'condition number 1.4 → 12',
    ]);
  });

  it('a filter of another kind is written out in full: longpass 650 → bandpass 660/40', () => {
    const lp = panel((p) => ({
      ...p,
      channels: [p.channels[0], { ...p.channels[1], filters: [{ type: 'longpass', edgeNm: 650 }] }],
    }));
    const bp = panel((p) => ({
      ...p,
      channels: [p.channels[0], { ...p.channels[1], filters: [{ type: 'bandpass', centerNm: 660, widthNm: 40 }] }],
    }));
    expect(panelDifferences(panelFigures(lp), panelFigures(bp))).toEqual([
      "Channel 'Red': longpass 650 → bandpass 660/40",
    ]);
  });

  it('a new worst pair is named; numbers of a panel that could not be computed are left out', () => {
    const a = panelFigures(panel(), figures(0.25, 1.4, [1.1, 1.3]));
    const swapped: EvaluationFigures = {
      ...figures(0.25, 1.4, [1.1, 1.3]),
      worst: { from: 'p2', into: 'p1', interference: 0.25 },
    };
    expect(panelDifferences(a, panelFigures(panel(), swapped))).toEqual([
      'worst pair Green dot into Red dot → Red dot into Green dot',
    ]);
    expect(panelDifferences(a, panelFigures(panel()))).toEqual([]);
  });
});
