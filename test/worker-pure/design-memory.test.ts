// The API's design run within its limits, in Node: the memory it holds at its peak against the per-request cap
// (LIMITS.designBytes), and a client that has gone stopping the search. The heaviest accepted request is the one the
// per-route table of docs/api.md ("Work per request") measured: 12 free targets, 5 nm steps, a 5,000,000-node budget.
import { setFlagsFromString } from 'node:v8';
import { runInNewContext } from 'node:vm';
import { describe, expect, it } from 'vitest';
import { estimateDesignCost, LIMITS, type DesignRequest } from '../../spectra/index';
import { runBoundedDesign } from '../../worker/design-run';

setFlagsFromString('--expose-gc');
const gc = runInNewContext('gc') as () => void;

const words = ['high', 'low', 'medium'] as const;
const heaviest: DesignRequest = {
  targets: Array.from({ length: 12 }, (_, i) => ({ name: `t${i}`, abundance: words[i % 3] })),
  excitation: [{ wavelengthNm: 405 }],
  options: { peakStepNm: 5, bandStepNm: 5, nodeBudget: 5_000_000 },
} as DesignRequest;

/** JavaScript heap plus typed-array buffers in use, bytes: what the run holds, in and out of the heap. */
const inUse = () => {
  const m = process.memoryUsage();
  return m.heapUsed + m.arrayBuffers;
};

describe('runBoundedDesign memory', () => {
  it('runBoundedDesign(heaviest accepted request) holds under LIMITS.designBytes above its baseline', async () => {
    expect(estimateDesignCost(heaviest).workingBytes).toBeLessThanOrEqual(LIMITS.designBytes);
    gc();
    const baseline = inUse();
    let peak = baseline;
    // The run pauses on a zero-delay timer between chunks of work: the sampler reads memory in those pauses, so the
    // peak it sees is the memory the run holds across a chunk (garbage not yet collected included).
    const sampler = setInterval(() => (peak = Math.max(peak, inUse())), 0);
    const result = await runBoundedDesign(heaviest);
    clearInterval(sampler);
    peak = Math.max(peak, inUse());
    expect(result.verdict).toBeDefined();
    const heldMiB = (peak - baseline) / 2 ** 20;
    expect(heldMiB).toBeGreaterThan(0);
    expect(heldMiB).toBeLessThan(LIMITS.designBytes / 2 ** 20);
  });
});

describe('runBoundedDesign abort', () => {
  it('runBoundedDesign with the client gone before the start stops far short of a full run', async () => {
    // Six targets at the defaults: a search that runs to its node budget (docs/benchmarks.md, the design suite).
    const six = { targets: heaviest.targets.slice(0, 6), excitation: heaviest.excitation } as DesignRequest;
    const gone = new AbortController();
    gone.abort();
    const stopped = await runBoundedDesign(six, gone.signal);
    const full = await runBoundedDesign(six);
    const visited = (r: typeof stopped) => (r.stats as { nodesVisited: number } | null)?.nodesVisited ?? 0;
    expect(visited(full)).toBeGreaterThan(1000);
    expect(visited(stopped)).toBeLessThan(visited(full) / 10);
  });
});
