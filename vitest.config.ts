import { defineConfig } from 'vitest/config';
import { playwright } from '@vitest/browser-playwright';
import { CHROMIUM_LAUNCH } from './test/chromium';

export default defineConfig({
  test: {
    projects: [
      // Pure code in Node: spectra/, the bench table, and the worker's modules that need no runtime. Some tests run
      // whole design searches; on a loaded 2-core machine one can take several seconds, so the limit is a hang guard,
      // not a speed claim (speed is measured in `npm run bench`).
      {
        test: {
          name: 'unit',
          include: ['test/spectra/**/*.test.ts', 'test/bench/**/*.test.ts', 'test/worker-pure/**/*.test.ts'],
          environment: 'node',
          testTimeout: 30_000,
        },
      },
      // The API on the real Workers runtime (workerd via wrangler) with real local KV.
      {
        test: {
          name: 'api',
          include: ['test/worker/**/*.test.ts'],
          environment: 'node',
          testTimeout: 60_000,
          hookTimeout: 120_000,
          fileParallelism: false,
        },
      },
      // Lit elements rendered in real headless Chromium.
      {
        test: {
          name: 'web',
          include: ['test/web/**/*.test.ts'],
          browser: {
            enabled: true,
            headless: true,
            provider: playwright({ launchOptions: CHROMIUM_LAUNCH }),
            instances: [{ browser: 'chromium' }],
          },
        },
      },
      // End to end: the app as `npm start` serves it, driven in headless Chromium.
      {
        test: {
          name: 'e2e',
          include: ['test/e2e/**/*.test.ts'],
          environment: 'node',
          testTimeout: 120_000,
          hookTimeout: 180_000,
          fileParallelism: false,
        },
      },
      // Measured quality: load soak, faults, fuzz and security checks against the app as `npm start` runs it. One file
      // at a time and in its own group after the others (groupOrder 1), so the load never competes with other tests.
      {
        test: {
          name: 'quality',
          include: ['test/quality/**/*.test.ts'],
          environment: 'node',
          testTimeout: 300_000,
          hookTimeout: 180_000,
          fileParallelism: false,
          sequence: { groupOrder: 1 },
        },
      },
    ],
  },
});
