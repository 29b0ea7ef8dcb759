// The design pipeline through the public entry: catalog and free mode, the proposal's evaluation, the rules of
// free mode. Scenarios are fictional (imagined markers, no real lab or product).
import { describe, expect, it } from 'vitest';
import {
  EXCLUSIONS,
  createRandom,
  evaluatePanel,
  listMaterials,
  resolveDot,
  runDesign,
  runDesignAsync,
  type DesignRequest,
  type SearchProgress,
} from '../../../spectra/index';

const line405 = [{ wavelengthNm: 405 }];
const getMaterial = (id: string) => listMaterials().find((m) => m.id === id)!;

/**
 * Free mode's grid catalog as its documentation states it, written here independently of the library: dots every
 * `peakStepNm` inside each material's reach and the window; bandpasses (2 nm edges) centred every `bandStepNm` at each
 * width, inside the window and clear of each line by half the width plus the edge.
 */
function gridCatalog(windowNm: [number, number], stepNm: number, widthsNm: number[], lineNm: number) {
  const [lo, hi] = windowNm;
  const probes = listMaterials()
    .filter((m) => m.id !== 'custom' && m.emissionRangeNm)
    .flatMap((m) => {
      const from = Math.max(Math.ceil(m.emissionRangeNm![0]), lo);
      const to = Math.min(Math.floor(m.emissionRangeNm![1]), hi);
      const peaks: number[] = [];
      for (let nm = Math.ceil(from / stepNm) * stepNm; nm <= to; nm += stepNm) peaks.push(nm);
      return peaks.map((nm) => ({ id: `${m.id}-${nm}`, material: m.id, emissionPeakNm: nm }));
    });
  const bands = widthsNm.flatMap((widthNm) => {
    const out: { centerNm: number; widthNm: number }[] = [];
    for (let c = Math.ceil((lo + widthNm / 2) / stepNm) * stepNm; c + widthNm / 2 <= hi; c += stepNm)
      if (Math.abs(lineNm - c) > widthNm / 2 + 2) out.push({ centerNm: c, widthNm });
    return out;
  });
  const channels = bands.map((b, k) => ({
    id: `b${k}`,
    filters: [{ type: 'bandpass' as const, centerNm: b.centerNm, widthNm: b.widthNm, edgeWidthNm: 2 }],
  }));
  return { probes, bands, channels };
}

/** Two passbands overlap when their FWHM intervals do (written here, independently of the library). */
const overlap = (a: { centerNm: number; widthNm: number }, b: { centerNm: number; widthNm: number }) =>
  Math.abs(a.centerNm - b.centerNm) < (a.widthNm + b.widthNm) / 2;

describe('runDesign', () => {
  it('runDesign (catalog) gives the rare target the brighter of two same-colour dots, as the objective rewards', () => {
    const dot = (id: string, nm: number, qy: number) => ({
      id,
      material: 'cdse' as const,
      emissionPeakNm: nm,
      quantumYield: qy,
    });
    const result = runDesign({
      targets: [
        { name: 'common', abundance: 'high' },
        { name: 'rare', abundance: 'low' },
      ],
      excitation: line405,
      candidates: {
        // Peaks close enough that line tails, not the filters' blocking floor, set the crosstalk.
        probes: [
          dot('dim-560', 560, 0.2),
          dot('bright-560', 560, 0.8),
          dot('dim-600', 600, 0.2),
          dot('bright-600', 600, 0.8),
        ],
        channels: [560, 600].map((nm) => ({
          id: `bp${nm}`,
          filters: [{ type: 'bandpass' as const, centerNm: nm, widthNm: 20 }],
        })),
      },
    });
    expect(result.warnings.join(' ')).toMatch(
      /contains cadmium.*local regulations, institutional safety rules and licensed practice/,
    );
    const byTarget = Object.fromEntries(result.panel!.probes.map((p) => [p.target, p]));
    expect(byTarget.rare.quantumYield).toBe(0.8);
    expect(byTarget.common.quantumYield).toBe(0.2);
    expect(result.exact).toBe(true);
  });

  it('runDesign (free) reports the interference and S/N its proposal evaluates to, no worse than the grid', () => {
    const result = runDesign({
      targets: [
        { name: 'A', abundance: 1 },
        { name: 'B', abundance: 'low' },
        { name: 'C', abundance: 'medium' },
      ],
      excitation: line405,
      windowNm: [480, 720],
    });
    const evaluation = evaluatePanel(result.panel!);
    expect(evaluation.worst.interference).toBeCloseTo(result.objective!.worstInterference, 14);
    const snr = result.noise!.signalToNoise.map((x) => x!);
    expect(result.objective!.worstSignalToNoise).toBe(Math.min(...snr));
    expect(result.objective!.weakestTarget).toBe(['A', 'B', 'C'][snr.indexOf(Math.min(...snr))]);
    // The refinement only accepts moves that raise the score.
    const grid = 'gridSignalToNoise' in result.stats! ? result.stats.gridSignalToNoise : NaN;
    expect(result.objective!.worstSignalToNoise).toBeGreaterThanOrEqual(grid * (1 - 1e-9));
    expect(result.panel!.probes.every((p) => p.channel !== undefined && p.abundance !== undefined)).toBe(true);
  });

  const freeCases: [string, Partial<DesignRequest>][] = [
    ['cadmium-free', { exclude: ['cadmium'] }],
    ['lead- and arsenic-free, 450–700 nm', { exclude: ['lead', 'arsenic'], windowNm: [450, 700] }],
    ['InP and carbon only', { allowedMaterials: ['inp', 'carbon'], windowNm: [500, 760] }],
  ];
  it.each(freeCases)('runDesign (free, %s) keeps every free-mode rule', (_name, extra) => {
    const request: DesignRequest = {
      targets: [
        { name: 'A', abundance: 'high' },
        { name: 'B', abundance: 'low' },
        { name: 'C', abundance: 'medium' },
        { name: 'D', abundance: 0.5 },
      ],
      excitation: line405,
      options: { nodeBudget: 1500 },
      ...extra,
    };
    const result = runDesign(request);
    const [lo, hi] = request.windowNm ?? [400, 800];
    const excluded = new Set<string>((request.exclude ?? []).map((w) => EXCLUSIONS[w]));
    for (const probe of result.panel!.probes) {
      const material = getMaterial(probe.material);
      if (request.allowedMaterials) expect(request.allowedMaterials).toContain(probe.material);
      expect(material.elements.some((e) => excluded.has(e))).toBe(false);
      const dot = resolveDot(probe);
      if (material.diameterRangeNm) {
        expect(dot.diameterNm!).toBeGreaterThanOrEqual(material.diameterRangeNm[0]);
        expect(dot.diameterNm!).toBeLessThanOrEqual(material.diameterRangeNm[1]);
      }
      expect(probe.emissionPeakNm!).toBeGreaterThanOrEqual(lo);
      expect(probe.emissionPeakNm!).toBeLessThanOrEqual(hi);
    }
    const bands = result.panel!.channels.map((c) => c.filters[0] as { centerNm: number; widthNm: number });
    bands.forEach((b, i) => {
      expect(b.centerNm - b.widthNm / 2).toBeGreaterThanOrEqual(lo);
      expect(b.centerNm + b.widthNm / 2).toBeLessThanOrEqual(hi);
      expect(b.widthNm).toBeGreaterThanOrEqual(20);
      expect(b.widthNm).toBeLessThanOrEqual(60);
      expect(Math.abs(b.centerNm - 405)).toBeGreaterThan(b.widthNm / 2 + 2);
      bands.slice(i + 1).forEach((other) => expect(overlap(b, other)).toBe(false));
    });
  });

  it.each([1, 2, 3])(
    'runDesign (free) is no worse than catalog mode on a catalog drawn from its own grid (draw %s)',
    (draw) => {
      const base: DesignRequest = {
        targets: [
          { name: 'A', abundance: 'high' },
          { name: 'B', abundance: 'low' },
          { name: 'C', abundance: 'medium' },
        ],
        excitation: line405,
        windowNm: [480, 700],
        options: { peakStepNm: 20, bandStepNm: 20, bandwidthsNm: [20, 40], nodeBudget: 200_000 },
      };
      const grid = gridCatalog(base.windowNm!, 20, [20, 40], 405);
      const rng = createRandom(draw);
      const pick = <T>(list: T[], k: number) => [...list].sort(() => rng.uniform() - 0.5).slice(0, k);
      // Six dots, and passbands added one by one while they overlap none already drawn (free mode's own rule).
      const probes = pick(grid.probes, 6);
      const bandIdx: number[] = [];
      for (const i of pick(
        grid.bands.map((_, k) => k),
        grid.bands.length,
      ))
        if (bandIdx.every((j) => !overlap(grid.bands[i], grid.bands[j]))) bandIdx.push(i);
      const channels = bandIdx.slice(0, 6).map((i) => grid.channels[i]);
      const catalog = runDesign({
        ...base,
        windowNm: undefined,
        candidates: { probes, channels },
        options: { minSignalFraction: 0.05 },
      });
      const free = runDesign(base);
      expect(free.exact).toBe(true);
      expect(catalog.exact).toBe(true);
      // Free mode's grid holds every catalog candidate, and both maximise the weakest target's S/N.
      expect(free.objective!.worstSignalToNoise).toBeGreaterThanOrEqual(
        catalog.objective!.worstSignalToNoise * (1 - 1e-9),
      );
    },
  );

  it('runDesignAsync reports the candidate and search stages and returns what runDesign returns', async () => {
    const request: DesignRequest = {
      targets: [
        { name: 'A', abundance: 1 },
        { name: 'B', abundance: 0.2 },
      ],
      excitation: line405,
      windowNm: [500, 680],
      options: { refine: false },
    };
    const seen: SearchProgress['stage'][] = [];
    const pause = () => new Promise<void>((resolve) => setTimeout(resolve, 0));
    const result = await runDesignAsync(request, { onProgress: (p) => seen.push(p.stage), pause });
    expect(seen[0]).toBe('candidates');
    expect(seen).toContain('done');
    expect(result.objective!.worstInterference).toBe(runDesign(request).objective!.worstInterference);
  });
});
