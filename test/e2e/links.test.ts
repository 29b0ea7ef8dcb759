import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { BrowserContext, Page } from 'playwright-core';
import { openBrowser, openEditors } from './helpers/browser';
import { startApp, type StartedApp } from '../quality/helpers/app';
import { decodeFragment, encodeFragment, KEPT_IN_BROWSER } from '../../web/state/fragment';
import { LINK_TOO_LARGE } from '../../web/state/state-size';
import { deflateBomb } from '../web/helpers/deflate-bomb';
import type { PanelSpec } from '../../spectra/index';

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

/** A new page on a visitor with nothing kept, failing the test on any script error. */
async function newVisitor(): Promise<{ page: Page; problems: string[] }> {
  const page = await browser.context.newPage();
  const problems: string[] = [];
  page.on('pageerror', (e) => problems.push(`pageerror: ${e.message}`));
  await page.goto(app.baseUrl + '/api/v1/health');
  await page.evaluate(() => localStorage.clear());
  return { page, problems };
}

/** `n` points of a smooth bandpass-like transmission with steep edges, from `fromNm` at 0.2137 nm steps. */
function measuredFilter(n: number, fromNm: number, centerNm: number): [number, number][] {
  return Array.from({ length: n }, (_, i) => {
    const nm = Number((fromNm + i * 0.2137).toFixed(4));
    const t = 0.93 / (1 + Math.exp(-(nm - centerNm + 20) / 3.1)) / (1 + Math.exp((nm - centerNm - 20) / 2.7));
    return [nm, Number(t.toFixed(6))];
  });
}

/** Two dots and two channels, the first a 1,000-point measured filter table. */
const TABLE_PANEL: PanelSpec = {
  version: 1,
  title: 'Measured filter',
  excitation: [{ wavelengthNm: 405 }],
  probes: [
    { id: 'p1', material: 'cdse', emissionPeakNm: 605 },
    { id: 'p2', material: 'cdse', emissionPeakNm: 640 },
  ],
  channels: [
    { id: 'c1', filters: [{ type: 'table', points: measuredFilter(1000, 500, 600) }] },
    { id: 'c2', filters: [{ type: 'bandpass', centerNm: 650, widthNm: 20 }] },
  ],
};

/** The page's evaluation as its own numbers (collected and spillover, every digit). */
const evaluationOf = (page: Page) =>
  page.evaluate(() => {
    const app = document.querySelector('qdp-panel-app') as unknown as {
      computed?: { evaluation: { collected: number[][]; spillover: number[][] } };
    };
    const ev = app.computed?.evaluation;
    return JSON.stringify(ev && { collected: ev.collected, spillover: ev.spillover });
  });

const titleInput = (page: Page) => page.locator('qdp-panel-app header input[type="text"]').first();
const worst = (page: Page) => page.locator('qdp-crosstalk-table p.worst');

/** Types a new title and leaves the field (one edit of the panel). */
async function retitle(page: Page, title: string): Promise<void> {
  await titleInput(page).fill(title);
  await titleInput(page).press('Tab');
}

describe('links', () => {
  it('a link inflating to 64 MiB is refused at once with the notice, and the demo is shown and editable', async () => {
    const { page, problems } = await newVisitor();
    const bytes = deflateBomb(64 * 1024 * 1024);
    const link = 'v1.' + Buffer.from(bytes).toString('base64url');
    await page.goto(`${app.baseUrl}/#${link}`);
    const notice = page.locator('qdp-panel-app p.notice[role="status"]').first();
    await notice.waitFor({ timeout: 5000 });
    expect(await notice.innerText()).toContain(LINK_TOO_LARGE);
    await worst(page).waitFor();
    expect(await titleInput(page).inputValue()).toContain('Demo: six targets');
    await retitle(page, 'Still usable');
    await expect
      .poll(() => decodeFragment(new URL(page.url()).hash))
      .toMatchObject({
        panel: { title: 'Still usable' },
      });
    expect(problems).toEqual([]);
    await page.close();
  });

  it('a panel with a 1,000-point filter table, edited and reloaded, evaluates the same to the last digit', async () => {
    const { page, problems } = await newVisitor();
    await page.goto(`${app.baseUrl}/#${encodeFragment({ panel: TABLE_PANEL, view: { exclude: [] } })}`);
    await worst(page).waitFor();
    // An edit makes the page write the address from its own state.
    await retitle(page, 'Measured filter, kept whole');
    await expect
      .poll(() => decodeFragment(new URL(page.url()).hash))
      .toMatchObject({
        panel: { title: 'Measured filter, kept whole' },
      });
    const before = await evaluationOf(page);
    const linked = decodeFragment(new URL(page.url()).hash) as { panel: PanelSpec };
    expect(linked.panel.channels[0].filters[0]).toEqual(TABLE_PANEL.channels[0].filters[0]);
    await page.reload();
    await worst(page).waitFor();
    expect(await titleInput(page).inputValue()).toBe('Measured filter, kept whole');
    expect(await evaluationOf(page)).toBe(before);
    expect(problems).toEqual([]);
    await page.close();
  });

  it('"New panel" right after an edit, then Back, shows the edit; Back again shows the panel before it', async () => {
    const { page, problems } = await newVisitor();
    await page.goto(app.baseUrl + '/');
    await worst(page).waitFor();
    await openEditors(page);
    await retitle(page, 'Edited just now');
    await page.locator('qdp-panel-app header button', { hasText: 'New panel' }).click();
    await expect.poll(() => titleInput(page).inputValue()).toBe('Untitled panel');
    await page.goBack();
    await expect.poll(() => titleInput(page).inputValue()).toBe('Edited just now');
    await page.goBack();
    await expect.poll(() => titleInput(page).inputValue()).toContain('Demo: six targets');
    expect(problems).toEqual([]);
    await page.close();
  });

  it('a panel too long for the address is kept in this browser, says so, and comes back whole on reload', async () => {
    const { page, problems } = await newVisitor();
    // Six 1,000-point tables of uneven values: their link is far over 32 KB.
    const uneven = (from: number, seed: number): [number, number][] =>
      measuredFilter(1000, from, from + 100).map(([nm, t], i) => [
        nm,
        Number((t * (0.9 + ((i * seed) % 97) / 970)).toFixed(6)),
      ]);
    const big: PanelSpec = {
      ...TABLE_PANEL,
      title: 'Six measured filters',
      channels: [0, 1, 2, 3, 4, 5].map((k) => ({
        id: `c${k + 1}`,
        filters: [{ type: 'table' as const, points: uneven(450 + k * 40, 31 + k * 17) }],
      })),
    };
    expect(encodeFragment({ panel: big, view: { exclude: [] } }).length).toBeGreaterThan(32 * 1024);
    await page.goto(app.baseUrl + '/');
    await worst(page).waitFor();
    await page.locator('qdp-panel-app header input[type="file"]').setInputFiles({
      name: 'six-filters.json',
      mimeType: 'application/json',
      buffer: Buffer.from(JSON.stringify(big)),
    });
    await expect.poll(() => titleInput(page).inputValue()).toBe('Six measured filters');
    expect(await page.locator('qdp-panel-app p.kept').innerText()).toContain(KEPT_IN_BROWSER);
    expect(new URL(page.url()).hash).toMatch(/^#d1\./);
    await worst(page).waitFor();
    const before = await evaluationOf(page);
    await page.locator('qdp-panel-app p.kept button', { hasText: 'Go to Share' }).click();
    await expect
      .poll(() =>
        page.evaluate(
          () =>
            document.querySelector('qdp-panel-app')?.shadowRoot?.querySelector('qdp-panel-actions')?.shadowRoot
              ?.activeElement?.textContent,
        ),
      )
      .toContain('Share');
    await page.reload();
    await worst(page).waitFor();
    expect(await titleInput(page).inputValue()).toBe('Six measured filters');
    expect(await evaluationOf(page)).toBe(before);
    expect(await page.locator('qdp-panel-app p.kept').innerText()).toContain(KEPT_IN_BROWSER);
    // The bare address opens this browser's last state: the copy kept in My panels.
    await page.goto(app.baseUrl + '/');
    await expect.poll(() => titleInput(page).inputValue()).toBe('Six measured filters');
    await worst(page).waitFor();
    expect(await evaluationOf(page)).toBe(before);
    expect(problems).toEqual([]);
    await page.close();
  });
});
