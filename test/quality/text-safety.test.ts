// Shared panel text is shown as text: script and markup payloads stored through the API and opened at /p/<id> in
// headless Chromium run nothing and appear literally. Spectrum CSV import is bounded; the exported ordering sheet
// escapes cells a spreadsheet would run as formulas.
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { chromium, type BrowserContext } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { CSV_LIMITS, parseSpectrumCsv, SpectraError } from '../../spectra/index';
import { orderingSheetCsv } from '../../web/io/csv-export';
import { startApp, type StartedApp } from './helpers/app';
import { demoPanelTitled, postJson } from './helpers/contract';
import { CHROMIUM_LAUNCH } from '../chromium';

// Each payload sets a global and opens a dialog if it ever runs.
const PAYLOADS = [
  '<img src=x onerror="window.__qdpRan=1;alert(1)">',
  '<script>window.__qdpRan=2;alert(2)</script>',
  '"><svg onload="window.__qdpRan=3;alert(3)">',
  'javascript:window.__qdpRan=4;alert(4)',
  "'><iframe src=javascript:alert(5)>",
];

let app: StartedApp;
let context: BrowserContext;
let profile: string;
beforeAll(async () => {
  app = await startApp();
  profile = mkdtempSync(join(tmpdir(), 'qdpanel-quality-chrome-'));
  context = await chromium.launchPersistentContext(profile, {
    ...CHROMIUM_LAUNCH,
    headless: true,
    viewport: { width: 1280, height: 900 },
  });
});
afterAll(async () => {
  await context?.close();
  if (profile) rmSync(profile, { recursive: true, force: true });
  await app?.stop();
});

describe('shared text in the page', () => {
  it.each(PAYLOADS.map((p, i) => [i, p] as const))(
    'opening /p/<id> with payload %i in title, labels and targets runs nothing and shows the text literally',
    async (_i, payload) => {
      const panel = demoPanelTitled(payload) as {
        probes: Record<string, unknown>[];
        channels: Record<string, unknown>[];
      };
      panel.probes[1].label = payload;
      panel.probes[2].target = payload;
      panel.channels[1].label = payload;
      const res = await postJson(app.baseUrl, '/api/v1/panels', panel);
      expect(res.status).toBe(201);
      const { url } = (await res.json()) as { url: string };

      const page = await context.newPage();
      const dialogs: string[] = [];
      const errors: string[] = [];
      page.on('dialog', async (d) => {
        dialogs.push(d.message());
        await d.dismiss();
      });
      page.on('pageerror', (e) => errors.push(e.message));
      await page.goto(app.baseUrl + url);
      await page.locator('qdp-crosstalk-table p.worst').waitFor();
      await page.waitForTimeout(500);
      expect(dialogs).toEqual([]);
      expect(await page.evaluate('window.__qdpRan')).toBeUndefined();
      expect(errors).toEqual([]);
      // The payload is text: the title field holds it, and the probe's card header and the page's text show it.
      expect(await page.locator('qdp-panel-app header input[type="text"]').first().inputValue()).toBe(payload);
      expect(await page.locator('qdp-probe-card').nth(1).locator('header strong').innerText()).toBe(payload);
      expect(await page.locator('qdp-crosstalk-table table').first().innerText()).toContain(payload);
      // No element the payloads would create exists anywhere, shadow roots included.
      for (const tag of ['img', 'iframe', 'script:not([src])']) expect(await page.locator(tag).count(), tag).toBe(0);
      expect(await page.locator('svg[onload]').count()).toBe(0);
      await page.close();
    },
  );
});

describe('spectrum CSV import bounds', () => {
  const expectTableError = (text: string, message: RegExp) => {
    let caught: unknown;
    try {
      parseSpectrumCsv(text, { kind: 'emission' });
    } catch (err) {
      caught = err;
    }
    expect(caught).toBeInstanceOf(SpectraError);
    expect((caught as SpectraError).code).toBe('invalid_table');
    expect((caught as SpectraError).message).toMatch(message);
  };

  it('parseSpectrumCsv refuses a text over its character limit before splitting it', () => {
    expectTableError('500,1\n'.repeat(Math.ceil((CSV_LIMITS.maxChars + 10) / 6)), /characters/);
  });
  it('parseSpectrumCsv refuses more lines than its limit', () => {
    expectTableError('\n'.repeat(CSV_LIMITS.maxLines + 1), /lines/);
  });
  it('parseSpectrumCsv refuses an over-long line and names its line number', () => {
    expectTableError(`400,1\n410,${'9'.repeat(CSV_LIMITS.maxLineChars)}\n`, /line 2/);
  });
  it('parseSpectrumCsv reads a large table within the limits and resamples it to at most 1,000 points', () => {
    const rows = Array.from(
      { length: CSV_LIMITS.maxLines - 1 },
      (_, i) => `${(400 + i * 0.01).toFixed(2)},${Math.exp(-(((i - 10_000) / 3000) ** 2)).toFixed(5)}`,
    );
    const { points } = parseSpectrumCsv(rows.join('\n'), { kind: 'emission' });
    expect(points.length).toBeLessThanOrEqual(1000);
    expect(points.length).toBeGreaterThan(100);
  });
});

describe('ordering sheet export', () => {
  it(
    'orderingSheetCsv writes cells starting with =, +, - or @ with a leading quote so spreadsheets show them as ' +
      'text',
    () => {
      const formulas = ['=HYPERLINK("http://example.invalid","x")', '+1+1', '-2+3', '@SUM(A1:A2)'];
      const panel = demoPanelTitled(formulas[0]) as any;
      panel.probes[0].label = formulas[1];
      panel.probes[1].target = formulas[2];
      panel.channels[0].label = formulas[3];
      const csv = orderingSheetCsv(panel, []);
      // Every field of every row, with RFC 4180 quotes removed: none may start with a formula character.
      const fields = csv
        .split('\r\n')
        .flatMap((row) => row.match(/("([^"]|"")*"|[^,]*)(,|$)/g) ?? [])
        .map((f) => f.replace(/,$/, '').replace(/^"|"$/g, '').replace(/""/g, '"'));
      for (const formula of formulas) expect(fields).toContain(`'${formula}`);
      expect(fields.filter((f) => /^[=+@]/.test(f) || /^-[^\d]/.test(f))).toEqual([]);
    },
  );
});
