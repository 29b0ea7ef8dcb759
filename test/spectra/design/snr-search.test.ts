// The search on the signal-to-noise objective against a plain enumeration of every assignment on small synthetic
// problems (the reference: try them all), and its score against the noise module the evaluate route uses.
import { describe, expect, it } from 'vitest';
import { predictUnmixingNoise } from '../../../spectra/index';
import { SnrSearch, type IndexLock } from '../../../spectra/design/snr-search';
import { betterScore, scoreDesign, type SnrScore, type SnrSettings } from '../../../spectra/design/snr';

/** A small deterministic generator (a linear congruential one) so that every instance is reproducible. */
function lcg(seed: number) {
  let s = seed;
  return () => (s = (s * 1103515245 + 12345) % 2147483648) / 2147483648;
}

interface Instance {
  collected: number[][];
  abundance: number[];
  sample: number[];
  settings: SnrSettings;
}

function instance(seed: number): Instance {
  const r = lcg(seed);
  const K = 5;
  const P = 5;
  // A dominant diagonal (each probe brightest in "its" channel) with random spill, as real candidates look.
  const collected = Array.from({ length: K }, (_, c) =>
    Array.from({ length: P }, (_, p) => (c === p ? 1 + r() : r() * r() * 0.6)),
  );
  return {
    collected,
    abundance: [1, 0.3, 0.1],
    sample: Array.from({ length: K }, () => r() * 0.05),
    settings: {
      photons: seed % 2 ? 1000 : [800, 1200, 3000],
      backgroundPhotons: 5,
      readNoiseElectrons: 2,
      excessNoiseFactor: 1.2,
    },
  };
}

const CEILING = 0.8;
const FLOOR = 0.05;

/** The best score over every assignment of the 3 targets that keeps the ceiling, the floor and the locks. */
function enumerate(x: Instance, locks: (IndexLock | undefined)[] = []): SnrScore | null {
  const K = x.collected.length;
  const P = x.collected[0].length;
  const light = new Float64Array(K * P);
  x.collected.forEach((row, c) => row.forEach((v, p) => (light[c * P + p] = v)));
  const problem = { probes: P, channels: K, light, sample: x.sample, abundance: x.abundance, settings: x.settings };
  let best: SnrScore | null = null;
  const a = x.abundance;
  for (let code = 0; code < (P * K) ** 3; code++) {
    const v = [code % (P * K), Math.floor(code / (P * K)) % (P * K), Math.floor(code / (P * K) ** 2)];
    const pr = v.map((w) => Math.floor(w / K));
    const ch = v.map((w) => w % K);
    if (new Set(pr).size < 3 || new Set(ch).size < 3) continue;
    if (locks.some((l, t) => l && ((l.probe ?? -1) >= 0 ? pr[t] !== l.probe : false))) continue;
    if (locks.some((l, t) => l && ((l.channel ?? -1) >= 0 ? ch[t] !== l.channel : false))) continue;
    const own = pr.map((p, t) => a[t] * x.collected[ch[t]][p]);
    let keeps = Math.min(...own) >= FLOOR * Math.max(...own);
    for (let t = 0; t < 3; t++)
      for (let u = 0; u < 3; u++) if (t !== u && a[t] * x.collected[ch[u]][pr[t]] > CEILING * own[u]) keeps = false;
    if (!keeps) continue;
    const score = scoreDesign(problem, pr, ch);
    if (score.worst > 0 && betterScore(score, best)) best = score;
  }
  return best;
}

function search(x: Instance, locks?: (IndexLock | undefined)[]) {
  const s = new SnrSearch({ ...x, ceiling: CEILING, minSignalFraction: FLOOR, locks });
  const bounds: number[] = [];
  while (!s.advance(1)) bounds.push(s.upperBound());
  return { result: s.result(), bounds };
}

describe('SnrSearch', () => {
  it.each(Array.from({ length: 24 }, (_, i) => i + 1))(
    'on instance %s (3 targets of 5 probes × 5 channels) finds the enumeration optimum, and each bound holds it',
    (seed) => {
      const x = instance(seed);
      const best = enumerate(x);
      const { result, bounds } = search(x);
      if (best === null) {
        expect(result.design).toBeNull();
        return;
      }
      expect(result.exact).toBe(true);
      expect(result.score!.worst).toBeCloseTo(best.worst, 9);
      expect(result.stats.gap).toBe(0);
      for (const b of bounds) expect(b).toBeGreaterThanOrEqual(best.worst * (1 - 1e-12));
    },
  );

  it.each([3, 8, 13])(
    'on instance %s with target 1 locked to probe 4 and target 3 to channel 0, finds the locked optimum',
    (seed) => {
      const x = instance(seed);
      const locks = [{ probe: 4 }, undefined, { channel: 0 }];
      const best = enumerate(x, locks);
      const { result } = search(x, locks);
      if (best === null) {
        expect(result.design).toBeNull();
        return;
      }
      expect(result.design!.probe[0]).toBe(4);
      expect(result.design!.channel[2]).toBe(0);
      expect(result.score!.worst).toBeCloseTo(best.worst, 9);
    },
  );

  it('polish after a one-node search keeps every rule and never lowers the score', () => {
    const x = instance(5);
    const s = new SnrSearch({ ...x, ceiling: CEILING, minSignalFraction: FLOOR });
    s.advance(3);
    const before = s.result().score;
    s.polish(10_000);
    const after = s.result();
    if (!before) return expect(after.score).toBeNull();
    expect(after.score!.worst).toBeGreaterThanOrEqual(before.worst);
    expect(after.score!.worst).toBeLessThanOrEqual(enumerate(x)!.worst * (1 + 1e-12));
  });
});

describe('scoreDesign', () => {
  it('equals predictUnmixingNoise on the same photons (shared scale, background, read and excess noise)', () => {
    const x = instance(7);
    const P = 5;
    const light = new Float64Array(25);
    x.collected.forEach((row, c) => row.forEach((v, p) => (light[c * P + p] = v)));
    const settings = { photons: 1000, backgroundPhotons: 5, readNoiseElectrons: 2, excessNoiseFactor: 1.2 };
    const probe = [2, 0, 4];
    const channel = [1, 3, 4];
    const score = scoreDesign(
      { probes: P, channels: 5, light, sample: x.sample, abundance: x.abundance, settings },
      probe,
      channel,
    );
    // The same design written out for the noise module: one scale k, brightest own signal = 1000 photons.
    const own = probe.map((p, t) => x.abundance[t] * x.collected[channel[t]][p]);
    const k = 1000 / Math.max(...own);
    const mixing = channel.map((c) => probe.map((p) => k * x.collected[c][p]));
    const noise = predictUnmixingNoise({
      mixingPhotons: mixing,
      abundance: x.abundance,
      backgroundPhotons: channel.map((c) => 5 + k * x.sample[c]),
      readNoiseElectrons: 2,
      excessNoiseFactor: 1.2,
      primaryChannel: [0, 1, 2],
    });
    const snr = noise.signalToNoise.map((s) => s!);
    snr.forEach((s, t) => expect(score.signalToNoise[t]).toBeCloseTo(s, 9));
    const spreading = noise.spreading.reduce(
      (sum, row, i) => sum + row.reduce<number>((a, v, j) => (i === j ? a : a + v!), 0),
      0,
    );
    expect(score.spreading).toBeCloseTo(spreading, 9);
  });
});
