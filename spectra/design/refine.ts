/**
 * Local refinement of a free-mode design: pattern search by coordinates (each target's emission peak moved by ±4,
 * then ±2, then ±1 nm; its passband moved to the neighbouring stock centre or stock width), keeping a move only when
 * it raises the design's score (its worst signal-to-noise, then less spreading: snr.ts) and keeps every rule: peaks
 * within the material's reach and the window and clear of the lines, stock filter sizes within the width range,
 * bands inside the window, non-overlapping, blocking every line by the required OD, each probe's channel containing
 * its peak and passing its share of its light, the signal floor, the interference ceiling.
 */
import type { Material } from '../dot/materials/types';
import type { ExcitationLine, MaterialId, PanelSpec, ProbeSpec } from '../core/panel';
import { bandChannel, bandPassesLine, bandsOverlap, type Band } from './free-catalog';
import { candidateMatrix, type SampleLight } from './matrix';
import { evaluatePanel } from '../signal/evaluate';
import { betterScore, scoreDesign, type SnrScore } from './snr';
import { worstInterference } from './objective';
import type { ResolvedDesignOptions } from './options';
import type { SearchProgress } from './search';
import { designProbe, designReachNm } from './request';
import { dotInputOf, type DotResolver } from '../signal/panel-model';
import { DEFAULT_GRID } from '../core/grid';
import { isStockBandpass, STOCK_BANDPASS_RULE } from '../light/filters/stock';
import { blocksItsLines, clearOfLines, readablePairs } from './practice';

/** A free-mode design: per target a material, an emission peak and a band. */
export interface FreeDesign {
  materials: MaterialId[];
  peaksNm: number[];
  bands: Band[];
}

/** What the refinement needs to know besides the design. */
export interface RefineContext {
  abundance: number[];
  excitation: ExcitationLine[];
  windowNm: [number, number];
  materials: Map<string, Material>;
  options: ResolvedDesignOptions;
  /** Where the refinement gets its dots (remembered for the run). */
  resolve: DotResolver;
  /** The sample's own light (scatter, water Raman), as the request states it. */
  sample: SampleLight;
  /** Checked after each pass: true ends the refinement with the best design so far. */
  shouldStop?: () => boolean;
}

/** Probe specs of a free design (ids p1…pn). */
export function freeProbes(d: FreeDesign, materials: ReadonlyMap<string, Material>): ProbeSpec[] {
  return d.materials.map((material, t) => designProbe(`p${t + 1}`, materials.get(material)!, d.peaksNm[t]));
}

/** True when the design keeps every free-mode rule except the signal floor (checked with the light). */
export function freeDesignAllowed(d: FreeDesign, ctx: RefineContext): boolean {
  const [lo, hi] = ctx.windowNm;
  const [wMin, wMax] = ctx.options.bandwidthRangeNm;
  return d.bands.every((b, t) => {
    const [r0, r1] = designReachNm(ctx.materials.get(d.materials[t])!);
    const peak = d.peaksNm[t];
    if (peak < Math.max(Math.ceil(r0), lo) || peak > Math.min(Math.floor(r1), hi)) return false;
    if (b.widthNm < wMin || b.widthNm > wMax || b.centerNm - b.widthNm / 2 < lo || b.centerNm + b.widthNm / 2 > hi)
      return false;
    if (bandPassesLine(b, ctx.excitation, ctx.options.edgeWidthNm)) return false;
    if (!isStockBandpass(b.centerNm, b.widthNm) || !clearOfLines(peak, ctx.excitation, ctx.options.lineClearanceNm))
      return false;
    if (!blocksItsLines(bandChannel('c', b, ctx.options.edgeWidthNm), ctx.excitation, ctx.options.minBlockingOD))
      return false;
    return d.bands.every((other, u) => u === t || !bandsOverlap(b, other));
  });
}

/** The design as a panel: probe t carries target t's abundance and reads channel t (as the proposal will). */
function designPanel(d: FreeDesign, ctx: RefineContext): PanelSpec {
  const channels = d.bands.map((b, t) => bandChannel(`c${t + 1}`, b, ctx.options.edgeWidthNm));
  return {
    version: 1,
    excitation: ctx.excitation,
    probes: freeProbes(d, ctx.materials).map((p, t) => ({
      ...p,
      abundance: ctx.abundance[t],
      channel: channels[t].id,
    })),
    channels,
    ...(ctx.sample.scatterLevel !== undefined ? { scatterLevel: ctx.sample.scatterLevel } : {}),
    ...(ctx.sample.waterRaman !== undefined ? { waterRaman: { ...ctx.sample.waterRaman } } : {}),
  };
}

/** Worst interference of a free design (probe t read in band t). */
export function freeInterference(d: FreeDesign, ctx: Omit<RefineContext, 'windowNm' | 'sample'>): number {
  const channels = d.bands.map((b, t) => bandChannel(`c${t + 1}`, b, ctx.options.edgeWidthNm));
  const m = candidateMatrix(freeProbes(d, ctx.materials), channels, ctx.excitation, ctx.resolve);
  const identity = ctx.abundance.map((_, t) => t);
  return worstInterference(m, ctx.abundance, { probe: identity, channel: identity }).worstInterference;
}

/**
 * The signal-to-noise score of a free design (snr.ts, from its own evaluation), or null when it breaks a rule, the
 * signal floor or the interference ceiling.
 */
export function freeScore(d: FreeDesign, ctx: RefineContext): SnrScore | null {
  if (!freeDesignAllowed(d, ctx)) return null;
  const panel = designPanel(d, ctx);
  const dots = panel.probes.map((p) => ctx.resolve(dotInputOf(p), DEFAULT_GRID));
  const readable = readablePairs(dots, panel.channels, DEFAULT_GRID, ctx.options.minChannelShare);
  if (!dots.every((_, t) => readable(t, t))) return null;
  const e = evaluatePanel(panel, { sensitivity: false });
  const n = ctx.abundance.length;
  const own = e.collected.map((row, t) => row[t]);
  if (!own.every((s) => s > 0) || Math.min(...own) < ctx.options.minSignalFraction * Math.max(...own)) return null;
  const ones = ctx.abundance.map(() => 1);
  const identity = ctx.abundance.map((_, t) => t);
  if (
    worstInterference(e.collected, ones, { probe: identity, channel: identity }).worstInterference >
    ctx.options.maxInterference
  )
    return null;
  const light = new Float64Array(n * n);
  e.collected.forEach((row, c) => row.forEach((x, p) => (light[c * n + p] = x / ctx.abundance[p])));
  const sample = e.lineLeak.map((row, c) => (e.backgroundCollected?.[c] ?? 0) + row.reduce((a, x) => a + x, 0));
  const problem = { probes: n, channels: n, light, sample, abundance: ctx.abundance, settings: ctx.options };
  return scoreDesign(problem, identity, identity);
}

/** Most designs the refinement evaluates: bounds its cost (each evaluation resolves n dots and n filters). */
export const REFINE_EVALUATIONS = 4000;

/**
 * Pattern search from `start` (whose score is `startScore`); yields progress after each pass and returns the refined
 * design and its score.
 */
export function* refineFreeDesign(
  start: FreeDesign,
  startScore: SnrScore,
  ctx: RefineContext,
): Generator<SearchProgress, { design: FreeDesign; score: SnrScore; moves: number }> {
  let design = {
    materials: [...start.materials],
    peaksNm: [...start.peaksNm],
    bands: start.bands.map((b) => ({ ...b })),
  };
  let best = startScore;
  let moves = 0;
  let evaluations = 0;
  for (const step of [4, 2, 1]) {
    for (let improved = true; improved && evaluations < REFINE_EVALUATIONS && !ctx.shouldStop?.();) {
      improved = false;
      for (let t = 0; t < design.peaksNm.length; t++) {
        // Bands move by stock steps: the next stock centre, the next stock width.
        const centreStep = STOCK_BANDPASS_RULE.centerStepNm;
        for (const [field, delta] of [
          ['peak', step],
          ['peak', -step],
          ['center', centreStep],
          ['center', -centreStep],
          ['width', 1],
          ['width', -1],
        ] as const) {
          const next = {
            materials: design.materials,
            peaksNm: [...design.peaksNm],
            bands: design.bands.map((b) => ({ ...b })),
          };
          if (field === 'peak') next.peaksNm[t] += delta;
          else if (field === 'center') next.bands[t].centerNm += delta;
          else {
            const widths: readonly number[] = STOCK_BANDPASS_RULE.widthsNm;
            const k = widths.indexOf(next.bands[t].widthNm) + delta;
            if (k < 0 || k >= widths.length) continue;
            next.bands[t].widthNm = widths[k];
          }
          evaluations++;
          const score = freeScore(next, ctx);
          if (score && score.worst > 0 && betterScore(score, best)) {
            design = next;
            best = score;
            moves++;
            improved = true;
          }
        }
      }
      yield {
        stage: 'refine',
        nodesVisited: evaluations,
        incumbent: best.worst,
        bound: null,
        measure: 'signalToNoise',
      };
    }
  }
  return { design, score: best, moves };
}
