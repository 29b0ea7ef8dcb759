// The design answer's noise and the page's own noise reading of the proposed panel are one computation on one
// photon scale: loading a proposal must not change its noise figures.
import { describe, expect, it } from 'vitest';
import { runDesign } from '../../spectra/index';
import { computePanel } from '../../web/state/compute';

describe('design noise and the page noise reading', () => {
  it('give the same relative SD for every target of a 5-target proposal under 405 nm', () => {
    const result = runDesign({
      targets: [
        { name: 'a', abundance: 'high' },
        { name: 'b', abundance: 'high' },
        { name: 'c', abundance: 'low' },
        { name: 'd', abundance: 'medium' },
        { name: 'e', abundance: 'high' },
      ],
      excitation: [{ wavelengthNm: 405 }],
    });
    const page = computePanel(result.panel!, { byBrightness: true });
    if (!page.ok) throw new Error(page.error.message);
    const relative = page.value.crosstalk.shotNoise!.relativeSd;
    result.panel!.probes.forEach((p, t) => {
      expect(relative[t]).not.toBeNull();
      expect(relative[t]!).toBeCloseTo(result.noise!.sd[t]! / p.abundance!, 9);
    });
  });
});
