import { readFileSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { BrowserContext, Page } from 'playwright-core';
import { openBrowser, openEditors, shot, visitAsNewUser } from './helpers/browser';
import { startApp, type StartedApp } from '../quality/helpers/app';
import { decodeFragment, encodeFragment } from '../../web/state/fragment';
import { DEFAULT_GRID, evaluatePanel, type PanelSpec } from '../../spectra/index';

let app: StartedApp;
let browser: { context: BrowserContext; close(): Promise<void> };
let shareUrl = '';

beforeAll(async () => {
  app = await startApp();
  browser = await openBrowser();
});

afterAll(async () => {
  await browser?.close();
  await app?.stop();
});

/** Opens a page, failing the test on any script error or dialog. */
async function open(url: string): Promise<{ page: Page; problems: string[] }> {
  const { page, problems } = await visitAsNewUser(browser.context, url);
  // A shared copy's editors are read-only: they stay folded.
  if (!new URL(url).pathname.startsWith('/p/')) await openEditors(page);
  return { page, problems };
}

const orangeWidth = (page: Page) =>
  page.locator('qdp-channel-card').nth(3).locator('qdp-number-field[data-field="filters.0.widthNm"] input');
const titleInput = (page: Page) => page.locator('qdp-panel-app header input[type="text"]').first();
const spillover = (page: Page) =>
  page.locator('qdp-crosstalk-table table[aria-label="Spillover by channel"]').innerText();

describe('the panel page', () => {
  it("opening / shows the demo's six curves and cadmium note, fits a 390 px phone, and logs no errors", async () => {
    const { page, problems } = await open(app.baseUrl + '/');
    expect(await page.locator('qdp-panel-app header input[type="text"]').first().inputValue()).toContain(
      'Demo: six targets',
    );
    expect(await page.locator('qdp-spectrum-chart path.curve').count()).toBe(6);
    expect(await page.locator('qdp-material-notes p.summary').innerText()).toContain('This panel contains cadmium');
    await shot(page, '01-demo-1280');
    await shot(page, '01b-crosstalk-1280', page.locator('qdp-crosstalk-table table'));
    await page.setViewportSize({ width: 390, height: 844 });
    await page.waitForTimeout(200);
    await shot(page, '01-demo-390');
    await shot(page, '01b-chart-390', page.locator('qdp-spectrum-chart svg'));
    await shot(page, '01c-crosstalk-390', page.locator('qdp-crosstalk-table table'));
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth);
    expect(overflow).toBeLessThanOrEqual(400);
    expect(problems).toEqual([]);
    await page.close();
  });

  it('typing a band width and dragging a band edge both change the crosstalk numbers and stay in step', async () => {
    const { page, problems } = await open(app.baseUrl + '/');
    const before = await spillover(page);
    await orangeWidth(page).fill('40');
    await expect.poll(() => spillover(page)).not.toBe(before);
    await shot(page, '02-typed-width-1280', page.locator('qdp-spectrum-chart svg'));
    const typed = await spillover(page);
    // The chart's upper edge of the 620/40 band sits at 640 nm (the red band's lower edge is at 650): drag it 40 px
    // right.
    const handle = page.locator('qdp-spectrum-chart g.handle[data-channel="c4"][data-edge="high"] line');
    await handle.scrollIntoViewIfNeeded();
    const box = (await handle.boundingBox())!;
    await page.mouse.move(box.x + box.width / 2, box.y + box.height / 2);
    await page.mouse.down();
    await page.mouse.move(box.x + box.width / 2 + 20, box.y + box.height / 2, { steps: 4 });
    await page.mouse.move(box.x + box.width / 2 + 40, box.y + box.height / 2, { steps: 4 });
    await page.mouse.up();
    await expect.poll(() => spillover(page)).not.toBe(typed);
    const width = Number(await orangeWidth(page).inputValue());
    expect(width).toBeGreaterThan(40);
    await shot(page, '03-dragged-edge-1280', page.locator('qdp-spectrum-chart svg'));
    expect(problems).toEqual([]);
    // The URL fragment carries the edit: a reload keeps it.
    await page.reload();
    await page.locator('qdp-crosstalk-table p.worst').waitFor();
    await openEditors(page);
    expect(Number(await orangeWidth(page).inputValue())).toBe(width);
    await page.close();
  });

  it(
    'an out-of-range emission peak is kept as typed, marked ' +
      'invalid with the reachable range, and the last numbers stay',
    async () => {
      const { page } = await open(app.baseUrl + '/');
      const before = await spillover(page);
      const peak = page.locator('qdp-probe-card').nth(1).locator('qdp-number-field[data-field="emissionPeakNm"]');
      await peak.locator('input').fill('990');
      await expect.poll(() => peak.locator('[role="alert"]').count()).toBe(1);
      expect(await peak.locator('input').inputValue()).toBe('990');
      expect(await peak.locator('[role="alert"]').innerText()).toMatch(/\d{3}.*\d{3}/);
      expect(await spillover(page)).toBe(before);
      await shot(page, '04-invalid-peak-1280', peak);
      await page.close();
    },
  );

  it(
    "a 2500 nm peak shows, under the field, the API's refusal of that panel in the user's words (the probe by its " +
      'label, the value and the same range), and the last numbers stay',
    async () => {
      const { page, problems } = await open(app.baseUrl + '/');
      const before = await spillover(page);
      const peak = page.locator('qdp-probe-card').nth(1).locator('qdp-number-field[data-field="emissionPeakNm"]');
      await peak.locator('input').fill('2500');
      await expect.poll(() => peak.locator('[role="alert"]').count()).toBe(1);
      const shown = await peak.locator('[role="alert"]').innerText();
      expect(shown).toBe("Probe 'Envelope dot': an emission peak of 2500 nm is outside 200–2000 nm");
      expect(await peak.locator('input').inputValue()).toBe('2500');
      expect(await spillover(page)).toBe(before);
      // The panel the page holds (its link carries it) sent to the API as it is: the API refuses the same field with
      // the same range.
      const { panel } = decodeFragment(new URL(page.url()).hash) as { panel: unknown };
      const res = await fetch(`${app.baseUrl}/api/v1/panels/evaluate`, {
        method: 'POST',
        headers: { 'content-type': 'application/json' },
        body: JSON.stringify(panel),
      });
      const body = (await res.json()) as { error: { code: string; message: string; path: unknown[] } };
      expect(res.status).toBe(400);
      expect(body.error).toMatchObject({ code: 'out_of_range', path: ['probes', 1, 'emissionPeakNm'] });
      expect(body.error.message).toContain('between 200 and 2000 nm');
      expect(problems).toEqual([]);
      await shot(page, '04b-refused-peak-1280', peak);
      await page.close();
    },
  );

  it('share stores the panel and the link opens the same panel as a shared copy that can be duplicated', async () => {
    const { page, problems } = await open(app.baseUrl + '/');
    await orangeWidth(page).fill('30');
    await expect.poll(() => orangeWidth(page).inputValue()).toBe('30');
    const worst = await page.locator('qdp-crosstalk-table p.worst').innerText();
    await page.getByRole('button', { name: /Share: store/ }).click();
    const link = page.getByLabel('Share link');
    await link.waitFor();
    shareUrl = await link.inputValue();
    expect(shareUrl).toMatch(/\/p\/[A-Za-z0-9_-]{22,}$/);
    await shot(page, '05-shared-1280', link);
    const other = await open(shareUrl);
    await other.page.getByText('Shared copy (read only)').waitFor();
    expect(await orangeWidth(other.page).inputValue()).toBe('30');
    expect(await other.page.locator('qdp-crosstalk-table p.worst').innerText()).toBe(worst);
    await shot(other.page, '06-opened-link-1280');
    await other.page.getByRole('button', { name: 'Duplicate and edit' }).click();
    await expect.poll(() => other.page.url()).toMatch(/\/#v1\./);
    expect(await other.page.locator('qdp-panel-app header input[type="text"]').first().inputValue()).toContain(
      '(copy)',
    );
    expect([...problems, ...other.problems]).toEqual([]);
    await other.page.close();
    await page.close();
  });

  it('Back after "Duplicate and edit" on a shared copy shows the shared copy again, Forward the copy', async () => {
    const { page, problems } = await open(shareUrl);
    await page.getByText('Shared copy (read only)').waitFor();
    await page.getByRole('button', { name: 'Duplicate and edit' }).click();
    await expect.poll(() => page.url()).toMatch(/\/#v1\./);
    await page.goBack();
    await page.getByText('Shared copy (read only)').waitFor();
    expect(new URL(page.url()).pathname).toMatch(/^\/p\//);
    // The shared panel is fetched again after Back: wait for it rather than read the title at once.
    await expect.poll(() => titleInput(page).inputValue()).not.toContain('(copy)');
    await page.goForward();
    await expect.poll(() => titleInput(page).inputValue()).toContain('(copy)');
    expect(await page.getByText('Shared copy (read only)').count()).toBe(0);
    expect(problems).toEqual([]);
    await page.close();
  });

  it(
    'a free design for 4 targets is shown beside the edited panel without changing it, loads only on ' +
      '"Load this proposal", and Back brings the edited panel back',
    async () => {
      const { page, problems } = await open(app.baseUrl + '/');
      await titleInput(page).fill('My six-colour panel');
      await titleInput(page).press('Tab');
      const form = page.locator('qdp-design-form');
      await form.getByLabel('new dots and filters').check();
      await form.getByRole('button', { name: 'Add target' }).click();
      await form.getByRole('button', { name: 'Add target' }).click();
      await form.getByRole('button', { name: 'Propose', exact: true }).click();
      const summary = page.locator('qdp-proposal-summary');
      await summary.waitFor({ timeout: 60_000 });
      expect(await summary.locator('table.assignment tr').count()).toBe(5);
      expect(await summary.locator('table.assignment').innerText()).toMatch(/bandpass \d+\/\d+/);
      // The panel being edited is untouched, and stays editable while the proposal is shown.
      expect(await titleInput(page).inputValue()).toBe('My six-colour panel');
      expect(await page.locator('qdp-spectrum-chart path.curve').count()).toBe(6);
      await shot(page, '07-proposal-shown-1280', summary);
      await titleInput(page).fill('My six-colour panel, renamed');
      // Clicking Load commits the title (change on blur) a moment before the proposal replaces the panel.
      await summary.getByRole('button', { name: 'Load this proposal' }).click();
      await expect.poll(() => titleInput(page).inputValue()).toBe('Proposed panel (free design)');
      await expect.poll(() => page.locator('qdp-spectrum-chart path.curve').count()).toBe(4);
      expect(await summary.count()).toBe(0);
      await shot(page, '07b-proposal-loaded-1280');
      await page.goBack();
      await expect.poll(() => titleInput(page).inputValue()).toBe('My six-colour panel, renamed');
      await expect.poll(() => page.locator('qdp-spectrum-chart path.curve').count()).toBe(6);
      expect(problems).toEqual([]);
      await page.close();
    },
  );

  it(
    "a free design with target 1 locked to the demo's Actin dot (p4) proposes p4 for target 1, and the loaded " +
      'panel keeps it',
    async () => {
      const { page, problems } = await open(app.baseUrl + '/');
      const form = page.locator('qdp-design-form');
      await form.getByLabel('new dots and filters').check();
      await form.getByLabel('Use my probe for target 1').selectOption('p4');
      await form.getByRole('button', { name: 'Propose', exact: true }).click();
      const summary = page.locator('qdp-proposal-summary');
      await summary.waitFor({ timeout: 60_000 });
      const row = summary.locator('table.assignment tr', { hasText: 'target 1' });
      // The Actin dot as the demo writes it: CdSe, peak 620 nm, a 0.9 nm ZnS shell.
      expect(await row.innerText()).toMatch(/emission peak 620 nm[\s\S]*shell ZnS 0\.9 nm/);
      await shot(page, '10-design-locked-probe-1280', summary);
      await summary.getByRole('button', { name: 'Load this proposal' }).click();
      await expect.poll(() => titleInput(page).inputValue()).toBe('Proposed panel (free design)');
      const { panel } = decodeFragment(new URL(page.url()).hash) as { panel: PanelSpec };
      expect(panel.probes.find((p) => p.target === 'target 1')?.id).toBe('p4');
      expect(problems).toEqual([]);
      await page.close();
    },
  );

  it('exporting the ordering sheet gives a CSV with every probe and channels as "bandpass 620/20"', async () => {
    const { page } = await open(app.baseUrl + '/');
    const [download] = await Promise.all([
      page.waitForEvent('download'),
      page.getByRole('button', { name: 'Ordering sheet (CSV)' }).click(),
    ]);
    const csv = readFileSync((await download.path())!, 'utf8');
    expect(download.suggestedFilename()).toMatch(/\.csv$/);
    expect(csv).toContain('bandpass 620/20');
    expect(csv).toContain('longpass 700');
    for (const target of ['nuclear envelope marker', 'mitochondrial marker', 'membrane marker'])
      expect(csv).toContain(target);
    const cdseRow = csv.split('\r\n').find((r) => r.startsWith('p4,'))!;
    // material, shell, core diameter (a number), emission peak 620.
    expect(cdseRow).toMatch(/^p4,Actin dot,cytoskeleton marker,cdse,ZnS [\d.]+ nm,\d+(\.\d+)?,620,/);
    await page.close();
  });

  it('saves the chart SVG (title, probe legend, no handles) and matrices CSV equal to a new evaluation', async () => {
    const { page, problems } = await open(app.baseUrl + '/');
    await page.setViewportSize({ width: 1440, height: 900 });
    await page.waitForTimeout(200);
    const save = async (name: string) => {
      const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name }).click()]);
      return { name: download.suggestedFilename(), text: readFileSync((await download.path())!, 'utf8') };
    };
    const svg = await save('Chart (SVG)');
    const matrices = await save('Matrices (CSV)');
    const { panel } = decodeFragment(new URL(page.url()).hash) as { panel: PanelSpec };
    const labels = panel.probes.map((p) => p.label || p.id);

    expect(svg.name).toMatch(/-spectra\.svg$/);
    expect(svg.text).not.toContain('<!--');
    expect(svg.text).not.toMatch(/class="handle"|role="slider"/);
    expect(svg.text.match(/font-family=/g)).toHaveLength(1);
    expect(svg.text).toContain(`>${panel.title}</text>`);
    for (const label of labels) expect(svg.text).toMatch(new RegExp(`>${label} \\(\\d+ nm\\)`));
    expect(svg.text).toContain('wavelength (nm)');

    // The SVG on its own in Chromium at 1440 px, for a look at what a lab files.
    const view = await browser.context.newPage();
    await view.setViewportSize({ width: 1440, height: 900 });
    await view.setContent(`<body style="margin:0">${svg.text.replace(/^<\?xml[^>]*>\s*/, '')}</body>`);
    await shot(view, '11-exported-chart-svg-1440');
    expect(await view.locator('svg g.legend text').count()).toBeGreaterThanOrEqual(labels.length);
    await view.close();

    expect(matrices.name).toMatch(/-matrices\.csv$/);
    const rows = matrices.text.split('\r\n').map((r) => r.split(','));
    const at = rows.findIndex((r) => r[0] === 'matrix' && r[1] === 'collected signal');
    expect(rows[at + 1].slice(1)).toEqual(labels);
    const ev = evaluatePanel(panel, { grid: DEFAULT_GRID });
    panel.channels.forEach((c, i) => {
      const row = rows[at + 2 + i];
      expect(row[0]).toBe(c.label || c.id);
      // Six significant digits in the file.
      row
        .slice(1)
        .forEach((v, p) =>
          expect(Math.abs(Number(v) - ev.collected[i][p])).toBeLessThanOrEqual(Math.abs(ev.collected[i][p]) * 1e-5),
        );
    });
    expect(rows.some((r) => r[0] === 'matrix' && r[1] === 'unmixing' && r[2].startsWith('rows: probes'))).toBe(true);
    expect(problems).toEqual([]);
    await page.close();
  });

  it(
    'a title, label and target of <img src=x onerror=alert(1)> ' +
      'are shown as text after a share round trip, with no dialog',
    async () => {
      const evil = '<img src=x onerror=alert(1)>';
      const { page, problems } = await open(app.baseUrl + '/');
      await page.locator('qdp-panel-app header input[type="text"]').first().fill(evil);
      await page.locator('qdp-panel-app header input[type="text"]').first().press('Tab');
      const card = page.locator('qdp-probe-card').first();
      await card.getByLabel('Label').fill(evil);
      await card.getByLabel('Label').press('Tab');
      await card.getByLabel('Target').fill(evil);
      await card.getByLabel('Target').press('Tab');
      await page.getByRole('button', { name: /Share: store/ }).click();
      const url = await page.getByLabel('Share link').inputValue();
      const other = await open(url);
      await other.page.getByText('Shared copy (read only)').waitFor();
      expect(await other.page.locator('qdp-panel-app header input[type="text"]').first().inputValue()).toBe(evil);
      expect(await other.page.locator('qdp-probe-list qdp-editor-row').first().locator('.name').innerText()).toBe(evil);
      expect(await other.page.locator('qdp-crosstalk-table table').first().innerText()).toContain(evil);
      expect(await other.page.locator('img').count()).toBe(0);
      await other.page.waitForTimeout(300);
      await shot(other.page, '07-xss-as-text-1280', other.page.locator('qdp-probe-list'));
      expect([...problems, ...other.problems]).toEqual([]);
      await other.page.close();
      await page.close();
    },
  );

  it(
    'a link with an 800 nm probe and a shared dichroic: the chart reaches 850 nm, draws the shared path, ' +
      'reads log tails with a curve hidden, and a dragged edge snaps to a stock size',
    async () => {
      // Invented panel: four dots, a shared dichroic passing above 480 nm, snapping on in the link's view.
      const panel: PanelSpec = {
        version: 1,
        title: 'NIR probe and a shared dichroic',
        excitation: [{ wavelengthNm: 405, powerRel: 1 }],
        probes: [
          { id: 'p1', label: 'Green dot', material: 'cdse', emissionPeakNm: 525 },
          { id: 'p2', label: 'Orange dot', material: 'cdse', emissionPeakNm: 605 },
          { id: 'p3', label: 'NIR dot', material: 'gaas', emissionPeakNm: 800 },
        ],
        channels: [
          { id: 'c1', label: 'Green', filters: [{ type: 'bandpass', centerNm: 525, widthNm: 30 }] },
          { id: 'c2', label: 'Orange', filters: [{ type: 'bandpass', centerNm: 605, widthNm: 20 }] },
          { id: 'c3', label: 'NIR', filters: [{ type: 'longpass', edgeNm: 770 }] },
        ],
        lightPath: { emissionFilters: [{ type: 'dichroic', edgeNm: 480, passes: 'above' }] },
      };
      const fragment = encodeFragment({ panel, view: { exclude: [], snapStock: true } });
      const { page, problems } = await open(`${app.baseUrl}/#${fragment}`);
      const chart = page.locator('qdp-spectrum-chart');
      const ticks = await chart.locator('g.x-axis .tick text').allTextContents();
      expect(ticks).toContain('850');
      expect(await chart.locator('path.shared[data-part="emission"]').count()).toBe(1);
      await chart.getByLabel(/Log scale/).check();
      await chart.getByLabel(/Green dot/).uncheck();
      await expect.poll(() => chart.locator('path.curve').count()).toBe(2);
      await shot(page, '08-log-hidden-shared-1280', chart);
      // Drag the Orange band's upper edge 30 px right: with snapping on it lands on a stock size.
      const handle = chart.locator('g.handle[data-channel="c2"][data-edge="high"] line');
      const box = (await handle.boundingBox())!;
      await page.mouse.move(box.x + box.width / 2, box.y + box.height / 2);
      await page.mouse.down();
      await page.mouse.move(box.x + box.width / 2 + 30, box.y + box.height / 2, { steps: 5 });
      await page.mouse.up();
      const orange = page.locator('qdp-channel-card').nth(1);
      await expect
        .poll(() => orange.locator('qdp-number-field[data-field="filters.0.widthNm"] input').inputValue())
        .not.toBe('20');
      expect(await orange.locator('.stock').innerText()).toBe('stock size');
      await page.setViewportSize({ width: 390, height: 844 });
      await page.waitForTimeout(200);
      await shot(page, '08-log-hidden-shared-390', chart);
      expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(400);
      expect(problems).toEqual([]);
      await page.close();
    },
  );
});

describe('keeping typed work', () => {
  it('a 5000 nm centre is refused in place and, after a reload of the bare address, is still there', async () => {
    const { page, problems } = await open(app.baseUrl + '/');
    const centre = () =>
      page.locator('qdp-channel-card').nth(3).locator('qdp-number-field[data-field="filters.0.centerNm"] input');
    await centre().fill('5000');
    await centre().press('Tab');
    await page.getByRole('button', { name: 'Add probe' }).click();
    // The API's own range, in the user's words, naming the channel by its label.
    const refusal = "Channel 'Orange': a centre of 5000 nm is outside 200–2000 nm";
    await expect.poll(() => page.locator('p.error').first().innerText()).toContain(refusal);
    await page.goto(app.baseUrl + '/');
    await page.locator('p.notice').getByText('Your last panel in this browser is back').waitFor();
    await openEditors(page);
    expect(await centre().inputValue()).toBe('5000');
    expect(await page.locator('qdp-probe-card').count()).toBe(7);
    expect(await page.locator('p.error').first().innerText()).toContain(refusal);
    expect(problems).toEqual([]);
    await page.close();
  });
});

describe("keeping the design form's typed work", () => {
  it(
    'targets, abundances, a lock, lines, free design, cadmium-free, window and a check come back after a reload, ' +
      "and the abundance 'plenty' is still refused beside its target",
    async () => {
      const { page, problems } = await open(app.baseUrl + '/');
      const form = page.locator('qdp-design-form');
      const names = form.locator('input[aria-label="target name"]');
      const abundances = form.locator('input[aria-label="abundance"]');
      const lines = form.locator('input[aria-label="excitation lines"]');
      const windowStart = form.locator('input[aria-label="window start"]');
      const minSnr = form.locator('qdp-number-field[data-check="minSignalToNoise"] input');
      const refusal = form.locator('p.error');
      await form.getByRole('button', { name: 'Add target' }).click();
      await names.nth(0).fill('CD3');
      await abundances.nth(0).fill('plenty');
      await names.nth(1).fill('Ki-67');
      await names.nth(2).fill('CD8');
      await abundances.nth(2).fill('0.4');
      await form.getByLabel('Use my probe for Ki-67').selectOption('p4');
      await lines.fill('405, 488');
      await form.getByLabel('new dots and filters').check();
      await form.getByLabel('cadmium-free').check();
      await windowStart.fill('450');
      await windowStart.press('Tab');
      await minSnr.fill('8');
      const refused = 'Abundance: must be a number greater than 0 or one of high, medium, low';
      await expect.poll(() => refusal.allInnerTexts()).toEqual([refused]);

      await page.reload();
      await page.locator('qdp-crosstalk-table p.worst').waitFor();
      await openEditors(page);
      expect(await names.evaluateAll((inputs) => inputs.map((i) => (i as HTMLInputElement).value))).toEqual([
        'CD3',
        'Ki-67',
        'CD8',
      ]);
      expect(await abundances.evaluateAll((inputs) => inputs.map((i) => (i as HTMLInputElement).value))).toEqual([
        'plenty',
        'low',
        '0.4',
      ]);
      expect(await form.getByLabel('Use my probe for Ki-67').inputValue()).toBe('p4');
      expect(await lines.inputValue()).toBe('405, 488');
      expect(await form.getByLabel('new dots and filters').isChecked()).toBe(true);
      expect(await form.getByLabel('cadmium-free').isChecked()).toBe(true);
      expect(await windowStart.inputValue()).toBe('450');
      expect(await minSnr.inputValue()).toBe('8');
      // The kept 'plenty' is checked again with the API's schema and refused beside the first target's row.
      await expect.poll(() => refusal.allInnerTexts()).toEqual([refused]);
      expect(await refusal.evaluate((p) => p.previousElementSibling?.getAttribute('aria-label'))).toBe('target 1');
      await shot(page, '13-design-form-after-reload-1280', form.locator('fieldset.targets'));
      expect(problems).toEqual([]);
      await page.close();
    },
  );
});

describe('instrument profiles in the page', () => {
  it(
    'switching the demo to the four-line confocal shows what changed, survives a reload, shares by reference, ' +
      'and undo restores the panel',
    async () => {
      const { page, problems } = await open(app.baseUrl + '/');
      const picker = page.locator('qdp-instrument-picker');
      await picker.getByRole('button', { name: /Core confocal, four lines/ }).click();
      await picker.getByRole('button', { name: 'Undo the switch' }).waitFor();
      expect(await picker.locator('.changes').innerText()).toContain('Lines: 405 nm → 405, 488, 561, 640 nm');
      expect(await page.locator('qdp-channel-card').count()).toBe(4);
      await shot(page, '08-instrument-switch-1280', page.locator('section[aria-labelledby="h-instrument"]'));

      // A reload keeps the panel on its profile.
      await page.reload();
      await page.locator('qdp-crosstalk-table p.worst').waitFor();
      await openEditors(page);
      await picker.getByText('On the instrument').waitFor();
      expect(await picker.locator('p.current strong').innerText()).toBe('Core confocal, four lines');

      // Sharing stores a panel that names the profile rather than carrying its dichroic.
      await page.getByRole('button', { name: /Share: store/ }).click();
      const url = await page.getByLabel('Share link').inputValue();
      const id = url.split('/p/')[1];
      const stored = (await (await fetch(`${app.baseUrl}/api/v1/panels/${id}`)).json()) as Record<string, unknown>;
      expect(typeof stored.instrument).toBe('string');
      expect(stored.lightPath).toBeUndefined();
      const other = await open(url);
      await other.page.locator('qdp-instrument-picker').getByText('On the instrument').waitFor();
      expect(await other.page.locator('qdp-channel-card').count()).toBe(4);
      await other.page.close();

      // Switching again and undoing returns to the confocal panel.
      await picker.getByRole('button', { name: /Teaching widefield/ }).click();
      await picker.getByRole('button', { name: 'Undo the switch' }).click();
      expect(await picker.locator('p.current strong').innerText()).toBe('Core confocal, four lines');
      expect(await page.locator('qdp-channel-card').count()).toBe(4);
      expect(problems).toEqual([]);
      await page.close();
    },
  );

  it('a profile made from the demo is stored, its /i/ link starts a new panel with its six channels', async () => {
    const { page, problems } = await open(app.baseUrl + '/');
    await page.getByText('Make an instrument profile of this set-up').click();
    const maker = page.locator('qdp-instrument-maker');
    await maker.getByRole('button', { name: 'Store the profile and show its link' }).click();
    // No name yet: refused in the user's words, nothing stored.
    expect(await maker.locator('p.err').innerText()).toContain('Name:');
    await maker.getByLabel('Instrument name').fill('Room 4 widefield');
    await maker.getByRole('button', { name: 'Store the profile and show its link' }).click();
    const link = await maker.getByLabel('Instrument link').inputValue();
    expect(link).toMatch(/\/i\/[A-Za-z0-9_-]{24}$/);
    await shot(page, '09-instrument-maker-1280', page.locator('section[aria-labelledby="h-instrument"]'));
    const started = await browser.context.newPage();
    await started.goto(link);
    await started.locator('qdp-instrument-picker').waitFor({ state: 'attached' });
    await openEditors(started);
    await started.locator('qdp-instrument-picker').getByText('Room 4 widefield').waitFor();
    expect(await started.locator('qdp-channel-card').count()).toBe(6);
    expect(new URL(started.url()).pathname).toBe('/');
    expect(problems).toEqual([]);
    await started.close();
    await page.close();
  });
});

describe('undo, redo and labels that follow their filters', () => {
  const orangeCentre = (page: Page) =>
    page.locator('qdp-channel-card').nth(3).locator('qdp-number-field[data-field="filters.0.centerNm"] input');
  const header = (page: Page) => page.locator('qdp-panel-app header');
  const legend = (page: Page) => page.locator('qdp-chart-legend ul').innerText();

  it(
    'typing 630 as the orange centre changes the spillover; Undo brings back the first numbers and 620 in the ' +
      'field, Redo brings back 630 and its numbers',
    async () => {
      const { page, problems } = await open(app.baseUrl + '/');
      const undo = page.getByRole('button', { name: 'Undo', exact: true });
      const redo = page.getByRole('button', { name: 'Redo', exact: true });
      expect(await undo.isDisabled()).toBe(true);
      const first = await spillover(page);
      await orangeCentre(page).fill('');
      await orangeCentre(page).pressSequentially('630');
      await expect.poll(() => spillover(page)).not.toBe(first);
      const typed = await spillover(page);
      await page.setViewportSize({ width: 1440, height: 900 });
      await shot(page, '20-undo-redo-1440', header(page));
      await undo.click();
      await expect.poll(() => orangeCentre(page).inputValue()).toBe('620');
      await expect.poll(() => spillover(page)).toBe(first);
      expect(await undo.isDisabled()).toBe(true);
      await redo.click();
      await expect.poll(() => orangeCentre(page).inputValue()).toBe('630');
      await expect.poll(() => spillover(page)).toBe(typed);
      await undo.click();
      await page.setViewportSize({ width: 390, height: 844 });
      await page.waitForTimeout(200);
      await shot(page, '20b-undo-redo-390', header(page));
      expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(400);
      expect(problems).toEqual([]);
      await page.close();
    },
  );

  it(
    'a channel whose label was emptied reads "630/20 channel" in the chart legend after its centre is typed as 630, ' +
      'while the channel named "Red" keeps its name through its own centre edit',
    async () => {
      const { page, problems } = await open(app.baseUrl + '/');
      const label = page.locator('qdp-channel-card').nth(3).getByLabel('Label');
      await label.fill('');
      await label.press('Tab');
      await expect.poll(() => legend(page)).toContain('c4 channel');
      await orangeCentre(page).fill('');
      await orangeCentre(page).pressSequentially('630');
      await expect.poll(() => legend(page)).toContain('630/20 channel');
      expect(await legend(page)).not.toContain('c4 channel');
      expect(await label.inputValue()).toBe('630/20');
      // The named "Red" channel next to it keeps its name through its own edit.
      const redCentre = page
        .locator('qdp-channel-card')
        .nth(4)
        .locator('qdp-number-field[data-field="filters.0.centerNm"] input');
      await redCentre.fill('650');
      await expect.poll(() => legend(page)).toContain('Red channel');
      await shot(page, '21-label-follows-1280', page.locator('qdp-chart-legend'));
      expect(problems).toEqual([]);
      await page.close();
    },
  );
});
