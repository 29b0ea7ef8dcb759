/**
 * The whole design pipeline behind POST /api/v1/panels/design and the page's search worker: check the request, run
 * catalog mode (candidates given) or free mode, turn the answer into a panel whose probes carry their `channel` and
 * `abundance` (so evaluatePanel reproduces the objective), evaluate it, and predict its unmixing noise.
 */
import { proposalReference } from './measured-candidates';
import type { ChannelSpec, PanelSpec, ProbeSpec } from '../core/panel';
import { evaluatePanel, type PanelEvaluation } from '../signal/evaluate';
import type { NoisePrediction } from '../signal/noise';
import { catalogDesignSteps, type CatalogOutcome } from './catalog-mode';
import { freeDesignSteps, type FreeOutcome } from './free';
import { designNoise } from './design-noise';
import { worstInterference } from './objective';
import { resolveOptions } from './options';
import { SUBSET_BUDGET_SHARE } from './cost';
import { defaultLeftOut, normalizeWindow, targetsOf, type DesignRequest } from './request';
import { exclusionsOf } from '../dot/materials/exclusions';
import { getMaterial } from '../dot/materials/catalog';
import { runSteps, runStepsAsync, type SearchProgress } from './search';
import { SpectraError } from '../core/errors';
import { NoDesignFound, verdictOf, type DesignVerdict } from './practice';

/**
 * The design objective as the API reports it. The search maximises worstSignalToNoise (the weakest target's predicted
 * signal-to-noise after unmixing, on one photon scale) with every interference at most interferenceCeiling, ties
 * broken by the smaller totalSpreading; `statement` says so in words with the figures. The worst interference and
 * its pair (probe ids, target names) are reported beside it.
 */
export interface DesignObjectiveReport {
  worstInterference: number;
  from: string | null;
  into: string | null;
  fromTarget: string | null;
  intoTarget: string | null;
  worstSignalToNoise: number;
  weakestTarget: string;
  totalSpreading: number;
  interferenceCeiling: number;
  statement: string;
}

/**
 * What the design route returns. `stats` holds the search figures of the mode that ran. When the search finds no
 * design that meets the constraints, the verdict is no_usable_panel and panel, evaluation, objective, stats and
 * noise are null (`exact` then says whether that is proven).
 */
export interface DesignResult {
  mode: 'catalog' | 'free';
  panel: PanelSpec | null;
  evaluation: PanelEvaluation | null;
  objective: DesignObjectiveReport | null;
  exact: boolean;
  stats: CatalogOutcome['stats'] | FreeOutcome['stats'] | null;
  noise: (NoisePrediction & { photons: number[] }) | null;
  /**
   * `usable` when every target's signal-to-noise after unmixing reaches options.minSignalToNoise and the worst
   * interference stays within options.maxInterference; else `no_usable_panel`.
   */
  verdict: DesignVerdict['verdict'];
  /** Why the proposal is not usable (the binding figure), or '' when it is. */
  verdictReason: string;
  /**
   * With no_usable_panel: the most targets (the most abundant first) for which a usable panel was found under the
   * same constraints, 0 when none; null when the proposal is usable or the search for it was not run.
   */
  largestUsableTargets: number | null;
  warnings: string[];
}

/** The objective in words, with the figures of the proposal. */
export function objectiveStatement(
  worstSignalToNoise: number,
  weakestTarget: string,
  totalSpreading: number,
  worstInterference: number,
  ceiling: number,
): string {
  const pct = (x: number) => `${Number((x * 100).toPrecision(3))} %`;
  return (
    `maximise the weakest target's predicted signal-to-noise after unmixing (one photon scale for every probe), ` +
    `keeping every interference at or below ${pct(ceiling)}, ties broken by the smaller total spillover spreading: ` +
    `here ${worstSignalToNoise.toPrecision(3)} for '${weakestTarget}', worst interference ` +
    `${pct(worstInterference)}, total spreading ${totalSpreading.toPrecision(3)}`
  );
}

/** Hooks of a running design: progress reports and a stop check (between search chunks). */
export interface DesignHooks {
  onProgress?: (progress: SearchProgress) => void;
  shouldStop?: () => boolean;
}

/** The pipeline as steps; see runDesign / runDesignAsync. */
export function* designSteps(
  request: DesignRequest,
  shouldStop?: () => boolean,
  lookForFewer = true,
): Generator<SearchProgress, DesignResult> {
  const { names, abundance } = targetsOf(request.targets);
  const free = request.candidates === undefined;
  const o = resolveOptions(request.options, free, request.targets.length);
  if (!free && request.channelChoices) {
    throw new SpectraError(
      'invalid_input',
      'channel choices are for free mode; in catalog mode list the channels among the candidates',
      ['channelChoices'],
    );
  }
  let probes: ProbeSpec[];
  let channels: ChannelSpec[];
  let worst: number;
  let exact: boolean;
  let stats: NonNullable<DesignResult['stats']>;
  let measuredProbes = new Set<string>();
  const referenceWarnings: string[] = [];
  if (free && request.measuredReference)
    referenceWarnings.push(
      'the measured reference columns are not used: free mode designs new probes and channels, which the controls ' +
        'were not measured in; choose among the panel’s own probes and channels to use them',
    );
  try {
    if (free) {
      const windowNm = normalizeWindow(request.windowNm);
      const out = yield* freeDesignSteps(request, windowNm, o, shouldStop);
      ({ probes, channels, worst, exact } = out);
      stats = { ...out.stats };
    } else {
      const out = yield* catalogDesignSteps(request, o, shouldStop);
      ({ probes, channels, worst, exact } = out);
      stats = { ...out.stats };
      measuredProbes = new Set(out.measuredProbes);
      referenceWarnings.push(...out.referenceWarnings);
    }
  } catch (err) {
    if (!(err instanceof NoDesignFound)) throw err;
    return {
      mode: free ? 'free' : 'catalog',
      panel: null,
      evaluation: null,
      objective: null,
      exact: err.exhausted,
      stats: null,
      noise: null,
      verdict: 'no_usable_panel',
      verdictReason: err.message,
      largestUsableTargets: lookForFewer ? yield* largestUsable(request, shouldStop) : null,
      warnings: [...referenceWarnings, ...(free ? defaultLeftOut(request) : [])],
    };
  }
  const panel: PanelSpec = {
    version: 1,
    title: free ? 'Proposed panel (free design)' : 'Proposed panel (from candidates)',
    excitation: request.excitation,
    probes: probes.map((p, t) => ({
      ...p,
      label: names[t],
      target: names[t],
      abundance: abundance[t],
      channel: channels[t].id,
    })),
    channels,
    // The sample's own light, so that the proposal's evaluation and noise include it.
    ...(request.scatterLevel !== undefined ? { scatterLevel: request.scatterLevel } : {}),
    ...(request.waterRaman !== undefined ? { waterRaman: { ...request.waterRaman } } : {}),
    // The request's exclusions travel with the proposal, so its evaluation and the page keep them.
    ...(request.exclude?.length ? { exclude: [...new Set(request.exclude)] } : {}),
  };
  // The measured columns the search used travel with the proposal, so its evaluation uses them too.
  const measuredReference = proposalReference(request.measuredReference, measuredProbes, panel);
  if (measuredReference) panel.measuredReference = measuredReference;
  // A pause point before the proposal's full evaluation (its lot-to-lot check included), the last long stretch.
  yield { stage: 'done', nodesVisited: stats.nodesVisited, incumbent: null, bound: null };
  const evaluation = evaluatePanel(panel);
  // The pair that sets the objective, read from the evaluation (abundances are inside its collected matrix).
  const identity = names.map((_, t) => t);
  const pair = worstInterference(
    evaluation.collected,
    names.map(() => 1),
    { probe: identity, channel: identity },
  );
  const objective = {
    worstInterference: worst,
    from: pair.from >= 0 ? panel.probes[pair.from].id : null,
    into: pair.into >= 0 ? panel.probes[pair.into].id : null,
    fromTarget: pair.from >= 0 ? names[pair.from] : null,
    intoTarget: pair.into >= 0 ? names[pair.into] : null,
  } as DesignObjectiveReport;
  const noise = designNoise(evaluation, abundance, o);
  const snr = noise.signalToNoise.map((x) => x ?? 0);
  const weakest = snr.indexOf(Math.min(...snr));
  const spreading = noise.spreading.reduce(
    (sum, row, i) => sum + row.reduce<number>((s2, x, j) => (i === j || x === null ? s2 : s2 + x), 0),
    0,
  );
  Object.assign(objective, {
    worstSignalToNoise: snr[weakest],
    weakestTarget: names[weakest],
    totalSpreading: spreading,
    interferenceCeiling: o.maxInterference,
    statement: objectiveStatement(snr[weakest], names[weakest], spreading, worst, o.maxInterference),
  });
  const warnings = [...noise.warnings, ...referenceWarnings, ...(free ? defaultLeftOut(request) : [])];
  for (const id of new Set(panel.probes.map((p) => p.material))) {
    const m = getMaterial(id);
    const hazards = exclusionsOf(m);
    if (hazards.length) {
      warnings.push(
        `the proposal uses ${m.name}, which contains ${hazards.join(' and ')}: see its cautions ` +
          '(GET /api/v1/materials) and handle it as local regulations, institutional safety rules and licensed ' +
          'practice require',
      );
    }
  }
  if (!exact)
    warnings.push(
      'the search stopped at its node budget: the design is the best found, not proven optimal (see stats.bound)',
    );
  const judged = verdictOf(
    names,
    noise.signalToNoise,
    { value: worst, from: objective.fromTarget, into: objective.intoTarget },
    o,
  );
  const largestUsableTargets =
    judged.verdict === 'usable' || !lookForFewer ? null : yield* largestUsable(request, shouldStop);
  return {
    mode: free ? 'free' : 'catalog',
    panel,
    evaluation,
    objective,
    exact,
    stats,
    noise,
    verdict: judged.verdict,
    verdictReason: judged.reason,
    largestUsableTargets,
    warnings,
  };
}

/**
 * The most targets, the most abundant first, for which the same request gives a usable panel: a bisection over the
 * count (assuming fewer targets are never harder), each trial at a quarter of the node budget without refinement.
 */
function* largestUsable(request: DesignRequest, shouldStop?: () => boolean): Generator<SearchProgress, number> {
  const order = request.targets
    .map((t, i) => ({ i, a: targetsOf([t]).abundance[0] }))
    .sort((x, y) => y.a - x.a || x.i - y.i)
    .map((x) => x.i);
  const budget = Math.max(
    1,
    Math.floor(
      resolveOptions(request.options, !request.candidates, request.targets.length).nodeBudget * SUBSET_BUDGET_SHARE,
    ),
  );
  const usable = function* (k: number): Generator<SearchProgress, boolean> {
    const keep = order.slice(0, k).sort((x, y) => x - y);
    const photons = request.options?.photons;
    const background = request.options?.backgroundPhotons;
    const sub: DesignRequest = {
      ...request,
      targets: keep.map((i) => request.targets[i]),
      options: {
        ...request.options,
        nodeBudget: budget,
        refine: false,
        // Per-target noise settings follow their targets.
        ...(Array.isArray(photons) ? { photons: keep.map((i) => photons[i]) } : {}),
        ...(Array.isArray(background) ? { backgroundPhotons: keep.map((i) => background[i]) } : {}),
      },
    };
    try {
      return (yield* designSteps(sub, shouldStop, false)).verdict === 'usable';
    } catch (err) {
      if (err instanceof SpectraError) return false;
      throw err;
    }
  };
  let lo = 0; // usable (vacuously)
  let hi = request.targets.length; // not usable
  while (hi - lo > 1 && !shouldStop?.()) {
    const mid = Math.floor((lo + hi) / 2);
    if (yield* usable(mid)) lo = mid;
    else hi = mid;
  }
  return lo;
}

/**
 * Runs a design synchronously (the API route: bounded by options.nodeBudget).
 * @example
 * runDesign({
 *   targets: [{ name: 'membrane marker', abundance: 'high' }, { name: 'rare nuclear marker', abundance: 'low' }],
 *   excitation: [{ wavelengthNm: 405 }],
 * });
 */
export function runDesign(request: DesignRequest, hooks: DesignHooks = {}): DesignResult {
  return runSteps(designSteps(request, hooks.shouldStop), hooks.onProgress);
}

/**
 * Runs a design, awaiting `pause` between chunks of the search (in a browser Web Worker a zero-delay timer, so that
 * progress is posted and a stop request can arrive).
 */
export function runDesignAsync(
  request: DesignRequest,
  hooks: DesignHooks & { pause: () => Promise<void> },
): Promise<DesignResult> {
  return runStepsAsync(designSteps(request, hooks.shouldStop), hooks.pause, hooks.onProgress);
}
