/**
 * A catalog design problem in the flat form the search works on: every (probe, channel) pair is one candidate
 * "value" v = probe · channelCount + channel that a target can take.
 */
import { SpectraError } from '../core/errors';
import type { CollectedMatrix } from './objective';

/** What a catalog search needs: the candidate matrix at abundance 1, the targets' abundances and the floors. */
export interface CatalogProblem {
  /** collected[c][p] for every candidate channel c and probe p, at abundance 1. */
  collected: CollectedMatrix;
  /** Relative abundance of each target (> 0). */
  abundance: readonly number[];
  /** Each target's own signal must be at least this fraction of the brightest target's (0 or absent: no floor). */
  minSignalFraction?: number;
  /** channelConflict(c1, c2) true when two channels cannot both be used (e.g. overlapping passbands). */
  channelConflict?: (c1: number, c2: number) => boolean;
  /**
   * pairAllowed(c, p) false when probe p may not be read in channel c (e.g. the channel misses its peak): such a
   * pair gives no own signal, while p's light still spills into c when another target is read there.
   */
  pairAllowed?: (c: number, p: number) => boolean;
}

/** The flattened problem; built once per search. */
export interface FlatProblem {
  targets: number;
  probes: number;
  channels: number;
  values: number;
  abundance: Float64Array;
  /** collected[c][p] at index c · probes + p. */
  light: Float64Array;
  /** The same where probe p may be read in channel c, else 0: what a target's own signal is made of. */
  ownLight: Float64Array;
  probeOf: Int32Array;
  channelOf: Int32Array;
  /** Own signal a_t · collected[c_v][p_v] at index t · values + v. */
  own: Float64Array;
  /** 1 where channels c1 and c2 conflict, at c1 · channels + c2 (null: none do). */
  conflict: Uint8Array | null;
  minSignalFraction: number;
}

/** Checks a catalog problem and flattens it; throws `invalid_input` naming the field. */
export function flattenProblem(problem: CatalogProblem): FlatProblem {
  const { collected, abundance } = problem;
  const channels = collected.length;
  const probes = channels > 0 ? collected[0].length : 0;
  const targets = abundance.length;
  if (targets === 0) throw new SpectraError('invalid_input', 'a design needs at least one target', ['targets']);
  if (probes < targets) {
    throw new SpectraError(
      'invalid_input',
      `${targets} targets need at least ${targets} probe candidates, got ${probes}`,
      ['candidates', 'probes'],
    );
  }
  if (channels < targets) {
    throw new SpectraError(
      'invalid_input',
      `${targets} targets need at least ${targets} channel candidates, got ${channels}`,
      ['candidates', 'channels'],
    );
  }
  const light = new Float64Array(channels * probes);
  for (let c = 0; c < channels; c++) {
    if (collected[c].length !== probes)
      throw new SpectraError('invalid_input', 'collected rows differ in length', ['collected', c]);
    for (let p = 0; p < probes; p++) {
      const x = collected[c][p];
      if (!Number.isFinite(x) || x < 0)
        throw new SpectraError('invalid_input', 'collected light must be finite and ≥ 0', ['collected', c, p]);
      light[c * probes + p] = x;
    }
  }
  const ownLight = problem.pairAllowed
    ? light.map((x, i) => (problem.pairAllowed!(Math.floor(i / probes), i % probes) ? x : 0))
    : light;
  const values = probes * channels;
  const probeOf = new Int32Array(values);
  const channelOf = new Int32Array(values);
  for (let v = 0; v < values; v++) {
    probeOf[v] = Math.floor(v / channels);
    channelOf[v] = v % channels;
  }
  const own = new Float64Array(targets * values);
  abundance.forEach((a, t) => {
    if (!Number.isFinite(a) || a <= 0)
      throw new SpectraError('invalid_input', 'abundance must be a finite number > 0', ['targets', t, 'abundance']);
    for (let v = 0; v < values; v++) own[t * values + v] = a * ownLight[channelOf[v] * probes + probeOf[v]];
  });
  let conflict: Uint8Array | null = null;
  if (problem.channelConflict) {
    conflict = new Uint8Array(channels * channels);
    for (let a = 0; a < channels; a++)
      for (let b = 0; b < channels; b++) conflict[a * channels + b] = a !== b && problem.channelConflict(a, b) ? 1 : 0;
  }
  const minSignalFraction = problem.minSignalFraction ?? 0;
  if (!Number.isFinite(minSignalFraction) || minSignalFraction < 0 || minSignalFraction > 1) {
    throw new SpectraError('invalid_input', 'minSignalFraction must lie between 0 and 1', [
      'options',
      'minSignalFraction',
    ]);
  }
  return {
    targets,
    probes,
    channels,
    values,
    abundance: Float64Array.from(abundance),
    light,
    ownLight,
    probeOf,
    channelOf,
    own,
    conflict,
    minSignalFraction,
  };
}

/**
 * The larger of I(t→u) and I(u→t) when target t takes value v and u takes w; Infinity when they share a probe
 * or a channel, or their channels conflict.
 */
export function pairCost(f: FlatProblem, t: number, v: number, u: number, w: number): number {
  const pv = f.probeOf[v];
  const pw = f.probeOf[w];
  const cv = f.channelOf[v];
  const cw = f.channelOf[w];
  if (pv === pw || cv === cw || (f.conflict !== null && f.conflict[cv * f.channels + cw] === 1)) return Infinity;
  const tIntoU = (f.abundance[t] * f.light[cw * f.probes + pv]) / f.own[u * f.values + w];
  const uIntoT = (f.abundance[u] * f.light[cv * f.probes + pw]) / f.own[t * f.values + v];
  return tIntoU > uIntoT ? tIntoU : uIntoT;
}

/** Number of complete assignments: P!/(P−n)! · K!/(K−n)! (a float; may exceed 2^53). */
export function fullEnumerationSize(targets: number, probes: number, channels: number): number {
  let size = 1;
  for (let i = 0; i < targets; i++) size *= (probes - i) * (channels - i);
  return size;
}
