// The budget of share links on the real local runtime: its limiter binding (wrangler.toml [[ratelimits]]) keyed by the
// client address the runtime passes on in CF-Connecting-IP. Addresses are from the documentation ranges (2001:db8::/32,
// RFC 3849; 192.0.2.0/24, RFC 5737): no real client.
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { examplePanel } from './helpers/panels';
import { errorOf, freshPersistDir, postJson, ROOT, startWorker, type RunningWorker } from './helpers/worker';

const LIMIT = Number(
  /\[\[ratelimits\]\][^[]*?limit\s*=\s*(\d+)/.exec(readFileSync(join(ROOT, 'wrangler.toml'), 'utf8'))![1],
);
/** The local limiter counts in fixed windows aligned to the clock (wrangler.toml `period`, 60 s). */
const WINDOW_MS = 60_000;
/** Time a test of this file needs within one window (our convention, ample for LIMIT + 3 local requests). */
const TEST_SPAN_MS = 20_000;

let worker: RunningWorker;

beforeAll(async () => {
  worker = await startWorker(freshPersistDir());
});
afterAll(async () => {
  await worker?.dispose();
});

/** Waits for the next window when too little of the current one is left for a test. */
async function clearOfWindowEnd(): Promise<void> {
  const intoWindowMs = Date.now() % WINDOW_MS;
  if (intoWindowMs > WINDOW_MS - TEST_SPAN_MS) await new Promise((r) => setTimeout(r, WINDOW_MS + 500 - intoWindowMs));
}

/** POST /api/v1/panels of a panel with this title from this client address; its status. */
async function shareFrom(ip: string, title: string): Promise<number> {
  const res = await worker.call('/api/v1/panels', {
    method: 'POST',
    headers: { 'content-type': 'application/json', 'cf-connecting-ip': ip },
    body: JSON.stringify({ ...examplePanel(), title }),
  });
  if (res.status === 429) expect((await errorOf(res))?.code).toBe('rate_limited');
  else await res.text();
  return res.status;
}

/** Spends a client's whole budget with new panels; the statuses. */
async function spendAll(ip: string, tag: string): Promise<number[]> {
  const statuses: number[] = [];
  for (let i = 0; i < LIMIT; i++) statuses.push(await shareFrom(ip, `${tag} ${i}`));
  return statuses;
}

describe('budget of share links per client', () => {
  it('two spellings of one IPv6 /64 share one budget; another /64 has its own', async () => {
    expect(LIMIT).toBeGreaterThan(0);
    await clearOfWindowEnd();
    expect(await spendAll('2001:db8:5:6::1', 'v6 budget')).toEqual(new Array(LIMIT).fill(201));
    expect(await shareFrom('2001:0DB8:0005:0006:ffff:0:0:2', 'v6 other spelling')).toBe(429);
    expect(await shareFrom('2001:db8:5:7::1', 'v6 next /64')).toBe(201);
  });

  it('an IPv4-mapped IPv6 client spends the budget of the IPv4 address it carries', async () => {
    await clearOfWindowEnd();
    expect(await spendAll('192.0.2.9', 'v4 budget')).toEqual(new Array(LIMIT).fill(201));
    expect(await shareFrom('::ffff:c000:209', 'v4 mapped hex')).toBe(429);
    expect(await shareFrom('::ffff:192.0.2.10', 'v4 mapped neighbour')).toBe(201);
  });

  it('sharing an already stored panel spends budget too, and past it answers 429 like a new panel', async () => {
    await clearOfWindowEnd();
    const ip = '2001:db8:5:8::1';
    expect(await shareFrom(ip, 'stored before the budget is spent')).toBe(201);
    expect(await spendAll(ip, 're-share budget')).toEqual([...new Array<number>(LIMIT - 1).fill(201), 429]);
    expect(await shareFrom(ip, 'stored before the budget is spent')).toBe(429);
    expect((await postJson(worker, '/api/v1/panels', { ...examplePanel(), title: 'from loopback' })).status).toBe(201);
  });
});
