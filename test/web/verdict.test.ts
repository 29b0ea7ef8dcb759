// The two-line verdict kept above the chart, from a crosstalk view written by hand.
import { describe, expect, it } from 'vitest';
import type { CrosstalkView } from '../../web/chart/crosstalk-view';
import { noisiestText, worstPairText } from '../../web/chart/verdict';
import { lightSummary } from '../../web/elements/panel-app';
import type { PanelSpec } from '../../spectra/index';

/** A three-probe view: B spills 0.42 of A's own signal into A's channel; C has the largest noise gain, 2.345. */
function view(gains: (number | null)[] = [1.2, 1.05, 2.345]): CrosstalkView {
  return {
    probes: [
      { id: 'a', label: 'Dot A' },
      { id: 'b', label: 'Dot B' },
      { id: 'c', label: 'Dot C' },
    ],
    channels: [],
    interference: [],
    spillover: [],
    belowResolution: [],
    primaryChannel: [],
    noiseAmplification: gains,
    conditionNumber: 3,
    signalToBackground: null,
    warnings: [],
    lotShift: null,
    worst: { from: 'b', into: 'a', interference: 0.42 },
  } as unknown as CrosstalkView;
}

describe('the verdict above the chart', () => {
  it("names the worst pair by label with its share as the tables print it: 'Dot B adds 42 % of Dot A's …'", () => {
    expect(worstPairText(view())).toBe("Worst pair: Dot B adds 42 % of Dot A's own signal in Dot A's channel.");
  });

  it('names the target with the largest noise gain, written with two decimals (2.35×)', () => {
    expect(noisiestText(view())).toBe('Noisiest after unmixing: Dot C (noise 2.35× what it would be alone).');
  });

  it('names first a target the channels cannot separate (a null gain), whatever the others read', () => {
    expect(noisiestText(view([1.2, null, 9]))).toBe(
      'Noisiest after unmixing: Dot B, which the channels cannot separate.',
    );
  });

  it('says there is no pair yet for a panel with no worst pair', () => {
    expect(worstPairText({ ...view(), worst: null })).toBe('Worst pair: none yet (no two probes to compare).');
  });
});

describe('the folded light section heading', () => {
  it('lists the lines, the background, water Raman and the count of shared filters', () => {
    const panel: PanelSpec = {
      version: 1,
      excitation: [{ wavelengthNm: 405 }, { wavelengthNm: 488 }],
      probes: [],
      channels: [],
      background: { level: 0.1 },
      waterRaman: { level: 1 } as PanelSpec['waterRaman'],
      lightPath: { emissionFilters: [{ type: 'longpass', edgeNm: 420 }] },
    };
    expect(lightSummary(panel)).toBe(
      'excitation 405 + 488 nm · sample background on · water Raman on · 1 shared filter',
    );
    expect(lightSummary({ ...panel, background: undefined, waterRaman: undefined, lightPath: undefined })).toBe(
      'excitation 405 + 488 nm · no sample background',
    );
  });
});

describe('<qdp-key-verdict> before any figures', () => {
  it('says to fix the marked input when the first panel is refused, and to add parts when it is not', async () => {
    await import('../../web/elements/key-verdict');
    const el = document.createElement('qdp-key-verdict') as HTMLElement & {
      stale: boolean;
      updateComplete: Promise<unknown>;
    };
    document.body.appendChild(el);
    await el.updateComplete;
    expect(el.shadowRoot!.textContent).toContain('once the panel has a probe and a channel');
    el.stale = true;
    await el.updateComplete;
    expect(el.shadowRoot!.textContent).toContain('No verdict yet: fix the marked input');
    el.remove();
  });
});
