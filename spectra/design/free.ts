/**
 * Free mode: choose materials, sizes (through the emission peak) and bandpass filters. Three stages:
 *  1. a grid catalog (free-catalog.ts: dots every few nm across each allowed material's reach, bands at a few widths);
 *  2. the exact catalog branch and bound on it, with the signal floor and non-overlapping bands as constraints;
 *  3. pattern-search refinement on the 1 nm grid (refine.ts), which only accepts improvements.
 * `exact` means stage 2 was exhausted: no design drawn from the stated grid catalog beats the answer (the refinement
 * can only have improved on that optimum). The continuous problem has no proven bound.
 */
import { SpectraError } from '../core/errors';
import type { ExcitationLine, ProbeSpec } from '../core/panel';
import { CatalogSearch } from './catalog';
import { bandsOverlap, freeCatalog, type Band } from './free-catalog';
import type { DesignAssignment } from './objective';
import { candidateMatrix, rememberingResolver } from './matrix';
import type { ResolvedDesignOptions } from './options';
import { freeProbes, refineFreeDesign, type FreeDesign } from './refine';
import { allowedMaterials, type DesignRequest } from './request';
import { searchSteps, type SearchProgress } from './search';
import { NoDesignFound, readablePairs } from './practice';
import { DEFAULT_GRID } from '../core/grid';
import { dotInputOf } from '../signal/panel-model';

/** Outcome of free mode: the design, its objective, and how it was found. */
export interface FreeOutcome {
  design: FreeDesign;
  /** The design's probes (ids p1…pn), with each material's typical shell. */
  probes: ProbeSpec[];
  worst: number;
  exact: boolean;
  stats: {
    nodesVisited: number;
    fullEnumeration: number;
    /** Lower bound on the best design drawn from the grid catalog (null: none proven). */
    bound: number | null;
    greedyWorst: number | null;
    /** The grid catalog's best design found, before refinement. */
    gridWorst: number;
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
  abundance: number[],
  request: Pick<DesignRequest, 'allowedMaterials' | 'exclude'> & { excitation: ExcitationLine[] },
  windowNm: [number, number],
  o: ResolvedDesignOptions,
  shouldStop?: () => boolean,
): Generator<SearchProgress, FreeOutcome> {
  const n = abundance.length;
  const materials = allowedMaterials(request, windowNm);
  if (n * o.bandwidthRangeNm[0] > windowNm[1] - windowNm[0]) {
    throw new SpectraError(
      'invalid_input',
      `${n} passbands of at least ${o.bandwidthRangeNm[0]} nm do not fit in ${windowNm[0]}–${windowNm[1]} nm`,
      ['windowNm'],
    );
  }
  const catalog = freeCatalog(materials, windowNm, request.excitation, o);
  if (catalog.probes.length < n || catalog.channels.length < n) {
    throw new SpectraError(
      'invalid_input',
      `the window holds ${catalog.probes.length} dots and ${catalog.channels.length} passbands on the grid; ${n} ` +
        `targets need ${n} of each`,
      ['windowNm'],
    );
  }
  yield { stage: 'candidates', nodesVisited: 0, incumbent: null, bound: null };
  const resolve = rememberingResolver();
  const collected = candidateMatrix(catalog.probes, catalog.channels, request.excitation, resolve);
  const dots = catalog.probes.map((p) => resolve(dotInputOf(p), DEFAULT_GRID));
  const pairAllowed = readablePairs(dots, catalog.channels, DEFAULT_GRID, o.minChannelShare);
  const search = new CatalogSearch(
    {
      collected,
      abundance,
      minSignalFraction: o.minSignalFraction,
      channelConflict: catalog.conflict,
      pairAllowed,
    },
    spreadDesign(catalog.bands, collected, pairAllowed, abundance) ?? undefined,
  );
  const found = yield* searchSteps(search, o.nodeBudget, 500, shouldStop);
  if (!found.design) {
    throw new NoDesignFound(
      `${found.exact ? 'no' : 'within its node budget the search found no'} design of ${n} targets on the grid ` +
        'that meets the signal floor with non-overlapping stock passbands, each containing its probe’s peak, passing ' +
        'its share of the light and blocking the lines; lower options.minSignalFraction or options.minChannelShare, ' +
        'widen the window, or ask for fewer targets',
      ['options', 'minSignalFraction'],
      found.exact,
    );
  }
  const start: FreeDesign = {
    materials: found.design.probe.map((p) => catalog.probes[p].material),
    peaksNm: found.design.probe.map((p) => catalog.probes[p].emissionPeakNm!),
    bands: found.design.channel.map((c) => ({ ...catalog.bands[c] })),
  };
  const gridWorst = found.objective!.worstInterference;
  let outcome = { design: start, worst: gridWorst, moves: 0 };
  const byId = new Map(materials.map((m) => [m.id as string, m]));
  if (o.refine && !shouldStop?.()) {
    const ctx = {
      abundance,
      excitation: request.excitation,
      windowNm,
      materials: byId,
      options: o,
      resolve,
    };
    outcome = yield* refineFreeDesign(start, ctx);
  }
  return {
    design: outcome.design,
    probes: freeProbes(outcome.design, byId),
    worst: outcome.worst,
    exact: found.exact,
    stats: {
      nodesVisited: found.stats.nodesVisited,
      fullEnumeration: found.stats.fullEnumeration,
      bound: found.stats.bound,
      greedyWorst: found.stats.greedyWorst,
      gridWorst,
      candidateProbes: catalog.probes.length,
      candidateChannels: catalog.channels.length,
      grid: { peakStepNm: o.peakStepNm, bandStepNm: o.bandStepNm, bandwidthsNm: [...o.bandwidthsNm], windowNm },
      refineMoves: outcome.moves,
    },
  };
}
