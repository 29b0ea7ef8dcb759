// When the page recomputes: a small panel on every keystroke, a large one after a pause in the typing. The weights
// below are worked by hand from the panels' sizes; the page is driven in Chromium with real keystrokes.
import { afterEach, describe, expect, it } from 'vitest';
import { page, userEvent } from 'vitest/browser';
import '../../web/elements/panel-app';
import { PENDING_NOTE } from '../../web/elements/key-verdict';
import { demoPanel } from '../../web/state/demo-panel';
import { panelWeight, PAUSED_UPDATE_WEIGHT, waitsForPause } from '../../web/state/edit-pace';
import { addChannel, addProbe, setFilter, setProbe } from '../../web/state/panel-edit';
import { decodeFragment, encodeFragment } from '../../web/state/fragment';
import type { FilterSpec, PanelSpec } from '../../spectra/index';
import { openRow } from './helpers/page-rows';

type Host = HTMLElement & { updateComplete: Promise<unknown> };

afterEach(() => {
  document.body.replaceChildren();
  history.replaceState(null, '', location.pathname + location.search);
  localStorage.clear();
});

/** `n` CdSe probes 10 nm apart from 500 nm and `n` bandpass channels 8 nm wide on their peaks. */
function squarePanel(n: number): PanelSpec {
  let panel: PanelSpec = { version: 1, title: 'Square', excitation: [{ wavelengthNm: 405 }], probes: [], channels: [] };
  for (let i = 0; i < n; i++) {
    panel = addChannel(addProbe(panel));
    panel = setProbe(panel, i, { ...panel.probes[i], emissionPeakNm: 500 + 10 * i });
    panel = setFilter(panel, i, 0, { type: 'bandpass', centerNm: 500 + 10 * i, widthNm: 8 });
  }
  return panel;
}

const table = (points: number): FilterSpec => ({
  type: 'table',
  points: Array.from({ length: points }, (_, k) => [400 + k * 0.5, 0.5] as [number, number]),
});

describe('panelWeight', () => {
  it('panelWeight(demo panel) is 36 (6 probes × 6 channels, no tables): it updates on every keystroke', () => {
    expect(panelWeight(demoPanel())).toBe(36);
    expect(waitsForPause(demoPanel())).toBe(false);
  });

  it('panelWeight(16 × 16 panel) is 256 and waits for a pause; 10 × 10 (100) is the first size that waits', () => {
    expect(panelWeight(squarePanel(16))).toBe(256);
    expect(waitsForPause(squarePanel(16))).toBe(true);
    expect(PAUSED_UPDATE_WEIGHT).toBe(100);
    expect(waitsForPause(squarePanel(9))).toBe(false);
    expect(waitsForPause(squarePanel(10))).toBe(true);
  });

  it('panelWeight counts 1000 table points as 20 cells: 2 × 2 + 1000-point filter = 24, + 5 such filters = 104', () => {
    const one = setFilter(squarePanel(2), 0, 0, table(1000));
    expect(panelWeight(one)).toBe(24);
    let five = squarePanel(2);
    five = { ...five, channels: five.channels.map((c) => ({ ...c, filters: [table(1000), table(1000)] })) };
    five = { ...five, lightPath: { emissionFilters: [table(1000)] } };
    expect(panelWeight(five)).toBe(4 + 5 * 20);
    expect(waitsForPause(five)).toBe(true);
  });
});

const inner = (root: Element, selector: string) => root.shadowRoot!.querySelector(selector) as Host;
const verdictText = (app: Host) => inner(app, 'qdp-key-verdict').shadowRoot!.textContent!.replace(/\s+/g, ' ');
/** The emission peak of the first curve the chart draws, nm. */
const drawnPeakNm = (app: Host) =>
  (inner(app, 'qdp-spectrum-chart') as unknown as { curves: { peakNm: number }[] }).curves[0].peakNm;
const linkedPeak = () =>
  (decodeFragment(location.hash) as { panel: PanelSpec }).panel.probes[0].emissionPeakNm as number | undefined;

/** Opens the page on a 16 × 16 panel and types `keys` into the first probe's emission-peak field. */
async function typeIntoLargePanel(keys: string): Promise<Host> {
  history.replaceState(null, '', `#${encodeFragment({ panel: squarePanel(16), view: { exclude: [] } })}`);
  const app = document.createElement('qdp-panel-app') as Host;
  document.body.appendChild(app);
  await expect
    .poll(() => inner(app, 'qdp-spectrum-chart')?.shadowRoot?.querySelectorAll('path.curve').length, {
      timeout: 10_000,
    })
    .toBe(16);
  await openRow(app, 'qdp-probe-list', 0);
  const card = inner(app, 'qdp-probe-list').shadowRoot!.querySelector('qdp-probe-card')!;
  const input = page.elementLocator(card).getByLabelText('Emission peak (nm)');
  await userEvent.clear(input);
  await userEvent.type(input, keys);
  return app;
}

describe('<qdp-panel-app> on a large panel', () => {
  it('typing shows the "updating" note and keeps the address; after the pause figures and address follow', async () => {
    const app = await typeIntoLargePanel('545');
    expect(verdictText(app)).toContain(PENDING_NOTE);
    expect(linkedPeak()).toBe(500);
    expect(drawnPeakNm(app)).toBeCloseTo(500, 0);
    await expect.poll(() => linkedPeak(), { timeout: 5_000 }).toBe(545);
    expect(verdictText(app)).not.toContain(PENDING_NOTE);
    expect(drawnPeakNm(app)).toBeCloseTo(545, 0);
  });

  it('Back after a burst of typing on a large panel returns to the peak before the burst', async () => {
    await typeIntoLargePanel('545');
    await expect.poll(() => linkedPeak(), { timeout: 5_000 }).toBe(545);
    history.back();
    await expect.poll(() => linkedPeak(), { timeout: 5_000 }).toBe(500);
  });

  it('leaving the page (pagehide) during the pause writes the typed value into the address at once', async () => {
    const app = await typeIntoLargePanel('545');
    expect(linkedPeak()).toBe(500);
    window.dispatchEvent(new PageTransitionEvent('pagehide'));
    expect(linkedPeak()).toBe(545);
    await app.updateComplete;
    expect(verdictText(app)).not.toContain(PENDING_NOTE);
  });
});
