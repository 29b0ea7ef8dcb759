// The measured-controls section on the served page: it loads after the first paint (its code is not in the first
// bundle), and "Try the demo controls" fetches the demo file and shows the flagged entry the demo was made with.
import { readFileSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { BrowserContext } from 'playwright-core';
import { openBrowser } from './helpers/browser';
import { ROOT, startApp, type StartedApp } from '../quality/helpers/app';

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

describe('measured controls on the demo page', () => {
  it('the files the first load fetches hold none of the controls code; a later chunk does', () => {
    const assets = join(ROOT, 'dist', 'assets');
    const read = (file: string) => readFileSync(join(assets, file), 'utf8');
    // The first load: the entry script of index.html and every chunk it imports statically, transitively.
    const html = readFileSync(join(ROOT, 'dist', 'index.html'), 'utf8');
    const first = new Set<string>();
    const queue = [...html.matchAll(/src="\/assets\/([^"]+\.js)"/g)].map((m) => m[1]);
    while (queue.length > 0) {
      const file = queue.pop()!;
      if (first.has(file)) continue;
      first.add(file);
      queue.push(...[...read(file).matchAll(/(?:from|import)\s*"\.\/([^"]+\.js)"/g)].map((m) => m[1]));
    }
    expect(first.size).toBeGreaterThan(0);
    // A word of the section (web/) and one of the library's controls code (spectra/controls/).
    for (const word of ['Try the demo controls', 'is dark in its primary']) {
      expect(
        [...first].filter((f) => read(f).includes(word)),
        word,
      ).toEqual([]);
      expect(
        readdirSync(assets).some((f) => f.endsWith('.js') && read(f).includes(word)),
        word,
      ).toBe(true);
    }
  });

  it('"Try the demo controls" on the demo page lists the Mito dot in Orange as outside the prediction', async () => {
    const page = await browser.context.newPage();
    const problems: string[] = [];
    page.on('pageerror', (e) => problems.push(`pageerror: ${e.message}`));
    await page.goto(app.baseUrl + '/api/v1/health');
    await page.evaluate(() => localStorage.clear());
    await page.goto(app.baseUrl + '/');
    await page.locator('qdp-crosstalk-table p.worst').waitFor();
    await page.locator('summary', { hasText: 'Measured controls' }).click();
    await page.locator('qdp-controls-section button', { hasText: 'Try the demo controls' }).click();
    const sentence = page.locator('qdp-controls-section .sentences li', { hasText: 'Mito dot spills' });
    await sentence.waitFor();
    expect(await sentence.innerText()).toMatch(/^Mito dot spills [\d.]+ % into Orange; predicted [\d.]+ % \(band /);
    expect(await page.locator('qdp-controls-section td.flag').count()).toBeGreaterThanOrEqual(1);
    expect(problems).toEqual([]);
    await page.close();
  });
});
