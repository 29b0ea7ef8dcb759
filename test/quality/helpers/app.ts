/**
 * Starts the app exactly as `npm start` does (setsid bash scripts/start.sh: wrangler dev on workerd with local KV) on
 * a free port and a chosen persist directory, in its own process group, so a test can stop it gently, kill it hard
 * (SIGKILL to the whole group, workerd included) and read the workerd process's memory from /proc.
 */
import { execFileSync, spawn, type ChildProcess } from 'node:child_process';
import { cpSync, existsSync, mkdtempSync, readdirSync, readFileSync, symlinkSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';

/** The repository root. */
export const ROOT = resolve(import.meta.dirname, '../../..');

/** A running app started through scripts/start.sh. */
export interface StartedApp {
  baseUrl: string;
  port: number;
  persistDir: string;
  /** The directory served from (a snapshot of the work tree, see snapshotRoot). */
  root: string;
  /** Process-group id (the setsid leader's pid). */
  pgid: number;
  /** Pid of the workerd process in the group, or null if none is running. */
  workerdPid(): number | null;
  /** Resident memory of workerd in KiB (VmRSS from /proc/<pid>/status), or null. */
  workerdRssKiB(): number | null;
  /** CPU time (user + system) used so far by each workerd process of the group, ms, keyed by pid. */
  workerdCpuMs(): Map<number, number>;
  /** Sends a signal to the whole process group and waits for the leader to exit (SIGKILL after 5 s). */
  stop(signal?: NodeJS.Signals): Promise<void>;
  /** The last 8,000 characters of the server's output. */
  log(): string;
}

/** A fresh temporary directory for local KV state. */
export function freshPersistDir(): string {
  return mkdtempSync(join(tmpdir(), 'qdpanel-quality-kv-'));
}

/** Builds the front end into dist/ once if it is missing (start.sh is then told to skip its own build). */
export function ensureBuilt(): void {
  if (existsSync(join(ROOT, 'dist', 'index.html'))) return;
  execFileSync('npx', ['vite', 'build', '--logLevel', 'warn'], { cwd: ROOT, stdio: 'inherit' });
}

/**
 * A copy of what `npm start` needs (scripts, worker, spectra, web, dist, configs; node_modules linked) in a temporary
 * directory. wrangler dev rebuilds and restarts the worker whenever a source file changes, and a POST in flight then
 * gets a 503 from its proxy; serving a snapshot keeps edits made in the work tree during a long run from doing that.
 */
export function snapshotRoot(): string {
  ensureBuilt();
  const dir = mkdtempSync(join(tmpdir(), 'qdpanel-quality-app-'));
  for (const entry of [
    'scripts',
    'worker',
    'spectra',
    'web',
    'dist',
    'package.json',
    'tsconfig.json',
    'wrangler.toml',
    'local.env',
    'vite.config.ts',
  ]) {
    if (existsSync(join(ROOT, entry))) cpSync(join(ROOT, entry), join(dir, entry), { recursive: true });
  }
  symlinkSync(join(ROOT, 'node_modules'), join(dir, 'node_modules'));
  return dir;
}

/** A TCP port the OS says is free right now on 127.0.0.1. */
export function freePort(): Promise<number> {
  return new Promise((done, fail) => {
    const srv = createServer();
    srv.once('error', fail);
    srv.listen(0, '127.0.0.1', () => {
      const { port } = srv.address() as { port: number };
      srv.close(() => done(port));
    });
  });
}

/** Pids whose process group is `pgid` and whose command name is `comm` (read from /proc/<pid>/stat). */
function groupPids(pgid: number, comm: string): number[] {
  const out: number[] = [];
  for (const entry of readdirSync('/proc')) {
    if (!/^\d+$/.test(entry)) continue;
    try {
      const stat = readFileSync(`/proc/${entry}/stat`, 'utf8');
      // Fields after the parenthesised name: state ppid pgrp ...
      const name = stat.slice(stat.indexOf('(') + 1, stat.lastIndexOf(')'));
      const pgrp = Number(stat.slice(stat.lastIndexOf(')') + 2).split(' ')[2]);
      if (pgrp === pgid && name === comm) out.push(Number(entry));
    } catch {
      // the process ended while being read
    }
  }
  return out;
}

// Linux's USER_HZ: /proc/<pid>/stat counts CPU time in 1/100 s on every common architecture.
const CLOCK_TICKS_PER_S = 100;

function cpuMs(pid: number): number {
  try {
    const stat = readFileSync(`/proc/${pid}/stat`, 'utf8');
    const fields = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
    // utime and stime are fields 14 and 15 of stat(5), i.e. indices 11 and 12 after the name.
    return ((Number(fields[11]) + Number(fields[12])) * 1000) / CLOCK_TICKS_PER_S;
  } catch {
    return 0;
  }
}

function rssKiB(pid: number): number | null {
  try {
    const match = /VmRSS:\s+(\d+) kB/.exec(readFileSync(`/proc/${pid}/status`, 'utf8'));
    return match ? Number(match[1]) : null;
  } catch {
    return null;
  }
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
      if ((await fetch(`${baseUrl}/api/v1/health`)).ok) return;
    } catch {
      // not listening yet
    }
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error(`no answer on /api/v1/health within ${timeoutMs} ms:\n${log()}`);
}

/** Starts `bash scripts/start.sh` (of a fresh snapshot unless `root` is given) under setsid with PORT, PERSIST_DIR,
 * LOG_LEVEL=warn and SKIP_BUILD=1. */
export async function startApp(
  options: { persistDir?: string; port?: number; timeoutMs?: number; root?: string } = {},
): Promise<StartedApp> {
  const root = options.root ?? snapshotRoot();
  // A free port can be taken by another process before wrangler binds it: try again on a new one.
  for (let attempt = 1; ; attempt++) {
    try {
      return await startOnce({ ...options, root });
    } catch (err) {
      if (attempt >= 3 || options.port !== undefined || !/Address already in use/.test(String(err))) throw err;
    }
  }
}

async function startOnce(options: {
  persistDir?: string;
  port?: number;
  timeoutMs?: number;
  root: string;
}): Promise<StartedApp> {
  const root = options.root;
  const persistDir = options.persistDir ?? freshPersistDir();
  const port = options.port ?? (await freePort());
  const child = spawn('setsid', ['bash', 'scripts/start.sh'], {
    cwd: root,
    env: { ...process.env, PORT: String(port), PERSIST_DIR: persistDir, LOG_LEVEL: 'warn', SKIP_BUILD: '1' },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let output = '';
  const keep = (d: Buffer) => (output = (output + d).slice(-8000));
  child.stdout!.on('data', keep);
  child.stderr!.on('data', keep);
  const pgid = child.pid!;
  const exited = new Promise<void>((r) => child.once('exit', () => r()));
  const stop = async (signal: NodeJS.Signals = 'SIGTERM') => {
    if (child.exitCode === null && child.signalCode === null) {
      try {
        process.kill(-pgid, signal);
      } catch {
        /* group already gone */
      }
      const timer = setTimeout(() => {
        try {
          process.kill(-pgid, 'SIGKILL');
        } catch {
          /* gone */
        }
      }, 5000);
      await exited;
      clearTimeout(timer);
    }
    // wrangler's children may outlive the leader by a moment: make sure nothing of the group is left.
    for (let i = 0; i < 40 && groupPids(pgid, 'workerd').length > 0; i++) {
      if (i === 20)
        try {
          process.kill(-pgid, 'SIGKILL');
        } catch {
          /* gone */
        }
      await new Promise((r) => setTimeout(r, 100));
    }
  };
  const baseUrl = `http://127.0.0.1:${port}`;
  try {
    await waitForHealth(baseUrl, child, options.timeoutMs ?? 120_000, () => output);
  } catch (err) {
    await stop('SIGKILL');
    throw err;
  }
  const workerdPid = () => groupPids(pgid, 'workerd')[0] ?? null;
  return {
    baseUrl,
    port,
    persistDir,
    root,
    pgid,
    workerdPid,
    workerdRssKiB: () => {
      const pid = workerdPid();
      return pid === null ? null : rssKiB(pid);
    },
    workerdCpuMs: () => new Map(groupPids(pgid, 'workerd').map((pid) => [pid, cpuMs(pid)])),
    stop,
    log: () => output,
  };
}
