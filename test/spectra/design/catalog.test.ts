import { describe, expect, it } from 'vitest';
import { searchCatalog, type SearchProgress } from '../../../spectra/index';
import { syntheticAbundances, syntheticCatalog } from './synthetic';

/**
 * Plain enumeration of every one-to-one (probe, channel) assignment, written here independently of the library:
 * the objective is max over t ≠ u of a_t·C[c_u][p_t] / (a_u·C[c_u][p_u]), as the design issue defines it.
 */
function enumerateOptimum(
  C: number[][],
  a: number[],
  floor = 0,
  conflict: (x: number, y: number) => boolean = () => false,
  readable: (c: number, p: number) => boolean = () => true,
): number {
  const n = a.length;
  const probes: number[] = new Array(n);
  const channels: number[] = new Array(n);
  const probeUsed = new Array(C[0].length).fill(false);
  const channelUsed = new Array(C.length).fill(false);
  let best = Infinity;
  const score = () => {
    const own = a.map((at, u) => at * C[channels[u]][probes[u]]);
    let lo = Infinity;
    let hi = 0;
    for (const s of own) {
      lo = Math.min(lo, s);
      hi = Math.max(hi, s);
    }
    if (lo < floor * hi) return Infinity;
    for (let u = 0; u < n; u++) if (!readable(channels[u], probes[u])) return Infinity;
    for (let x = 0; x < n; x++) for (let y = x + 1; y < n; y++) if (conflict(channels[x], channels[y])) return Infinity;
    let worst = 0;
    for (let u = 0; u < n; u++)
      for (let t = 0; t < n; t++) if (t !== u) worst = Math.max(worst, (a[t] * C[channels[u]][probes[t]]) / own[u]);
    return worst;
  };
  const visit = (t: number) => {
    if (t === n) {
      best = Math.min(best, score());
      return;
    }
    for (let p = 0; p < C[0].length; p++) {
      if (probeUsed[p]) continue;
      probeUsed[p] = true;
      probes[t] = p;
      for (let c = 0; c < C.length; c++) {
        if (channelUsed[c]) continue;
        channelUsed[c] = true;
        channels[t] = c;
        visit(t + 1);
        channelUsed[c] = false;
      }
      probeUsed[p] = false;
    }
  };
  visit(0);
  return best;
}

const instances = Array.from({ length: 40 }, (_, k) => ({
  seed: 100 + k,
  targets: 3 + (k % 2),
  probes: 6 + (k % 3),
  channels: 6 + ((k >> 1) % 3),
}));

describe('catalog branch and bound', () => {
  it.each(instances)(
    'searchCatalog(seed $seed, $targets of $probes × $channels) equals the plain enumeration',
    ({ seed, targets, probes, channels }) => {
      const { collected } = syntheticCatalog(seed, probes, channels);
      const abundance = syntheticAbundances(seed + 1, targets);
      const result = searchCatalog({ collected, abundance });
      const optimum = enumerateOptimum(collected, abundance);
      expect(result.exact).toBe(true);
      expect(result.objective!.worstInterference).toBeCloseTo(optimum, 12);
      expect(result.stats.bound).toBeCloseTo(optimum, 12);
      expect(result.stats.nodesVisited).toBeLessThan(result.stats.fullEnumeration);
    },
  );

  it.each(instances.slice(0, 16))(
    'searchCatalog(seed $seed) with a 20 % signal floor and overlapping-band conflicts equals the enumeration',
    ({ seed, targets, probes, channels }) => {
      const { collected, bands } = syntheticCatalog(seed, probes, channels);
      const abundance = syntheticAbundances(seed + 1, targets);
      const overlap = (x: number, y: number) =>
        Math.abs(bands[x].centerNm - bands[y].centerNm) < (bands[x].widthNm + bands[y].widthNm) / 2;
      const result = searchCatalog({ collected, abundance, minSignalFraction: 0.2, channelConflict: overlap });
      const optimum = enumerateOptimum(collected, abundance, 0.2, overlap);
      if (optimum === Infinity) expect(result.design).toBeNull();
      else {
        expect(result.objective!.worstInterference).toBeCloseTo(optimum, 12);
        const { channel } = result.design!;
        for (let x = 0; x < channel.length; x++)
          for (let y = x + 1; y < channel.length; y++) expect(overlap(channel[x], channel[y])).toBe(false);
      }
    },
  );

  it.each(instances.slice(0, 16))(
    'searchCatalog(seed $seed) reading probes only in allowed channels equals the enumeration under the same rule',
    ({ seed, targets, probes, channels }) => {
      const { collected } = syntheticCatalog(seed, probes, channels);
      const abundance = syntheticAbundances(seed + 1, targets);
      // A probe may be read only where it is among the two brightest probes of the channel (a stand-in rule).
      const readable = (c: number, p: number) => collected[c].filter((x) => x > collected[c][p]).length < 2;
      const result = searchCatalog({ collected, abundance, pairAllowed: readable });
      const optimum = enumerateOptimum(collected, abundance, 0, () => false, readable);
      if (optimum === Infinity) expect(result.design).toBeNull();
      else {
        expect(result.objective!.worstInterference).toBeCloseTo(optimum, 12);
        result.design!.channel.forEach((c, t) => expect(readable(c, result.design!.probe[t])).toBe(true));
      }
    },
  );

  it('searchCatalog gives the rare target the brighter probe when two probes differ only in brightness', () => {
    // Two probes with the same spectral shape far apart in wavelength, one 5× brighter, two clean channels.
    const shapeA = [1, 0.02];
    const shapeB = [0.02, 1];
    const collected = [0, 1].map((c) => [shapeA[c], 5 * shapeA[c], shapeB[c], 5 * shapeB[c]]);
    // Target 0 common, target 1 rare; only probes 0 (dim A) and 3 (bright B) or 1 (bright A) and 2 (dim B) make sense.
    const result = searchCatalog({ collected, abundance: [1, 0.05] });
    const bright = (p: number) => p === 1 || p === 3;
    expect(bright(result.design!.probe[1])).toBe(true);
    expect(bright(result.design!.probe[0])).toBe(false);
  });

  it(
    'searchCatalog under a tiny node budget returns exact false, a design no better than the optimum and a bound no ' +
      'higher',
    () => {
      const { collected } = syntheticCatalog(7, 12, 12);
      const abundance = [1, 0.3, 0.1, 1, 0.5, 0.1];
      const full = searchCatalog({ collected, abundance }, { nodeBudget: 1e7 });
      const cut = searchCatalog({ collected, abundance }, { nodeBudget: 20 });
      expect(full.exact).toBe(true);
      expect(cut.exact).toBe(false);
      expect(cut.stats.nodesVisited).toBeLessThanOrEqual(20);
      expect(cut.objective!.worstInterference).toBeGreaterThanOrEqual(full.objective!.worstInterference - 1e-15);
      expect(cut.stats.bound!).toBeLessThanOrEqual(full.objective!.worstInterference + 1e-15);
    },
  );

  it('searchCatalog reports progress between chunks, stops when asked with exact false, and otherwise finishes', () => {
    const { collected } = syntheticCatalog(11, 12, 12);
    const abundance = [1, 0.3, 0.1, 1, 0.5, 0.1];
    const seen: SearchProgress[] = [];
    const stopped = searchCatalog(
      { collected, abundance },
      { chunkNodes: 5, onProgress: (p) => seen.push(p), shouldStop: () => seen.length >= 3 },
    );
    expect(seen).toHaveLength(3);
    expect(seen[2].nodesVisited).toBeGreaterThan(seen[0].nodesVisited);
    expect(stopped.exact).toBe(false);
    const all = searchCatalog({ collected, abundance }, { chunkNodes: 500, nodeBudget: Number.POSITIVE_INFINITY });
    expect(all.exact).toBe(true);
    expect(all.objective!.worstInterference).toBeLessThanOrEqual(stopped.objective!.worstInterference);
  });

  it('searchCatalog with fewer probe candidates than targets throws invalid_input naming candidates.probes', () => {
    expect(() =>
      searchCatalog({
        collected: [
          [1, 1],
          [1, 1],
          [1, 1],
        ],
        abundance: [1, 1, 1],
      }),
    ).toThrow(expect.objectContaining({ code: 'invalid_input', path: ['candidates', 'probes'] }));
  });
});
