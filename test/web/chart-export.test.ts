// The exported chart, checked on its serialized text: a real <qdp-spectrum-chart> drawing the demo panel as the page
// computes it, exported, parsed back as SVG and compared with the chart on the page.
import { afterEach, describe, expect, it } from 'vitest';
import '../../web/elements/spectrum-chart';
import type { SpectrumChart } from '../../web/elements/spectrum-chart';
import { chartSvgExport } from '../../web/io/chart-export';
import { computePanel } from '../../web/state/compute';
import { demoPanel } from '../../web/state/demo-panel';

const SVG_NS = 'http://www.w3.org/2000/svg';

afterEach(() => document.body.replaceChildren());

async function mountDemo(): Promise<SpectrumChart> {
  const panel = demoPanel();
  const r = computePanel(panel, { byBrightness: false });
  if (!r.ok) throw new Error(r.error.message);
  const el = document.createElement('qdp-spectrum-chart');
  el.style.width = '1000px';
  el.curves = r.value.chart.curves;
  el.passbands = r.value.chart.passbands;
  el.excitationNm = panel.excitation.map((e) => e.wavelengthNm);
  document.body.appendChild(el);
  await el.updateComplete;
  await new Promise((resolve) => requestAnimationFrame(resolve));
  await el.updateComplete;
  return el;
}

const pageSvg = (el: SpectrumChart) => el.shadowRoot!.querySelector('svg')!;

function exported(el: SpectrumChart, title = 'Four-colour tissue panel') {
  const out = chartSvgExport(pageSvg(el), { title, legend: el.legendEntries() });
  const doc = new DOMParser().parseFromString(out.text, 'image/svg+xml');
  expect(doc.querySelector('parsererror')).toBeNull();
  return { ...out, doc, root: doc.documentElement };
}

describe('chartSvgExport', () => {
  it('chartSvgExport writes an SVG document with the given title above the plot', async () => {
    const { text, root } = exported(await mountDemo());
    expect(text.startsWith('<?xml version="1.0" encoding="UTF-8"?>\n<svg')).toBe(true);
    expect(root.namespaceURI).toBe(SVG_NS);
    const title = root.querySelector(':scope > text')!;
    expect(title.textContent).toBe('Four-colour tissue panel');
    const plotTop = Number(
      /translate\(0,(\d+)\)/.exec(root.querySelector(':scope > g.chart')!.getAttribute('transform')!)![1],
    );
    expect(Number(title.getAttribute('y'))).toBeLessThan(plotTop);
  });

  it("chartSvgExport's legend lists each probe by name with the colour and dash of its curve on the page", async () => {
    const el = await mountDemo();
    const { root } = exported(el);
    const onPage = [...pageSvg(el).querySelectorAll('path.curve')];
    expect(onPage).toHaveLength(6);
    for (const curve of el.curves) {
      const drawn = onPage.find((p) => p.getAttribute('data-probe') === curve.id)!;
      const item = root.querySelector(`g.legend g[data-key="probe:${curve.id}"]`)!;
      expect(item.querySelector('text')!.textContent).toContain(curve.label);
      const line = item.querySelector('line')!;
      expect(line.getAttribute('stroke')).toBe(drawn.getAttribute('stroke'));
      expect(line.getAttribute('stroke-dasharray')).toBe(drawn.getAttribute('stroke-dasharray'));
    }
  });

  it('chartSvgExport leaves hidden layers out of the legend', async () => {
    const el = await mountDemo();
    const entries = el.legendEntries().map((e, i) => (i === 0 ? { ...e, hidden: true } : e));
    const doc = new DOMParser().parseFromString(
      chartSvgExport(pageSvg(el), { title: 't', legend: entries }).text,
      'image/svg+xml',
    );
    const keys = [...doc.querySelectorAll('g.legend g[data-key]')].map((g) => g.getAttribute('data-key'));
    expect(keys).toEqual(entries.slice(1).map((e) => e.key));
  });

  it('chartSvgExport keeps the wavelength, emission and transmission axis labels and the axis ticks', async () => {
    const el = await mountDemo();
    const { root } = exported(el);
    const texts = [...root.querySelectorAll('text')].map((t) => t.textContent!.trim());
    expect(texts).toEqual(expect.arrayContaining(['wavelength (nm)', el.yLabel, 'passband transmission']));
    expect(root.querySelectorAll('g.x-axis g.tick').length).toBeGreaterThan(3);
  });

  it('chartSvgExport drops the drag handles and hover line the page chart has, and no tab stops remain', async () => {
    const el = await mountDemo();
    el.shadowRoot!.querySelector<SVGRectElement>('rect.plot')!.dispatchEvent(
      new KeyboardEvent('keydown', { key: 'ArrowRight', bubbles: true }),
    );
    await el.updateComplete;
    expect(pageSvg(el).querySelectorAll('g.handle').length).toBeGreaterThan(0);
    expect(pageSvg(el).querySelectorAll('line.hover')).toHaveLength(1);
    const { root } = exported(el);
    expect(root.querySelectorAll('.handle, [role="slider"], line.hover, [tabindex]')).toHaveLength(0);
    // The page's chart keeps its handles.
    expect(pageSvg(el).querySelectorAll('g.handle').length).toBeGreaterThan(0);
  });

  it('chartSvgExport strips the comment markers Lit leaves in the page chart', async () => {
    const el = await mountDemo();
    expect(pageSvg(el).innerHTML).toContain('<!---->');
    expect(exported(el).text).not.toContain('<!--');
  });

  it('chartSvgExport sets one font family on the root svg and no other element sets a font family', async () => {
    const el = await mountDemo();
    const { root, text } = exported(el);
    expect(root.getAttribute('font-family')).toBe('system-ui, sans-serif');
    expect(root.querySelectorAll('[font-family]')).toHaveLength(0);
    expect(text.match(/font-family/g)).toHaveLength(1);
    expect(text).not.toMatch(/style=/);
  });

  it('chartSvgExport sizes the document to hold the title, the plot and every legend row', async () => {
    const el = await mountDemo();
    const { root, widthPx, heightPx } = exported(el);
    expect(root.getAttribute('width')).toBe(String(widthPx));
    expect(root.getAttribute('height')).toBe(String(heightPx));
    expect(root.getAttribute('viewBox')).toBe(`0 0 ${widthPx} ${heightPx}`);
    const legendTop = Number(
      /translate\(0,([\d.]+)\)/.exec(root.querySelector('g.legend')!.getAttribute('transform')!)![1],
    );
    const rows = new Set(
      [...root.querySelectorAll('g.legend g[data-key]')].map(
        (g) => /,([\d.]+)\)/.exec(g.getAttribute('transform')!)![1],
      ),
    );
    const lastRowTop = Math.max(...[...rows].map(Number));
    expect(legendTop).toBeGreaterThanOrEqual(pageSvg(el).height.baseVal.value);
    expect(legendTop + lastRowTop + 12).toBeLessThanOrEqual(heightPx);
  });
});
