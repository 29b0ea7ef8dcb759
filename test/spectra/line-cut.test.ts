import { describe, expect, it } from 'vitest';
import { DEFAULT_GRID, evaluatePanel, resolveDot, spectrumOnGrid } from '../../spectra/index';

const nm = (i: number) => DEFAULT_GRID.startNm + i * DEFAULT_GRID.stepNm;

describe('emission cut at the exciting line', () => {
  it(
    'resolveDot(cdse 480 nm, line 488 nm): nothing at or below 488 ' + 'nm, unit area left (sum × step = 1 to 1e-12)',
    () => {
      const dot = resolveDot({ material: 'cdse', emissionPeakNm: 480, excitationNm: 488 });
      const values = spectrumOnGrid(dot.emission, DEFAULT_GRID);
      let area = 0;
      values.forEach((v, i) => {
        if (nm(i) <= 488) expect(v).toBe(0);
        area += v * DEFAULT_GRID.stepNm;
      });
      expect(Math.abs(area - 1)).toBeLessThan(1e-12);
    },
  );

  it(
    'the reported cut share equals the nominal emission’s area at or below the line, summed independently, and is ' +
      '40–70 % for a 480 nm CdSe dot under 488 nm',
    () => {
      const nominal = spectrumOnGrid(resolveDot({ material: 'cdse', emissionPeakNm: 480 }).emission, DEFAULT_GRID);
      let below = 0;
      let total = 0;
      nominal.forEach((v, i) => {
        total += v;
        if (nm(i) <= 488) below += v;
      });
      const cut = resolveDot({ material: 'cdse', emissionPeakNm: 480, excitationNm: 488 });
      expect(cut.emissionCutFraction!).toBeCloseTo(below / total, 12);
      expect(cut.emissionCutFraction!).toBeGreaterThan(0.4);
      expect(cut.emissionCutFraction!).toBeLessThan(0.7);
      expect(cut.warnings.join(' ')).toMatch(/at or below the 488 nm line/);
    },
  );

  it('a line far to the blue (405 nm for a 605 nm dot) cuts nothing: share 0, spectrum unchanged, no warning', () => {
    const plain = resolveDot({ material: 'cdse', emissionPeakNm: 605 });
    const lit = resolveDot({ material: 'cdse', emissionPeakNm: 605, excitationNm: 405 });
    expect(lit.emissionCutFraction).toBe(0);
    expect(lit.emission.values).toEqual(plain.emission.values);
    expect(lit.warnings.join(' ')).not.toMatch(/at or below/);
    expect(plain.emissionCutFraction).toBeNull();
  });

  it(
    'in a panel, each probe reports the cut share per line, and a 490 nm probe read at 440–460 nm under the 488 nm ' +
      'line gives under 1e-3 of what it gives under 405 nm (per unit ε: only filter leakage beyond 488 nm is left)',
    () => {
      const band = { type: 'bandpass' as const, centerNm: 450, widthNm: 20 };
      const panel = {
        excitation: [{ wavelengthNm: 405 }, { wavelengthNm: 488 }],
        probes: [{ id: 'p', material: 'cdse' as const, emissionPeakNm: 490 }],
        channels: [
          { id: 'under405', filters: [band], excitationNm: 405 },
          { id: 'under488', filters: [band], excitationNm: 488 },
        ],
      };
      const ev = evaluatePanel(panel, { sensitivity: false });
      const [e405, e488] = ev.probes[0].extinctionAtLines;
      expect(ev.probes[0].emissionCutAtLines[0]).toBeLessThan(1e-6);
      expect(ev.probes[0].emissionCutAtLines[1]).toBeGreaterThan(0.2);
      expect(ev.collected[1][0] / e488).toBeLessThan(1e-3 * (ev.collected[0][0] / e405));
    },
  );

  it('the warning speaks of the larger dots of the ensemble for a dot, not for a probe without a size law', () => {
    const points: [number, number][] = [
      [400, 0],
      [420, 1],
      [460, 0],
    ];
    const custom = resolveDot({ material: 'custom', measuredEmission: { points }, excitationNm: 425 });
    const dot = resolveDot({ material: 'cdse', emissionPeakNm: 480, excitationNm: 488 });
    expect(custom.warnings.join(' ')).toMatch(/at or below the 425 nm line/);
    expect(custom.warnings.join(' ')).not.toMatch(/dots of the ensemble/);
    expect(dot.warnings.join(' ')).toMatch(/dots of the ensemble/);
  });
});
