/**
 * The panel design objective. A design assigns each target t a probe p_t and a channel c_t (one-to-one).
 * With collected[c][p] the relative detected light of probe p in channel c at abundance 1 (docs/api.md, "The signal
 * model"), the interference of target t into target u is
 *   I(t→u) = a_t · collected[c_u][p_t] / (a_u · collected[c_u][p_u]),
 * the light of t's probe in u's channel relative to u's own signal there: the same quantity as `worst` in the
 * evaluate route once abundances are inside collected. A design is scored by its worst interference.
 */

/** A channel × probe matrix of collected light at abundance 1 (rows: channels, columns: probes). */
export type CollectedMatrix = readonly ArrayLike<number>[];

/** Probe index and channel index of each target, in target order. */
export interface DesignAssignment {
  probe: number[];
  channel: number[];
}

/** The worst interference of a design and the target pair (indices) that sets it; -1 when there is no pair. */
export interface DesignObjective {
  worstInterference: number;
  from: number;
  into: number;
}

/**
 * Relative abundance words of a design request. Our own convention (documented in docs/science.md): one
 * decade between "high" and "low", "medium" about half-way on a log scale.
 */
export const ABUNDANCE_WORDS = Object.freeze({ high: 1, medium: 0.3, low: 0.1 });

/** An abundance as a design request may state it. */
export type AbundanceInput = number | keyof typeof ABUNDANCE_WORDS;

/**
 * Default floor on each target's own signal, as a fraction of the brightest target's (free mode; catalog mode
 * only when asked). 5 %: our choice, so that no target is left near the noise while the others are bright.
 */
export const DEFAULT_MIN_SIGNAL_FRACTION = 0.05;

/** An abundance as a number: the value of a word (ABUNDANCE_WORDS), or the number itself. */
export function abundanceValue(input: AbundanceInput): number {
  return typeof input === 'string' ? ABUNDANCE_WORDS[input] : input;
}

/** I(t→u) for one ordered pair of targets of a design (Infinity when u's own signal is zero). */
export function interference(
  collected: CollectedMatrix,
  abundance: readonly number[],
  design: DesignAssignment,
  from: number,
  into: number,
): number {
  const channel = collected[design.channel[into]];
  const own = abundance[into] * channel[design.probe[into]];
  const foreign = abundance[from] * channel[design.probe[from]];
  return own > 0 ? foreign / own : foreign > 0 ? Infinity : 0;
}

/** The design objective: the largest I(t→u) over ordered pairs t ≠ u, and the pair that sets it. */
export function worstInterference(
  collected: CollectedMatrix,
  abundance: readonly number[],
  design: DesignAssignment,
): DesignObjective {
  let worst: DesignObjective = { worstInterference: 0, from: -1, into: -1 };
  for (let u = 0; u < abundance.length; u++) {
    for (let t = 0; t < abundance.length; t++) {
      if (t === u) continue;
      const value = interference(collected, abundance, design, t, u);
      if (value > worst.worstInterference || worst.from < 0) worst = { worstInterference: value, from: t, into: u };
    }
  }
  return worst;
}
