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
import { blocksItsLines, clearOfLines, NoDesignFound, readablePairs } from './practice';
import { dotInputOf } from '../signal/panel-model';
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
  stats: CatalogSearchStats & {
    candidateProbes: number;
    candidateChannels: number;
    channelsDropped: string[];
    probesDropped: string[];
  };
}

/** Runs catalog mode as steps (see search.ts for the drivers). */
export function* catalogDesignSteps(
  abundance: number[],
  request: { excitation: ExcitationLine[]; candidates?: { probes: ProbeSpec[]; channels: ChannelSpec[] } },
  o: ResolvedDesignOptions,
  shouldStop?: () => boolean,
): Generator<SearchProgress, CatalogOutcome> {
  const n = abundance.length;
  const { probes: offeredProbes, channels: offered } = request.candidates ?? { probes: [], channels: [] };
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
  if (channels.length < n) {
    throw new SpectraError(
      'invalid_input',
      `only ${channels.length} candidate channels block every line they are read under by OD ${o.minBlockingOD} ` +
        `or more (${dropped.join(', ')} do not); ${n} targets need ${n}`,
      ['candidates', 'channels'],
    );
  }
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
  if (probes.length < n) {
    throw new SpectraError(
      'invalid_input',
      `only ${probes.length} candidate probes emit at least ${o.lineClearanceNm} nm from every line ` +
        `(${probesDropped.join(', ')} do not); ${n} targets need ${n}`,
      ['candidates', 'probes'],
    );
  }
  yield { stage: 'candidates', nodesVisited: 0, incumbent: null, bound: null };
  const collected = candidateMatrix(probes, channels, request.excitation, resolve, {
    pathPrefix: ['candidates'],
  });
  const dots = probes.map((p) => dotOf(p, offeredProbes.indexOf(p)));
  const pairAllowed = readablePairs(dots, channels, DEFAULT_GRID, o.minChannelShare);
  const search = new CatalogSearch({ collected, abundance, minSignalFraction: o.minSignalFraction, pairAllowed });
  const found = yield* searchSteps(search, o.nodeBudget, 2000, shouldStop);
  if (!found.design) {
    throw new NoDesignFound(
      'no assignment of the candidates gives every target a channel that contains its peak and passes ' +
        `${Math.round(o.minChannelShare * 100)} % of its light, and meets the signal floor`,
      ['candidates'],
      found.exact,
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
      probesDropped,
    },
  };
}
