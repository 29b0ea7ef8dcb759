/**
 * What a design request will cost, estimated from its sizes before any spectrum is computed or any working array is
 * allocated: the candidate probes and channels (given in catalog mode; in free mode counted from the grid steps, the
 * window and the allowed materials' reach), the wavelength grid, the work of the candidate matrix and of one search
 * node, and the bytes of the search's working arrays. A caller that must bound one request (the API) refuses or
 * shortens the search from these figures; the page runs any size.
 */
import { DEFAULT_GRID } from '../core/grid';
import { LIMITS } from '../core/limits';
import { peaksFor } from './free-catalog';
import { resolveOptions, type ResolvedDesignOptions } from './options';
import { allowedMaterials, normalizeWindow, type DesignRequest } from './request';
import { POLISH_EVALUATIONS, REPAIR_EVALUATIONS } from './snr-run';

/**
 * Share of the node budget each trial of the search for the largest usable subset of targets gets (design.ts); our
 * convention, a quarter.
 */
export const SUBSET_BUDGET_SHARE = 0.25;

/** Bytes of one stored number in the working arrays (Float64Array, and JS number arrays: 8 each). */
const NUMBER_BYTES = 8;

/** Bytes of one index (Int32Array). */
const INDEX_BYTES = 4;

/**
 * Bytes per (target, candidate pair) of every node frame of the two searches: the interference table of stage 1
 * (catalog.ts / frame.ts, one Float64 per target, probe and channel in each of n + 1 frames) and the domains of
 * stage 2 (snr-search.ts, one Int32 per target and pair in each of n + 1 frames). Read from those files.
 */
const FRAME_BYTES_PER_PAIR = NUMBER_BYTES + INDEX_BYTES;

/** The sizes and work of one design request. */
export interface DesignCost {
  mode: 'catalog' | 'free';
  targets: number;
  /** Candidate probes (free mode: an upper bound, before the line-clearance check). */
  candidateProbes: number;
  /** Candidate channels (free mode: an upper bound, before the line and stock-width checks). */
  candidateChannels: number;
  /** Points of the wavelength grid every spectrum is computed on. */
  gridPoints: number;
  /** Work units of the candidate matrix: one per (probe, channel, grid point). */
  matrixUnits: number;
  /**
   * Work units that do not depend on the node budget, over every run: the candidate matrix and the repair and polish
   * of each search (one unit per n × n entry of each design they score, n³ for the polish's inverse), times the runs.
   * Free mode's refinement is not counted: it is bounded by REFINE_EVALUATIONS and stops when its caller says so.
   */
  fixedUnits: number;
  /** Work units of one search node at worst: one per (target, probe, channel) it may scan. */
  unitsPerNode: number;
  /**
   * Node budgets' worth of search the whole request may run: 1 for the search, plus a quarter for each trial of the
   * search for the largest usable subset of targets (design.ts: a bisection over the count).
   */
  searchRuns: number;
  /** Nodes the request asks for (its nodeBudget or the mode's default). */
  nodesAsked: number;
  /** Bytes of the working arrays: spectra on the grid, the candidate matrix and the search frames. */
  workingBytes: number;
}

/** Peaks on free mode's grid across the allowed materials: arithmetic only, no dot is resolved. */
function gridProbeCount(request: DesignRequest, windowNm: [number, number], o: ResolvedDesignOptions): number {
  return allowedMaterials(request, windowNm).reduce((sum, m) => sum + peaksFor(m, windowNm, o.peakStepNm).length, 0);
}

/** Passbands on free mode's grid at every width, before the line and stock checks drop any (an upper bound). */
function gridBandCount(windowNm: [number, number], o: ResolvedDesignOptions): number {
  let count = 0;
  for (const widthNm of o.bandwidthsNm) {
    const first = Math.ceil((windowNm[0] + widthNm / 2) / o.bandStepNm) * o.bandStepNm;
    const last = windowNm[1] - widthNm / 2;
    if (last >= first) count += Math.floor((last - first) / o.bandStepNm) + 1;
  }
  return count;
}

/** The candidate probes and channels a request's search will scan. */
function candidateCounts(request: DesignRequest, o: ResolvedDesignOptions): { probes: number; channels: number } {
  const ownedProbes = request.owned?.probes?.length ?? 0;
  const ownedChannels = request.owned?.channels?.length ?? 0;
  if (request.candidates) {
    return {
      probes: request.candidates.probes.length + ownedProbes,
      channels: request.candidates.channels.length + ownedChannels,
    };
  }
  const windowNm = normalizeWindow(request.windowNm);
  const bands = request.channelChoices ? request.channelChoices.length : gridBandCount(windowNm, o);
  return { probes: gridProbeCount(request, windowNm, o) + ownedProbes, channels: bands + ownedChannels };
}

/**
 * Estimates a design request's work and memory from its sizes alone (pure; no spectrum, matrix or search array is
 * made). Throws the request's own SpectraError when its window or materials leave nothing to design with, as the
 * design itself would.
 * @example estimateDesignCost({ targets: [{ name: 'a', abundance: 'high' }], excitation: [{ wavelengthNm: 405 }] })
 */
export function estimateDesignCost(request: DesignRequest): DesignCost {
  const free = request.candidates === undefined;
  const n = request.targets.length;
  const o = resolveOptions(request.options, free, n);
  const { probes, channels } = candidateCounts(request, o);
  const pairs = probes * channels;
  const gridPoints = DEFAULT_GRID.count;
  const spectraBytes = (probes + channels) * gridPoints * NUMBER_BYTES;
  const trials = n > 1 ? Math.ceil(Math.log2(n)) : 0;
  const matrixUnits = pairs * gridPoints;
  const searchFixed = POLISH_EVALUATIONS * n ** 3 + REPAIR_EVALUATIONS * n ** 2;
  // The candidate matrix, its flat copy for the search, and the search's own-light table (one per target and pair).
  const matrixBytes = pairs * NUMBER_BYTES * (2 + n);
  const frameBytes = (n + 1) * n * pairs * FRAME_BYTES_PER_PAIR;
  return {
    mode: free ? 'free' : 'catalog',
    targets: n,
    candidateProbes: probes,
    candidateChannels: channels,
    gridPoints,
    matrixUnits,
    fixedUnits: (matrixUnits + searchFixed) * (1 + trials),
    unitsPerNode: Math.max(1, n * pairs),
    searchRuns: 1 + trials * SUBSET_BUDGET_SHARE,
    nodesAsked: o.nodeBudget,
    workingBytes: spectraBytes + matrixBytes + frameBytes,
  };
}

/** Why a request is refused under a work plan, or null when it may run. */
export type DesignRefusal = { reason: 'memory' | 'work'; message: string } | null;

/** How much of a request one bounded run may do. */
export interface DesignWorkPlan {
  /** Nodes the search may visit: the request's budget, shortened to the work limit. */
  nodeBudget: number;
  /** Nodes the request asked for. */
  nodesAsked: number;
  /** True when the work limit shortened the request's node budget. */
  shortened: boolean;
  /** Work units the run is planned to take at most. */
  plannedUnits: number;
  refusal: DesignRefusal;
}

/** Fewest search nodes worth starting: below it the search cannot place every target a few times (our convention). */
export const MIN_BOUNDED_NODES = 64;

/** The words that tell a refused client how to get under the limit. */
export const GET_UNDER_HINT =
  'use a coarser candidate step (peakStepNm and bandStepNm of 5 nm or more), fewer targets or candidates, or run ' +
  'the search in the page, which has no such limit';

/**
 * Plans a bounded run: refuses a request whose working arrays pass `limits.designBytes` or whose fixed work leaves too
 * little for `MIN_BOUNDED_NODES` search nodes within `limits.designWorkUnits`; otherwise shortens its node budget to
 * what the work limit allows.
 */
export function planBoundedDesign(
  cost: DesignCost,
  limits: { designWorkUnits: number; designBytes: number } = LIMITS,
): DesignWorkPlan {
  const mib = (bytes: number) => `${Math.ceil(bytes / 2 ** 20).toLocaleString('en-US')} MiB`;
  const sizes =
    `${cost.targets} targets over ${cost.candidateProbes} candidate probes × ${cost.candidateChannels} ` + 'channels';
  if (cost.workingBytes > limits.designBytes) {
    const message =
      `the design needs about ${mib(cost.workingBytes)} of working memory for ${sizes}; the API's limit is ` +
      `${mib(limits.designBytes)}: ${GET_UNDER_HINT}`;
    return {
      nodeBudget: 0,
      nodesAsked: cost.nodesAsked,
      shortened: true,
      plannedUnits: 0,
      refusal: { reason: 'memory', message },
    };
  }
  const searchUnits = Math.max(0, limits.designWorkUnits - cost.fixedUnits);
  const affordable = Math.floor(searchUnits / (cost.unitsPerNode * cost.searchRuns));
  const nodeBudget = Math.min(cost.nodesAsked, affordable);
  if (nodeBudget < Math.min(cost.nodesAsked, MIN_BOUNDED_NODES)) {
    const message =
      `the design of ${sizes} is larger than one API request may compute (about 2 s of processor time): ` +
      GET_UNDER_HINT;
    return {
      nodeBudget: 0,
      nodesAsked: cost.nodesAsked,
      shortened: true,
      plannedUnits: 0,
      refusal: { reason: 'work', message },
    };
  }
  return {
    nodeBudget,
    nodesAsked: cost.nodesAsked,
    shortened: nodeBudget < cost.nodesAsked,
    plannedUnits: cost.fixedUnits + nodeBudget * cost.unitsPerNode * cost.searchRuns,
    refusal: null,
  };
}
