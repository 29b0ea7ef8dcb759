// docs/benchmarks.md holds the results table that bench/report.ts makes from bench/results/*.json, and nothing typed
// by hand in its place: regenerating it from the committed results must give back the same document.
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { RESULTS_END, RESULTS_START, readSuiteResults, resultsTable, withResults } from '../../bench/report';

const root = fileURLToPath(new URL('../../', import.meta.url));

describe('docs/benchmarks.md', () => {
  it('docs/benchmarks.md holds exactly the table generated from bench/results/*.json', () => {
    const doc = readFileSync(`${root}docs/benchmarks.md`, 'utf8');
    const table = resultsTable(readSuiteResults(`${root}bench/results`));
    expect(doc).toContain(RESULTS_START);
    expect(doc).toContain(RESULTS_END);
    expect(withResults(doc, table)).toBe(doc);
  });

  it('resultsTable writes one row per measurement with its median and figures, and escapes pipes', () => {
    const table = resultsTable([
      {
        suite: 'demo',
        date: '2026-12-02T00:00:00.000Z',
        machine: { cpus: 2, cpuModel: 'Test CPU', memGiB: 4, node: 'v20.0.0' },
        rows: [{ suite: 'demo', name: 'a | b', medianMs: 0.0123, extra: { ratio: 0.9 } }],
      },
    ]);
    expect(table).toContain('**demo** — 2026-12-02, 2 × Test CPU, Node v20.0.0');
    expect(table).toContain('| a \\| b | 0.0123 | ratio=0.9 |');
  });
});
