/**
 * Drivers for the catalog branch and bound: a synchronous one under a node budget (the API route: the Workers
 * runtime's clock does not advance during synchronous work, so only a node count can bound it) and an
 * asynchronous one that yields to the event loop between chunks (a browser Web Worker: progress and cancel).
 */
import { CatalogSearch, type CatalogResult } from './catalog';
import type { CatalogProblem } from './problem';
import type { DesignAssignment } from './objective';
import { LIMITS } from '../core/limits';

/** What a running search reports between chunks. */
export interface SearchProgress {
  stage: 'candidates' | 'search' | 'refine' | 'done';
  nodesVisited: number;
  /**
   * The best design so far (null: none yet): its worst interference while `measure` is 'interference' (the seed
   * search and the refinement of an interference objective), its worst signal-to-noise when 'signalToNoise'.
   */
  incumbent: number | null;
  /** Proven bound on the optimum so far (null: none yet): lower for interference, upper for signal-to-noise. */
  bound: number | null;
  /** What incumbent and bound measure (absent: interference). */
  measure?: 'interference' | 'signalToNoise';
}

/** Budget, progress and stop hooks shared by the drivers. */
export interface SearchOptions {
  /** Most nodes to visit before returning the best found (exact: false). Default DEFAULT_NODE_BUDGET. */
  nodeBudget?: number;
  /** Nodes per chunk between progress reports and stop checks (default 2,000). */
  chunkNodes?: number;
  onProgress?: (progress: SearchProgress) => void;
  /** Checked between chunks; true stops the search with the best found so far. */
  shouldStop?: () => boolean;
  /** A complete design to start from (the search then only looks for better ones). */
  initial?: DesignAssignment;
}

/**
 * Default node budget of one search. Chosen so that a catalog request of 8 targets from 16 × 16 candidates stays
 * within the CPU limit assumed for the route (docs/architecture.md, "The design engine").
 */
export const DEFAULT_NODE_BUDGET = 200_000;

function progressOf(search: CatalogSearch, stage: SearchProgress['stage']): SearchProgress {
  const bound = search.lowerBound();
  return {
    stage,
    nodesVisited: search.nodesVisited,
    incumbent: Number.isFinite(search.incumbentWorst) ? search.incumbentWorst : null,
    bound: Number.isFinite(bound) ? bound : null,
  };
}

/**
 * The search loop as a generator: runs `search` in chunks, yielding progress after each, until it is exhausted,
 * the node budget is spent or `shouldStop` says so; returns the outcome. Callers decide how to wait between chunks.
 */
export function* searchSteps(
  search: CatalogSearch,
  budget: number,
  chunk: number,
  shouldStop?: () => boolean,
): Generator<SearchProgress, CatalogResult> {
  while (!search.done && search.nodesVisited < budget) {
    search.advance(Math.min(chunk, budget - search.nodesVisited));
    yield progressOf(search, search.done ? 'done' : 'search');
    if (shouldStop?.()) break;
  }
  return search.result();
}

/** Runs a step generator to its end, passing each progress report on. */
export function runSteps<T>(steps: Generator<SearchProgress, T>, onProgress?: (p: SearchProgress) => void): T {
  for (;;) {
    const next = steps.next();
    if (next.done) return next.value;
    onProgress?.(next.value);
  }
}

/**
 * As runSteps, but awaits `pause` after each report: the caller's way to yield to its event loop (in a browser, a
 * zero-delay timer) so that messages such as a stop request can arrive between chunks.
 */
export async function runStepsAsync<T>(
  steps: Generator<SearchProgress, T>,
  pause: () => Promise<void>,
  onProgress?: (p: SearchProgress) => void,
): Promise<T> {
  for (;;) {
    const next = steps.next();
    if (next.done) return next.value;
    onProgress?.(next.value);
    await pause();
  }
}

/**
 * Exact catalog design (branch and bound) within a node budget; `exact` is true when the search space was exhausted.
 * @example searchCatalog({ collected, abundance: [1, 0.1, 0.3] }).objective?.worstInterference
 */
export function searchCatalog(problem: CatalogProblem, options: SearchOptions = {}): CatalogResult {
  const search = new CatalogSearch(problem, options.initial);
  const steps = searchSteps(
    search,
    options.nodeBudget ?? DEFAULT_NODE_BUDGET,
    options.chunkNodes ?? 2000,
    options.shouldStop,
  );
  return runSteps(steps, options.onProgress);
}

/**
 * Nodes per search chunk so that one chunk stays near `chunkUnits` work units (between progress reports, stop checks
 * and the caller's pauses), never more than `most`.
 */
export function chunkNodesFor(unitsPerNode: number, most: number, chunkUnits = LIMITS.designChunkUnits): number {
  return Math.max(1, Math.min(most, Math.floor(chunkUnits / Math.max(1, unitsPerNode))));
}
