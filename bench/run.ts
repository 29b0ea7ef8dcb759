/**
 * `npm run bench` (or `npm run bench -- spectra` for the suites whose file names contain "spectra"): runs the suites in
 * bench/suites/ (each a module whose default export returns rows), prints one table, writes each suite's rows to
 * bench/results/<suite>.json and regenerates the results table of docs/benchmarks.md from those files. Suites are plain
 * async functions so that each can time what it measures in its own way (tinybench for pure functions, a load
 * generator for HTTP, a browser for the page).
 */
import { readdirSync, mkdirSync, writeFileSync } from 'node:fs';
import { cpus, totalmem } from 'node:os';
import { join, dirname } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { writeResultsTable } from './report';
import type { BenchRow, Machine, SuiteResult } from './types';

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
const machine: Machine = {
  cpus: cpus().length,
  cpuModel: cpus()[0]?.model,
  memGiB: Math.round(totalmem() / 2 ** 30),
  node: process.version,
};
// One file per suite, so running one suite keeps the others' last results; the table in docs/benchmarks.md is made
// from all of them.
const resultsDir = join(here, 'results');
mkdirSync(resultsDir, { recursive: true });
const date = new Date().toISOString();
for (const suite of new Set(rows.map((r) => r.suite))) {
  const result: SuiteResult = { suite, date, machine, rows: rows.filter((r) => r.suite === suite) };
  writeFileSync(join(resultsDir, `${suite}.json`), `${JSON.stringify(result, null, 2)}\n`);
}
writeResultsTable(join(here, '..'));
console.log(
  `machine: ${JSON.stringify(machine)}\nwritten: bench/results/<suite>.json and the table in docs/benchmarks.md`,
);
