import { afterEach, describe, expect, it } from 'vitest';
import { cmfs } from 'spectral-color';
import { converter, differenceCiede2000, formatHex } from 'culori';
import '../../web/elements/spectrum-chart';
import type { SpectrumChart } from '../../web/elements/spectrum-chart';
import type { ChartCurve, ChartPassband, ChartSharedPath, EdgeDragDetail } from '../../web/chart/types';

const toLinearRgb = converter('lrgb');
const colourDifference = differenceCiede2000();

/**
 * The display colour of a wavelength worked out independently of the page's code: the CIE 1931 2° colour-matching
 * table (CIE 015:2018, as the spectral-color package ships it) at that wavelength, turned into linear sRGB and then
 * encoded sRGB by culori, after the display rule the chart promises (add white until no channel is negative, then
 * scale the brightest channel to 1).
 */
function referenceColour(wavelengthNm: number): string {
  const [x, y, z] = cmfs.CIE_1931_2DEG.sampleAt(wavelengthNm);
  const { r, g, b } = toLinearRgb({ mode: 'xyz65', x, y, z });
  const lift = Math.max(0, -Math.min(r, g, b));
  const top = Math.max(r, g, b) + lift;
  return formatHex({ mode: 'lrgb', r: (r + lift) / top, g: (g + lift) / top, b: (b + lift) / top });
}

/** CIEDE2000 difference below which two colours look the same side by side (about one just-noticeable step). */
const SAME_COLOUR = 1;

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
  it(
    'draws a 525 nm curve solid in the colour the CIE 1931 table gives ' +
      '525 nm, and a 760 nm curve dashed in #4a4a4a with an NIR note',
    async () => {
      const el = await mount();
      const paths = el.shadowRoot!.querySelectorAll<SVGPathElement>('path.curve');
      expect(paths.length).toBe(2);
      expect(colourDifference(paths[0].getAttribute('stroke')!, referenceColour(525))).toBeLessThan(SAME_COLOUR);
      expect(paths[0].getAttribute('stroke-dasharray')).toBe('none');
      expect(paths[0].getAttribute('d')!.length).toBeGreaterThan(50);
      // Near-infrared curves share one dark grey (the chart's NIR style), told apart by their dashes and the legend.
      expect(paths[1].getAttribute('stroke')).toBe('#4a4a4a');
      expect(paths[1].getAttribute('stroke-dasharray')).toBe('6 3');
      expect(el.shadowRoot!.textContent).toContain('NIR: near-infrared emission');
    },
  );

  it('draws the x axis in nm with d3-axis tick labels and marks the excitation line', async () => {
    const el = await mount();
    const ticks = [...el.shadowRoot!.querySelectorAll('g.x-axis .tick text')].map((t) => t.textContent);
    expect(ticks).toContain('500');
    expect(el.shadowRoot!.querySelectorAll('line.excitation').length).toBe(1);
    expect(el.shadowRoot!.textContent).toContain('ex 405');
  });

  it('moving a peak from 525 to 545 nm redraws its path in the CIE 1931 colour of 545 nm', async () => {
    const el = await mount();
    const before = el.shadowRoot!.querySelector('path.curve')!.getAttribute('d');
    el.curves = [{ id: 'p1', label: 'Green', peakNm: 545, spectrum: gaussian(545, 30) }];
    await el.updateComplete;
    const after = el.shadowRoot!.querySelector('path.curve')!;
    expect(after.getAttribute('d')).not.toBe(before);
    expect(colourDifference(after.getAttribute('stroke')!, referenceColour(545))).toBeLessThan(SAME_COLOUR);
    // 525 and 545 nm must not look alike, or the check above would pass for a curve that kept its old colour.
    expect(colourDifference(referenceColour(525), referenceColour(545))).toBeGreaterThan(5 * SAME_COLOUR);
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

  it('unticking the "Orange channel" hides its shading and its edge handles; the legend still lists it', async () => {
    const el = await mount();
    legendItem(el, 'Orange channel').querySelector('input')!.click();
    await el.updateComplete;
    expect(el.shadowRoot!.querySelectorAll('path.passband').length).toBe(0);
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
