// Design requests with per-target noise settings and stock filters at the blocking threshold. Scenarios are fictional.
import { describe, expect, it } from 'vitest';
import { evaluatePanel, runDesign, type ChannelSpec } from '../../../spectra/index';

const bandpass = (id: string, centerNm: number, widthNm: number): ChannelSpec => ({
  id,
  filters: [{ type: 'bandpass', centerNm, widthNm }],
});

describe('design requests', () => {
  it('per-target photons and background with no usable panel: the smaller trials keep their targets’ values', () => {
    const result = runDesign({
      targets: Array.from({ length: 6 }, (_, i) => ({ name: `t${i + 1}`, abundance: i % 2 ? 'low' : 'high' })),
      excitation: [{ wavelengthNm: 405 }],
      options: {
        photons: [50, 50, 50, 50, 50, 50],
        backgroundPhotons: [200, 200, 200, 200, 200, 200],
        nodeBudget: 2000,
      },
    });
    // 50 photons over 200 background cannot reach S/N 5 (50 / √250 ≈ 3.2 at best).
    expect(result.verdict).toBe('no_usable_panel');
    expect(result.largestUsableTargets).toBe(0);
  });

  it('a stock 440/40 bandpass (floor OD 6) under 405 nm meets the OD 6 check: kept by catalog mode, no warning', () => {
    const channels = [bandpass('blue', 440, 40), bandpass('green', 525, 40)];
    const result = runDesign({
      targets: [{ name: 'nuclear', abundance: 'high' }],
      excitation: [{ wavelengthNm: 405 }],
      candidates: { probes: [{ id: 'q1', material: 'cds', emissionPeakNm: 445 }], channels },
    });
    expect(result.stats && 'channelsDropped' in result.stats ? result.stats.channelsDropped : null).toEqual([]);
    const evaluation = evaluatePanel({
      version: 1,
      excitation: [{ wavelengthNm: 405 }],
      probes: [{ id: 'q1', material: 'cds', emissionPeakNm: 445 }],
      channels: [channels[0]],
    });
    expect(evaluation.warnings.filter((w) => w.includes('blocks the 405 nm line'))).toEqual([]);
  });
});
