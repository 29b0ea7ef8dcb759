// The checks a microscopist makes first, applied to free-mode proposals: blocking of every line (OD 6, common
// practice), each probe's peak inside its channel with at least 30 % of its light passed, no emission within 15 nm of
// a line, stock filter sizes only, and no material unsuitable for aqueous stains unless asked for. Scenarios are
// fictional; each check is recomputed here from the proposed panel, not read from the design's own figures.
import { describe, expect, it } from 'vitest';
import {
  DEFAULT_GRID,
  filterTransmission,
  isStockBandpass,
  resolveDot,
  runDesign,
  type DesignRequest,
  type PanelSpec,
} from '../../../spectra/index';

const targets = (n: number): DesignRequest['targets'] =>
  Array.from({ length: n }, (_, i) => ({ name: `target ${i + 1}`, abundance: i % 3 === 2 ? 'low' : 'high' }));

/** Every check, recomputed from the panel with the filter and dot models. */
function checkPractice(panel: PanelSpec): void {
  const grid = DEFAULT_GRID;
  panel.probes.forEach((probe, t) => {
    const channel = panel.channels.find((c) => c.id === probe.channel)!;
    const [filter] = channel.filters;
    expect(filter.type).toBe('bandpass');
    if (filter.type !== 'bandpass') return;
    expect(isStockBandpass(filter.centerNm, filter.widthNm), `${filter.centerNm}/${filter.widthNm}`).toBe(true);
    const t1 = filterTransmission(filter, grid);
    for (const line of panel.excitation) {
      // OD 6 at the line (common practice), within 1e-6 OD (a relative 2.3e-6 in transmission, far below any
      // filter's tolerance): a filter whose floor is the threshold meets it, whatever its edges add far from the line.
      const atLine = filterTransmission(filter, { startNm: line.wavelengthNm, stepNm: 1, count: 1 })[0];
      const od = -Math.log10(atLine);
      expect(od, `${filter.centerNm}/${filter.widthNm} at ${line.wavelengthNm} nm`).toBeGreaterThanOrEqual(6 - 1e-6);
    }
    const dot = resolveDot({ ...probe, abundance: undefined, channel: undefined } as never, { grid });
    for (const line of panel.excitation)
      // 15 nm, within the model's rounding of a stated peak (a few 1e-13 nm).
      expect(Math.abs(dot.emissionPeakNm - line.wavelengthNm)).toBeGreaterThanOrEqual(15 - 1e-9);
    // The peak lies in the passband (at least half the filter's best transmission there).
    const peakIndex = Math.round(dot.emissionPeakNm - grid.startNm);
    expect(t1[peakIndex], `probe ${t + 1} peak ${dot.emissionPeakNm}`).toBeGreaterThanOrEqual(Math.max(...t1) / 2);
    // At least 30 % of its emitted photons pass.
    let total = 0;
    let passed = 0;
    dot.emission.values.forEach((v, k) => {
      total += v;
      passed += v * t1[dot.emissionFrom + k];
    });
    expect(passed / total, `probe ${t + 1}`).toBeGreaterThanOrEqual(0.3);
    expect(['cspbbr3', 'carbon', 'gaas']).not.toContain(probe.material);
  });
}

describe('free-mode proposals keep the practice checks', () => {
  it.each([
    ['405 nm', [{ wavelengthNm: 405 }]],
    ['405 and 488 nm', [{ wavelengthNm: 405 }, { wavelengthNm: 488 }]],
  ])('a 6-target proposal under %s passes every check, recomputed from its panel', (_, excitation) => {
    const result = runDesign({ targets: targets(6), excitation });
    checkPractice(result.panel!);
    expect(result.warnings.some((w) => w.startsWith('cspbbr3 is left out'))).toBe(true);
  });

  it('a 12-target proposal under 405 nm (abundances high, medium, low in turn) exists and passes every check', () => {
    const words = ['high', 'medium', 'low'] as const;
    const result = runDesign({
      targets: Array.from({ length: 12 }, (_, i) => ({ name: `target ${i + 1}`, abundance: words[i % 3] })),
      excitation: [{ wavelengthNm: 405 }],
    });
    expect(result.panel).not.toBeNull();
    checkPractice(result.panel!);
  });

  it('12 targets, eight high, at 405 nm: a design within the 100 % ceiling too faint to use, and how many fit', () => {
    const result = runDesign({ targets: targets(12), excitation: [{ wavelengthNm: 405 }] });
    expect(result.verdict).toBe('no_usable_panel');
    checkPractice(result.panel!);
    expect(result.objective!.worstInterference).toBeLessThanOrEqual(1);
    expect(result.objective!.worstSignalToNoise).toBeLessThan(5);
    expect(result.verdictReason).toContain(`${result.objective!.weakestTarget} reaches a signal-to-noise of only`);
    expect(result.largestUsableTargets).toBeGreaterThanOrEqual(5);
    expect(result.largestUsableTargets).toBeLessThan(12);
  });

  it.each([5, 8, 16])(
    '%s targets under 405 + 488 nm: a proposal passing every check within a 100 percent ceiling, or no_usable_panel',
    (n) => {
      const result = runDesign({
        targets: targets(n),
        excitation: [{ wavelengthNm: 405 }, { wavelengthNm: 488 }],
      });
      if (result.panel === null) {
        expect(result.verdict).toBe('no_usable_panel');
        expect(result.verdictReason.length).toBeGreaterThan(20);
        expect(result.largestUsableTargets).toBeLessThan(n);
        return;
      }
      checkPractice(result.panel);
      expect(result.objective!.worstInterference).toBeLessThanOrEqual(1);
      if (result.verdict === 'usable') expect(result.objective!.worstSignalToNoise).toBeGreaterThanOrEqual(5);
      else expect(result.verdictReason).toContain('signal-to-noise');
    },
  );

  it('asking for carbon dots by name brings them back as candidates', () => {
    const result = runDesign({
      targets: targets(2),
      excitation: [{ wavelengthNm: 405 }],
      allowedMaterials: ['carbon'],
      options: { minSignalFraction: 0 },
    });
    expect(result.panel!.probes.every((p) => p.material === 'carbon')).toBe(true);
  });
});
