import { describe, expect, it } from 'vitest';
import { evaluatePanel, lineBlocking, type PanelSpec } from '../../spectra/index';

const probe = { id: 'p', material: 'cdse' as const, emissionPeakNm: 605 };
const panelWith = (channels: PanelSpec['channels'], extra: Partial<PanelSpec> = {}): PanelSpec => ({
  excitation: [{ wavelengthNm: 405 }],
  probes: [probe],
  channels,
  ...extra,
});
const bandpass = (id: string, centerNm: number, widthNm: number) => ({
  id,
  filters: [{ type: 'bandpass' as const, centerNm, widthNm }],
});

describe('blocking of the excitation lines (common practice: emission filters block laser lines by OD ≥ 6)', () => {
  it('a 420/20 channel next to a 405 nm line warns, naming the channel and the line; a 605/20 channel does not', () => {
    const ev = evaluatePanel(panelWith([bandpass('near', 420, 20), bandpass('far', 605, 20)]), { sensitivity: false });
    const text = ev.warnings.join('\n');
    expect(text).toMatch(/channel near blocks the 405 nm line it is read under by only OD \d\.\d \(less than OD 6\)/);
    expect(text).not.toMatch(/channel far blocks/);
  });

  it('a longpass edge 5 nm above the line blocks it by the OD of its logistic edge, written out independently', () => {
    // Edge filter: T = floor + (peak − floor)·1/(1 + exp(−(λ − edge)/s)), s = edgeWidth / (2 ln 9) (10–90 % width).
    const s = 2 / (2 * Math.log(9));
    const floor = 1e-6;
    const t = floor + (0.95 - floor) / (1 + Math.exp(5 / s));
    const channel = { id: 'lp', filters: [{ type: 'longpass' as const, edgeNm: 410, edgeWidthNm: 2 }] };
    const { blocking } = lineBlocking(panelWith([channel]), [[0]]);
    expect(blocking[0].od).toBeCloseTo(-Math.log10(t), 9);
  });

  it('a 400/20 channel straddling the 405 nm line blocks it by under OD 0.1', () => {
    const { blocking, warnings } = lineBlocking(panelWith([bandpass('on', 400, 20)]), [[0]]);
    expect(blocking[0].od).toBeLessThan(0.1);
    expect(warnings).toHaveLength(1);
  });

  it(
    'minBlockingOD sets the threshold (OD 3 passes the 420/20 channel); a line a channel is not read under is not ' +
      'checked',
    () => {
      const near = bandpass('near', 420, 20);
      const relaxed = evaluatePanel(panelWith([near], { minBlockingOD: 3 }), { sensitivity: false });
      expect(relaxed.warnings.join('\n')).not.toMatch(/blocks the/);
      const lines = { excitation: [{ wavelengthNm: 405 }, { wavelengthNm: 640 }] };
      const onlyRed = { ...near, excitationNm: 640 };
      const ev = evaluatePanel(panelWith([onlyRed], lines), { sensitivity: false });
      expect(ev.warnings.join('\n')).not.toMatch(/405 nm line/);
    },
  );

  it('a bandpass blocking at OD 6 leaks 1e-6 × scatterLevel × powerRel (closed form), 0 for a line not read', () => {
    const panel = {
      ...panelWith([bandpass('far', 605, 20), { ...bandpass('red', 605, 20), excitationNm: 640 }], {
        excitation: [{ wavelengthNm: 405, powerRel: 2 }, { wavelengthNm: 640 }],
      }),
      scatterLevel: 3e9,
    };
    const ev = evaluatePanel(panel, { sensitivity: false });
    expect(Math.abs(ev.lineLeak[0][0] / (1e-6 * 3e9 * 2) - 1)).toBeLessThan(1e-12);
    expect(ev.lineLeak[1][0]).toBe(0);
  });

  it('without scatterLevel the leak uses the documented default of 1e10 (OD 6: 1e4 per unit power)', () => {
    const ev = evaluatePanel(panelWith([bandpass('far', 605, 20)]), { sensitivity: false });
    expect(Math.abs(ev.lineLeak[0][0] / 1e4 - 1)).toBeLessThan(1e-12);
  });
});
