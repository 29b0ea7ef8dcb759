import { afterEach, describe, expect, it } from 'vitest';
import { differenceCiede2000 } from 'culori';
import '../../web/elements/spectrum-chart';
import type { SpectrumChart } from '../../web/elements/spectrum-chart';
import type { ChartCurve, ChartPassband, ChartSharedPath, EdgeDragDetail } from '../../web/chart/types';
import { PROBE_PALETTE } from '../../web/chart/curve-looks';

const colourDifference = differenceCiede2000();

/** A Gaussian on a 1 nm grid from 300 nm (test data only). */
function gaussian(peakNm: number, fwhmNm: number): ChartCurve['spectrum'] {
  const s = fwhmNm / 2.3548;
  return {
    startNm: 300,
    stepNm: 1,
    values: Array.from({ length: 701 }, (_, i) => Math.exp(-0.5 * ((300 + i - peakNm) / s) ** 2)),
  };
}

function box(loNm: number, hiNm: number): ChartPassband['transmission'] {
  return {
    startNm: 300,
    stepNm: 1,
    values: Array.from({ length: 701 }, (_, i) => (300 + i >= loNm && 300 + i <= hiNm ? 0.9 : 0)),
  };
}

async function mount(): Promise<SpectrumChart> {
  const el = document.createElement('qdp-spectrum-chart');
  el.style.width = '800px';
  el.curves = [
    { id: 'p1', label: 'Green', peakNm: 525, spectrum: gaussian(525, 30) },
    { id: 'p2', label: 'Deep red', peakNm: 760, spectrum: gaussian(760, 40) },
  ];
  el.passbands = [
    {
      id: 'c1',
      label: 'Orange',
      transmission: box(595, 615),
      handles: [
        { channelIndex: 0, filterIndex: 0, edge: 'low', wavelengthNm: 595 },
        { channelIndex: 0, filterIndex: 0, edge: 'high', wavelengthNm: 615 },
      ],
    },
  ];
  el.excitationNm = [405];
  document.body.appendChild(el);
  await el.updateComplete;
  return el;
}

afterEach(() => document.body.replaceChildren());

describe('<qdp-spectrum-chart>', () => {
  it('draws the 525 and 760 nm curves in different palette colours and dashes, the 760 nm one marked NIR', async () => {
    const el = await mount();
    const paths = el.shadowRoot!.querySelectorAll<SVGPathElement>('path.curve');
    expect(paths.length).toBe(2);
    const [green, deepRed] = [...paths].map((p) => ({
      stroke: p.getAttribute('stroke')!,
      dash: p.getAttribute('stroke-dasharray')!,
    }));
    expect(PROBE_PALETTE).toContain(green.stroke);
    expect(PROBE_PALETTE).toContain(deepRed.stroke);
    expect(colourDifference(green.stroke, deepRed.stroke)).toBeGreaterThan(30);
    expect(green.dash).not.toBe(deepRed.dash);
    expect(paths[0].getAttribute('d')!.length).toBeGreaterThan(50);
    expect(legendItem(el, 'Deep red (760 nm)').textContent).toContain('NIR');
    expect(legendItem(el, 'Green (525 nm)').textContent).not.toContain('NIR');
    expect(el.shadowRoot!.textContent).toContain('NIR: near-infrared emission');
  });

  it('names the 525 nm curve at its peak and draws the Orange channel as a 595–615 nm strip window', async () => {
    const el = await mount();
    // The x scale maps the followed range [390, 830] nm onto [52, 754] px (see the readout test).
    const px = (nm: number) => 52 + ((nm - 390) / 440) * (800 - 46 - 52);
    const label = el.shadowRoot!.querySelector<SVGTextElement>('text.peak-label[data-probe="p1"]')!;
    expect(label.textContent).toBe('Green');
    expect(Number(label.getAttribute('x'))).toBeCloseTo(px(525), 0);
    const window = el.shadowRoot!.querySelector('g.window[data-channel="c1"] rect')!;
    expect(Number(window.getAttribute('x'))).toBeCloseTo(px(595), 0);
    expect(Number(window.getAttribute('width'))).toBeCloseTo(px(615) - px(595), 0);
    // The window sits under the plot (whose bottom the curves' baseline marks), not over it.
    const plot = el.shadowRoot!.querySelector('rect.plot')!;
    const plotBottom = Number(plot.getAttribute('y')) + Number(plot.getAttribute('height'));
    expect(Number(window.getAttribute('y'))).toBeGreaterThan(plotBottom);
  });

  it('draws the x axis in nm with tick labels and marks the excitation line', async () => {
    const el = await mount();
    const ticks = [...el.shadowRoot!.querySelectorAll('g.x-axis .tick text')].map((t) => t.textContent);
    expect(ticks).toContain('500');
    expect(el.shadowRoot!.querySelectorAll('line.excitation').length).toBe(1);
    expect(el.shadowRoot!.textContent).toContain('ex 405');
  });

  it('moving a peak from 525 to 545 nm redraws its path and moves its name with it', async () => {
    const el = await mount();
    const before = el.shadowRoot!.querySelector('path.curve')!.getAttribute('d');
    const labelX = () => Number(el.shadowRoot!.querySelector('text.peak-label[data-probe="p1"]')!.getAttribute('x'));
    const x525 = labelX();
    el.curves = [{ id: 'p1', label: 'Green', peakNm: 545, spectrum: gaussian(545, 30) }, el.curves[1]];
    await el.updateComplete;
    expect(el.shadowRoot!.querySelector('path.curve')!.getAttribute('d')).not.toBe(before);
    expect(labelX()).toBeGreaterThan(x525);
  });

  it('fires edge-drag with the new wavelength when a focused edge handle gets ArrowRight', async () => {
    const el = await mount();
    const seen: EdgeDragDetail[] = [];
    document.body.addEventListener('edge-drag', (e) => seen.push((e as CustomEvent<EdgeDragDetail>).detail));
    const handle = el.shadowRoot!.querySelector<SVGGElement>('g.handle[data-edge="high"]')!;
    handle.focus();
    handle.dispatchEvent(new KeyboardEvent('keydown', { key: 'ArrowRight', bubbles: true, composed: true }));
    expect(seen).toEqual([
      { channelIndex: 0, filterIndex: 0, edge: 'high', wavelengthNm: 616, done: true, byKey: true },
    ]);
  });

  it('shows each curve value and passband transmission in the readout when the pointer moves over 605 nm', async () => {
    const el = await mount();
    const svgEl = el.shadowRoot!.querySelector('svg')!;
    const rect = svgEl.getBoundingClientRect();
    // The range follows the panel: the 405 nm line − 10 nm → 390; the 760 nm curve (σ = 16.99 nm) reaches 1 % of its
    // peak at 811 nm, + 10 nm → 830. The x scale maps [390, 830] nm onto [52, 800 - 46] px (the chart's margins).
    const px = 52 + ((605 - 390) / 440) * (800 - 46 - 52);
    svgEl.dispatchEvent(
      new PointerEvent('pointermove', { clientX: rect.left + px, clientY: rect.top + 100, bubbles: true }),
    );
    await el.updateComplete;
    const text = el.shadowRoot!.querySelector('.readout')!.textContent!;
    expect(text).toMatch(/60[45] nm/);
    expect(text).toContain('Orange T = 90.0 %');
    expect(text).toContain('Green:');
  });

  it('"Log scale" puts decade ticks 0.0001…1 on the emission axis and 0.01%…100% on the transmission one', async () => {
    const el = await mount();
    const ticks = (axis: string) =>
      [...el.shadowRoot!.querySelectorAll(`g.${axis} .tick text`)].map((t) => t.textContent).filter((t) => t !== '');
    expect(ticks('y-axis')).not.toContain('0.0001');
    const before = el.shadowRoot!.querySelector('path.curve')!.getAttribute('d');
    const log = controlCheckbox(el, 'Log scale');
    log.click();
    await el.updateComplete;
    expect(ticks('y-axis')).toEqual(expect.arrayContaining(['0.0001', '0.001', '0.01', '0.1', '1']));
    expect(ticks('t-axis')).toEqual(expect.arrayContaining(['0.01%', '1%', '100%']));
    expect(el.shadowRoot!.querySelector('path.curve')!.getAttribute('d')).not.toBe(before);
  });

  it('unticking "Green (525 nm)" hides its curve, lists it as hidden, and keeps it hidden with new data', async () => {
    const el = await mount();
    const green = legendItem(el, 'Green (525 nm)');
    green.querySelector('input')!.click();
    await el.updateComplete;
    expect(el.shadowRoot!.querySelector('path.curve[data-probe="p1"]')).toBeNull();
    expect(el.shadowRoot!.querySelector('path.curve[data-probe="p2"]')).not.toBeNull();
    expect(legendItem(el, 'Green (525 nm)').textContent).toContain('(hidden)');
    // A recomputation brings new curve objects with the same probe id: the choice holds.
    el.curves = [{ id: 'p1', label: 'Green', peakNm: 530, spectrum: gaussian(530, 30) }, el.curves[1]];
    await el.updateComplete;
    expect(el.shadowRoot!.querySelector('path.curve[data-probe="p1"]')).toBeNull();
    legendItem(el, 'Green (530 nm)').querySelector('input')!.click();
    await el.updateComplete;
    expect(el.shadowRoot!.querySelector('path.curve[data-probe="p1"]')).not.toBeNull();
  });

  it('unticking the "Orange channel" hides its line, window and edge handles; the legend still lists it', async () => {
    const el = await mount();
    expect(el.shadowRoot!.querySelectorAll('g.window').length).toBe(1);
    legendItem(el, 'Orange channel').querySelector('input')!.click();
    await el.updateComplete;
    expect(el.shadowRoot!.querySelectorAll('path.passband').length).toBe(0);
    expect(el.shadowRoot!.querySelectorAll('g.window').length).toBe(0);
    expect(el.shadowRoot!.querySelectorAll('g.handle').length).toBe(0);
    expect(legendItem(el, 'Orange channel').textContent).toContain('(hidden)');
  });

  it('draws a shared emission path as its own line, lists it in the legend and hides it when unticked', async () => {
    const el = await mount();
    const shared: ChartSharedPath = { id: 'emission', label: 'shared emission path', transmission: box(500, 900) };
    el.shared = [shared];
    await el.updateComplete;
    const line = el.shadowRoot!.querySelector('path.shared[data-part="emission"]')!;
    expect(line.getAttribute('fill')).toBe('none');
    expect(line.getAttribute('d')!.length).toBeGreaterThan(50);
    legendItem(el, 'shared emission path').querySelector('input')!.click();
    await el.updateComplete;
    expect(el.shadowRoot!.querySelector('path.shared')).toBeNull();
  });

  it('a range typed as 600–700 nm sets the x axis; "Follow the panel" restores the panel\'s range', async () => {
    const el = await mount();
    const xTicks = () => [...el.shadowRoot!.querySelectorAll('g.x-axis .tick text')].map((t) => t.textContent);
    await commitRangeEnd(el, 'From', '600');
    await commitRangeEnd(el, 'To', '700');
    expect(xTicks()[0]).toBe('600');
    expect(xTicks().at(-1)).toBe('700');
    expect(controlCheckbox(el, 'Follow the panel').checked).toBe(false);
    controlCheckbox(el, 'Follow the panel').click();
    await el.updateComplete;
    // The range that follows this panel is 390–830 nm (see the readout test).
    expect(xTicks()).toContain('400');
    expect(xTicks()).toContain('800');
  });

  it('a range typed as 600–610 nm is refused with a message, and the axis keeps its range', async () => {
    const el = await mount();
    await commitRangeEnd(el, 'From', '600');
    await commitRangeEnd(el, 'To', '610');
    const controls = el.shadowRoot!.querySelector('qdp-chart-controls')!;
    expect(controls.shadowRoot!.querySelector('[role="alert"]')!.textContent).toContain('at least 20 nm');
    const ticks = [...el.shadowRoot!.querySelectorAll('g.x-axis .tick text')].map((t) => t.textContent);
    expect(ticks.at(-1)).not.toBe('610');
  });
});

/** The checkbox of the chart's controls whose label starts with `text`. */
function controlCheckbox(el: SpectrumChart, text: string): HTMLInputElement {
  const controls = el.shadowRoot!.querySelector('qdp-chart-controls')!;
  const label = [...controls.shadowRoot!.querySelectorAll('label')].find((l) => l.textContent!.trim().startsWith(text));
  return label!.querySelector('input')!;
}

/** The legend line whose label starts with `text`. */
function legendItem(el: SpectrumChart, text: string): HTMLLIElement {
  const legend = el.shadowRoot!.querySelector('qdp-chart-legend')!;
  return [...legend.shadowRoot!.querySelectorAll('li')].find((li) => li.textContent!.trim().startsWith(text))!;
}

/** Types `text` into the range field labelled `label` and finishes (a change event, as on Enter or leaving it). */
async function commitRangeEnd(el: SpectrumChart, label: string, text: string): Promise<void> {
  const controls = el.shadowRoot!.querySelector('qdp-chart-controls')!;
  const field = [...controls.shadowRoot!.querySelectorAll('qdp-number-field')].find((f) => f.label === label)!;
  await field.updateComplete;
  const input = field.shadowRoot!.querySelector('input')!;
  input.value = text;
  input.dispatchEvent(new Event('input', { bubbles: true, composed: true }));
  input.dispatchEvent(new Event('change', { bubbles: true }));
  await el.updateComplete;
  await controls.updateComplete;
}
