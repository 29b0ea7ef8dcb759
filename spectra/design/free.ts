/**
 * Free mode: choose materials, sizes (through the emission peak) and bandpass filters. Three stages:
 *  1. a grid catalog (free-catalog.ts: dots every few nm across each allowed material's reach, bands at a few widths);
 *  2. the exact search on the signal-to-noise objective over it (snr-run.ts), with the signal floor, the interference
 *     ceiling, non-overlapping bands and any locks as constraints;
 *  3. pattern-search refinement on the 1 nm grid (refine.ts), which only accepts improvements.
 * `exact` means stage 2 was exhausted: no design drawn from the stated grid catalog beats the answer (the refinement
 * can only have improved on that optimum); stats.signalToNoiseBound bounds the grid catalog's designs, not the
 * continuous problem. Owned probes and channels join the grid, and channel choices (e.g. an instrument's) replace
 * its bands; a design that uses them is not refined.
 */
import { SpectraError } from '../core/errors';
import type { ChannelSpec, ProbeSpec } from '../core/panel';
import { bandChannel, bandsOverlap, freeCatalog, type Band } from './free-catalog';
import { worstInterference, type DesignAssignment } from './objective';
import { asCandidate, candidateMatrixSteps, rememberingResolver, sampleLight } from './matrix';
import type { ResolvedDesignOptions } from './options';
import { freeInterference, freeProbes, refineFreeDesign, type FreeDesign } from './refine';
import { allowedMaterials, designProbe, targetsOf, type DesignRequest } from './request';
import { chunkNodesFor, type SearchProgress } from './search';
import { blocksItsLines, clearOfLines, NoDesignFound, readablePairs } from './practice';
import { interferenceWords, LEFT_OUT_WORDS, searchStats, type DesignSearchStats } from './catalog-mode';
import { lockIndices } from './locks';
import { snrSearchSteps } from './snr-run';
import type { SnrScore } from './snr';
import { fullEnumerationSize } from './problem';
import { DEFAULT_GRID } from '../core/grid';
import { dotInputOf } from '../signal/panel-model';

/** Outcome of free mode: the design, its objective, and how it was found. */
export interface FreeOutcome {
  /** The design as materials, peaks and bands (null when it uses owned items or channel choices). */
  design: FreeDesign | null;
  /** The design's probes (ids p1…pn for designed ones, with each material's typical shell; owned ones as given). */
  probes: ProbeSpec[];
  /** The design's channels (ids c1…cn for designed bands; owned and chosen ones as given). */
  channels: ChannelSpec[];
  worst: number;
  score: SnrScore;
  exact: boolean;
  stats: DesignSearchStats & {
    /** The worst interference of the grid catalog's best design, before refinement. */
    gridWorst: number;
    /** The grid catalog's best worst S/N found, before refinement. */
    gridSignalToNoise: number;
    candidateProbes: number;
    candidateChannels: number;
    grid: { peakStepNm: number; bandStepNm: number; bandwidthsNm: number[]; windowNm: [number, number] };
    refineMoves: number;
  };
}

/**
 * A first feasible design for large panels, which the branch and bound then improves: n passbands of the narrowest
 * width that read some probe, spread evenly across the window, and for each (bluest first) an unused probe it reads
 * about as brightly as the dimmest band can read any, the most abundant target taking the dimmest pairing. Null when
 * that construction leaves a target without a readable probe.
 */
export function spreadDesign(
  bands: readonly Band[],
  collected: number[][],
  readable: (c: number, p: number) => boolean,
  abundance: readonly number[],
): DesignAssignment | null {
  const n = abundance.length;
  const narrowest = Math.min(...bands.map((b) => b.widthNm));
  const candidates = bands
    .map((b, c) => ({ b, c }))
    .filter(({ b, c }) => b.widthNm === narrowest && collected[c].some((_, p) => readable(c, p)))
    .sort((x, y) => x.b.centerNm - y.b.centerNm);
  // Evenly spaced picks, skipping any that would overlap the previous pick.
  const picked: number[] = [];
  for (let k = 0; k < n; k++) {
    const want = Math.round((k * (candidates.length - 1)) / Math.max(1, n - 1));
    const next = candidates.slice(want).find(({ b }) => {
      const last = picked.length ? bands[picked[picked.length - 1]] : null;
      return !last || !bandsOverlap(last, b);
    });
    if (!next) return null;
    picked.push(next.c);
  }
  // Each band takes the dimmest unused probe it reads at least as brightly as the dimmest band's best can be read,
  // so that the targets' own signals come out even (the signal floor compares them).
  const bestOf = (c: number) => Math.max(...collected[c].map((x, p) => (readable(c, p) ? x : 0)));
  const level = Math.min(...picked.map(bestOf));
  const used = new Set<number>();
  const own = picked.map((c) => {
    let best = -1;
    collected[c].forEach((x, p) => {
      if (used.has(p) || !readable(c, p)) return;
      const better =
        best < 0 ||
        (x >= level && (collected[c][best] < level || x < collected[c][best])) ||
        (x < level && collected[c][best] < level && x > collected[c][best]);
      if (better) best = p;
    });
    if (best >= 0) used.add(best);
    return { c, p: best, light: best >= 0 ? collected[c][best] : 0 };
  });
  if (own.some((x) => x.p < 0)) return null;
  // The most abundant targets take the dimmest pairings, evening out the targets' own signals.
  const byAbundance = abundance.map((a, t) => ({ a, t })).sort((x, y) => y.a - x.a);
  const byLight = [...own].sort((x, y) => x.light - y.light);
  const design: DesignAssignment = { probe: new Array<number>(n), channel: new Array<number>(n) };
  byAbundance.forEach(({ t }, k) => {
    design.probe[t] = byLight[k].p;
    design.channel[t] = byLight[k].c;
  });
  return design;
}

/** Runs free mode as steps (see search.ts for the drivers). */
export function* freeDesignSteps(
  request: Pick<
    DesignRequest,
    | 'targets'
    | 'allowedMaterials'
    | 'exclude'
    | 'excitation'
    | 'owned'
    | 'channelChoices'
    | 'scatterLevel'
    | 'waterRaman'
  >,
  windowNm: [number, number],
  o: ResolvedDesignOptions,
  shouldStop?: () => boolean,
): Generator<SearchProgress, FreeOutcome> {
  const { abundance } = targetsOf(request.targets);
  const n = abundance.length;
  const materials = allowedMaterials(request, windowNm);
  const choices = request.channelChoices;
  if (!choices && n * o.bandwidthRangeNm[0] > windowNm[1] - windowNm[0]) {
    throw new SpectraError(
      'invalid_input',
      `${n} passbands of at least ${o.bandwidthRangeNm[0]} nm do not fit in ${windowNm[0]}–${windowNm[1]} nm`,
      ['windowNm'],
    );
  }
  const catalog = freeCatalog(materials, windowNm, request.excitation, o);
  const resolve = rememberingResolver();
  // Owned probes and channels join the grid; channel choices replace its bands. Each still meets the checks.
  const leftOutProbes = new Map<string, string>();
  const ownedProbes = (request.owned?.probes ?? []).filter((p) => {
    const peak = resolve(dotInputOf(asCandidate(p)), DEFAULT_GRID).emissionPeakNm;
    const clear = clearOfLines(peak, request.excitation, o.lineClearanceNm);
    if (!clear) leftOutProbes.set(p.id, LEFT_OUT_WORDS.clearance(o.lineClearanceNm));
    return clear;
  });
  const leftOutChannels = new Map<string, string>();
  const extraChannels = [...(choices ?? []), ...(request.owned?.channels ?? [])].filter((ch) => {
    const fails = !blocksItsLines(ch, request.excitation, o.minBlockingOD);
    if (fails) leftOutChannels.set(ch.id, LEFT_OUT_WORDS.blocking(o.minBlockingOD));
    return !fails;
  });
  const gridBands = choices ? [] : catalog.bands;
  const probes = [...catalog.probes, ...ownedProbes];
  const channels = [...(choices ? [] : catalog.channels), ...extraChannels];
  if (probes.length < n || channels.length < n) {
    throw new SpectraError(
      'invalid_input',
      `the window holds ${probes.length} dots and ${channels.length} ` +
        `${choices ? 'usable channel choices' : 'passbands on the grid'}; ` +
        `${n} targets need ${n} of each`,
      [choices ? 'channelChoices' : 'windowNm'],
    );
  }
  const locks = lockIndices(
    request.targets,
    { kept: probes.map((p) => p.id), leftOut: leftOutProbes },
    { kept: channels.map((c) => c.id), leftOut: leftOutChannels },
  );
  yield { stage: 'candidates', nodesVisited: 0, incumbent: null, bound: null };
  const collected = yield* candidateMatrixSteps(probes, channels, request.excitation, resolve);
  const dots = probes.map((p) => resolve(dotInputOf(asCandidate(p)), DEFAULT_GRID));
  const pairAllowed = readablePairs(dots, channels, DEFAULT_GRID, o.minChannelShare);
  yield { stage: 'candidates', nodesVisited: 0, incumbent: null, bound: null };
  const bandCount = gridBands.length;
  const problem = {
    collected,
    abundance,
    minSignalFraction: o.minSignalFraction,
    channelConflict: (a: number, b: number) => a < bandCount && b < bandCount && catalog.conflict(a, b),
    pairAllowed,
    sample: sampleLight(channels, request.excitation, request, probes[0]),
    settings: o,
    ceiling: o.maxInterference,
    locks,
  };
  const spread = bandCount > 0 ? spreadDesign(gridBands, collected, pairAllowed, abundance) : null;
  yield { stage: 'candidates', nodesVisited: 0, incumbent: null, bound: null };
  const chunk = chunkNodesFor(n * probes.length * channels.length, 500);
  const run = yield* snrSearchSteps(problem, o.nodeBudget, chunk, spread ? [spread] : [], shouldStop);
  const found = run.result;
  if (!found.design) {
    throw new NoDesignFound(
      `${found.exact ? 'no' : 'within its node budget the search found no'} design of ${n} targets on the grid ` +
        'that meets the signal floor with non-overlapping stock passbands, each containing its probe’s peak, passing ' +
        `its share of the light and blocking the lines, with every interference at or below ` +
        `${interferenceWords(o.maxInterference)}${locks.some(Boolean) ? ' and the locks kept' : ''}; lower ` +
        'options.minSignalFraction or options.minChannelShare, raise options.maxInterference, widen the window, or ' +
        'ask for fewer targets',
      ['options', 'minSignalFraction'],
      found.exact,
    );
  }
  const design = found.design;
  const gridScore = found.score!;
  const byId = new Map(materials.map((m) => [m.id as string, m]));
  const onGrid = design.probe.every((p) => p < catalog.probes.length) && design.channel.every((c) => c < bandCount);
  const stats = {
    ...searchStats(run, fullEnumerationSize(n, probes.length, channels.length)),
    gridWorst: worstInterference(collected, abundance, design).worstInterference,
    gridSignalToNoise: gridScore.worst,
    candidateProbes: probes.length,
    candidateChannels: channels.length,
    grid: { peakStepNm: o.peakStepNm, bandStepNm: o.bandStepNm, bandwidthsNm: [...o.bandwidthsNm], windowNm },
    refineMoves: 0,
  };
  const ownedIds = new Set([
    ...design.probe.filter((p) => p >= catalog.probes.length).map((p) => probes[p].id),
    ...design.channel.filter((c) => c >= bandCount).map((c) => channels[c].id),
  ]);
  const freshId = (prefix: string, t: number) => {
    let id = `${prefix}${t + 1}`;
    while (ownedIds.has(id)) id = `${id}-new`;
    return id;
  };
  if (!onGrid) {
    // Owned items and channel choices are kept as they are: no refinement moves them.
    return {
      design: null,
      probes: design.probe.map((p, t) =>
        p < catalog.probes.length
          ? designProbe(freshId('p', t), byId.get(catalog.probes[p].material!)!, catalog.probes[p].emissionPeakNm!)
          : asCandidate(probes[p]),
      ),
      channels: design.channel.map((c, t) =>
        c < bandCount ? bandChannel(freshId('c', t), gridBands[c], o.edgeWidthNm) : channels[c],
      ),
      worst: stats.gridWorst,
      score: gridScore,
      exact: found.exact,
      stats,
    };
  }
  const start: FreeDesign = {
    materials: design.probe.map((p) => catalog.probes[p].material),
    peaksNm: design.probe.map((p) => catalog.probes[p].emissionPeakNm!),
    bands: design.channel.map((c) => ({ ...gridBands[c] })),
  };
  let outcome = { design: start, score: gridScore, moves: 0 };
  if (o.refine && !shouldStop?.()) {
    const ctx = {
      abundance,
      excitation: request.excitation,
      windowNm,
      materials: byId,
      options: o,
      resolve,
      sample: { scatterLevel: request.scatterLevel, waterRaman: request.waterRaman },
      shouldStop,
    };
    outcome = yield* refineFreeDesign(start, gridScore, ctx);
  }
  const final = outcome.design;
  return {
    design: final,
    probes: freeProbes(final, byId),
    channels: final.bands.map((b, t) => bandChannel(`c${t + 1}`, b, o.edgeWidthNm)),
    worst: freeInterference(final, { abundance, excitation: request.excitation, options: o, resolve, materials: byId }),
    score: outcome.score,
    exact: found.exact,
    stats: { ...stats, refineMoves: outcome.moves },
  };
}
