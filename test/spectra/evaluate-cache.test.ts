// The resolved-dot cache and the non-finite guard of evaluatePanel, tested through the public entry.
import { describe, expect, it } from 'vitest';
import { evaluatePanel, resolveDot } from '../../spectra/index';
import type { PanelSpec, ProbeSpec } from '../../spectra/index';

const channels: PanelSpec['channels'] = [
  { id: 'c1', filters: [{ type: 'bandpass', centerNm: 605, widthNm: 20 }] },
  { id: 'c2', filters: [{ type: 'bandpass', centerNm: 655, widthNm: 20 }] },
];
const panelOf = (probe: ProbeSpec): PanelSpec => ({
  excitation: [{ wavelengthNm: 405 }],
  probes: [probe, { id: 'q', material: 'cdse', emissionPeakNm: 655 }],
  channels,
});
const base: ProbeSpec = { id: 'p', material: 'cdse', emissionPeakNm: 605, sizeDispersionPct: 5, quantumYield: 0.5 };

describe('evaluatePanel with a warm resolved-dot cache', () => {
  // Each variant differs from `base` in one field only; evaluating base first fills the cache, so a key that left the
  // field out would hand back base's dot and the figures would not change.
  it.each([
    ['fwhmNm', { fwhmNm: 40 }, (a: number[], b: number[]) => expect(b[0]).not.toBeCloseTo(a[0], 6)],
    [
      'sizeDispersionPct',
      { sizeDispersionPct: 9 },
      (a: number[], b: number[]) => expect(b[0]).not.toBeCloseTo(a[0], 6),
    ],
    ['emissionPeakNm', { emissionPeakNm: 610 }, (a: number[], b: number[]) => expect(b[1]).not.toBeCloseTo(a[1], 6)],
  ] as const)('evaluatePanel gives a probe that differs only in %s its own figures', (_field, change, check) => {
    const first = evaluatePanel(panelOf(base), { sensitivity: false });
    const second = evaluatePanel(panelOf({ ...base, ...change }), { sensitivity: false });
    const fwhmAndPeak = (ev: typeof first) => [ev.probes[0].fwhmNm, ev.probes[0].emissionPeakNm];
    check(fwhmAndPeak(first), fwhmAndPeak(second));
    // The uncached library agrees with what the cached evaluation reports.
    const { id: _id, ...dotInput } = { ...base, ...change };
    const fresh = resolveDot(dotInput);
    expect(second.probes[0].fwhmNm).toBeCloseTo(fresh.fwhmNm, 9);
  });

  it('evaluatePanel gives a probe that differs only in quantumYield a proportionally different collected column', () => {
    const a = evaluatePanel(panelOf(base), { sensitivity: false });
    const b = evaluatePanel(panelOf({ ...base, quantumYield: 0.25 }), { sensitivity: false });
    expect(b.collected[0][0] / a.collected[0][0]).toBeCloseTo(0.5, 12);
  });
});

describe('evaluatePanel on figures that overflow double precision', () => {
  it('evaluatePanel with a measured extinction of 1e308 answers nulls and a warning, never NaN or Infinity', () => {
    const huge: ProbeSpec = {
      ...base,
      abundance: 1e6,
      extinction: {
        points: [
          [300, 1e308],
          [1000, 1e308],
        ],
      },
    };
    const ev = evaluatePanel(panelOf(huge));
    const text = JSON.stringify(ev, (_k, v) => (typeof v === 'number' && !Number.isFinite(v) ? `NONFINITE(${v})` : v));
    expect(text).not.toContain('NONFINITE');
    expect(ev.collected[0][0]).toBeNull();
    expect(ev.warnings.join(' ')).toMatch(/finite/i);
  });
});
