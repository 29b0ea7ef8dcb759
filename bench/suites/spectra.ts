/**
 * Panel evaluation speed against the numpy script a scientist would otherwise write (bench/numpy_reference.py): the
 * same 8 × 8 work, peaks 490–715 nm with 0.09 eV wide lines, 24 nm bandpasses centred on them with the script's
 * edges, 1 nm grid 300–1000 nm, collected + spillover + condition number (the library also gives purity, noise
 * gains, brightness, sizing and warnings; no lot-shift check, the script has none). Requirement: at most numpy's time.
 * Headline row, like for like: every evaluation resolves its 8 dots (sizing, line shape, absorption) and computes its
 * 8 filter transmissions from scratch, as the script does. What stays warm is per material, not per probe (the smooth
 * size fit and the inverse sizing table, built once per process like the constants the script holds).
 * Then the lot-shift check, 16 × 16, a 32-bin spectral detector, one resolveDot, and the two parts of the headline
 * that the script also does, timed alone (the 8 dots, the 8 filters).
 * Timed as the script times itself: batches of 200 calls after 200 calls to warm up, and the mean per call of each
 * batch. A batch mean includes the garbage collection the calls cause (Python frees as it goes, inside each call); a
 * per-call median (tinybench's p50, given beside it) leaves the collections out and flatters a JS engine. The machine
 * is shared, so each of our batches is paired with an adjacent numpy batch (the script kept running in --paired
 * mode) and the ratio is the median of the pairs' ratios.
 */
import { spawn } from 'node:child_process';
import { existsSync } from 'node:fs';
import { createInterface } from 'node:readline';
import { fileURLToPath } from 'node:url';
import { Bench } from 'tinybench';
import { BENCH_CPU, pinToBenchCpu } from '../pin';
import type { BenchRow } from '../types';
import {
  DEFAULT_GRID,
  centerEvForPeakNm,
  channelTransmission,
  evaluatePanel,
  fwhmNmOfLine,
  resolveDot,
  type DotInput,
  type PanelSpec,
  type ProbeSpec,
} from '../../spectra/index';

const NUMPY_SCRIPT = fileURLToPath(new URL('../numpy_reference.py', import.meta.url));

const materialFor = (peakNm: number): ProbeSpec['material'] =>
  peakNm <= 650 ? 'cdse' : peakNm <= 730 ? 'cdte' : 'gaas';

/** A panel with one probe per peak and one bandpass (centre = peak) per probe, excited at 405 nm. */
function panelFor(peaksNm: number[], widthNm: number): PanelSpec {
  return {
    version: 1,
    excitation: [{ wavelengthNm: 405 }],
    probes: peaksNm.map((nm, i) => ({ id: `p${i}`, material: materialFor(nm), emissionPeakNm: nm, quantumYield: 0.5 })),
    channels: peaksNm.map((nm, i) => ({ id: `c${i}`, filters: [{ type: 'bandpass', centerNm: nm, widthNm }] })),
  };
}

// the numpy script's parameters: every line 0.09 eV FWHM in energy, filter edges logistic with a 1.5 nm scale.
const NUMPY_FWHM_EV = 0.09;
const NUMPY_EDGE_SCALE_NM = 1.5;

/**
 * The 8 × 8 panel of the numpy script: its peaks, its line widths (each probe's fwhmNm is the per-nm FWHM of a
 * 0.09 eV line at that peak, so resolveDot finds 0.09 eV again) and its filter edges (edgeWidthNm is the 10–90 % rise
 * of a logistic of scale 1.5 nm, 2 ln 9 × 1.5 nm). Left at our defaults: peak transmission 0.93 and OD 6 blocking
 * (numpy's filters go to 1 and to 0), QY 0.5, one 405 nm line; with the excitation leak (scatter level 1e10) and
 * water Raman (level 0.1) on, as the script computes them.
 */
function numpyPanel(): PanelSpec {
  const peaksNm = [490, 525, 565, 605, 640, 680, 715, 665];
  const panel = panelFor(peaksNm, 24);
  panel.probes.forEach((probe, i) => {
    probe.fwhmNm = fwhmNmOfLine(centerEvForPeakNm(peaksNm[i], NUMPY_FWHM_EV), NUMPY_FWHM_EV);
  });
  panel.channels.forEach((channel) => {
    channel.filters[0] = {
      ...channel.filters[0],
      edgeWidthNm: 2 * Math.log(9) * NUMPY_EDGE_SCALE_NM,
    } as (typeof channel.filters)[number];
  });
  // The sample's light, as the script models it: the line leaking through each filter and water Raman under it.
  return { ...panel, scatterLevel: 1e10, waterRaman: { level: 0.1 } };
}

/** numpy's batches on request: the script kept running in --paired mode, one batch of 200 calls per line sent. */
interface NumpyBatches {
  /** Mean microseconds per call of one more batch. */
  next(): Promise<number>;
  close(): void;
}

/** Starts the numpy script in --paired mode and waits for its warm-up; null (with the reason) if it cannot run. */
async function startNumpy(pinned: boolean): Promise<{ numpy: NumpyBatches | null; note: string }> {
  if (!existsSync(NUMPY_SCRIPT)) return { numpy: null, note: `skipped: ${NUMPY_SCRIPT} not found` };
  const [command, args] = pinned
    ? ['taskset', ['-c', BENCH_CPU, 'python3', NUMPY_SCRIPT, '--paired']]
    : ['python3', [NUMPY_SCRIPT, '--paired']];
  const child = spawn(command as string, args as string[], { stdio: ['pipe', 'pipe', 'pipe'] });
  const lines = createInterface({ input: child.stdout })[Symbol.asyncIterator]();
  let stderr = '';
  child.stderr.on('data', (chunk) => (stderr += String(chunk)));
  const failed = new Promise<IteratorResult<string>>((resolve) => {
    child.on('error', (err) => {
      stderr += err.message;
      resolve({ done: true, value: undefined });
    });
  });
  const readLine = async () => {
    const line = await Promise.race([lines.next(), failed]);
    if (line.done) throw new Error(stderr.trim().split('\n').pop() || 'python3 stopped');
    return line.value;
  };
  try {
    const first = await readLine();
    if (first !== 'ready') throw new Error(`unexpected output: ${first}`);
  } catch (err) {
    child.kill();
    return { numpy: null, note: `skipped: python3/numpy failed (${(err as Error).message})` };
  }
  const numpy: NumpyBatches = {
    async next() {
      child.stdin.write('batch\n');
      return Number(await readLine());
    },
    close: () => child.stdin.end(),
  };
  return {
    numpy,
    note: `python3 bench/numpy_reference.py --paired${pinned ? `, both sides on core ${BENCH_CPU}` : ', not pinned'}`,
  };
}

/** Mean ms per call of one batch of 200 calls: the numpy script's batch. */
function batchMeanMs(fn: () => void): number {
  const start = performance.now();
  for (let i = 0; i < 200; i++) fn();
  return (performance.now() - start) / 200;
}

const median = (values: number[]) => {
  const sorted = values.toSorted((a, b) => a - b);
  const mid = sorted.length >> 1;
  return sorted.length % 2 === 1 ? sorted[mid] : (sorted[mid - 1] + sorted[mid]) / 2;
};

/** Median ms of each task of a fresh tinybench run. */
async function medians(tasks: [string, () => void][], timeMs: number): Promise<BenchRow[]> {
  const bench = new Bench({ time: timeMs, warmupTime: 200 });
  for (const [name, fn] of tasks) bench.add(name, fn);
  await bench.run();
  return bench.tasks.map((task) => {
    const r = task.result as unknown as
      { latency?: { p50: number; min: number; max: number; samplesCount?: number } } | undefined;
    return {
      suite: 'spectra',
      name: task.name,
      medianMs: r?.latency?.p50 ?? null,
      minMs: r?.latency?.min ?? null,
      maxMs: r?.latency?.max ?? null,
      samples: r?.latency?.samplesCount,
    };
  });
}

// The machine is shared and its speed drifts over seconds, so numpy and the headline are timed in adjacent batches
// (pairs), in alternating order, and the ratio is the median of the pairs' ratios: a pair caught by a change of speed
// is an outlier that the median leaves out.
const PAIRS = 101;

export default async function spectraSuite(): Promise<BenchRow[]> {
  const panel8 = numpyPanel();
  const panel16 = panelFor(
    Array.from({ length: 16 }, (_, i) => 470 + 20 * i),
    16,
  );
  const spectral: PanelSpec = {
    ...panel8,
    channels: Array.from({ length: 32 }, (_, i) => ({
      id: `bin${i}`,
      filters: [{ type: 'bandpass' as const, centerNm: 455 + 10 * i, widthNm: 10, edgeWidthNm: 1 }],
    })),
  };
  const paired: [string, () => void][] = [
    [
      'HEADLINE evaluatePanel 8x8 from scratch, leak and water Raman on (8 dots + 8 filters computed, as numpy)',
      () => void evaluatePanel(panel8, { sensitivity: false }),
    ],
  ];
  const [, headline] = paired[0];
  const unpin = pinToBenchCpu();
  const { numpy, note: numpyNote } = await startNumpy(unpin !== null);
  const oursUs: number[] = [];
  const numpyUs: number[] = [];
  for (let i = 0; i < 200; i++) headline();
  if (numpy) {
    for (let pair = 0; pair < PAIRS; pair++) {
      if (pair % 2 === 0) numpyUs.push(await numpy.next());
      oursUs.push(batchMeanMs(headline) * 1000);
      if (pair % 2 === 1) numpyUs.push(await numpy.next());
    }
    numpy.close();
  } else {
    for (let pair = 0; pair < PAIRS; pair++) oursUs.push(batchMeanMs(headline) * 1000);
  }
  unpin?.();
  const ratios = numpyUs.map((us, k) => oursUs[k] / us);
  // tinybench afterwards: it keeps every sample, and that garbage would slow the collections of later batches.
  const [perCall] = await medians(paired, 1000);
  const quartiles = (values: number[]) => {
    const sorted = values.toSorted((a, b) => a - b);
    return [sorted[Math.floor(sorted.length / 4)], sorted[Math.floor((3 * sorted.length) / 4)]];
  };
  const rows: BenchRow[] = [
    {
      suite: 'spectra',
      name: paired[0][0],
      medianMs: median(oursUs) / 1000,
      minMs: Math.min(...oursUs) / 1000,
      maxMs: Math.max(...oursUs) / 1000,
      samples: PAIRS * 200,
      note:
        `${PAIRS} batches of 200 calls, each paired with a numpy batch; median of the batch means. ` +
        `Per-call p50 (tinybench, no GC): ${((perCall.medianMs ?? NaN) * 1000).toFixed(1)} us`,
      extra: {
        ratioToNumpy: ratios.length > 0 ? Number(median(ratios).toFixed(3)) : null,
        ratioQuartiles:
          ratios.length > 0
            ? quartiles(ratios)
                .map((r) => r.toFixed(3))
                .join(' – ')
            : null,
        requirement: '<= 1.0',
      },
    },
    {
      suite: 'spectra',
      name: 'numpy evaluate 8x8 (same run, paired batches)',
      medianMs: numpyUs.length > 0 ? median(numpyUs) / 1000 : null,
      minMs: numpyUs.length > 0 ? Math.min(...numpyUs) / 1000 : null,
      maxMs: numpyUs.length > 0 ? Math.max(...numpyUs) / 1000 : null,
      samples: numpyUs.length * 200,
      note: numpyNote,
    },
  ];
  rows.push(
    ...(await medians(
      [
        ['evaluatePanel 8x8 warm with lot-shift sensitivity', () => void evaluatePanel(panel8)],
        ['evaluatePanel 16x16 warm (no lot shift)', () => void evaluatePanel(panel16, { sensitivity: false })],
        [
          'evaluatePanel 8 probes x 32-bin spectral detector warm',
          () => void evaluatePanel(spectral, { sensitivity: false }),
        ],
        ['resolveDot cdse 605 nm', () => void resolveDot({ material: 'cdse', emissionPeakNm: 605, quantumYield: 0.5 })],
        // Where the headline's time goes: the two parts numpy also does, alone.
        [
          'part of the headline: 8 resolveDot (the 8x8 probes)',
          () => {
            for (const probe of panel8.probes) resolveDot(probe as DotInput);
          },
        ],
        [
          'part of the headline: 8 channelTransmission (the 8x8 bandpasses)',
          () => {
            for (const channel of panel8.channels) channelTransmission(channel, DEFAULT_GRID);
          },
        ],
      ],
      1500,
    )),
  );
  return rows;
}
