/**
 * Design engine speed (`npm run bench -- design`). Rows:
 *  - catalog search, 8 targets from 16 × 16 candidates, on 8 seeded synthetic catalogs (Gaussian lines through
 *    rectangular passbands): median/min/max time and nodes visited against the full enumeration 16P8 × 16P8;
 *  - the whole catalog route pipeline (runDesign: candidate matrix from real dot models, search, evaluation, noise)
 *    for 8 targets from 16 CdSe/CdTe dots and 16 bandpasses;
 *  - free mode, 6 and 8 targets, 400–800 nm, 405 nm line, default options: time, objective, exact, nodes.
 * Targets: catalog 8-of-16 under 1 s, free 6-plex under 5 s (Node, this machine).
 */
import erf from '@stdlib/math-base-special-erf';
import type { BenchRow } from '../types';
import { createRandom, runDesign, searchCatalog, type DesignRequest } from '../../spectra/index';

const phi = (x: number) => 0.5 * (1 + erf(x / Math.SQRT2));
const WORDS = ['high', 'low', 'medium', 'high', 'low', 'medium', 'high', 'low'] as const;

function syntheticCatalog(seed: number): { collected: number[][]; abundance: number[] } {
  const rng = createRandom(seed);
  const probes = Array.from({ length: 16 }, () => ({
    mu: 450 + 300 * rng.uniform(),
    s: (20 + 25 * rng.uniform()) / 2.3548,
    b: 0.2 + 2.8 * rng.uniform(),
  }));
  const bands = Array.from({ length: 16 }, () => ({ c: 450 + 300 * rng.uniform(), w: 15 + 35 * rng.uniform() }));
  const collected = bands.map(({ c, w }) =>
    probes.map(({ mu, s, b }) => b * (phi((c + w / 2 - mu) / s) - phi((c - w / 2 - mu) / s) + 1e-6)),
  );
  return { collected, abundance: Array.from({ length: 8 }, () => [1, 0.3, 0.1][Math.floor(rng.uniform() * 3)]) };
}

function stats(ms: number[]): Pick<BenchRow, 'medianMs' | 'minMs' | 'maxMs' | 'samples'> {
  const sorted = [...ms].sort((a, b) => a - b);
  return {
    medianMs: sorted[Math.floor(sorted.length / 2)],
    minMs: sorted[0],
    maxMs: sorted[sorted.length - 1],
    samples: ms.length,
  };
}

function timed<T>(run: () => T): [T, number] {
  const start = performance.now();
  const out = run();
  return [out, performance.now() - start];
}

function catalogRows(): BenchRow[] {
  const times: number[] = [];
  const nodes: number[] = [];
  let full = 0;
  let exact = 0;
  for (let seed = 1; seed <= 8; seed++) {
    const [result, ms] = timed(() => searchCatalog(syntheticCatalog(100 + seed), { nodeBudget: 50_000_000 }));
    times.push(ms);
    nodes.push(result.stats.nodesVisited);
    full = result.stats.fullEnumeration;
    exact += result.exact ? 1 : 0;
  }
  const medianNodes = [...nodes].sort((a, b) => a - b)[4];
  // 24 core/shell dots every 11 nm from 490 nm, and 24 stock 20 nm bandpasses every 10 nm from 500 nm.
  const peaks = Array.from({ length: 24 }, (_, i) => 490 + 11 * i);
  const centres = Array.from({ length: 24 }, (_, i) => 500 + 10 * i);
  const request: DesignRequest = {
    targets: WORDS.map((abundance, i) => ({ name: `T${i + 1}`, abundance })),
    excitation: [{ wavelengthNm: 405 }],
    candidates: {
      probes: peaks.map((nm, i) => ({
        id: `d${i}`,
        material: nm <= 640 ? 'cdse' : 'cdte',
        emissionPeakNm: nm,
        shell: [{ material: nm <= 640 ? 'zns' : 'cds', thicknessNm: 0.6 }],
      })),
      channels: centres.map((nm, i) => ({ id: `c${i}`, filters: [{ type: 'bandpass', centerNm: nm, widthNm: 20 }] })),
    },
    options: { nodeBudget: 5_000_000 },
  };
  const pipeline = [1, 2, 3].map(() => timed(() => runDesign(request)));
  const last = pipeline[2][0];
  return [
    {
      suite: 'design',
      name: 'catalog search 8 of 16×16 (8 synthetic catalogs)',
      ...stats(times),
      extra: {
        medianNodes,
        maxNodes: Math.max(...nodes),
        fullEnumeration: full.toExponential(2),
        exactRuns: `${exact}/8`,
      },
    },
    {
      suite: 'design',
      name: 'catalog runDesign 8 of 24×24 core/shell dots and stock bandpasses',
      ...stats(pipeline.map(([, ms]) => ms)),
      extra: {
        verdict: last.verdict,
        nodes: last.stats?.nodesVisited ?? null,
        exact: String(last.exact),
        worst: last.objective ? last.objective.worstInterference.toExponential(3) : null,
        worstSignalToNoise: last.objective ? last.objective.worstSignalToNoise.toFixed(2) : null,
        gap: last.stats?.gap ?? null,
      },
    },
  ];
}

function freeRow(targets: number, linesNm: number[] = [405]): BenchRow {
  const request: DesignRequest = {
    targets: Array.from({ length: targets }, (_, i) => ({ name: `T${i + 1}`, abundance: WORDS[i % WORDS.length] })),
    excitation: linesNm.map((wavelengthNm) => ({ wavelengthNm })),
  };
  const runs = [1, 2].map(() => timed(() => runDesign(request)));
  const r = runs[1][0];
  const sn = r.noise?.signalToNoise.filter((x): x is number => x !== null) ?? [];
  return {
    suite: 'design',
    name: `free mode ${targets} targets, ${linesNm.join(' + ')} nm, 400–800 nm`,
    ...stats(runs.map(([, ms]) => ms)),
    extra: {
      verdict: r.verdict,
      largestUsable: r.largestUsableTargets,
      worst: r.objective ? r.objective.worstInterference.toExponential(3) : null,
      minSignalToNoise: sn.length ? Math.min(...sn).toFixed(1) : null,
      signalToNoiseBound: r.stats?.signalToNoiseBound?.toFixed(1) ?? null,
      gap: r.stats?.gap?.toFixed(3) ?? null,
      exact: String(r.exact),
      nodes: r.stats?.nodesVisited ?? null,
    },
  };
}

/** The suite's rows. */
export default async function designSuite(): Promise<BenchRow[]> {
  return [
    ...catalogRows(),
    freeRow(6),
    freeRow(6, [405, 488]),
    freeRow(8),
    freeRow(12),
    freeRow(12, [405, 488]),
    freeRow(16),
  ];
}
