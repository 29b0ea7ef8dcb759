/**
 * Pinning a bench to one core. The cores of a shared virtual machine can differ in speed by a third for minutes at a
 * time when a neighbour is busy, so a pair of timings (ours, numpy's) must never compare two different cores.
 */
import { execFileSync } from 'node:child_process';

/** The core both sides of every pair run on (BENCH_CPU, default 0). */
export const BENCH_CPU = process.env.BENCH_CPU ?? '0';

/** Pins this process (every thread) to BENCH_CPU with taskset; returns how to undo it, or null without taskset. */
export function pinToBenchCpu(): (() => void) | null {
  try {
    const mask = /affinity mask: ([0-9a-f]+)/.exec(
      execFileSync('taskset', ['-p', String(process.pid)], { encoding: 'utf8' }),
    );
    execFileSync('taskset', ['-cp', BENCH_CPU, String(process.pid)], { stdio: 'ignore' });
    return () => {
      if (mask) execFileSync('taskset', ['-p', mask[1], String(process.pid)], { stdio: 'ignore' });
    };
  } catch {
    return null;
  }
}
