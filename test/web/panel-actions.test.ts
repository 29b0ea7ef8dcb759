// Component tests in headless Chromium for the share and export buttons. Downloads are caught as the page makes them
// (the temporary <a download> the element clicks) and read back from their blob URL; the test page has no qdpanel API
// behind it, so share and the server side of the ordering sheet take their real "server unreachable" paths.
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import type { PanelSpec } from '../../spectra/index';
import '../../web/elements/panel-actions';
import { demoPanel } from '../../web/state/demo-panel';

type Download = { filename: string; blob: Promise<Blob> };
let downloads: Download[] = [];

/** Catches each download link the element clicks, keeps its file, and stops the browser from saving it. */
function catchDownload(e: MouseEvent): void {
  const a = e.target;
  if (!(a instanceof HTMLAnchorElement) || !a.download) return;
  e.preventDefault();
  downloads.push({ filename: a.download, blob: fetch(a.href).then((r) => r.blob()) });
}

beforeEach(() => {
  downloads = [];
  document.addEventListener('click', catchDownload, true);
});
afterEach(() => {
  document.removeEventListener('click', catchDownload, true);
  document.body.replaceChildren();
});

async function mount(
  panel: PanelSpec | undefined,
  setup: (el: HTMLElementTagNameMap['qdp-panel-actions']) => void = () => {},
) {
  const el = document.createElement('qdp-panel-actions');
  el.panel = panel;
  setup(el);
  document.body.appendChild(el);
  await el.updateComplete;
  return el;
}

const button = (el: HTMLElement, start: string) =>
  [...el.shadowRoot!.querySelectorAll('button')].find((b) => b.textContent!.trim().startsWith(start))!;
const panelButtons = (el: HTMLElement) => ['Share', 'Ordering sheet', 'Panel (JSON)'].map((s) => button(el, s));
const liveMessage = (el: HTMLElement) => el.shadowRoot!.querySelector('p[aria-live="polite"]')!.textContent!.trim();

/** An inline chart stand-in: 300 × 120 px with one focusable curve, as the spectrum chart draws. */
function smallChart(): SVGSVGElement {
  const ns = 'http://www.w3.org/2000/svg';
  const svg = document.createElementNS(ns, 'svg');
  svg.setAttribute('width', '300');
  svg.setAttribute('height', '120');
  svg.setAttribute('style', 'outline: 1px solid red');
  const path = document.createElementNS(ns, 'path');
  path.setAttribute('d', 'M0 100 L150 10 L300 100');
  path.setAttribute('stroke', '#c60');
  path.setAttribute('tabindex', '0');
  svg.appendChild(path);
  document.body.appendChild(svg);
  return svg;
}

describe('<qdp-panel-actions>', () => {
  it('saves the panel as JSON under a file name made from its title, readable back as the same panel', async () => {
    const panel = demoPanel();
    const el = await mount(panel);
    button(el, 'Panel (JSON)').click();
    expect(downloads.map((d) => d.filename)).toEqual(['demo-six-targets-on-a-tissue-section-one-405-nm-line.json']);
    const blob = await downloads[0].blob;
    expect(blob.type).toBe('application/json');
    expect(JSON.parse(await blob.text())).toEqual(panel);
  });

  it('<qdp-panel-actions> names the file "panel" when the title is missing or has no letters or digits', async () => {
    const { title: _t, ...untitled } = demoPanel();
    const el = await mount(untitled);
    button(el, 'Panel (JSON)').click();
    el.panel = { ...untitled, title: '— ✶ —' };
    await el.updateComplete;
    button(el, 'Panel (JSON)').click();
    expect(downloads.map((d) => d.filename)).toEqual(['panel.json', 'panel.json']);
  });

  it('with a blocked reason disables share, sheet, matrices and JSON, says why, and saves nothing', async () => {
    const el = await mount(demoPanel(), (a) => {
      a.blocked = 'a probe is made of an excluded material.';
      a.evaluation = { collected: [[1]], spillover: [[1]] };
    });
    expect([...panelButtons(el), button(el, 'Matrices')].map((b) => b.disabled)).toEqual([true, true, true, true]);
    expect(el.shadowRoot!.querySelector('p[role="status"]')!.textContent).toBe(
      'Sharing, the ordering sheet, the matrices and the panel file are off (the chart can still be saved): ' +
        'a probe is made of an excluded material.',
    );
    for (const b of [...panelButtons(el), button(el, 'Matrices')]) b.click();
    await new Promise((r) => setTimeout(r, 50));
    expect(downloads).toEqual([]);
    expect(liveMessage(el)).toBe('');
  });

  it('<qdp-panel-actions> turns share and export back on when the blocked reason is cleared', async () => {
    const el = await mount(demoPanel(), (a) => (a.blocked = 'fix the marked input first.'));
    el.blocked = '';
    await el.updateComplete;
    expect(panelButtons(el).map((b) => b.disabled)).toEqual([false, false, false]);
    expect(el.shadowRoot!.textContent).not.toContain('are off');
  });

  it('gives every button a visible name and keeps a polite live region for its messages', async () => {
    const el = await mount(demoPanel());
    const names = [...el.shadowRoot!.querySelectorAll('button')].map((b) => b.textContent!.trim());
    expect(names).toEqual([
      'Share: store and copy link',
      'Ordering sheet (CSV)',
      'Matrices (CSV)',
      'Panel (JSON)',
      'Chart (SVG)',
      'Chart (PNG)',
      'Preview report',
      'Print report',
    ]);
    for (const b of el.shadowRoot!.querySelectorAll('button')) expect(b.type).toBe('button');
    expect(el.shadowRoot!.querySelector('p[role="status"][aria-live="polite"]')).not.toBeNull();
  });

  it('Preview report and Print report fire report-show {print}, also while share and export are off', async () => {
    const el = await mount(demoPanel(), (a) => (a.blocked = 'a probe is made of an excluded material.'));
    const asked: { print: boolean }[] = [];
    el.addEventListener('report-show', (e) => asked.push((e as CustomEvent<{ print: boolean }>).detail));
    button(el, 'Preview report').click();
    button(el, 'Print report').click();
    expect(asked).toEqual([{ print: false }, { print: true }]);
  });

  it("share without a reachable API: buttons off while it tries, then 'Sharing failed: …' and no link", async () => {
    const el = await mount(demoPanel());
    button(el, 'Share').click();
    await el.updateComplete;
    expect(panelButtons(el).map((b) => b.disabled)).toEqual([true, true, true]);
    await vi.waitFor(() => expect(liveMessage(el)).toMatch(/^Sharing failed: \S/), { timeout: 10_000 });
    await el.updateComplete;
    expect(panelButtons(el).map((b) => b.disabled)).toEqual([false, false, false]);
    expect(el.shadowRoot!.querySelector('input')).toBeNull();
  });

  it("ordering sheet with no API reachable is saved from the page's own values and says so", async () => {
    const panel = demoPanel();
    const localResolved = panel.probes.map((_, i) => ({
      diameterNm: 3.25 + i,
      emissionPeakNm: 500 + 11 * i,
      fwhmNm: 30,
      firstExcitonNm: 490 + 11 * i,
    }));
    const el = await mount(panel, (a) => (a.localResolved = localResolved));
    button(el, 'Ordering sheet').click();
    await vi.waitFor(() => expect(downloads).toHaveLength(1), { timeout: 10_000 });
    expect(downloads[0].filename).toBe('demo-six-targets-on-a-tissue-section-one-405-nm-line-order.csv');
    expect(liveMessage(el)).toMatch(/^Ordering sheet saved with values computed in this page \(server: .+\)\.$/);
    const rows = (await (await downloads[0].blob).text()).split('\r\n');
    const orange = rows.find((r) => r.startsWith('p4,'))!;
    expect(orange.split(',')).toEqual(
      expect.arrayContaining([
        'Actin dot',
        'cdse',
        String(localResolved[3].diameterNm),
        String(localResolved[3].emissionPeakNm),
      ]),
    );
  });

  it('saves the chart as a standalone SVG document without its page style or tab stops', async () => {
    const el = await mount(demoPanel(), (a) => (a.chartSvg = smallChart));
    button(el, 'Chart (SVG)').click();
    expect(downloads.map((d) => d.filename)).toEqual([
      'demo-six-targets-on-a-tissue-section-one-405-nm-line-spectra.svg',
    ]);
    const text = await (await downloads[0].blob).text();
    expect(text.startsWith('<?xml')).toBe(true);
    const doc = new DOMParser().parseFromString(text, 'image/svg+xml');
    expect(doc.querySelector('parsererror')).toBeNull();
    expect(doc.documentElement.namespaceURI).toBe('http://www.w3.org/2000/svg');
    expect(doc.querySelector('path')!.getAttribute('d')).toBe('M0 100 L150 10 L300 100');
    expect(doc.querySelectorAll('[tabindex]')).toHaveLength(0);
    expect(doc.documentElement.hasAttribute('style')).toBe(false);
  });

  it('<qdp-panel-actions> saves the chart as a PNG at twice the size of the exported SVG', async () => {
    const el = await mount(demoPanel(), (a) => (a.chartSvg = smallChart));
    button(el, 'Chart (SVG)').click();
    button(el, 'Chart (PNG)').click();
    await vi.waitFor(() => expect(downloads).toHaveLength(2), { timeout: 10_000 });
    expect(downloads[1].filename).toBe('demo-six-targets-on-a-tissue-section-one-405-nm-line-spectra.png');
    const svgDoc = new DOMParser().parseFromString(await (await downloads[0].blob).text(), 'image/svg+xml');
    const [w, h] = ['width', 'height'].map((a) => Number(svgDoc.documentElement.getAttribute(a)));
    expect(w).toBe(300);
    expect(h).toBeGreaterThan(120); // the title row and the legend's spacing come on top of the 120 px chart
    const blob = await downloads[1].blob;
    expect(blob.type).toBe('image/png');
    const image = await createImageBitmap(blob);
    expect([image.width, image.height]).toEqual([2 * w, 2 * h]);
  });

  it('saves the matrices CSV named after the title; its button is off until an evaluation is given', async () => {
    const el = await mount(demoPanel());
    expect(button(el, 'Matrices').disabled).toBe(true);
    el.evaluation = {
      collected: [
        [4, 1],
        [1, 3],
      ],
      spillover: [
        [1, 0.5],
        [0.25, 1],
      ],
    };
    el.panel = { ...demoPanel(), probes: demoPanel().probes.slice(0, 2), channels: demoPanel().channels.slice(0, 2) };
    await el.updateComplete;
    button(el, 'Matrices').click();
    expect(downloads.map((d) => d.filename)).toEqual([
      'demo-six-targets-on-a-tissue-section-one-405-nm-line-matrices.csv',
    ]);
    const text = await (await downloads[0].blob).text();
    expect(text).toContain('matrix,collected signal,');
    expect(text).toContain('matrix,unmixing,');
    expect(liveMessage(el)).toMatch(/^Matrices saved/);
  });

  it('<qdp-panel-actions> chart export without a chart, and every export without a panel, saves nothing', async () => {
    const el = await mount(undefined, (a) => (a.chartSvg = smallChart));
    for (const b of el.shadowRoot!.querySelectorAll('button')) b.click();
    el.panel = demoPanel();
    el.chartSvg = () => null;
    await el.updateComplete;
    button(el, 'Chart (SVG)').click();
    button(el, 'Chart (PNG)').click();
    await new Promise((r) => setTimeout(r, 100));
    expect(downloads).toEqual([]);
  });
});
