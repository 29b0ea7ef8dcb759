/**
 * Starts the worker on the real local Workers runtime (workerd via wrangler's unstable_startWorker) with real local
 * KV persisted to a directory, and serves the built front end from dist/ exactly as `npm start` does.
 */
import { createServer } from 'node:net';
import { execFileSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { unstable_startWorker } from 'wrangler';

/** The repository root. */
export const ROOT = resolve(import.meta.dirname, '../../..');

// Offline: no request-metadata fetch from the internet, no telemetry.
process.env.CLOUDFLARE_CF_FETCH_ENABLED = 'false';
process.env.WRANGLER_SEND_METRICS = 'false';

/** Builds the front end into dist/ if it is missing (the asset layer needs the directory before start-up). */
export function ensureFrontEndBuilt(): void {
  if (existsSync(join(ROOT, 'dist', 'index.html'))) return;
  execFileSync('npx', ['vite', 'build', '--logLevel', 'warn'], { cwd: ROOT, stdio: 'inherit' });
}

/** The file of local-only variables (the share-id key), relative to the repository root. */
export const LOCAL_ENV_FILE = 'local.env';

/** A variable of local.env (the key the local worker runs with). */
export function localEnvVar(name: string): string {
  const line = readFileSync(join(ROOT, LOCAL_ENV_FILE), 'utf8')
    .split('\n')
    .find((l) => l.startsWith(`${name}=`));
  if (line === undefined) throw new Error(`${name} is not in ${LOCAL_ENV_FILE}`);
  return line.slice(name.length + 1).trim();
}

/** A fresh temporary directory for local KV state. */
export function freshPersistDir(): string {
  return mkdtempSync(join(tmpdir(), 'qdpanel-kv-'));
}

/** Writes a key straight into the local KV store with wrangler's own CLI (before a worker opens the directory). */
export function plantKv(persistDir: string, key: string, value: string): void {
  execFileSync(
    'npx',
    ['wrangler', 'kv', 'key', 'put', '--binding', 'PANELS', '--local', '--persist-to', persistDir, key, value],
    { cwd: ROOT, env: { ...process.env, CI: 'true' }, stdio: 'pipe' },
  );
}

/** A running worker: `call` fetches a path on it. */
export interface RunningWorker {
  url: URL;
  call(path: string, init?: RequestInit): Promise<Response>;
  dispose(): Promise<void>;
}

/**
 * Starts the worker from wrangler.toml on 127.0.0.1 (free port), local KV persisted under `persistDir`, with the
 * variables of `envFiles` (by default local.env, as `npm start` runs).
 */
export async function startWorker(persistDir: string, envFiles = [LOCAL_ENV_FILE]): Promise<RunningWorker> {
  ensureFrontEndBuilt();
  const worker = await unstable_startWorker({
    config: join(ROOT, 'wrangler.toml'),
    // The local-only share-id key, as scripts/start.sh passes it.
    envFiles,
    dev: {
      server: { hostname: '127.0.0.1', port: 0 },
      inspector: false,
      persist: persistDir,
      logLevel: 'warn',
      watch: false,
    },
  });
  await worker.ready;
  const url = await worker.url;
  return {
    url,
    call: (path, init) => fetch(new URL(path, url), init),
    dispose: () => worker.dispose(),
  };
}

/** POST a JSON value (or raw text) to a path. */
export function postJson(w: RunningWorker, path: string, body: unknown, raw = false): Promise<Response> {
  return w.call(path, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: raw ? (body as string) : JSON.stringify(body),
  });
}

/** The `error` object of a response in the contract's error shape, or null when the body is not one. */
export async function errorOf(
  res: Response,
): Promise<{ code: string; message: string; path: (string | number)[] } | null> {
  const text = await res.text();
  try {
    const body = JSON.parse(text) as { error?: { code: string; message: string; path: (string | number)[] } };
    return body.error ?? null;
  } catch {
    return null;
  }
}

/** A TCP port that was free a moment ago (the OS picks it). */
export function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const server = createServer();
    server.once('error', reject);
    server.listen(0, '127.0.0.1', () => {
      const { port } = server.address() as { port: number };
      server.close(() => resolve(port));
    });
  });
}
