/**
 * The front end as a visitor gets it: gzipped size of what the first page load fetches (index.html plus the scripts
 * and stylesheets it references, not chunks loaded later on demand), and the time from navigation to the demo panel's
 * drawn chart (six emission curves) in headless Chromium, against the app started as `npm start` does.
 */
import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { gzipSync } from 'node:zlib';
import { chromium } from 'playwright-core';
import type { BenchRow } from '../types';
import { ROOT, startApp } from '../../test/quality/helpers/app';
import { CHROMIUM_LAUNCH } from '../../test/chromium';

const LOADS = 7;
/** Budget for the first load, gzipped (our target). */
const BUDGET_KIB = 80;

/** Files the built index.html loads up front: its module scripts, module preloads and stylesheets. */
export function firstLoadFiles(html: string): string[] {
  const refs = [...html.matchAll(/<(?:script|link)\b[^>]*?(?:src|href)="([^"]+)"[^>]*>/g)]
    .filter((m) => /<script|rel="(?:stylesheet|modulepreload)"/.test(m[0]))
    .map((m) => m[1].replace(/^\.?\//, ''));
  return ['index.html', ...refs];
}

function bundleRow(): BenchRow {
  execFileSync('npx', ['vite', 'build', '--logLevel', 'warn'], { cwd: ROOT, stdio: 'inherit' });
  const files = firstLoadFiles(readFileSync(join(ROOT, 'dist', 'index.html'), 'utf8'));
  let raw = 0;
  let gz = 0;
  for (const file of files) {
    const bytes = readFileSync(join(ROOT, 'dist', file));
    raw += bytes.byteLength;
    gz += gzipSync(bytes, { level: 9 }).byteLength;
  }
  return {
    suite: 'frontend',
    name: 'first load, gzipped',
    medianMs: null,
    extra: {
      files: files.length,
      rawKiB: +(raw / 1024).toFixed(1),
      gzipKiB: +(gz / 1024).toFixed(1),
      budgetKiB: BUDGET_KIB,
    },
    note: gz / 1024 <= BUDGET_KIB ? 'within budget' : 'OVER BUDGET',
  };
}

async function chartRow(): Promise<BenchRow> {
  const app = await startApp();
  const profile = mkdtempSync(join(tmpdir(), 'qdpanel-bench-chrome-'));
  const context = await chromium.launchPersistentContext(profile, {
    ...CHROMIUM_LAUNCH,
    headless: true,
    viewport: { width: 1280, height: 900 },
  });
  try {
    const times: number[] = [];
    for (let i = 0; i <= LOADS; i++) {
      const page = await context.newPage();
      const t0 = Date.now();
      await page.goto(`${app.baseUrl}/`);
      // A drawn chart: the demo's six emission curves are in the chart's SVG (locators pierce shadow roots).
      await page.locator('qdp-spectrum-chart path.curve').nth(5).waitFor({ state: 'attached' });
      if (i > 0) times.push(Date.now() - t0); // the first load warms the server and the disk cache
      await page.close();
    }
    times.sort((a, b) => a - b);
    return {
      suite: 'frontend',
      name: 'navigation to drawn demo chart',
      medianMs: times[Math.floor(times.length / 2)],
      minMs: times[0],
      maxMs: times[times.length - 1],
      samples: times.length,
      note: 'headless Chromium, loopback, browser cache on',
    };
  } finally {
    await context.close();
    rmSync(profile, { recursive: true, force: true });
    await app.stop();
  }
}

export default async function frontendSuite(): Promise<BenchRow[]> {
  return [bundleRow(), await chartRow()];
}
