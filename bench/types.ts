/** One measured figure of a benchmark suite. */
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

/** The machine a suite ran on. */
export interface Machine {
  cpus: number;
  cpuModel: string | undefined;
  memGiB: number;
  node: string;
}

/** One suite's run, as saved in bench/results/<suite>.json. */
export interface SuiteResult {
  suite: string;
  date: string;
  machine: Machine;
  rows: BenchRow[];
}
