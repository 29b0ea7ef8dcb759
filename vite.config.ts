import { defineConfig } from 'vite';

// The front end lives in web/; the built files land in dist/, which the worker serves as static assets.
export default defineConfig({
  root: 'web',
  build: { outDir: '../dist', emptyOutDir: true, target: 'es2022', sourcemap: false },
  worker: { format: 'es' },
});
