// The exact catalog search (searchCatalog) against a general-purpose MILP solver, HiGHS (npm `highs`, Huangfu & Hall,
// Math. Prog. Comp. 2018), on the same min–max interference problem formulated independently in interference-milp.ts.
import { beforeAll, describe, expect, it } from 'vitest';
import { createRandom, searchCatalog } from '../../../spectra/index';
import { assignmentWorst, loadHighs, solveInterferenceMilp, type MilpInstance } from './interference-milp';

let highs: Awaited<ReturnType<typeof loadHighs>>;
beforeAll(async () => {
  highs = await loadHighs();
});

/**
 * A seeded random instance with a diagonal-ish structure: probes and channels sit at jittered positions along one
 * axis; a probe's light in a channel falls off as a Gaussian of their distance, times the probe's brightness, plus a
 * floor of 0.1–5 % of its brightness (a finite blocking), and about one off-diagonal entry in eight is exactly 0 (a
 * channel that collects none of that probe: the MILP leaves such values out and the search must not read a target
 * there). Abundances from {1, 0.5, 0.3, 0.1}.
 */
function randomInstance(seed: number, targets: number, probes: number, channels: number): MilpInstance {
  const rng = createRandom(seed);
  const probeAt = Array.from({ length: probes }, (_, p) => (p + 0.5 + 0.6 * (rng.uniform() - 0.5)) / probes);
  const channelAt = Array.from({ length: channels }, (_, c) => (c + 0.5 + 0.6 * (rng.uniform() - 0.5)) / channels);
  const brightness = Array.from({ length: probes }, () => 0.3 + 2.7 * rng.uniform());
  const width = 0.6 / Math.max(probes, channels);
  const collected = channelAt.map((x) =>
    probeAt.map((y, p) => {
      const near = Math.exp(-(((x - y) / width) ** 2));
      if (near < 0.5 && rng.uniform() < 0.125) return 0;
      return brightness[p] * (near + 0.001 + 0.049 * rng.uniform());
    }),
  );
  const abundance = Array.from({ length: targets }, () => [1, 0.5, 0.3, 0.1][Math.floor(rng.uniform() * 4)]);
  return { collected, abundance };
}

const instances = Array.from({ length: 10 }, (_, k) => ({
  seed: 7100 + k,
  targets: 3 + (k % 2),
  probes: 4 + (k % 3),
  channels: 4 + ((k >> 1) % 3),
}));

describe('searchCatalog against a MILP solved by HiGHS', () => {
  it('the MILP on two targets, two probes, two channels picks the assignment worked by hand', () => {
    // collected (channels × probes) = [[1, 0.1], [0.2, 1]], abundances 1 and 0.5. Probe 0 read in channel 0 and
    // probe 1 in channel 1: I(0→1) = 1·0.2 / (0.5·1) = 0.4, I(1→0) = 0.5·0.1 / (1·1) = 0.05, worst 0.4.
    // Swapping the targets' probes (and channels): I(1→0) = 0.5·0.2 / (1·1) = 0.1, I(0→1) = 1·0.1 / (0.5·1) = 0.2,
    // worst 0.2. Reading probes off-diagonal gives own signals 0.1 or 0.2 against foreign 1: far worse. Optimum 0.2.
    const instance = {
      collected: [
        [1, 0.1],
        [0.2, 1],
      ],
      abundance: [1, 0.5],
    };
    const answer = solveInterferenceMilp(highs, instance);
    expect(answer.status).toBe('Optimal');
    expect(answer.objectiveValue).toBeCloseTo(0.2, 9);
    expect(answer.design).toEqual({ probe: [1, 0], channel: [1, 0] });
  });

  it.each(instances)(
    'searchCatalog (seed $seed, $targets targets of $probes probes × $channels channels) is exact and equals the ' +
      'MILP optimum to 1e-6',
    ({ seed, targets, probes, channels }) => {
      const instance = randomInstance(seed, targets, probes, channels);
      const answer = solveInterferenceMilp(highs, instance);
      expect(answer.status).toBe('Optimal');
      // The MILP's own figure agrees with its assignment's exact worst interference (the model is sound).
      const milpWorst = assignmentWorst(instance, answer.design!);
      expect(Math.abs(answer.objectiveValue - milpWorst)).toBeLessThanOrEqual(1e-6 * milpWorst);
      const result = searchCatalog(instance);
      expect(result.exact).toBe(true);
      const worst = result.objective!.worstInterference;
      expect(Math.abs(worst - milpWorst)).toBeLessThanOrEqual(1e-6 * milpWorst);
      // The search reads no target where its channel collects none of its probe.
      result.design!.probe.forEach((p, t) =>
        expect(instance.collected[result.design!.channel[t]][p]).toBeGreaterThan(0),
      );
    },
    // A solve takes up to about a second alone; the machine's two cores are shared with other work.
    30_000,
  );
});
