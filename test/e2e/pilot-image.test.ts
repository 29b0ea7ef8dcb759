// Unmixing the demo pilot image in the app as `npm start` serves it (its lazily loaded part, its Web Worker, the demo
// file from web/public/demo, the page's Content-Security-Policy), reached with the keyboard at 1440 px and by taps on
// a 390 px phone, without the page growing wider than the screen.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { openBrowser, shot } from './helpers/browser';
import { startApp, type StartedApp } from '../quality/helpers/app';

let app: StartedApp;
let browser: Awaited<ReturnType<typeof openBrowser>>;
let phone: Awaited<ReturnType<typeof openBrowser>>;

beforeAll(async () => {
  app = await startApp();
  browser = await openBrowser();
  phone = await openBrowser({ touch: true });
});

afterAll(async () => {
  await browser?.close();
  await phone?.close();
  await app?.stop();
});

/** What has the keyboard focus, through shadow roots: its tag and its text or accessible name. */
function focused(page: Page): Promise<string> {
  return page.evaluate(() => {
    let e: Element | null = document.activeElement;
    while (e?.shadowRoot?.activeElement) e = e.shadowRoot.activeElement;
    return e ? `${e.tagName.toLowerCase()} ${(e.getAttribute('aria-label') ?? e.textContent ?? '').trim()}` : '';
  });
}

async function openDemo(page: Page, width: number): Promise<void> {
  await page.setViewportSize({ width, height: 900 });
  await page.goto(app.baseUrl + '/');
  await page.locator('qdp-spectrum-chart path.curve').nth(5).waitFor();
}

describe('the pilot image in the app', () => {
  it('unmixes the demo image by keyboard at 1440 px into six abundance maps and a residual map', async () => {
    const page = await browser.context.newPage();
    await openDemo(page, 1440);
    const summary = page.locator('summary', { hasText: 'Unmix a pilot image' });
    await summary.focus();
    await page.keyboard.press('Enter');
    // The file chooser, then "Try the demo image".
    await page.keyboard.press('Tab');
    await page.keyboard.press('Tab');
    expect(await focused(page)).toBe('button Try the demo image');
    await page.keyboard.press('Enter');
    await page.locator('qdp-pilot-image .loaded').waitFor();
    await page.getByLabel('Least squares (abundances may come out negative)').check();
    await page.getByRole('button', { name: 'Unmix the image' }).press('Enter');
    await page.locator('qdp-image-map').nth(6).waitFor();
    expect(await page.locator('qdp-image-map').count()).toBe(7);
    await expect.poll(() => page.locator('qdp-pilot-image output').textContent()).toContain('Unmixed by Least squares');
    await shot(page, 'pilot-image-1440', page.locator('qdp-image-map').first());
    await page.close();
  });

  it('unmixes the demo image on a 390 px phone with no sideways scrolling', async () => {
    const page = await phone.context.newPage();
    await openDemo(page, 390);
    await page.locator('summary', { hasText: 'Unmix a pilot image' }).tap();
    await page.getByRole('button', { name: 'Try the demo image' }).tap();
    await page.locator('qdp-pilot-image .loaded').waitFor();
    await page.getByRole('button', { name: 'Unmix the image' }).tap();
    await page.locator('qdp-image-map').nth(6).waitFor();
    expect(await page.evaluate(() => document.documentElement.scrollWidth <= window.innerWidth)).toBe(true);
    await shot(page, 'pilot-image-390', page.locator('qdp-image-map').first());
    await page.close();
  });
});
