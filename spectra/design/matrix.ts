/**
 * The candidate matrix of a design: collected[c][p] for every candidate channel and probe at abundance 1, computed
 * exactly as evaluatePanel computes a panel's (buildPanelModel + collectedMatrix), so that a proposed panel
 * evaluates to the objective the search saw. A panel holds at most 16 probes and 64 channels, so large candidate
 * sets are computed in blocks.
 */
import { SpectraError } from '../core/errors';
import { DEFAULT_GRID, type WavelengthGrid } from '../core/grid';
import { modelPanel, type DotResolver } from '../signal/panel-model';
import { resolveDot, type ResolvedDot } from '../dot/resolve';
import { collectedMatrix } from '../signal/crosstalk';
import { evaluatePanel } from '../signal/evaluate';
import type { ChannelSpec, ExcitationLine, PanelSpec, ProbeSpec } from '../core/panel';
import { runSteps, type SearchProgress } from './search';

/** The progress report of the candidate stage (no node visited yet). */
const CANDIDATES: SearchProgress = { stage: 'candidates', nodesVisited: 0, incumbent: null, bound: null };

const PROBES_PER_BLOCK = 16;
const CHANNELS_PER_BLOCK = 64;

/** A probe as a candidate: abundance 1, no channel assignment. */
export function asCandidate(probe: ProbeSpec): ProbeSpec {
  const { abundance: _a, channel: _c, ...rest } = probe;
  return rest;
}

/**
 * A DotResolver that keeps its answers for one design run: the search and its refinement ask for the same dots many
 * times. Dropped with the run.
 */
export function rememberingResolver(): DotResolver {
  const known = new Map<string, ResolvedDot>();
  return (input, grid) => {
    const key = `${grid.startNm} ${grid.stepNm} ${grid.count} ${JSON.stringify(input)}`;
    let dot = known.get(key);
    if (!dot) {
      dot = resolveDot(input, { grid });
      known.set(key, dot);
    }
    return dot;
  };
}

/**
 * collected[c][p] at abundance 1 for candidate probes and channels, with the dots from `resolve`. Errors from the
 * spectral model are re-thrown with their path under `pathPrefix` (e.g. ['candidates']) so the API names the
 * candidate's field.
 */
export function* candidateMatrixSteps(
  probes: ProbeSpec[],
  channels: ChannelSpec[],
  excitation: ExcitationLine[],
  resolve: DotResolver,
  options: { grid?: WavelengthGrid; pathPrefix?: (string | number)[] } = {},
): Generator<SearchProgress, number[][]> {
  const grid = options.grid ?? DEFAULT_GRID;
  const out = channels.map(() => new Array<number>(probes.length).fill(0));
  for (let p0 = 0; p0 < probes.length; p0 += PROBES_PER_BLOCK) {
    for (let c0 = 0; c0 < channels.length; c0 += CHANNELS_PER_BLOCK) {
      const panel: PanelSpec = {
        version: 1,
        excitation,
        probes: probes.slice(p0, p0 + PROBES_PER_BLOCK).map(asCandidate),
        channels: channels.slice(c0, c0 + CHANNELS_PER_BLOCK),
      };
      let block: number[][];
      try {
        const model = modelPanel(panel, grid, resolve);
        block = collectedMatrix(model.components, model.transmissions, grid.stepNm);
      } catch (err) {
        if (!(err instanceof SpectraError)) throw err;
        const [list, index, ...rest] = err.path;
        const shifted =
          typeof index === 'number' ? index + (list === 'probes' ? p0 : list === 'channels' ? c0 : 0) : index;
        const path = index === undefined ? err.path : [list, shifted, ...rest];
        throw new SpectraError(err.code, err.message, [...(options.pathPrefix ?? []), ...path]);
      }
      block.forEach((row, c) => row.forEach((x, p) => (out[c0 + c][p0 + p] = x)));
      // A pause point after each block: a large catalog's matrix is the longest stretch of a design's work.
      yield CANDIDATES;
    }
  }
  return out;
}

/** candidateMatrixSteps run to its end in one go. */
export function candidateMatrix(...args: Parameters<typeof candidateMatrixSteps>): number[][] {
  return runSteps(candidateMatrixSteps(...args));
}

/** The sample's own light a design request states: scattered excitation and water Raman, as a panel's. */
export interface SampleLight {
  scatterLevel?: number;
  waterRaman?: PanelSpec['waterRaman'];
}

/**
 * The sample's light each candidate channel collects, in the units of the candidate matrix: the excitation leak
 * (Σ over lines of lineLeak) plus water Raman (backgroundCollected), computed by evaluatePanel on blocks of the
 * channels with one probe (`probe`; the sample's light does not depend on it), so that it is what the proposal's
 * evaluation will report.
 */
export function sampleLight(
  channels: ChannelSpec[],
  excitation: ExcitationLine[],
  sample: SampleLight,
  probe: ProbeSpec,
): number[] {
  const out: number[] = [];
  for (let c0 = 0; c0 < channels.length; c0 += CHANNELS_PER_BLOCK) {
    const panel: PanelSpec = {
      version: 1,
      excitation,
      probes: [asCandidate(probe)],
      channels: channels.slice(c0, c0 + CHANNELS_PER_BLOCK),
      ...(sample.scatterLevel !== undefined ? { scatterLevel: sample.scatterLevel } : {}),
      ...(sample.waterRaman !== undefined ? { waterRaman: { ...sample.waterRaman } } : {}),
    };
    const e = evaluatePanel(panel, { sensitivity: false });
    e.lineLeak.forEach((row, c) => out.push((e.backgroundCollected?.[c] ?? 0) + row.reduce((a, x) => a + x, 0)));
  }
  return out;
}
