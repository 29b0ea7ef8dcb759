/**
 * `npm run bench`: runs every suite in bench/suites/ (each a module whose default export returns rows), prints one
 * table and writes it as JSON to bench/results/latest.json. Suites are plain async functions so that each can time
 * what it measures in its own way (tinybench for pure functions, a load generator for HTTP, a browser for the page).
 */
import { readdirSync, mkdirSync, writeFileSync } from 'node:fs';
import { cpus, totalmem } from 'node:os';
import { join, dirname } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';

export interface BenchRow {
  suite: string;
  name: string;
  /** Median time of one operation, ms (null where the row reports something else, e.g. a rate). */
  medianMs: number | null;
  minMs?: number | null;
  maxMs?: number | null;
  samples?: number;
  /** Free-form figures: ratio, req/s, p99, bytes, nodes visited... */
  extra?: Record<string, number | string | null>;
  note?: string;
}

const here = dirname(fileURLToPath(import.meta.url));
const only = process.argv.slice(2);
const files = readdirSync(join(here, 'suites'))
  .filter((f) => f.endsWith('.ts'))
  .filter((f) => only.length === 0 || only.some((o) => f.includes(o)))
  .sort();

const rows: BenchRow[] = [];
for (const file of files) {
  const mod = (await import(pathToFileURL(join(here, 'suites', file)).href)) as { default: () => Promise<BenchRow[]> };
  try {
    rows.push(...(await mod.default()));
  } catch (err) {
    rows.push({ suite: file, name: 'failed', medianMs: null, note: String((err as Error)?.message ?? err) });
  }
}

const fmt = (v: number | null | undefined) =>
  v == null ? '—' : v < 0.1 ? v.toFixed(4) : v < 10 ? v.toFixed(3) : v.toFixed(1);
const table = rows.map((r) => ({
  suite: r.suite,
  name: r.name,
  'median ms': fmt(r.medianMs),
  'min ms': fmt(r.minMs),
  'max ms': fmt(r.maxMs),
  extra: r.extra
    ? Object.entries(r.extra)
        .map(([k, v]) => `${k}=${v}`)
        .join(' ')
    : '',
  note: r.note ?? '',
}));
console.table(table);
const machine = {
  cpus: cpus().length,
  cpuModel: cpus()[0]?.model,
  memGiB: Math.round(totalmem() / 2 ** 30),
  node: process.version,
};
mkdirSync(join(here, 'results'), { recursive: true });
writeFileSync(
  join(here, 'results', 'latest.json'),
  JSON.stringify({ date: new Date().toISOString(), machine, rows }, null, 2),
);
console.log(`machine: ${JSON.stringify(machine)}\nwritten: bench/results/latest.json`);
