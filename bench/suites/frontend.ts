/**
 * The front end as a visitor gets it: gzipped size of what the first page load fetches (index.html plus the scripts
 * and stylesheets it references, not chunks loaded later on demand), the time from navigation to the demo panel's
 * drawn chart (six emission curves), and the redraw after a typed edit on a 16 probes × 16 channels panel, in
 * headless Chromium against the app started as `npm start` does.
 */
import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { gzipSync } from 'node:zlib';
import { chromium } from 'playwright-core';
import type { BenchRow } from '../types';
import { addChannel, addProbe, setFilter, setProbe } from '../../web/state/panel-edit';
import { encodeFragment } from '../../web/state/fragment';
import type { PanelSpec } from '../../spectra/index';
import { ROOT, startApp } from '../../test/quality/helpers/app';
import { CHROMIUM_LAUNCH } from '../../test/chromium';

const LOADS = 7;
/** Budget for the first load, gzipped (our target). */
const BUDGET_KIB = 60;
/** Typed edits timed on the large panel, and the redraw budget: one frame at 60 Hz (our target). */
const EDITS = 21;
const REDRAW_BUDGET_MS = 16;
/** Probes and channels of the large panel (the panel limits of spectra/core/limits.ts). */
const LARGE_PANEL_SIZE = 16;

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

/**
 * 16 CdSe dots 10 nm apart (500–650 nm) and 16 bandpass channels 8 nm wide on their peaks, built with the page's own
 * edit helpers from an empty panel.
 */
export function largePanel(): PanelSpec {
  let panel: PanelSpec = {
    version: 1,
    title: 'Sixteen-plex redraw bench',
    excitation: [{ wavelengthNm: 405, powerRel: 1 }],
    probes: [],
    channels: [],
  };
  for (let i = 0; i < LARGE_PANEL_SIZE; i++) {
    panel = addChannel(addProbe(panel));
    panel = setProbe(panel, i, { ...panel.probes[i], emissionPeakNm: 500 + 10 * i });
    panel = setFilter(panel, i, 0, { type: 'bandpass', centerNm: 500 + 10 * i, widthNm: 8 });
  }
  return panel;
}

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];

/**
 * Types a new centre into the first channel's centre field of the large panel, EDITS times, and times each from the
 * input event to the first frame after the chart's update: the app's and the chart's updateComplete, then the next
 * animation frame and a task after it (the frame's paint). Also reports the time to the chart's updateComplete alone.
 */
async function redrawRow(): Promise<BenchRow> {
  const app = await startApp();
  const profile = mkdtempSync(join(tmpdir(), 'qdpanel-bench-chrome-'));
  const context = await chromium.launchPersistentContext(profile, {
    ...CHROMIUM_LAUNCH,
    headless: true,
    viewport: { width: 1440, height: 900 },
  });
  try {
    const page = await context.newPage();
    await page.goto(`${app.baseUrl}/#${encodeFragment({ panel: largePanel(), view: { exclude: [] } })}`);
    await page
      .locator('qdp-spectrum-chart path.curve')
      .nth(LARGE_PANEL_SIZE - 1)
      .waitFor({ state: 'attached' });
    const input = page
      .locator('qdp-channel-card')
      .first()
      .locator('qdp-number-field[data-field="filters.0.centerNm"] input');
    const toFrame: number[] = [];
    const toUpdate: number[] = [];
    for (let i = 0; i <= EDITS; i++) {
      const t = await input.evaluate(
        async (el: HTMLInputElement, centreNm: number) => {
          const host = document.querySelector('qdp-panel-app') as HTMLElement & { updateComplete: Promise<boolean> };
          const chart = host.shadowRoot!.querySelector('qdp-spectrum-chart') as unknown as typeof host;
          const t0 = performance.now();
          el.value = String(centreNm);
          el.dispatchEvent(new Event('input', { bubbles: true, composed: true }));
          await host.updateComplete;
          await chart.updateComplete;
          const updated = performance.now() - t0;
          await new Promise((done) => requestAnimationFrame(() => setTimeout(done, 0)));
          return { updated, frame: performance.now() - t0 };
        },
        496 + (i % 9),
      );
      if (i === 0) continue; // the first edit warms the page's code paths
      toFrame.push(t.frame);
      toUpdate.push(t.updated);
    }
    const frame = median(toFrame);
    return {
      suite: 'frontend',
      name: 'redraw after a typed edit, 16 probes × 16 channels',
      medianMs: +frame.toFixed(1),
      minMs: +Math.min(...toFrame).toFixed(1),
      maxMs: +Math.max(...toFrame).toFixed(1),
      samples: toFrame.length,
      extra: { toChartUpdateMedianMs: +median(toUpdate).toFixed(1), budgetMs: REDRAW_BUDGET_MS },
      note: frame <= REDRAW_BUDGET_MS ? 'within budget (input → next frame after the chart)' : 'OVER BUDGET',
    };
  } finally {
    await context.close();
    rmSync(profile, { recursive: true, force: true });
    await app.stop();
  }
}

export default async function frontendSuite(): Promise<BenchRow[]> {
  return [bundleRow(), await chartRow(), await redrawRow()];
}
