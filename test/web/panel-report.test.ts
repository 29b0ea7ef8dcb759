// The report element on the demo panel as the page computes it, with a real <qdp-spectrum-chart> as the page's chart.
import { afterEach, describe, expect, it, vi } from 'vitest';
import '../../web/elements/panel-report';
import '../../web/elements/spectrum-chart';
import type { PanelReport } from '../../web/elements/panel-report';
import type { SpectrumChart } from '../../web/elements/spectrum-chart';
import { computePanel, DETECTORS, MATERIALS } from '../../web/state/compute';
import { demoPanel } from '../../web/state/demo-panel';

afterEach(() => {
  document.body.replaceChildren();
  vi.restoreAllMocks();
});

/** The page's chart at `widthPx` and the report fed like the page feeds it; the report is not open yet. */
async function mount(widthPx = 900): Promise<{ report: PanelReport; chart: SpectrumChart }> {
  const panel = demoPanel();
  const r = computePanel(panel, { byBrightness: true });
  if (!r.ok) throw new Error(r.error.message);
  const chart = document.createElement('qdp-spectrum-chart');
  chart.style.width = `${widthPx}px`;
  chart.curves = r.value.chart.curves;
  chart.passbands = r.value.chart.passbands;
  chart.excitationNm = [405];
  document.body.appendChild(chart);
  await chart.updateComplete;
  await new Promise((resolve) => requestAnimationFrame(resolve));
  await chart.updateComplete;
  const report = document.createElement('qdp-panel-report');
  report.panel = panel;
  report.computed = r.value;
  report.materials = MATERIALS;
  report.detectors = DETECTORS;
  report.instrumentName = 'Wide-field 1';
  report.chart = () => chart;
  document.body.appendChild(report);
  await report.updateComplete;
  return { report, chart };
}

const text = (report: PanelReport) => report.shadowRoot!.querySelector('article')?.textContent ?? '';

describe('<qdp-panel-report>', () => {
  it('draws nothing and takes no room until it is shown', async () => {
    const { report } = await mount();
    expect(report.shadowRoot!.querySelector('article')).toBeNull();
    expect(report.getBoundingClientRect().height).toBe(0);
  });

  it("show(): title, date, link, the page's chart without handles and with every probe in its legend", async () => {
    const { report, chart } = await mount();
    await report.show();
    const root = report.shadowRoot!;
    expect(root.querySelector('h1')!.textContent).toBe('Demo: six targets on a tissue section, one 405 nm line');
    expect(root.querySelector('.link a')!.getAttribute('href')).toBe(location.href);
    const svg = root.querySelector('.chart svg')!;
    const page = chart.shadowRoot!.querySelector('svg')!;
    expect(page.querySelectorAll('.handle').length).toBeGreaterThan(0);
    expect(svg.querySelectorAll('.handle').length).toBe(0);
    const legend = svg.querySelector('g.legend')!.textContent!;
    for (const probe of ['Nuclear stain', 'Envelope dot', 'Mito dot', 'Actin dot', 'Vessel dot', 'Membrane dot']) {
      expect(legend).toContain(probe);
    }
    // The report heads the chart itself: the picture has no title of its own.
    expect(svg.querySelector(':scope > text')).toBeNull();
    expect(svg.getAttribute('viewBox')!.split(' ')[2]).toBe(String(page.width.baseVal.value));
  });

  it('holds the probe and channel tables, both matrices, the noise, the cadmium hazard and the settings', async () => {
    const { report } = await mount();
    await report.show();
    const root = report.shadowRoot!;
    const probes = root.querySelector('table[aria-label="Probes"]')!;
    expect(probes.querySelectorAll('tbody tr').length).toBe(6);
    expect(probes.querySelector('tbody tr')!.textContent).toContain('nuclear DNA counterstain');
    expect(root.querySelector('table[aria-label="Detection channels"]')!.textContent).toContain('bandpass 620/20');
    expect(root.querySelectorAll('table[aria-label="Crosstalk between probes"] tbody tr').length).toBe(6);
    expect(root.querySelectorAll('table[aria-label="Spillover by channel"] tbody tr').length).toBe(6);
    expect(root.querySelectorAll('section.noise li').length).toBe(6);
    const all = text(report);
    expect(all).toContain('This panel contains cadmium.');
    expect(all).toContain('DNA-binding stains');
    expect(all).toContain('local regulations, institutional safety rules and licensed practice');
    const terms = [...root.querySelectorAll('dt')].map((dt) => dt.textContent);
    expect(terms).toContain('Instrument profile');
    expect(terms).toContain('Excitation lines');
    expect(root.querySelectorAll('input, select, textarea').length).toBe(0);
  });

  it('without an evaluation it says there are no figures instead of the matrices', async () => {
    const { report } = await mount();
    report.computed = undefined;
    await report.show();
    expect(report.shadowRoot!.querySelector('table[aria-label="Spillover by channel"]')).toBeNull();
    expect(text(report)).toContain('No figures');
  });

  it("a page chart narrower than 600 px is drawn again at the chart's default 800 px for the report", async () => {
    const { report } = await mount(360);
    await report.show();
    expect(report.shadowRoot!.querySelector('.chart svg')!.getAttribute('viewBox')!.split(' ')[2]).toBe('800');
  });

  it('show({ print: true }) prints once; Close preview hides it and says so', async () => {
    const { report } = await mount();
    const print = vi.spyOn(window, 'print').mockImplementation(() => {});
    await report.show({ print: true });
    expect(print).toHaveBeenCalledTimes(1);
    const closed = vi.fn();
    report.addEventListener('report-close', closed);
    const close = [...report.shadowRoot!.querySelectorAll('button')].find((b) => b.textContent === 'Close preview')!;
    close.click();
    await report.updateComplete;
    expect(closed).toHaveBeenCalledTimes(1);
    expect(report.getBoundingClientRect().height).toBe(0);
  });

  it('the legend lists the six probes and the six channels of the chart drawn here (12 rows)', async () => {
    const { report } = await mount();
    await report.show();
    expect(report.shadowRoot!.querySelectorAll('.chart svg g.legend > g').length).toBe(12);
  });
});
