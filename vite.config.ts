import { defineConfig } from 'vite';

// The front end lives in web/; the built files land in dist/, which the worker serves as static assets.
// A build resolves packages' "production" export condition explicitly: without it Lit's development build (with its
// console warning and extra checks) ends up in the bundle when NODE_ENV is not set in the shell.
// The API's contract modules (worker/schemas) only define values: declaring them free of side effects lets the first
// bundle take the plain ones (ApiError, LIMITS, RANGES, issueToError) while zod and the schemas stay in the chunk that
// the page loads just after it starts (web/state/checks.ts). spectra/controls likewise: only the lazily loaded controls
// section uses it, and without the mark the re-exports of spectra/index.ts pull it into the first bundle.
export default defineConfig(({ command }) => ({
  root: 'web',
  resolve: command === 'build' ? { conditions: ['module', 'browser', 'production'] } : {},
  build: {
    outDir: '../dist',
    emptyOutDir: true,
    target: 'es2022',
    sourcemap: false,
    rolldownOptions: {
      treeshake: {
        moduleSideEffects: [
          { test: /\/worker\/schemas\//, sideEffects: false },
          { test: /\/spectra\/controls\//, sideEffects: false },
        ],
      },
    },
  },
  worker: { format: 'es' },
}));
