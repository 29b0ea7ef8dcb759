// `npm start` (scripts/start.sh): builds, serves on PORT on the real runtime, and stops with its process group.
import { spawn } from 'node:child_process';
import { join } from 'node:path';
import { expect, it } from 'vitest';
import { freePort, ROOT } from './helpers/worker';

async function healthAt(port: number): Promise<number | null> {
  try {
    return (await fetch(`http://127.0.0.1:${port}/api/v1/health`, { signal: AbortSignal.timeout(1000) })).status;
  } catch {
    return null;
  }
}

async function waitFor(check: () => Promise<boolean>, timeoutMs: number): Promise<boolean> {
  const until = Date.now() + timeoutMs;
  while (Date.now() < until) {
    if (await check()) return true;
    await new Promise((r) => setTimeout(r, 250));
  }
  return false;
}

it('scripts/start.sh serves /api/v1/health on PORT and a signal to its process group frees the port', async () => {
  const port = await freePort();
  const child = spawn('bash', [join(ROOT, 'scripts/start.sh')], {
    cwd: ROOT,
    detached: true, // its own process group, as `setsid` gives
    env: { ...process.env, PORT: String(port), LOG_LEVEL: 'warn' },
    stdio: ['ignore', 'ignore', 'pipe'],
  });
  let stderr = '';
  child.stderr.on('data', (d: Buffer) => (stderr += d.toString()));
  try {
    const up = await waitFor(async () => (await healthAt(port)) === 200, 90_000);
    expect(up, stderr).toBe(true);
    const page = await fetch(`http://127.0.0.1:${port}/`);
    expect(page.status).toBe(200);
    expect(await page.text()).toContain('<html');
  } finally {
    process.kill(-child.pid!, 'SIGTERM');
  }
  const down = await waitFor(async () => (await healthAt(port)) === null, 15_000);
  expect(down).toBe(true);
}, 120_000);
