/**
 * Catalog mode: the exact branch and bound over the request's candidate probes and channels. The candidate matrix is
 * computed once (channel × probe at abundance 1). The signal floor and the rule that no channel passes an excitation
 * line apply only when the request sets them (options.minSignalFraction, options.lineClearance).
 */
import { SpectraError } from '../core/errors';
import { DEFAULT_GRID } from '../core/grid';
import { channelTransmission } from '../light/filters/channel';
import type { ChannelSpec, ProbeSpec } from '../core/panel';
import { asCandidate, candidateMatrixSteps, rememberingResolver, sampleLight } from './matrix';
import { measuredCandidates } from './measured-candidates';
import { blocksItsLines, clearOfLines, NoDesignFound, readablePairs } from './practice';
import { dotInputOf } from '../signal/panel-model';
import type { ResolvedDesignOptions } from './options';
import { chunkNodesFor, type SearchProgress } from './search';
import { snrSearchSteps, type SnrRun } from './snr-run';
import type { SnrScore } from './snr';
import { lockIndices } from './locks';
import { targetsOf, type DesignRequest } from './request';
import { worstInterference } from './objective';
import { fullEnumerationSize } from './problem';

/** A channel passes a line when its transmission there is at least this (1 %: our choice, far above any blocking
 * floor). */
export const LINE_PASS_TRANSMISSION = 0.01;

/** Outcome of catalog mode: the chosen probe and channel per target. */
export interface CatalogOutcome {
  probes: ProbeSpec[];
  channels: ChannelSpec[];
  worst: number;
  score: SnrScore;
  exact: boolean;
  /** Candidate probes whose measured reference column the search used (the request's measuredReference). */
  measuredProbes: string[];
  /** Why a measured column was not used, if any was not. */
  referenceWarnings: string[];
  stats: DesignSearchStats & {
    candidateProbes: number;
    candidateChannels: number;
    channelsDropped: string[];
    probesDropped: string[];
  };
}

/** Search figures both modes report. */
export interface DesignSearchStats {
  nodesVisited: number;
  fullEnumeration: number;
  /** Lower bound on the worst interference of any design of the candidates (the interference stage; null: none). */
  bound: number | null;
  greedyWorst: number | null;
  /** Proven upper bound on the worst signal-to-noise of any design of the candidates (null: none proven). */
  signalToNoiseBound: number | null;
  /** (signalToNoiseBound − found) / signalToNoiseBound: 0 when proven optimal. */
  gap: number | null;
}

/** The figures of a finished two-stage search. */
export function searchStats(run: SnrRun, fullEnumeration: number): DesignSearchStats {
  return {
    nodesVisited: run.result.stats.nodesVisited + (run.seed?.stats.nodesVisited ?? 0),
    fullEnumeration,
    bound: run.seed?.stats.bound ?? null,
    greedyWorst: run.seed?.stats.greedyWorst ?? null,
    signalToNoiseBound: run.result.stats.bound,
    gap: run.result.stats.gap,
  };
}

/** The words of each practice check, for the reasons a locked item is left out. */
export const LEFT_OUT_WORDS = {
  blocking: (od: number) => `does not block every line it is read under by OD ${od}`,
  clearance: (nm: number) => `emits within ${nm} nm of an excitation line`,
};

/** Runs catalog mode as steps (see search.ts for the drivers). */
export function* catalogDesignSteps(
  request: Pick<
    DesignRequest,
    'targets' | 'excitation' | 'candidates' | 'owned' | 'scatterLevel' | 'waterRaman' | 'measuredReference'
  >,
  o: ResolvedDesignOptions,
  shouldStop?: () => boolean,
): Generator<SearchProgress, CatalogOutcome> {
  const { abundance } = targetsOf(request.targets);
  const n = abundance.length;
  const offeredProbes = [...(request.candidates?.probes ?? []), ...(request.owned?.probes ?? [])];
  const offered = [...(request.candidates?.channels ?? []), ...(request.owned?.channels ?? [])];
  const dropped: string[] = [];
  const channels = offered.filter((ch, c) => {
    let passes = !blocksItsLines(ch, request.excitation, o.minBlockingOD);
    if (!passes && o.lineClearance) {
      const t = channelTransmission(ch, DEFAULT_GRID, ['candidates', 'channels', c]);
      passes = request.excitation.some(
        (l) => t[Math.round(l.wavelengthNm - DEFAULT_GRID.startNm)] >= LINE_PASS_TRANSMISSION,
      );
    }
    if (passes) dropped.push(ch.id);
    return !passes;
  });
  const resolve = rememberingResolver();
  const dotOf = (p: ProbeSpec, i: number) => {
    try {
      return resolve(dotInputOf(asCandidate(p)), DEFAULT_GRID);
    } catch (err) {
      if (err instanceof SpectraError)
        throw new SpectraError(err.code, err.message, ['candidates', 'probes', i, ...err.path]);
      throw err;
    }
  };
  const probesDropped: string[] = [];
  const probes = offeredProbes.filter((p, i) => {
    const clear = clearOfLines(dotOf(p, i).emissionPeakNm, request.excitation, o.lineClearanceNm);
    if (!clear) probesDropped.push(p.id);
    return clear;
  });
  const locks = lockIndices(
    request.targets,
    {
      kept: probes.map((p) => p.id),
      leftOut: new Map(probesDropped.map((id) => [id, LEFT_OUT_WORDS.clearance(o.lineClearanceNm)])),
    },
    {
      kept: channels.map((c) => c.id),
      leftOut: new Map(dropped.map((id) => [id, LEFT_OUT_WORDS.blocking(o.minBlockingOD)])),
    },
  );
  if (channels.length < n) {
    throw new SpectraError(
      'invalid_input',
      `only ${channels.length} candidate channels block every line they are read under by OD ${o.minBlockingOD} ` +
        `or more (${dropped.join(', ')} do not); ${n} targets need ${n}`,
      ['candidates', 'channels'],
    );
  }
  if (probes.length < n) {
    throw new SpectraError(
      'invalid_input',
      `only ${probes.length} candidate probes emit at least ${o.lineClearanceNm} nm from every line ` +
        `(${probesDropped.join(', ')} do not); ${n} targets need ${n}`,
      ['candidates', 'probes'],
    );
  }
  yield { stage: 'candidates', nodesVisited: 0, incumbent: null, bound: null };
  const measured = measuredCandidates(
    yield* candidateMatrixSteps(probes, channels, request.excitation, resolve, { pathPrefix: ['candidates'] }),
    probes,
    channels,
    request.measuredReference,
  );
  const collected = measured.collected;
  const dots = probes.map((p) => dotOf(p, offeredProbes.indexOf(p)));
  const pairAllowed = readablePairs(dots, channels, DEFAULT_GRID, o.minChannelShare);
  yield { stage: 'candidates', nodesVisited: 0, incumbent: null, bound: null };
  const problem = {
    collected,
    abundance,
    minSignalFraction: o.minSignalFraction,
    pairAllowed,
    sample: sampleLight(channels, request.excitation, request, probes[0]),
    settings: o,
    ceiling: o.maxInterference,
    locks,
  };
  const chunk = chunkNodesFor(n * probes.length * channels.length, 2000);
  const run = yield* snrSearchSteps(problem, o.nodeBudget, chunk, [], shouldStop);
  const found = run.result;
  if (!found.design) {
    throw new NoDesignFound(
      `${found.exact ? 'no' : 'within its node budget the search found no'} assignment of the candidates that ` +
        'gives every target a channel that contains its peak and passes ' +
        `${Math.round(o.minChannelShare * 100)} % of its light, keeps every interference at or below ` +
        `${interferenceWords(o.maxInterference)} and meets the signal floor` +
        (locks.some(Boolean) ? ' and the locks' : ''),
      ['candidates'],
      found.exact,
    );
  }
  const design = found.design;
  return {
    probes: design.probe.map((p) => asCandidate(probes[p])),
    channels: design.channel.map((c) => channels[c]),
    worst: worstInterference(collected, abundance, design).worstInterference,
    score: found.score!,
    exact: found.exact,
    measuredProbes: probes.filter((_, p) => measured.source[p] === 'measured').map((p) => p.id),
    referenceWarnings: measured.warnings,
    stats: {
      ...searchStats(run, fullEnumerationSize(n, probes.length, channels.length)),
      candidateProbes: probes.length,
      candidateChannels: offered.length,
      channelsDropped: dropped,
      probesDropped,
    },
  };
}

/** An interference ceiling in words: "100 %". */
export function interferenceWords(ceiling: number): string {
  return `${Number((ceiling * 100).toPrecision(3))} %`;
}
