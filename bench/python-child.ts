/**
 * A Python reference script kept running beside a bench: it prints one banner line when ready, then answers each
 * command line sent to it with one line. Keeping it running lets the bench pair each of its timings with an adjacent
 * reference timing on the same core.
 */
import { spawn } from 'node:child_process';
import { existsSync } from 'node:fs';
import { createInterface } from 'node:readline';
import { BENCH_CPU } from './pin';

/** A running script: one answer line per command. */
export interface PythonChild {
  banner: string;
  ask(command: string): Promise<string>;
  close(): void;
}

/** Starts `python3 script ...args` (pinned to BENCH_CPU when `pinned`); null with the reason if it cannot run. */
export async function startPython(
  script: string,
  args: string[],
  pinned: boolean,
): Promise<{ child: PythonChild | null; note: string }> {
  if (!existsSync(script)) return { child: null, note: `skipped: ${script} not found` };
  const [command, argv] = pinned
    ? ['taskset', ['-c', BENCH_CPU, 'python3', script, ...args]]
    : ['python3', [script, ...args]];
  const proc = spawn(command, argv, { stdio: ['pipe', 'pipe', 'pipe'] });
  const lines = createInterface({ input: proc.stdout })[Symbol.asyncIterator]();
  let stderr = '';
  proc.stderr.on('data', (chunk) => (stderr += String(chunk)));
  const failed = new Promise<IteratorResult<string>>((resolve) => {
    proc.on('error', (err) => {
      stderr += err.message;
      resolve({ done: true, value: undefined });
    });
  });
  const readLine = async () => {
    const line = await Promise.race([lines.next(), failed]);
    if (line.done) throw new Error(stderr.trim().split('\n').pop() || 'python3 stopped');
    return line.value;
  };
  try {
    const banner = await readLine();
    const child: PythonChild = {
      banner,
      async ask(line) {
        proc.stdin.write(`${line}\n`);
        return readLine();
      },
      close: () => proc.stdin.end(),
    };
    return { child, note: `python3 ${script.split('/').slice(-2).join('/')}${pinned ? `, on core ${BENCH_CPU}` : ''}` };
  } catch (err) {
    proc.kill();
    return { child: null, note: `skipped: python3 failed (${(err as Error).message})` };
  }
}
