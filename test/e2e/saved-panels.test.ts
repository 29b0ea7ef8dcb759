import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { BrowserContext, Page } from 'playwright-core';
import { openBrowser, openEditors, shot } from './helpers/browser';
import { startApp, type StartedApp } from '../quality/helpers/app';

let app: StartedApp;
let browser: { context: BrowserContext; close(): Promise<void> };
let page: Page;
const problems: string[] = [];

beforeAll(async () => {
  app = await startApp();
  browser = await openBrowser();
  page = await browser.context.newPage();
  page.on('pageerror', (e) => problems.push(`pageerror: ${e.message}`));
  page.on('console', (m) => m.type() === 'error' && problems.push(`console: ${m.text()}`));
  page.on('dialog', async (d) => {
    problems.push(`dialog: ${d.message()}`);
    await d.dismiss();
  });
});

afterAll(async () => {
  await browser?.close();
  await app?.stop();
});

/** The centre field of the demo's fifth channel ("Red", bandpass 660/20). */
const redCentre = (p: Page) =>
  p.locator('qdp-channel-card').nth(4).locator('qdp-number-field[data-field="filters.0.centerNm"] input');

/** The Red channel's centres in the entries of My panels' IndexedDB store, as the browser holds them. */
function savedRedCentres(p: Page): Promise<number[]> {
  return p.evaluate(
    () =>
      new Promise<number[]>((resolve, reject) => {
        const req = indexedDB.open('qdpanel');
        // Reading must not create the page's database before the page does (it would lack the page's store).
        req.onupgradeneeded = () => req.transaction?.abort();
        req.onerror = () => resolve([]);
        req.onsuccess = () => {
          const db = req.result;
          if (!db.objectStoreNames.contains('panels')) {
            db.close();
            return resolve([]);
          }
          const all = db.transaction('panels').objectStore('panels').getAll();
          db.close(); // takes effect once the read is done
          all.onsuccess = () =>
            resolve(
              (all.result as { panel: { channels: { label?: string; filters: { centerNm?: number }[] }[] } }[])
                .map((e) => e.panel.channels.find((c) => c.label === 'Red')?.filters[0]?.centerNm ?? NaN)
                .filter((n) => !Number.isNaN(n)),
            );
          all.onerror = () => reject(all.error);
        };
      }),
  );
}

/** The panel is computed and its editors are open, as a user opens them to edit. */
const ready = async () => {
  await page.locator('qdp-crosstalk-table p.worst').waitFor();
  await openEditors(page);
};
const myPanels = () => page.locator('qdp-my-panels');

describe('panels kept in this browser', () => {
  it('an edit of the demo is saved in IndexedDB and a reload of the bare address brings it back', async () => {
    await page.goto(app.baseUrl + '/');
    await ready();
    expect(await redCentre(page).inputValue()).toBe('660');
    await redCentre(page).fill('650');
    await redCentre(page).press('Tab');
    await expect.poll(() => savedRedCentres(page), { timeout: 5000 }).toEqual([650]);
    await page.goto(app.baseUrl + '/');
    await ready();
    expect(page.url()).toBe(app.baseUrl + '/');
    expect(await redCentre(page).inputValue()).toBe('650');
  });

  it('after "New panel", My panels opens the earlier panel with its edit, as a step that Undo takes back', async () => {
    await page.getByRole('button', { name: 'New panel' }).click();
    await expect.poll(() => page.locator('qdp-channel-card').count()).toBe(0);
    await myPanels().locator('summary').click();
    const entry = myPanels().locator('li.entry:not(.current)').filter({ hasText: 'Demo: six targets' });
    await expect.poll(() => entry.count()).toBe(1);
    expect(await entry.innerText()).toContain('6 probes, 6 channels');
    await shot(page, 'saved-01-list-1280', myPanels());
    await entry.getByRole('button', { name: /^Open / }).click();
    await ready();
    expect(await redCentre(page).inputValue()).toBe('650');
    await page.locator('qdp-panel-app').getByRole('button', { name: 'Undo', exact: true }).click();
    await expect.poll(() => page.locator('qdp-channel-card').count()).toBe(0);
    await page.locator('qdp-panel-app').getByRole('button', { name: 'Redo', exact: true }).click();
    await expect.poll(() => redCentre(page).inputValue()).toBe('650');
  });

  it('comparing a fresh demo with the saved one says the Red band changed; both fit a 390 px screen', async () => {
    await page.getByRole('button', { name: 'Open the demo panel' }).click();
    await ready();
    expect(await redCentre(page).inputValue()).toBe('660');
    const list = myPanels();
    await list.locator('li.entry.current').getByRole('checkbox').check();
    await list.locator('li.entry:not(.current)').first().getByRole('checkbox').check();
    const compare = list.locator('qdp-panel-compare');
    await expect
      .poll(() => compare.locator('ul.diff').innerText())
      .toContain("Channel 'Red': bandpass 660/20 → 650/20");
    const [first, second] = await compare.locator('section').allInnerTexts();
    expect(first).toContain('Red: bandpass 660/20');
    expect(second).toContain('Red: bandpass 650/20');
    expect(second).toMatch(/Worst crosstalk: \d+(\.\d+)? % \(.+ into .+’s channel\)/);
    expect(second).toMatch(/Condition number: \d/);
    await shot(page, 'saved-02-compare-1280', compare);
    await page.setViewportSize({ width: 390, height: 844 });
    await page.waitForTimeout(200);
    await shot(page, 'saved-03-list-390', list);
    await shot(page, 'saved-04-compare-390', compare.locator('ul.diff'));
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
    expect(problems).toEqual([]);
  });
});
