/**
 * The controls report (spectra's controlsReport, what POST /api/v1/controls/spillover and the page's controls section
 * compute): the demo panel's 6 probes × 6 channels with 3 replicates, with and without the comparison against the
 * model (which builds the panel's model and its ±5 nm lot-shift columns); 16 probes × 16 channels with the comparison;
 * and the API's largest request without a panel, 16 probes × 8 replicates × 64 channels. Tinybench medians per call.
 */
import { Bench } from 'tinybench';
import type { BenchRow } from '../types';
import {
  controlsReport,
  createRandom,
  evaluatePanel,
  type ControlsMeasurement,
  type PanelSpec,
} from '../../spectra/index';
import { demoPanel } from '../../web/state/demo-panel';

/** Controls made from a panel's model: each column scaled to 1000 over an unstained 100, 2 % noise per replicate. */
function modelControls(panel: PanelSpec, replicates: number): ControlsMeasurement {
  const { collected } = evaluatePanel(panel, { sensitivity: false });
  const rng = createRandom(7);
  return {
    channels: panel.channels.map((c) => c.id),
    unstained: panel.channels.map(() => 100),
    controls: panel.probes.flatMap((probe, p) => {
      const column = collected.map((row) => row[p]);
      const scale = 1000 / Math.max(...column);
      return Array.from({ length: replicates }, () => ({
        probe: probe.id,
        values: column.map((v) => 100 + v * scale * (1 + 0.02 * rng.normal()) + 1e-3),
      }));
    }),
  };
}

/** 16 CdSe/CdTe probes 500–725 nm and a 20 nm bandpass on each, one 405 nm line. */
function panel16(): PanelSpec {
  const peaks = Array.from({ length: 16 }, (_, i) => 500 + i * 15);
  return {
    version: 1,
    excitation: [{ wavelengthNm: 405 }],
    probes: peaks.map((nm, i) => ({ id: `p${i}`, material: nm <= 650 ? 'cdse' : 'cdte', emissionPeakNm: nm })),
    channels: peaks.map((nm, i) => ({ id: `c${i}`, filters: [{ type: 'bandpass', centerNm: nm, widthNm: 12 }] })),
  };
}

/** The API's largest body without a panel: 64 channels, 16 probes × 8 replicates, diagonal-dominant invented data. */
function largest(): ControlsMeasurement {
  const rng = createRandom(11);
  const channels = Array.from({ length: 64 }, (_, c) => `c${c}`);
  return {
    channels,
    unstained: channels.map(() => 100),
    controls: Array.from({ length: 128 }, (_, k) => {
      const p = k >> 3;
      return {
        probe: `p${p}`,
        values: channels.map((_, c) => 100 + 1000 * Math.exp(-(((c - 4 * p) / 3) ** 2)) + 5 + rng.normal()),
      };
    }),
  };
}

export default async function controlsSuite(): Promise<BenchRow[]> {
  const demo = demoPanel();
  const demoControls = modelControls(demo, 3);
  const big = panel16();
  const bigControls = modelControls(big, 3);
  const limit = largest();
  const bench = new Bench({ time: 2000, warmupTime: 200 });
  bench.add('controlsReport demo 6x6, 3 replicates, no panel', () => controlsReport(demoControls));
  bench.add('controlsReport demo 6x6, 3 replicates, with comparison', () => controlsReport(demoControls, demo));
  bench.add('controlsReport 16x16, 3 replicates, with comparison', () => controlsReport(bigControls, big));
  bench.add('controlsReport 64 channels x 16 probes x 8 replicates, no panel', () => controlsReport(limit));
  await bench.run();
  return bench.tasks.map((task) => {
    const r = task.result as unknown as
      { latency?: { p50: number; min: number; max: number; samplesCount?: number } } | undefined;
    return {
      suite: 'controls',
      name: task.name,
      medianMs: r?.latency?.p50 ?? null,
      minMs: r?.latency?.min ?? null,
      maxMs: r?.latency?.max ?? null,
      samples: r?.latency?.samplesCount,
    };
  });
}
