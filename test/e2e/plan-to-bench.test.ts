// From plan to bench in the app as `npm start` serves it, from the demo: the demo controls read in and compared with
// the prediction, the FCS 3.1 $SPILLOVER value downloaded and read back, the measured columns adopted, the demo pilot
// image unmixed with them and the abundance maps downloaded as a float TIFF that utif2 reads.
import { readFileSync } from 'node:fs';
import UTIF from 'utif2';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Locator, Page } from 'playwright-core';
import { openBrowser, shot, visitAsNewUser } from './helpers/browser';
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

/** The bytes of the file the page downloads when `button` is clicked. */
async function download(page: Page, button: Locator): Promise<Buffer> {
  const [file] = await Promise.all([page.waitForEvent('download'), button.click()]);
  return readFileSync((await file.path())!);
}

/**
 * A $SPILLOVER keyword value read as FCS 3.1 defines it (ISAC Data File Standard for Flow Cytometry, Version FCS 3.1,
 * Spidlen et al., Cytometry A 2010; the $SPILLOVER keyword): n, the n parameter names, then n × n values row by row.
 */
function readSpillover(text: string): { names: string[]; value: (row: string, column: string) => number } {
  const cells = text.trim().split(',');
  const n = Number(cells[0]);
  expect(Number.isInteger(n) && cells.length === 1 + n + n * n).toBe(true);
  const names = cells.slice(1, 1 + n);
  const values = cells.slice(1 + n).map(Number);
  return { names, value: (row, column) => values[names.indexOf(row) * n + names.indexOf(column)] };
}

describe('from plan to bench, on the demo', () => {
  it('controls in and compared, $SPILLOVER out, measured columns used, pilot image unmixed, maps out', async () => {
    const { page, problems } = await visitAsNewUser(browser.context, `${app.baseUrl}/`, { widthPx: 1440 });
    // Controls in: the demo controls' Mito dot spills into Orange beyond its lot-shift band.
    await page.locator('summary', { hasText: 'Measured controls' }).click();
    await page.getByRole('button', { name: 'Try the demo controls' }).click();
    await expect
      .poll(() => page.locator('qdp-controls-section .sentences').innerText())
      .toContain('Mito dot spills 41.0 % into');
    // Matrices out: the measured $SPILLOVER; the Mito dot (primary Yellow, c3) spills 0.41 into Orange (c4), as the
    // table shows (41.0 ± 0.56 %).
    const fcs = await download(page, page.getByRole('button', { name: 'FCS $SPILLOVER, measured (.txt)' }));
    const spill = readSpillover(fcs.toString('utf8'));
    expect(spill.names).toHaveLength(6);
    const [yellow, orange] = spill.names.includes('Yellow') ? ['Yellow', 'Orange'] : ['c3', 'c4'];
    expect(Math.abs(spill.value(yellow, orange) - 0.41)).toBeLessThan(0.01);
    // The measured columns become the panel's reference.
    await page.getByRole('button', { name: "Use the measured columns as the panel's reference" }).click();
    await expect.poll(() => page.locator('qdp-panel-app .measured-note').innerText()).toContain('measured columns');
    await shot(page, 'plan-to-bench-controls', page.locator('qdp-controls-section'));
    // The pilot image, unmixed with them by NNLS.
    await page.locator('summary', { hasText: 'Unmix a pilot image' }).click();
    await page.getByRole('button', { name: 'Try the demo image' }).click();
    await page.locator('qdp-pilot-image .loaded').waitFor();
    await page.getByRole('button', { name: 'Unmix the image' }).click();
    await page.locator('qdp-image-map').nth(6).waitFor({ timeout: 60_000 });
    const units = page.locator('qdp-pilot-image p', { hasText: 'Abundances are in units' });
    expect(await units.innerText()).not.toContain('modelled signal');
    await shot(page, 'plan-to-bench-image', page.locator('qdp-image-map').first());
    // Abundances out: one 32-bit float page per probe (TIFF 6.0, SampleFormat 3).
    const tiff = await download(page, page.getByRole('button', { name: 'Download abundance maps (TIFF)' }));
    const pages = UTIF.decode(tiff).filter((ifd) => String(ifd.t270 ?? '').startsWith('abundance'));
    expect(pages).toHaveLength(6);
    for (const ifd of pages) expect([ifd.t258, ifd.t339]).toEqual([[32], [3]]);
    expect(problems).toEqual([]);
    await page.close();
  });
});
