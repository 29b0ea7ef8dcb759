// Component tests in headless Chromium for the channel list: one card per channel, "Add channel", the spectral
// detector run (its three number fields and the spectral-run event), and the channel limit.
import { afterEach, describe, expect, it } from 'vitest';
import type { ChannelSpec, PanelSpec } from '../../spectra/index';
import '../../web/elements/channel-list';
import { demoPanel } from '../../web/state/demo-panel';

afterEach(() => document.body.replaceChildren());

type Updating = HTMLElement & { updateComplete: Promise<unknown> };
type Card = Updating & {
  channel: ChannelSpec;
  index: number;
  lines: number[];
  detectors: { id: string; name: string }[];
  errors: Record<string, string>;
};
type Field = Updating & { label: string };

/** A small invented panel with `n` 20 nm bandpass channels, centres 20 nm apart from 520 nm, under 405 and 488 nm. */
function panelWithChannels(n: number): PanelSpec {
  const channels: ChannelSpec[] = Array.from({ length: n }, (_, i) => ({
    id: `c${i + 1}`,
    label: `Band ${i + 1}`,
    filters: [{ type: 'bandpass', centerNm: 520 + 20 * i, widthNm: 20 }],
  }));
  return {
    version: 1,
    excitation: [{ wavelengthNm: 405 }, { wavelengthNm: 488 }],
    probes: [{ id: 'p1', material: 'cdse', emissionPeakNm: 605 }],
    channels,
  };
}

async function mount(panel: PanelSpec, setup: (el: HTMLElementTagNameMap['qdp-channel-list']) => void = () => {}) {
  const el = document.createElement('qdp-channel-list');
  el.panel = panel;
  setup(el);
  document.body.appendChild(el);
  await el.updateComplete;
  return el;
}

const cards = (el: HTMLElement) => [...el.shadowRoot!.querySelectorAll('qdp-channel-card')] as Card[];
const button = (el: HTMLElement, start: string) =>
  [...el.shadowRoot!.querySelectorAll('button')].find((b) => b.textContent!.trim().startsWith(start))!;
const runButton = (el: HTMLElement) => el.shadowRoot!.querySelector('fieldset button') as HTMLButtonElement;

/** Types into the run field labelled `label`, as a keyboard user would, and waits for the list to re-render. */
async function typeRun(el: Updating, label: string, text: string): Promise<void> {
  const field = [...el.shadowRoot!.querySelectorAll('qdp-number-field')].find(
    (f) => (f as Field).label === label,
  ) as Field;
  await field.updateComplete;
  const input = field.shadowRoot!.querySelector('input')!;
  input.value = text;
  input.dispatchEvent(new Event('input', { bubbles: true, composed: true }));
  await el.updateComplete;
}

describe('<qdp-channel-list>', () => {
  it("renders one card per channel of the demo panel, in order, with the panel's excitation lines", async () => {
    const panel = demoPanel();
    const el = await mount(panel);
    const shown = cards(el);
    expect(shown.map((c) => c.channel.id)).toEqual(panel.channels.map((c) => c.id));
    expect(shown.map((c) => c.index)).toEqual(panel.channels.map((_, i) => i));
    for (const c of shown) expect(c.lines).toEqual([405]);
  });

  it('re-renders when given a panel with one channel more, passing detectors and errors by index', async () => {
    const el = await mount(panelWithChannels(2));
    expect(cards(el)).toHaveLength(2);
    el.panel = panelWithChannels(3);
    el.detectors = [{ id: 'det-a', name: 'Invented detector A' }];
    el.errors = { 2: { 'filters.0.widthNm': 'widthNm must be positive' } };
    await el.updateComplete;
    const shown = cards(el);
    expect(shown.map((c) => c.channel.label)).toEqual(['Band 1', 'Band 2', 'Band 3']);
    expect(shown.map((c) => c.lines)).toEqual([
      [405, 488],
      [405, 488],
      [405, 488],
    ]);
    expect(shown[2].detectors).toEqual([{ id: 'det-a', name: 'Invented detector A' }]);
    expect(shown.map((c) => c.errors)).toEqual([{}, {}, { 'filters.0.widthNm': 'widthNm must be positive' }]);
  });

  it('"Add channel" fires one bubbling, composed channel-add that reaches the document', async () => {
    const el = await mount(panelWithChannels(2));
    const seen: Event[] = [];
    document.addEventListener('channel-add', (e) => seen.push(e), { once: true });
    button(el, 'Add channel').click();
    expect(seen).toHaveLength(1);
    expect(seen[0].composed).toBe(true);
  });

  it("lets a card's channel-remove bubble out with that card's index, read by its keyboard label", async () => {
    const el = await mount(panelWithChannels(3));
    const removed: number[] = [];
    el.addEventListener('channel-remove', (e) => removed.push((e as CustomEvent<{ index: number }>).detail.index));
    const card = cards(el)[1];
    await card.updateComplete;
    (card.shadowRoot!.querySelector('button[aria-label="Remove channel Band 2"]') as HTMLButtonElement).click();
    expect(removed).toEqual([1]);
  });

  it('fires spectral-run with the typed start, bin count and bin width, named on its button', async () => {
    const el = await mount(panelWithChannels(2));
    const runs: unknown[] = [];
    el.addEventListener('spectral-run', (e) => runs.push((e as CustomEvent).detail));
    await typeRun(el, 'From', '500');
    await typeRun(el, 'Bins', '8');
    await typeRun(el, 'Bin width', '12.5');
    expect(runButton(el).textContent).toContain('Add 8 × 12.5 nm bins');
    runButton(el).click();
    expect(runs).toEqual([{ startNm: 500, bins: 8, binWidthNm: 12.5 }]);
  });

  it("allows a 16 × 10 nm run from 200 to 1840 nm, and no further (the API's range is 200–2000 nm)", async () => {
    const el = await mount(panelWithChannels(2));
    await typeRun(el, 'Bins', '16');
    await typeRun(el, 'Bin width', '10');
    const allowedFrom = async (nm: string) => {
      await typeRun(el, 'From', nm);
      return !runButton(el).disabled;
    };
    // 16 × 10 nm = 160 nm: the last bin ends at the start + 160 nm.
    expect([await allowedFrom('199'), await allowedFrom('200')]).toEqual([false, true]);
    expect([await allowedFrom('1840'), await allowedFrom('1841')]).toEqual([true, false]);
  });

  it("<qdp-channel-list> labels the run's fields for keyboard users inside a legend-named group", async () => {
    const el = await mount(panelWithChannels(1));
    expect(el.shadowRoot!.querySelector('fieldset > legend')!.textContent).toBe('Add a spectral detector run');
    const fields = [...el.shadowRoot!.querySelectorAll('fieldset qdp-number-field')] as Field[];
    await Promise.all(fields.map((f) => f.updateComplete));
    // Each input sits inside its <label>, so its accessible name is the label text.
    expect(fields.map((f) => f.shadowRoot!.querySelector('label > input') !== null)).toEqual([true, true, true]);
    expect(fields.map((f) => f.shadowRoot!.querySelector('label')!.textContent!.trim())).toEqual([
      'From (nm)',
      'Bins',
      'Bin width (nm)',
    ]);
  });

  it('<qdp-channel-list> disables the run for a fractional or zero bin count and for a zero bin width', async () => {
    const el = await mount(panelWithChannels(2));
    await typeRun(el, 'From', '500');
    await typeRun(el, 'Bin width', '10');
    await typeRun(el, 'Bins', '3');
    expect(runButton(el).disabled).toBe(false);
    await typeRun(el, 'Bins', '2.5');
    expect(runButton(el).disabled).toBe(true);
    await typeRun(el, 'Bins', '0');
    expect(runButton(el).disabled).toBe(true);
    await typeRun(el, 'Bins', '4');
    expect(runButton(el).disabled).toBe(false);
    await typeRun(el, 'Bin width', '0');
    expect(runButton(el).disabled).toBe(true);
  });

  it('a new list offers no run range or bin width of its own: the fields are empty and the run disabled', async () => {
    const el = await mount(panelWithChannels(2));
    const fields = [...el.shadowRoot!.querySelectorAll('fieldset qdp-number-field')] as Field[];
    await Promise.all(fields.map((f) => f.updateComplete));
    expect(fields.map((f) => f.shadowRoot!.querySelector('input')!.value)).toEqual(['', '', '']);
    expect(runButton(el).disabled).toBe(true);
    expect(runButton(el).textContent!.trim()).toBe('Add the bins');
  });

  it('near maxChannels allows a run only up to the room left and says how much room there is', async () => {
    const el = await mount(panelWithChannels(6), (l) => (l.maxChannels = 10));
    await typeRun(el, 'From', '500');
    await typeRun(el, 'Bin width', '10');
    expect(el.shadowRoot!.querySelector('.note')!.textContent).toBe('4 more channels allowed (at most 10).');
    await typeRun(el, 'Bins', '5');
    expect(runButton(el).disabled).toBe(true);
    await typeRun(el, 'Bins', '4');
    expect(runButton(el).disabled).toBe(false);
    expect(button(el, 'Add channel').disabled).toBe(false);
  });

  it('<qdp-channel-list> with every channel slot used disables "Add channel" and the run', async () => {
    const el = await mount(panelWithChannels(3), (l) => (l.maxChannels = 3));
    expect(button(el, 'Add channel').disabled).toBe(true);
    expect(runButton(el).disabled).toBe(true);
    expect(el.shadowRoot!.querySelector('.note')!.textContent).toBe('0 more channels allowed (at most 3).');
  });

  it('<qdp-channel-list> by default allows 64 channels (api-v1)', async () => {
    const el = await mount(panelWithChannels(63));
    expect(button(el, 'Add channel').disabled).toBe(false);
    expect(el.shadowRoot!.querySelector('.note')!.textContent).toBe('1 more channel allowed (at most 64).');
  });

  it('ticking "Snap bandpass sizes to stock sizes" fires snap-stock-change true; cards get snapStock', async () => {
    const el = await mount(panelWithChannels(2), (l) => (l.snapStock = false));
    const seen: boolean[] = [];
    el.addEventListener('snap-stock-change', (e) =>
      seen.push((e as CustomEvent<{ snapStock: boolean }>).detail.snapStock),
    );
    const box = [...el.shadowRoot!.querySelectorAll('label')]
      .find((l) => l.textContent!.includes('Snap bandpass sizes to stock sizes'))!
      .querySelector('input')!;
    box.click();
    expect(seen).toEqual([true]);
    expect(cards(el).map((c) => (c as Card & { snapStock: boolean }).snapStock)).toEqual([false, false]);
    el.snapStock = true;
    await el.updateComplete;
    expect(cards(el).map((c) => (c as Card & { snapStock: boolean }).snapStock)).toEqual([true, true]);
  });
});
