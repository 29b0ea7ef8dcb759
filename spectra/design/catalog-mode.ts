/**
 * Catalog mode: the exact branch and bound over the request's candidate probes and channels. The candidate matrix is
 * computed once (channel × probe at abundance 1). The signal floor and the rule that no channel passes an excitation
 * line apply only when the request sets them (options.minSignalFraction, options.lineClearance).
 */
import { SpectraError } from '../errors';
import { DEFAULT_GRID } from '../grid';
import { channelTransmission } from '../filters/channel';
import type { ChannelSpec, ExcitationLine, ProbeSpec } from '../panel';
import { CatalogSearch, type CatalogSearchStats } from './catalog';
import { asCandidate, candidateMatrix } from './matrix';
import type { ResolvedDesignOptions } from './options';
import { searchSteps, type SearchProgress } from './search';

/** Most candidates catalog mode takes: a panel's limits (16 probes, 64 channels). */
export const MAX_CANDIDATES = Object.freeze({ probes: 16, channels: 64 });

/** A channel passes a line when its transmission there is at least this (1 %: our choice, far above any blocking floor). */
export const LINE_PASS_TRANSMISSION = 0.01;

/** Outcome of catalog mode: the chosen probe and channel per target. */
export interface CatalogOutcome {
  probes: ProbeSpec[];
  channels: ChannelSpec[];
  worst: number;
  exact: boolean;
  stats: CatalogSearchStats & { candidateProbes: number; candidateChannels: number; channelsDropped: string[] };
}

function checkCandidates(list: unknown, field: 'probes' | 'channels', needed: number): void {
  const max = MAX_CANDIDATES[field];
  if (!Array.isArray(list))
    throw new SpectraError('invalid_input', `candidates.${field} must be an array`, ['candidates', field]);
  if (list.length > max)
    throw new SpectraError('invalid_input', `at most ${max} candidate ${field} are allowed, got ${list.length}`, [
      'candidates',
      field,
    ]);
  if (list.length < needed)
    throw new SpectraError(
      'invalid_input',
      `${needed} targets need at least ${needed} candidate ${field}, got ${list.length}`,
      ['candidates', field],
    );
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
  checkCandidates(probes, 'probes', n);
  checkCandidates(offered, 'channels', n);
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
  const collected = candidateMatrix(probes, channels, request.excitation, { pathPrefix: ['candidates'] });
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
