import { defineConfig } from 'vite';

// The front end lives in web/; the built files land in dist/, which the worker serves as static assets.
// A build resolves packages' "production" export condition explicitly: without it Lit's development build (with its
// console warning and extra checks) ends up in the bundle when NODE_ENV is not set in the shell.
export default defineConfig(({ command }) => ({
  root: 'web',
  resolve: command === 'build' ? { conditions: ['module', 'browser', 'production'] } : {},
  build: { outDir: '../dist', emptyOutDir: true, target: 'es2022', sourcemap: false },
  worker: { format: 'es' },
}));
