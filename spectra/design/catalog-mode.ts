/**
 * Catalog mode: the exact branch and bound over the request's candidate probes and channels. The candidate matrix is
 * computed once (channel × probe at abundance 1). The signal floor and the rule that no channel passes an excitation
 * line apply only when the request sets them (options.minSignalFraction, options.lineClearance).
 */
import { SpectraError } from '../core/errors';
import { DEFAULT_GRID } from '../core/grid';
import { channelTransmission } from '../light/filters/channel';
import type { ChannelSpec, ExcitationLine, ProbeSpec } from '../core/panel';
import { CatalogSearch, type CatalogSearchStats } from './catalog';
import { asCandidate, candidateMatrix, rememberingResolver } from './matrix';
import type { ResolvedDesignOptions } from './options';
import { searchSteps, type SearchProgress } from './search';

/** A channel passes a line when its transmission there is at least this (1 %: our choice, far above any blocking
 * floor). */
export const LINE_PASS_TRANSMISSION = 0.01;

/** Outcome of catalog mode: the chosen probe and channel per target. */
export interface CatalogOutcome {
  probes: ProbeSpec[];
  channels: ChannelSpec[];
  worst: number;
  exact: boolean;
  stats: CatalogSearchStats & { candidateProbes: number; candidateChannels: number; channelsDropped: string[] };
}

/** Runs catalog mode as steps (see search.ts for the drivers). */
export function* catalogDesignSteps(
  abundance: number[],
  request: { excitation: ExcitationLine[]; candidates?: { probes: ProbeSpec[]; channels: ChannelSpec[] } },
  o: ResolvedDesignOptions,
  shouldStop?: () => boolean,
): Generator<SearchProgress, CatalogOutcome> {
  const n = abundance.length;
  const { probes, channels: offered } = request.candidates ?? { probes: [], channels: [] };
  const dropped: string[] = [];
  const channels = offered.filter((ch, c) => {
    if (!o.lineClearance) return true;
    const t = channelTransmission(ch, DEFAULT_GRID, ['candidates', 'channels', c]);
    const passes = request.excitation.some(
      (l) => t[Math.round(l.wavelengthNm - DEFAULT_GRID.startNm)] >= LINE_PASS_TRANSMISSION,
    );
    if (passes) dropped.push(ch.id);
    return !passes;
  });
  if (channels.length < n) {
    throw new SpectraError(
      'invalid_input',
      `only ${channels.length} candidate channels block every excitation line; ${n} targets need ${n}`,
      ['candidates', 'channels'],
    );
  }
  yield { stage: 'candidates', nodesVisited: 0, incumbent: null, bound: null };
  const collected = candidateMatrix(probes, channels, request.excitation, rememberingResolver(), {
    pathPrefix: ['candidates'],
  });
  const search = new CatalogSearch({ collected, abundance, minSignalFraction: o.minSignalFraction });
  const found = yield* searchSteps(search, o.nodeBudget, 2000, shouldStop);
  if (!found.design) {
    throw new SpectraError(
      'invalid_input',
      'no assignment of the candidates gives every target a signal and meets the signal floor',
      ['candidates'],
    );
  }
  return {
    probes: found.design.probe.map((p) => asCandidate(probes[p])),
    channels: found.design.channel.map((c) => channels[c]),
    worst: found.objective!.worstInterference,
    exact: found.exact,
    stats: {
      ...found.stats,
      candidateProbes: probes.length,
      candidateChannels: offered.length,
      channelsDropped: dropped,
    },
  };
}
