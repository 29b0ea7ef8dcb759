import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { openBrowser, shot, SHOT_DIR, visitAsNewUser } from './helpers/browser';
import { startApp, type StartedApp } from '../quality/helpers/app';

let app: StartedApp;
let browser: Awaited<ReturnType<typeof openBrowser>>;

beforeAll(async () => {
  app = await startApp();
  browser = await openBrowser();
});

afterAll(async () => {
  await browser?.close();
  await app?.stop();
});

/** The demo panel on a fresh visit at `widthPx`, with the report preview open; fails on any script error. */
async function openReport(widthPx: number): Promise<{ page: Page; problems: string[] }> {
  const { page, problems } = await visitAsNewUser(browser.context, `${app.baseUrl}/`, { widthPx });
  await page.locator('qdp-panel-actions button', { hasText: 'Preview report' }).click();
  await page.locator('qdp-panel-report article').waitFor();
  return { page, problems };
}

/** Pages in a PDF: its page objects (`/Type /Page`, not `/Type /Pages`). */
const pdfPages = (pdf: Buffer) => (pdf.toString('latin1').match(/\/Type\s*\/Page(?![a-z])/g) ?? []).length;

/** Inputs, selects and text areas of the page that take up room on screen in the current media. */
const visibleEditors = (page: Page) =>
  page.evaluate(() => {
    const found: string[] = [];
    const walk = (root: Document | ShadowRoot) => {
      for (const el of root.querySelectorAll('*')) {
        if (el.shadowRoot) walk(el.shadowRoot);
        if (!el.matches('input, select, textarea')) continue;
        const box = el.getBoundingClientRect();
        if (box.width > 0 && box.height > 0) found.push(el.outerHTML.slice(0, 80));
      }
    };
    walk(document);
    return found;
  });

describe('the printable report', () => {
  it('demo preview: legend with every probe, both matrices, noise, cadmium caution, settings', async () => {
    const { page, problems } = await openReport(1440);
    const report = page.locator('qdp-panel-report article');
    const legend = (await page.locator('qdp-panel-report .chart svg g.legend').textContent()) ?? '';
    for (const probe of ['Nuclear stain', 'Envelope dot', 'Mito dot', 'Actin dot', 'Vessel dot', 'Membrane dot']) {
      expect(legend).toContain(probe);
    }
    expect(await page.locator('qdp-panel-report .chart svg .handle').count()).toBe(0);
    const crosstalk = report.locator('table[aria-label="Crosstalk between probes"]');
    expect(await crosstalk.locator('tbody tr').count()).toBe(6);
    const spillover = report.locator('table[aria-label="Spillover by channel"]');
    expect(await spillover.locator('tbody tr').count()).toBe(6);
    expect(await spillover.innerText()).toContain('primary');
    const text = await report.innerText();
    expect(text).toContain('Unmixing noise');
    expect(text).toMatch(/Nuclear stain: this target's noise grows about \d/);
    expect(text).toContain('This panel contains cadmium.');
    expect(text).toContain('IARC Group 1');
    expect(text).toContain('local regulations, institutional safety rules and licensed practice');
    expect(text).toContain('bandpass 460/40');
    expect(text).toMatch(/Excitation lines:?\s*405 nm \(relative power 1\)/);
    expect(text).toMatch(/Excluded materials:?\s*none/);
    expect(text).toContain('Demo: six targets');
    expect(await report.locator('.meta a').getAttribute('href')).toMatch(/^http:\/\/127\.0\.0\.1:\d+\/#/);
    await shot(page, 'report-01-preview-1440', report);
    await report.screenshot({ path: join(SHOT_DIR, 'report-01-preview-whole-1440.png') });
    expect(problems).toEqual([]);
    await page.close();
  });

  it("at 390 px the preview fits the phone, and its chart is drawn at least 600 px wide, not the phone's", async () => {
    const { page, problems } = await openReport(390);
    const report = page.locator('qdp-panel-report article');
    const viewBox = (await report.locator('.chart svg').getAttribute('viewBox')) ?? '';
    expect(Number(viewBox.split(' ')[2])).toBeGreaterThanOrEqual(600);
    await report.screenshot({ path: join(SHOT_DIR, 'report-02-preview-whole-390.png') });
    await shot(page, 'report-02a-preview-top-390', report);
    await shot(page, 'report-02b-preview-matrices-390', report.locator('section.crosstalk'));
    await shot(page, 'report-02c-preview-settings-390', report.locator('section.settings'));
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
    expect(problems).toEqual([]);
    await page.close();
  });

  for (const widthPx of [1440, 390]) {
    it(`printed from a ${widthPx} px window: at most 2 pages, the report only, no editor inputs`, async () => {
      const { page, problems } = await openReport(widthPx);
      await page.emulateMedia({ media: 'print' });
      expect(await visibleEditors(page)).toEqual([]);
      expect(await page.locator('qdp-panel-app main').isVisible()).toBe(false);
      expect(await page.locator('qdp-panel-app header').first().isVisible()).toBe(false);
      expect(await page.locator('qdp-panel-report article').isVisible()).toBe(true);
      expect(await page.locator('qdp-panel-report .bar').isVisible()).toBe(false);
      await page.screenshot({ path: join(SHOT_DIR, `report-03-print-media-${widthPx}.png`), fullPage: true });
      for (const format of ['A4', 'Letter'] as const) {
        const pdf = await page.pdf({ format, printBackground: true });
        mkdirSync(SHOT_DIR, { recursive: true });
        writeFileSync(join(SHOT_DIR, `report-${widthPx}-${format}.pdf`), pdf);
        const pages = pdfPages(pdf);
        expect(pages, `${format} pages`).toBeGreaterThanOrEqual(1);
        expect(pages, `${format} pages`).toBeLessThanOrEqual(2);
      }
      // The paper's text width (A4 less 12 mm margins, 186 mm at 96 px per inch), to look at the pages as printed.
      await page.setViewportSize({ width: 703, height: 1032 });
      await page.screenshot({ path: join(SHOT_DIR, `report-04-paper-from-${widthPx}.png`), fullPage: true });
      expect(problems).toEqual([]);
      await page.close();
    });
  }

  it("printing from the browser's menu without a preview prints the report alone, its chart included", async () => {
    const { page } = await visitAsNewUser(browser.context, `${app.baseUrl}/`);
    expect(await page.locator('qdp-panel-report article').count()).toBe(0);
    // What the browser does on Ctrl+P: beforeprint, then the pages are laid out in print media.
    await page.evaluate(() => window.dispatchEvent(new Event('beforeprint')));
    await page.emulateMedia({ media: 'print' });
    expect(await page.locator('qdp-panel-report article').isVisible()).toBe(true);
    expect(await page.locator('qdp-panel-report .chart svg g.legend').textContent()).toContain('Membrane dot');
    expect(await page.locator('qdp-panel-app main').isVisible()).toBe(false);
    expect(pdfPages(await page.pdf({ format: 'A4' }))).toBeLessThanOrEqual(2);
    await page.close();
  });

  it('the print action opens the report and calls window.print once', async () => {
    const { page } = await openReport(1440);
    await page.locator('qdp-panel-report .bar button', { hasText: 'Close preview' }).click();
    expect(await page.locator('qdp-panel-report article').isVisible()).toBe(false);
    await page.evaluate(() => {
      const w = window as unknown as { printed: number };
      w.printed = 0;
      window.print = () => void w.printed++;
    });
    await page.locator('qdp-panel-actions button', { hasText: 'Print report' }).click();
    await expect.poll(() => page.evaluate(() => (window as unknown as { printed: number }).printed)).toBe(1);
    expect(await page.locator('qdp-panel-report article').isVisible()).toBe(true);
    await page.close();
  });
});
