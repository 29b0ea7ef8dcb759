// The spectra chart's own look on the served page (palette by peak, peak labels, detection strip, curve-height
// choice) and the unmixing-noise reading of the demo's most overlapping targets.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { BrowserContext } from 'playwright-core';
import { openBrowser, shot, visitAsNewUser } from './helpers/browser';
import { startApp, type StartedApp } from '../quality/helpers/app';
import { decodeFragment } from '../../web/state/fragment';
import { DEFAULT_GRID, evaluatePanel, type PanelSpec } from '../../spectra/index';

let app: StartedApp;
let browser: { context: BrowserContext; close(): Promise<void> };

beforeAll(async () => {
  app = await startApp();
  browser = await openBrowser();
});

afterAll(async () => {
  await browser?.close();
  await app?.stop();
});

/** The demo page as a new visitor sees it, at `widthPx`, with script errors collected. */
const openDemo = (widthPx: number) => visitAsNewUser(browser.context, `${app.baseUrl}/`, { widthPx });

describe('the spectra chart and noise reading on the demo', () => {
  it("the demo's most overlapping pair both read a noise gain above 1.00× after unmixing", async () => {
    const { page, problems } = await openDemo(1440);
    const { panel } = decodeFragment(new URL(page.url()).hash) as { panel: PanelSpec };
    // The pair with the largest crosstalk, read off a new evaluation: light of t in u's primary channel over u's own.
    const ev = evaluatePanel(panel, { grid: DEFAULT_GRID });
    let worst = { t: 0, u: 0, value: -1 };
    panel.probes.forEach((_, t) =>
      panel.probes.forEach((__, u) => {
        const c = ev.primaryChannel[u];
        if (t === u || c === null) return;
        const value = ev.collected[c][t] / ev.collected[c][u];
        if (value > worst.value) worst = { t, u, value };
      }),
    );
    expect(worst.value).toBeGreaterThan(0.5);
    const items = await page.locator('qdp-crosstalk-table li').allInnerTexts();
    for (const j of [worst.t, worst.u]) {
      const label = panel.probes[j].label || panel.probes[j].id;
      const line = items.find((text) => text.startsWith(`${label}:`))!;
      const gain = Number(/noise grows about ([\d.]+)×/.exec(line)![1]);
      expect(gain).toBeGreaterThan(1.0);
    }
    expect(problems).toEqual([]);
    await page.close();
  });

  it('names every demo curve at its peak at 1440 px, each curve with its own colour and dash', async () => {
    const { page, problems } = await openDemo(1440);
    const chart = page.locator('qdp-spectrum-chart');
    await expect.poll(() => chart.locator('path.curve').count()).toBe(6);
    const looks = await chart
      .locator('path.curve')
      .evaluateAll((paths) => paths.map((p) => `${p.getAttribute('stroke')}|${p.getAttribute('stroke-dasharray')}`));
    expect(new Set(looks).size).toBe(6);
    expect(await chart.locator('text.peak-label').count()).toBe(6);
    expect(await chart.locator('g.window').count()).toBe(6);
    await shot(page, '21-chart-look-1440', chart.locator('svg'));
    expect(problems).toEqual([]);
    await page.close();
  });

  it('"shape only" labels the emission axis "emission (peak = 1)"; "expected signal" restores the label', async () => {
    const { page, problems } = await openDemo(390);
    const chart = page.locator('qdp-spectrum-chart');
    const yLabel = () => chart.locator('text.y-label').textContent();
    expect((await yLabel())!.trim()).toBe('relative emission × brightness');
    await page.locator('qdp-height-toggle').getByText('shape only').click();
    await expect.poll(async () => (await yLabel())!.trim()).toBe('emission (peak = 1)');
    await shot(page, '22-chart-look-shape-only-390', chart.locator('svg'));
    await page.locator('qdp-height-toggle').getByText('expected signal').click();
    await expect.poll(async () => (await yLabel())!.trim()).toBe('relative emission × brightness');
    expect(problems).toEqual([]);
    await page.close();
  });
});
