// The page's layout as a new user meets it in Chromium: on a 1440 px desktop the chart and the verdict stay in view
// while the editors scroll, Share is at most 60 Tab stops from the top of the demo, and a new row takes the focus; on
// a 390 px phone the chart comes first, the editors are a separate view, and a tap on the chart reads it out.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { BrowserContext, Page } from 'playwright-core';
import { openBrowser, shot, visitAsNewUser } from './helpers/browser';
import { startApp, type StartedApp } from '../quality/helpers/app';

let app: StartedApp;
type Browser = { context: BrowserContext; close(): Promise<void> };
/** A desktop browser, and a touch-screen one for the phone flows. */
let desk: Browser;
let phone: Browser;

beforeAll(async () => {
  app = await startApp();
  desk = await openBrowser();
  phone = await openBrowser({ touch: true });
});

afterAll(async () => {
  await desk?.close();
  await phone?.close();
  await app?.stop();
});

/** The demo at `width` px, as a new visitor sees it (nothing kept from earlier flows); a phone below 600 px. */
async function openDemo(width: number): Promise<Page> {
  const { context } = width < 600 ? phone : desk;
  const { page } = await visitAsNewUser(context, `${app.baseUrl}/`, {
    widthPx: width,
    heightPx: width > 600 ? 900 : 844,
  });
  await page.locator('qdp-spectrum-chart path.curve').nth(5).waitFor();
  return page;
}

/** What has the keyboard focus, through shadow roots: its tag and its text or accessible name. */
function focused(page: Page): Promise<string> {
  return page.evaluate(() => {
    let e: Element | null = document.activeElement;
    while (e?.shadowRoot?.activeElement) e = e.shadowRoot.activeElement;
    if (!e) return '';
    return `${e.tagName.toLowerCase()} ${(e.getAttribute('aria-label') ?? e.textContent ?? '').trim()}`;
  });
}

describe('the page at 1440 px', () => {
  it('reaches the Share button within 60 Tab stops from the top of the demo', async () => {
    const page = await openDemo(1440);
    let stops = 0;
    let reached = false;
    while (stops < 120 && !reached) {
      await page.keyboard.press('Tab');
      stops++;
      reached = /^button Share\b/.test(await focused(page));
    }
    expect(reached).toBe(true);
    expect(stops).toBeLessThanOrEqual(60);
    await page.close();
  });

  it('keeps the chart and the verdict in view after scrolling the editors to the channels', async () => {
    const page = await openDemo(1440);
    await page.locator('qdp-channel-list').getByRole('button', { name: 'Add channel' }).scrollIntoViewIfNeeded();
    await page.mouse.wheel(0, 2000);
    await page.waitForTimeout(200);
    const inView = async (selector: string) => {
      const box = await page.locator(selector).first().boundingBox();
      return box !== null && box.y >= 0 && box.y + Math.min(box.height, 200) <= 900;
    };
    expect(await inView('qdp-spectrum-chart svg')).toBe(true);
    expect(await inView('qdp-key-verdict')).toBe(true);
    expect(await page.locator('qdp-key-verdict [role="status"]').innerText()).toMatch(
      /^Worst pair: .+\n+Noisiest after unmixing: /,
    );
    await shot(page, 'layout-1440-scrolled');
    await page.close();
  });

  it('"Add probe" opens the new row with the keyboard focus on its label field', async () => {
    const page = await openDemo(1440);
    await page.getByRole('button', { name: 'Add probe' }).click();
    await expect.poll(() => page.locator('qdp-probe-list qdp-editor-row').count()).toBe(7);
    expect(await page.locator('qdp-probe-list qdp-editor-row').nth(6).getAttribute('open')).not.toBeNull();
    await expect.poll(() => focused(page)).toMatch(/^input/);
    const label = await page.evaluate(() => {
      let e: Element | null = document.activeElement;
      while (e?.shadowRoot?.activeElement) e = e.shadowRoot.activeElement;
      return e?.closest('label')?.firstChild?.textContent?.trim();
    });
    expect(label).toBe('Label');
    await shot(page, 'layout-1440-added-probe', page.locator('qdp-probe-list qdp-editor-row').nth(6));
    await page.close();
  });
});

describe('the page at 390 px', () => {
  it('shows the chart first, within the first screen, with no sideways scrolling', async () => {
    const page = await openDemo(390);
    const chart = await page.locator('qdp-spectrum-chart svg').first().boundingBox();
    expect(chart).not.toBeNull();
    expect(chart!.y).toBeLessThan(844);
    expect(await page.locator('qdp-probe-list').isVisible()).toBe(false);
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
    await shot(page, 'layout-390-results');
    await page.close();
  });

  it('switches to the editors and back, and a tap on the chart gives a reading at that wavelength', async () => {
    const page = await openDemo(390);
    await page.getByRole('button', { name: 'Edit the panel' }).click();
    expect(await page.locator('qdp-probe-list').isVisible()).toBe(true);
    expect(await page.locator('qdp-spectrum-chart').isVisible()).toBe(false);
    await page.locator('qdp-probe-list qdp-editor-row').first().getByRole('button').first().click();
    await shot(page, 'layout-390-editors');
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
    await page.getByRole('button', { name: 'Chart and results' }).click();
    const plot = await page.locator('qdp-spectrum-chart svg').first().boundingBox();
    await page.touchscreen.tap(plot!.x + plot!.width * 0.55, plot!.y + plot!.height * 0.5);
    await expect
      .poll(() => page.locator('qdp-spectrum-chart p.readout[role="status"]').innerText())
      .toMatch(/\d{3}(\.\d)? nm/);
    await shot(page, 'layout-390-readout', page.locator('qdp-spectrum-chart'));
    await page.close();
  });
});
