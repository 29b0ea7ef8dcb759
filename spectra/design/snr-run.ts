/**
 * The search of both design modes on the signal-to-noise objective, in two stages over one candidate problem:
 *  1. the exact min–max interference search (catalog.ts) with a quarter of the node budget, whose design, when it
 *     keeps the interference ceiling and the locks, is the first incumbent (a good start prunes far more);
 *     A first design that breaks the ceiling is repaired by single moves when it can be;
 *  2. the branch and bound on the S/N objective (snr-search.ts) with the rest of the budget, and, when that stops
 *     unproven, local moves and swaps from its best design.
 * `exact` is stage 2's: no design of the candidates has a better worst S/N.
 */
import { CatalogSearch, type CatalogResult } from './catalog';
import type { DesignAssignment } from './objective';
import { chunkNodesFor, searchSteps, type SearchProgress } from './search';
import { SnrSearch, type SnrSearchProblem, type SnrSearchResult } from './snr-search';

/** Both stages' outcomes. */
export interface SnrRun {
  result: SnrSearchResult;
  /** The interference stage (null when locks skip it). */
  seed: CatalogResult | null;
}

/**
 * Most designs the local improvement after an unproven search may score (each costs about one n × n inverse; our
 * choice, a fraction of a second for 16 targets).
 */
export const POLISH_EVALUATIONS = 20_000;

/** Most designs a repair of a first design may try (each costs about n² pair checks; our choice). */
export const REPAIR_EVALUATIONS = 50_000;

/**
 * Work units of one design checked by the polish, per target pair: measured (Node 20, 12 targets on a 5 nm free grid,
 * about 14 µs a check against about 1.5 ns a search unit) at about 60; our rounding up.
 */
const POLISH_CHECK_UNITS = 64;

/** Share of the node budget the interference stage may use. */
export const SEED_SHARE = 0.25;

/** Runs both stages as steps within `nodeBudget` nodes in all; `starts` are extra first designs (e.g. spread ones). */
export function* snrSearchSteps(
  problem: SnrSearchProblem,
  nodeBudget: number,
  chunk: number,
  starts: readonly DesignAssignment[],
  shouldStop?: () => boolean,
): Generator<SearchProgress, SnrRun> {
  const locked = (problem.locks ?? []).some((l) => (l?.probe ?? -1) >= 0 || (l?.channel ?? -1) >= 0);
  let seed: CatalogResult | null = null;
  const firsts = [...starts];
  if (!locked) {
    const stage1 = new CatalogSearch(problem, starts[0]);
    const budget = Math.max(1, Math.floor(nodeBudget * SEED_SHARE));
    seed = yield* searchSteps(stage1, budget, chunk, shouldStop);
    if (seed.design) firsts.unshift(seed.design);
  }
  const search = new SnrSearch(problem, firsts);
  // A first design above the ceiling is repaired into a first incumbent when single moves can bring it under.
  if (search.incumbentWorst === null) {
    for (const start of firsts) if (search.repair(start, REPAIR_EVALUATIONS)) break;
  }
  const budget = Math.max(1, nodeBudget - (seed?.stats.nodesVisited ?? 0));
  const progress = (stage: SearchProgress['stage']): SearchProgress => ({
    stage,
    nodesVisited: search.nodesVisited + (seed?.stats.nodesVisited ?? 0),
    incumbent: search.incumbentWorst,
    bound: search.incumbentWorst === null ? null : search.upperBound(),
    measure: 'signalToNoise',
  });
  while (!search.done && search.nodesVisited < budget && !shouldStop?.()) {
    search.advance(Math.min(chunk, budget - search.nodesVisited));
    yield progress(search.done ? 'done' : 'search');
  }
  if (!search.done && !shouldStop?.()) {
    const n = problem.abundance.length;
    // The polish moves no bound: its reports between steps keep the last one (computing it is not free).
    const last = progress('search');
    for (const _ of search.polishSteps(POLISH_EVALUATIONS, chunkNodesFor(POLISH_CHECK_UNITS * n * n, Infinity))) {
      yield { ...last, incumbent: search.incumbentWorst };
      if (shouldStop?.()) break;
    }
    yield progress('search');
  }
  return { result: search.result(), seed };
}
