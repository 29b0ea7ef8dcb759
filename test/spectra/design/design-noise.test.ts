// The design's noise figures with the sample's own light: the excitation leaking through a proposal's filters and the
// water Raman join each channel's background photons. Scenarios are fictional.
import { describe, expect, it } from 'vitest';
import { runDesign, type DesignRequest } from '../../../spectra/index';

/**
 * One target, one candidate probe and one candidate channel: a 420/30 bandpass whose lower half-maximum point sits on
 * the 405 nm line, so the line passes at half the peak, 0.93 / 2 (docs/science.md, section 10: the bandpass default
 * peak 0.93, half maximum at centre ∓ width/2).
 */
const request = (extra: Partial<DesignRequest>): DesignRequest => ({
  targets: [{ name: 'membrane marker', abundance: 'high' }],
  excitation: [{ wavelengthNm: 405 }],
  candidates: {
    probes: [
      {
        id: 'q430',
        material: 'custom',
        measuredEmission: {
          points: [
            [410, 0],
            [430, 1],
            [450, 0],
          ],
        },
      },
    ],
    channels: [{ id: 'c420', filters: [{ type: 'bandpass', centerNm: 420, widthNm: 30 }] }],
  },
  // The channel sits on the line on purpose, so the design's OD check (minBlockingOD, default 6) is off here.
  options: { photons: 1000, minBlockingOD: 0 },
  ...extra,
});

describe('design noise with the excitation leak', () => {
  it('without scatter, one probe in one channel has SD √(a·N)/N = √1000/1000 (Poisson closed form)', () => {
    const result = runDesign(request({ scatterLevel: 0 }));
    expect(result.noise!.sd[0]).toBeCloseTo(Math.sqrt(1000) / 1000, 6);
  });

  it('a channel next to the line has a higher SD with scatterLevel 1e6 than without (SD² = (N + b)/N²)', () => {
    const quiet = runDesign(request({ scatterLevel: 0 }));
    const leaky = runDesign(request({ scatterLevel: 1e6 }));
    // Closed form for one probe in one channel: Var(â) = (N·a + b)/N², with b the background photons, b > 0 here.
    // b = N × leak / own signal, leak = 1e6 × 0.93/2 at the line (scatterLevel × T(405 nm)).
    const own = leaky.evaluation!.collected[0][0];
    const b = (1000 * 1e6 * 0.465) / own;
    expect(leaky.noise!.sd[0]!).toBeGreaterThan(quiet.noise!.sd[0]!);
    expect(leaky.noise!.sd[0]!).toBeCloseTo(Math.sqrt(1000 + b) / 1000, 4);
  });

  it('water Raman adds background photons to the proposal: its SD is higher with waterRaman than without', () => {
    const quiet = runDesign(request({ scatterLevel: 0 }));
    const raman = runDesign(request({ scatterLevel: 0, waterRaman: { level: 1000 } }));
    expect(raman.panel!.waterRaman).toEqual({ level: 1000 });
    expect(raman.noise!.sd[0]!).toBeGreaterThan(quiet.noise!.sd[0]!);
  });
});
