import { afterEach, describe, expect, it } from 'vitest';
import '../../web/elements/crosstalk-table';
import type { CrosstalkTable } from '../../web/elements/crosstalk-table';
import type { PanelSpec } from '../../spectra/index';
import { computePanel } from '../../web/state/compute';
import { cellLightness, formatFraction, shadeOf, type CrosstalkView } from '../../web/chart/crosstalk-view';

const view: CrosstalkView = {
  probes: [
    { id: 'p1', label: 'Green dot' },
    { id: 'p2', label: 'Orange dot' },
  ],
  channels: [
    { id: 'c1', label: 'Green' },
    { id: 'c2', label: 'Orange' },
  ],
  interference: [
    [1, 0.031],
    [0.00002, 1],
  ],
  spillover: [
    [1, 0.00002],
    [0.031, 1],
  ],
  belowResolution: [
    [false, true],
    [false, false],
  ],
  primaryChannel: [0, 1],
  noiseAmplification: [1.04, 2.31],
  conditionNumber: 1.07,
  signalToBackground: [41.2, null],
  lotShift: { shiftNm: 5, baseline: 0.031, worst: 0.05, shiftedProbe: 'p1', signedShiftNm: 5, from: 'p1', into: 'p2' },
  worst: { from: 'p1', into: 'p2', interference: 0.031 },
  warnings: ['Orange channel collects no background-free signal'],
};

afterEach(() => document.body.replaceChildren());

async function mount(v: CrosstalkView): Promise<CrosstalkTable> {
  const el = document.createElement('qdp-crosstalk-table');
  el.view = v;
  document.body.appendChild(el);
  await el.updateComplete;
  return el;
}

describe('<qdp-crosstalk-table>', () => {
  it('formatFraction prints two significant digits and "< 0.1 %" below the model resolution', () => {
    expect(formatFraction(0.031)).toBe('3.1 %');
    expect(formatFraction(0.4567)).toBe('46 %');
    expect(formatFraction(0.00002)).toBe('< 0.1 %');
    expect(formatFraction(null)).toBe('—');
  });

  it('cellLightness darkens monotonically with crosstalk, so the ramp reads in greyscale', () => {
    const ls = [0.0005, 0.002, 0.01, 0.1, 1].map(cellLightness);
    for (let i = 1; i < ls.length; i++) expect(ls[i]).toBeLessThan(ls[i - 1]);
    expect(shadeOf(1)).toBeGreaterThan(shadeOf(0.01));
    expect(shadeOf(0.01)).toBeGreaterThan(shadeOf(0.0001));
  });

  it('colours cells by class (no style attribute: the CSP blocks those), darker for more crosstalk', async () => {
    const el = await mount(view);
    const cells = [...el.shadowRoot!.querySelectorAll('td')];
    expect(cells.every((c) => !c.hasAttribute('style'))).toBe(true);
    const big = cells.find((c) => c.textContent === '3.1 %')!;
    expect(getComputedStyle(big).backgroundColor).not.toBe(
      getComputedStyle(cells.find((c) => c.textContent === '< 0.1 %')!).backgroundColor,
    );
  });

  it('renders the worst pair in words and every value as text', async () => {
    const el = await mount(view);
    const text = el.shadowRoot!.textContent!.replace(/\s+/g, ' ');
    expect(text).toContain("Worst pair: Green dot adds 3.1 % of Orange dot's own signal");
    expect(text).toContain("below the model's resolution");
    const spill = el.shadowRoot!.querySelector('table[aria-label="Spillover by channel"]')!;
    // spillover[0][1] = 2e-5 is flagged below resolution: shown as "< 0.1 %", not to three digits.
    expect(spill.querySelectorAll('tbody tr')[0].querySelectorAll('td')[1].textContent!.trim()).toBe('< 0.1 %');
    expect(text).toContain("this target's noise grows about 2.31× after unmixing");
    // A gain of 1.04 keeps its second decimal: "1.0×" would read as a panel without crosstalk.
    expect(text).toContain("this target's noise grows about 1.04× after unmixing");
    expect(text).toContain('Condition number 1.1');
    expect(text).toContain('can reach 5 % if Green dot comes 5 nm redder (Green dot into Orange dot)');
    expect(el.shadowRoot!.querySelector('ul.warnings')!.textContent).toContain('no background-free signal');
  });

  it('updates the tables when the view property changes', async () => {
    const el = await mount(view);
    el.view = { ...view, worst: { from: 'p2', into: 'p1', interference: 0.12 } };
    await el.updateComplete;
    expect(el.shadowRoot!.textContent!.replace(/\s+/g, ' ')).toContain('Worst pair: Orange dot adds 12 % of Green dot');
  });

  it('shows a spectral run of 16 channels as 16 rows with compact cells', async () => {
    const channels = Array.from({ length: 16 }, (_, i) => ({ id: `c${i + 1}`, label: `bin ${500 + 10 * i}` }));
    const spill = channels.map((_, i) => [i === 2 ? 1 : 0.01, i === 9 ? 1 : 0.0001]);
    const el = await mount({
      ...view,
      channels,
      spillover: spill,
      belowResolution: spill.map((r) => r.map((v) => v < 0.001)),
      primaryChannel: [2, 9],
      signalToBackground: undefined,
    });
    const table = el.shadowRoot!.querySelector('table[aria-label="Spillover by channel"]')!;
    expect(table.classList.contains('many')).toBe(true);
    expect(table.querySelectorAll('tbody tr').length).toBe(16);
  });

  it(
    'computePanel shows a larger shot-noise factor for a dim target whose ' +
      'channel a bright probe bleeds into, as a hand-worked 2 × 2 least-squares covariance gives',
    async () => {
      // Invented two-dot panel: a bright orange dot whose red tail lands in a dim red dot's channel.
      const panel: PanelSpec = {
        version: 1,
        excitation: [{ wavelengthNm: 405, powerRel: 1 }],
        probes: [
          { id: 'b', label: 'Bright dot', material: 'cdse', emissionPeakNm: 605, quantumYield: 0.5, abundance: 1 },
          { id: 'd', label: 'Dim dot', material: 'cdse', emissionPeakNm: 635, quantumYield: 0.5, abundance: 0.05 },
        ],
        channels: [
          { id: 'c1', label: 'Orange', filters: [{ type: 'bandpass', centerNm: 605, widthNm: 20 }] },
          { id: 'c2', label: 'Red', filters: [{ type: 'bandpass', centerNm: 640, widthNm: 20 }] },
        ],
        // No scattered excitation light: the hand-worked covariance below has shot noise only.
        scatterLevel: 0,
      };
      const result = computePanel(panel, { byBrightness: false });
      if (!result.ok) throw new Error(result.error.message);
      const { evaluation: ev, crosstalk } = result.value;
      // Independent reading, by hand for 2 × 2: collected already holds the abundances, so the expected counts per
      // channel are y = collected × k (k puts the brightest target's own signal at 1,000 photons), Poisson variance y,
      // and the least-squares estimate of the abundances is M⁻¹ y with M = collected × k / abundance, column by column.
      const a = [1, 0.05];
      const prim = ev.primaryChannel as number[];
      const own = prim.map((c, p) => ev.collected[c][p]);
      const k = 1000 / Math.max(...own);
      const y = ev.collected.map((row) => row[0] * k + row[1] * k);
      const [[m00, m01], [m10, m11]] = ev.collected.map((row) => row.map((x, p) => (x * k) / a[p]));
      const det = m00 * m11 - m01 * m10;
      const inv = [
        [m11 / det, -m01 / det],
        [-m10 / det, m00 / det],
      ];
      const sd = inv.map((row) => Math.sqrt(row[0] ** 2 * y[0] + row[1] ** 2 * y[1]));
      const factor = sd.map((s, p) => s / a[p] / (Math.sqrt(own[p] * k) / (own[p] * k)));
      expect(crosstalk.shotNoise!.relativeSd[0]!).toBeCloseTo(sd[0] / a[0], 9);
      expect(crosstalk.shotNoise!.relativeSd[1]! / (sd[1] / a[1])).toBeCloseTo(1, 9);
      expect(crosstalk.shotNoise!.factor[1]!).toBeCloseTo(factor[1], 9);
      expect(crosstalk.shotNoise!.factor[1]! - crosstalk.shotNoise!.factor[0]!).toBeGreaterThan(0.1);
      const el = await mount(crosstalk);
      const lines = [...el.shadowRoot!.querySelectorAll('li span.shot')].map((n) => n.textContent!);
      const shown = Number((sd[1] / a[1]).toPrecision(2));
      expect(lines[1]).toContain(
        `With shot noise (1,000 photons for the brightest target): SD ${shown} of its signal, ` +
          `${factor[1].toFixed(2)}× the SD it would have alone`,
      );
      expect(el.shadowRoot!.querySelector('p.shot-note')!.textContent).toContain('nominal');
    },
  );

  it('computePanel: a well-separated target with 4 × the abundance has half the shot-noise relative SD', () => {
    const panelWith = (abundance: number): PanelSpec => ({
      version: 1,
      excitation: [{ wavelengthNm: 405 }],
      probes: [
        { id: 'g', material: 'cdse', emissionPeakNm: 525, quantumYield: 0.5, abundance: 1 },
        { id: 'r', material: 'cdse', emissionPeakNm: 645, quantumYield: 0.5, abundance },
      ],
      channels: [
        { id: 'c1', filters: [{ type: 'bandpass', centerNm: 525, widthNm: 20 }] },
        { id: 'c2', filters: [{ type: 'bandpass', centerNm: 645, widthNm: 20 }] },
      ],
      // Shot noise alone (no scattered excitation light), so the SD scales as 1/√abundance exactly.
      scatterLevel: 0,
    });
    const sdAt = (abundance: number) => {
      const result = computePanel(panelWith(abundance), { byBrightness: false });
      if (!result.ok) throw new Error(result.error.message);
      return result.value.crosstalk.shotNoise!.relativeSd[1]!;
    };
    // The red dot is about 35 × brighter per unit abundance than the green one (a larger CdSe core absorbs more at
    // 405 nm); at these abundances it stays the dimmer target, so the 1,000-photon budget is set by the green one and
    // the red target's photons scale with its abundance.
    expect(sdAt(0.005) / sdAt(0.02)).toBeCloseTo(2, 2);
  });
});

describe('<qdp-crosstalk-table> without figures', () => {
  it('says to fix the marked input when refused before any figures, else to add probes and channels', async () => {
    const el = document.createElement('qdp-crosstalk-table') as CrosstalkTable;
    document.body.appendChild(el);
    await el.updateComplete;
    expect(el.shadowRoot!.textContent).toContain('Add probes and channels to see crosstalk.');
    el.stale = true;
    await el.updateComplete;
    expect(el.shadowRoot!.textContent).toContain('fix the input marked above');
    expect(el.shadowRoot!.textContent).not.toContain('Add probes and channels');
  });
});
