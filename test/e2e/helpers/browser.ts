/**
 * Headless Debian chromium through playwright-core, with a fresh profile per run, and a screenshot helper that
 * writes under test-output/e2e/ (git-ignored).
 */
import { mkdirSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { chromium, type BrowserContext, type Locator, type Page } from 'playwright-core';
import { CHROMIUM_LAUNCH } from '../../chromium';

/** Where the flows save their screenshots. */
export const SHOT_DIR = join(process.cwd(), 'test-output', 'e2e');

/**
 * A browser context on a new temporary profile; close() also deletes the profile. `touch` makes it a touch-screen
 * device (taps, as on a phone).
 */
export async function openBrowser({ touch = false } = {}): Promise<{
  context: BrowserContext;
  close(): Promise<void>;
}> {
  const profile = mkdtempSync(join(tmpdir(), 'qdp-e2e-'));
  const context = await chromium.launchPersistentContext(profile, {
    ...CHROMIUM_LAUNCH,
    headless: true,
    viewport: { width: 1280, height: 900 },
    acceptDownloads: true,
    hasTouch: touch,
  });
  return {
    context,
    close: async () => {
      await context.close();
      rmSync(profile, { recursive: true, force: true });
    },
  };
}

/**
 * Saves a screenshot of the viewport as test-output/e2e/<name>.png, first scrolling `focus` (what the step is about)
 * into view.
 */
export async function shot(page: Page, name: string, focus?: Locator): Promise<void> {
  mkdirSync(SHOT_DIR, { recursive: true });
  if (focus) await focus.first().scrollIntoViewIfNeeded();
  await page.screenshot({ path: join(SHOT_DIR, `${name}.png`) });
}

/**
 * Opens every folded part of the page's editors as a user would, by pressing it: the folded sections (microscope,
 * excitation and sample, proposals) and each probe and channel row, so that the flows can reach every field. A
 * shared copy's editors are read-only (inert) and stay as they are.
 */
export async function openEditors(page: Page): Promise<void> {
  const editable = 'qdp-panel-app .edit:not([inert])';
  const folds = page.locator(`${editable} details.fold:not([open]) > summary`);
  while ((await folds.count()) > 0) await folds.first().click();
  const rows = page.locator(`${editable} qdp-editor-row:not([open])`);
  while ((await rows.count()) > 0) await rows.first().locator('button.head').click();
}

/**
 * A new visitor's page at `url` (nothing kept from earlier flows: the page restores its last state on a bare /),
 * `widthPx` × `heightPx`, once the crosstalk section's first line is drawn. `problems` collects script errors,
 * console errors and dialogs (each dismissed), for the flow to assert empty.
 */
export async function visitAsNewUser(
  context: BrowserContext,
  url: string,
  { widthPx = 1280, heightPx = 900 } = {},
): Promise<{ page: Page; problems: string[] }> {
  const page = await context.newPage();
  const problems: string[] = [];
  page.on('pageerror', (e) => problems.push(`pageerror: ${e.message}`));
  page.on('console', (m) => m.type() === 'error' && problems.push(`console: ${m.text()}`));
  page.on('dialog', async (d) => {
    problems.push(`dialog: ${d.message()}`);
    await d.dismiss();
  });
  await page.setViewportSize({ width: widthPx, height: heightPx });
  await page.goto(new URL('/api/v1/health', url).href);
  await page.evaluate(() => localStorage.clear());
  await page.goto(url);
  await page.locator('qdp-crosstalk-table p.worst').waitFor();
  return { page, problems };
}
