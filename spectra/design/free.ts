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
import { freeCatalog } from './free-catalog';
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
  const search = new CatalogSearch({
    collected,
    abundance,
    minSignalFraction: o.minSignalFraction,
    channelConflict: catalog.conflict,
    pairAllowed: readablePairs(dots, catalog.channels, DEFAULT_GRID, o.minChannelShare),
  });
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
