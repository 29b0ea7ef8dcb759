/**
 * The API under load on loopback: the app started as `npm start` does (scripts/start.sh, workerd + local KV in a
 * temporary directory, log level warn), autocannon for 5 s per row at 1, 8 and 32 connections on POST
 * /api/v1/panels/evaluate (the demo's 6×6 panel) and GET /api/v1/panels/<id> (fetching a share link); and, at 8
 * connections, the demo's probes on a stored instrument profile evaluated by reference (one KV read) and with the
 * profile's parts written out (none).
 */
import autocannon from 'autocannon';
import type { BenchRow } from '../types';
import { startApp, type StartedApp } from '../../test/quality/helpers/app';
import { demoPanelTitled } from '../../test/quality/helpers/contract';
import { EXAMPLE_INSTRUMENTS, resolveOnInstrument, type PanelOnInstrumentSpec } from '../../spectra/index';

const SECONDS = Number(process.env.BENCH_API_SECONDS ?? 5);
const CONNECTIONS = [1, 8, 32];

/**
 * One autocannon run: requests per second, p50/p99 latency, errors and non-2xx answers, and CPU time per request of
 * the busier workerd process (wrangler dev runs two: its proxy and the worker; the worker's is the busier one, and its
 * figure includes the runtime's own HTTP handling, so it is an upper bound on the worker's CPU time per request).
 */
async function load(app: StartedApp, name: string, opts: autocannon.Options): Promise<BenchRow> {
  const before = app.workerdCpuMs();
  const result = await autocannon({ ...opts, duration: SECONDS });
  const after = app.workerdCpuMs();
  const busiestMs = Math.max(...[...after].map(([pid, ms]) => ms - (before.get(pid) ?? ms)));
  return {
    suite: 'api',
    name,
    medianMs: result.latency.p50,
    minMs: result.latency.min,
    maxMs: result.latency.max,
    samples: result.requests.total,
    extra: {
      'req/s': Math.round(result.requests.average),
      p99ms: result.latency.p99,
      errors: result.errors + result.timeouts,
      non2xx: result.non2xx,
      workerdCpuMsPerReq: result.requests.total > 0 ? +(busiestMs / result.requests.total).toFixed(2) : null,
    },
  };
}

export default async function apiSuite(): Promise<BenchRow[]> {
  const app = await startApp();
  try {
    const panel = JSON.stringify(demoPanelTitled('Benchmark panel'));
    const shared = await fetch(`${app.baseUrl}/api/v1/panels`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: panel,
    });
    const { id } = (await shared.json()) as { id: string };
    const rows: BenchRow[] = [];
    for (const connections of CONNECTIONS) {
      rows.push(
        await load(app, `POST /panels/evaluate demo 6x6, ${connections} conn`, {
          url: `${app.baseUrl}/api/v1/panels/evaluate`,
          method: 'POST',
          headers: { 'content-type': 'application/json' },
          body: panel,
          connections,
        }),
      );
      rows.push(
        await load(app, `GET /panels/<id> share fetch, ${connections} conn`, {
          url: `${app.baseUrl}/api/v1/panels/${id}`,
          connections,
        }),
      );
    }
    rows.push(...(await byReference(app)));
    return rows;
  } finally {
    await app.stop();
  }
}

/** The cost of naming an instrument: the same panel by reference to a stored profile and written out, 8 connections. */
async function byReference(app: StartedApp): Promise<BenchRow[]> {
  const profile = { ...EXAMPLE_INSTRUMENTS[0], name: 'Benchmark widefield (stored)' };
  const stored = await fetch(`${app.baseUrl}/api/v1/instruments`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify(profile),
  });
  const { id } = (await stored.json()) as { id: string };
  const { probes } = demoPanelTitled('Benchmark panel') as { probes: PanelOnInstrumentSpec['probes'] };
  const request: PanelOnInstrumentSpec = { version: 1, instrument: id, probes };
  const written = resolveOnInstrument(request, profile);
  const rows: BenchRow[] = [];
  for (const [name, body] of [
    ['POST /panels/evaluate demo probes on a stored instrument, by reference, 8 conn', request],
    ['POST /panels/evaluate the same panel written out, 8 conn', written],
  ] as const) {
    rows.push(
      await load(app, name, {
        url: `${app.baseUrl}/api/v1/panels/evaluate`,
        method: 'POST',
        headers: { 'content-type': 'application/json' },
        body: JSON.stringify(body),
        connections: 8,
      }),
    );
  }
  return rows;
}
