// Load soak: mixed evaluate, new-share and share-fetch traffic against the app as `npm start` runs it (workerd + local
// KV on loopback) for SOAK_SECONDS (default 60) at SOAK_CONNECTIONS (default 32) keep-alive connections.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startApp, type StartedApp } from './helpers/app';
import { demoPanelTitled, demoPanelWithPeak, postJson } from './helpers/contract';

const SECONDS = Number(process.env.SOAK_SECONDS ?? 60);
const CONNECTIONS = Number(process.env.SOAK_CONNECTIONS ?? 32);
// The local runtime itself (wrangler dev 4.86: both its proxy workerd and the worker's workerd) grows by several KiB of
// RSS per request even on /api/v1/health, so the bound is relative: a baseline phase of health requests measures
// the runtime's own growth per request, and the mixed traffic may grow at most RSS_GROWTH_RATIO times that per request
// plus RSS_GROWTH_SLACK_KIB (our tolerance; a leak of one stored panel's text per share, ~5 KiB, would break it).
const RSS_GROWTH_RATIO = 2;
const RSS_GROWTH_SLACK_KIB = 2;
const BASELINE_SECONDS = Math.max(5, Math.round(SECONDS / 4));

let app: StartedApp;
beforeAll(async () => {
  app = await startApp();
});
afterAll(async () => {
  await app?.stop();
});

interface Tally {
  byStatus: Map<number, number>;
  serverErrors: string[];
  networkErrors: string[];
  stored: Map<string, Record<string, unknown>>;
  fetchMismatches: string[];
  rssKiB: number[];
}

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];

/** One connection's loop: 5 evaluations, 3 new shares and 2 share fetches in every 10 requests. */
async function connectionLoop(conn: number, until: number, t: Tally): Promise<void> {
  for (let i = 0; Date.now() < until; i++) {
    const kind = i % 10;
    try {
      let res: Response;
      if (kind < 5) {
        // Peaks 590–620 nm in 0.5 nm steps: more distinct dots than the resolved-dot cache holds.
        res = await postJson(
          app.baseUrl,
          '/api/v1/panels/evaluate',
          demoPanelWithPeak(590 + ((conn * 7 + i) % 61) * 0.5),
        );
      } else if (kind < 8 || t.stored.size === 0) {
        const panel = demoPanelTitled(`Soak run, connection ${conn}, request ${i}`);
        res = await postJson(app.baseUrl, '/api/v1/panels', panel);
        if (res.status === 201) t.stored.set(((await res.clone().json()) as { id: string }).id, panel);
      } else {
        const ids = [...t.stored.keys()];
        const id = ids[(conn * 31 + i * 17) % ids.length];
        res = await fetch(`${app.baseUrl}/api/v1/panels/${id}`);
        if (res.status === 200) {
          const got = (await res.clone().json()) as unknown;
          if (!deepEqual(got, t.stored.get(id))) t.fetchMismatches.push(id);
        }
      }
      t.byStatus.set(res.status, (t.byStatus.get(res.status) ?? 0) + 1);
      const text = await res.text();
      if (res.status >= 500) t.serverErrors.push(`${res.status} ${text.slice(0, 200)}`);
    } catch (err) {
      t.networkErrors.push(String((err as Error).cause ?? err));
    }
  }
}

/** RSS growth of workerd per /api/v1/health request over BASELINE_SECONDS at the same concurrency. */
async function healthBaseline(): Promise<{ requests: number; kibPerRequest: number }> {
  const samples: number[] = [];
  const sampler = setInterval(() => samples.push(app.workerdRssKiB() ?? NaN), 500);
  const until = Date.now() + BASELINE_SECONDS * 1000;
  let requests = 0;
  await Promise.all(
    Array.from({ length: CONNECTIONS }, async () => {
      while (Date.now() < until) {
        await (await fetch(`${app.baseUrl}/api/v1/health`)).text();
        requests++;
      }
    }),
  );
  clearInterval(sampler);
  const third = Math.floor(samples.length / 3);
  const growthKiB = median(samples.slice(-third)) - median(samples.slice(0, third));
  return { requests, kibPerRequest: growthKiB / ((requests * 2) / 3) };
}

function deepEqual(a: unknown, b: unknown): boolean {
  try {
    expect(a).toEqual(b);
    return true;
  } catch {
    return false;
  }
}

describe('soak', () => {
  it(
    `mixed evaluate and share traffic for ${SECONDS} s at ${CONNECTIONS} connections gives no 5xx, loses no share ` +
      `and grows in memory no faster per request than plain health requests`,
    async () => {
      const baseline = await healthBaseline();
      const t: Tally = {
        byStatus: new Map(),
        serverErrors: [],
        networkErrors: [],
        stored: new Map(),
        fetchMismatches: [],
        rssKiB: [],
      };
      const started = Date.now();
      const until = started + SECONDS * 1000;
      const sampler = setInterval(() => {
        const rss = app.workerdRssKiB();
        if (rss !== null) t.rssKiB.push(rss);
      }, 1000);
      await Promise.all(Array.from({ length: CONNECTIONS }, (_, c) => connectionLoop(c, until, t)));
      clearInterval(sampler);
      const elapsedS = (Date.now() - started) / 1000;
      const total = [...t.byStatus.values()].reduce((a, b) => a + b, 0);

      // Every share that got a 201 is fetched back, equal to what was sent.
      const lost: string[] = [];
      for (const [id, panel] of t.stored) {
        const res = await fetch(`${app.baseUrl}/api/v1/panels/${id}`);
        if (res.status !== 200 || !deepEqual(await res.json(), panel)) lost.push(`${id}: ${res.status}`);
      }
      const third = Math.floor(t.rssKiB.length / 3);
      const firstMiB = median(t.rssKiB.slice(0, third)) / 1024;
      const lastMiB = median(t.rssKiB.slice(-third)) / 1024;
      // Requests between the middles of the first and last thirds: two thirds of the run.
      const kibPerRequest = ((lastMiB - firstMiB) * 1024) / ((total * 2) / 3);
      console.log(
        `soak: ${total} requests in ${elapsedS.toFixed(1)} s (${(total / elapsedS).toFixed(0)} req/s), statuses ` +
          `${JSON.stringify(Object.fromEntries(t.byStatus))}, ` +
          `${t.stored.size} shares stored, workerd RSS median first third ${firstMiB.toFixed(0)} MiB, last third ` +
          `${lastMiB.toFixed(0)} MiB, max ${(Math.max(...t.rssKiB) / 1024).toFixed(0)} MiB; ` +
          `growth ${kibPerRequest.toFixed(2)} KiB/request against ` +
          `${baseline.kibPerRequest.toFixed(2)} KiB/request for ` +
          `${baseline.requests} health requests; ` +
          `every 5 s: ${t.rssKiB
            .filter((_, i) => i % 5 === 0)
            .map((k) => (k / 1024).toFixed(0))
            .join(' ')}`,
      );

      if (t.serverErrors.length > 0) console.log(`server output:\n${app.log()}`);
      expect(t.serverErrors).toEqual([]);
      expect(t.networkErrors).toEqual([]);
      expect([...t.byStatus.keys()].every((s) => s === 200 || s === 201)).toBe(true);
      expect(t.stored.size).toBeGreaterThan(0);
      expect(t.fetchMismatches).toEqual([]);
      expect(lost).toEqual([]);
      expect(t.rssKiB.length).toBeGreaterThanOrEqual(6);
      expect(kibPerRequest).toBeLessThanOrEqual(
        Math.max(0, baseline.kibPerRequest) * RSS_GROWTH_RATIO + RSS_GROWTH_SLACK_KIB,
      );
    },
  );
});
