import { afterEach, describe, expect, it, vi } from 'vitest';
import { ApiError } from '../../worker/schemas';
import { loadSharedPanelPatiently, SHARE_RETRY_DELAYS_MS, SHARED_NOT_FOUND } from '../../web/io/shared-retry';

const NOT_FOUND = { error: { code: 'not_found', message: 'no panel is stored under this id', path: ['id'] } };
const PANEL = { version: 1, excitation: [], probes: [], channels: [] };

/** A fake fetch answering each call with the next of `answers` (status and body). */
function fakeFetch(answers: [number, unknown][]) {
  const calls: string[] = [];
  vi.stubGlobal('fetch', async (url: string) => {
    calls.push(url);
    const [status, body] = answers[Math.min(calls.length, answers.length) - 1];
    return new Response(JSON.stringify(body), { status, headers: { 'content-type': 'application/json' } });
  });
  return calls;
}

afterEach(() => vi.unstubAllGlobals());

describe('opening a shared panel not stored everywhere yet', () => {
  it('waits between tries for about a minute in all, each wait at least as long as the one before', () => {
    const total = SHARE_RETRY_DELAYS_MS.reduce((a, b) => a + b, 0);
    expect(total).toBe(60_000);
    SHARE_RETRY_DELAYS_MS.forEach((ms, i) => expect(ms).toBeGreaterThanOrEqual(SHARE_RETRY_DELAYS_MS[i - 1] ?? 0));
  });

  it('a panel found on the third try is returned, after two waits of 1 s and 2 s, each announced', async () => {
    const calls = fakeFetch([
      [404, NOT_FOUND],
      [404, NOT_FOUND],
      [200, PANEL],
    ]);
    const waits: number[] = [];
    const told: number[] = [];
    const sleep = async (ms: number) => void waits.push(ms);
    const got = await loadSharedPanelPatiently('abc', { sleep, onWait: (n) => told.push(n) });
    expect(got).toEqual(PANEL);
    expect(calls).toEqual(['/api/v1/panels/abc', '/api/v1/panels/abc', '/api/v1/panels/abc']);
    expect(waits).toEqual([1000, 2000]);
    expect(told).toEqual([1, 2]);
  });

  it('a panel never found is given up after every wait, with the final "still not available" message', async () => {
    const calls = fakeFetch([[404, NOT_FOUND]]);
    const waits: number[] = [];
    const failure = loadSharedPanelPatiently('abc', { sleep: async (ms) => void waits.push(ms) });
    await expect(failure).rejects.toThrow(SHARED_NOT_FOUND);
    await expect(failure).rejects.toBeInstanceOf(ApiError);
    expect(calls.length).toBe(SHARE_RETRY_DELAYS_MS.length + 1);
    expect(waits).toEqual([...SHARE_RETRY_DELAYS_MS]);
  });

  it('an answer other than 404 (too many requests, 429) is thrown at once without a retry', async () => {
    const calls = fakeFetch([[429, { error: { code: 'rate_limited', message: 'too many requests', path: [] } }]]);
    const sleep = vi.fn(async () => {});
    await expect(loadSharedPanelPatiently('abc', { sleep })).rejects.toThrow('too many requests');
    expect(calls.length).toBe(1);
    expect(sleep).not.toHaveBeenCalled();
  });
});
