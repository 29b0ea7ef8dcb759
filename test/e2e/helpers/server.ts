/**
 * Starts the app as `npm start` serves it (scripts/start.sh: vite build + wrangler dev on workerd with local KV) on a
 * free port, in its own process group so stopping it also stops workerd.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { createServer } from 'node:net';

/** A running app: its base URL and how to stop it. */
export interface RunningApp {
  baseUrl: string;
  stop(): Promise<void>;
}

/** A port the OS says is free right now. */
export function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const srv = createServer();
    srv.once('error', reject);
    srv.listen(0, '127.0.0.1', () => {
      const port = (srv.address() as { port: number }).port;
      srv.close(() => resolve(port));
    });
  });
}

async function waitForHealth(
  baseUrl: string,
  child: ChildProcess,
  timeoutMs: number,
  log: () => string,
): Promise<void> {
  const until = Date.now() + timeoutMs;
  while (Date.now() < until) {
    if (child.exitCode !== null) throw new Error(`start script exited with ${child.exitCode}:\n${log()}`);
    try {
      const res = await fetch(`${baseUrl}/api/v1/health`);
      if (res.ok) return;
    } catch {
      // not listening yet
    }
    await new Promise((r) => setTimeout(r, 300));
  }
  throw new Error(`app did not answer /api/v1/health within ${timeoutMs} ms:\n${log()}`);
}

/** Spawns `bash scripts/start.sh` with PORT set, waits for /api/v1/health, returns the base URL. */
export async function startApp(timeoutMs = 150_000): Promise<RunningApp> {
  const port = await freePort();
  const child = spawn('setsid', ['bash', 'scripts/start.sh'], {
    env: { ...process.env, PORT: String(port), LOG_LEVEL: 'warn' },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let output = '';
  child.stdout!.on('data', (d) => (output = (output + d).slice(-8000)));
  child.stderr!.on('data', (d) => (output = (output + d).slice(-8000)));
  const baseUrl = `http://127.0.0.1:${port}`;
  const stop = async () => {
    if (child.exitCode !== null || child.pid === undefined) return;
    // setsid made the child a process-group leader: signal the whole group (bash, npx, wrangler, workerd).
    try {
      process.kill(-child.pid, 'SIGTERM');
    } catch {
      /* already gone */
    }
    await new Promise<void>((r) => {
      const t = setTimeout(() => {
        try {
          process.kill(-child.pid!, 'SIGKILL');
        } catch {
          /* gone */
        }
        r();
      }, 5000);
      child.once('exit', () => {
        clearTimeout(t);
        r();
      });
    });
  };
  try {
    await waitForHealth(baseUrl, child, timeoutMs, () => output);
  } catch (e) {
    await stop();
    throw e;
  }
  return { baseUrl, stop };
}
