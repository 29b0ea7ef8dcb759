/**
 * The checks a microscopist makes of a proposed panel before anything else, as constraints of the design search:
 * - every channel blocks every line it is read under by at least OD 6 (common practice for emission filters next to
 *   a laser line; the same threshold as the evaluation's warning, DEFAULT_MIN_BLOCKING_OD);
 * - a probe is read only in a channel that contains its emission peak (transmission there at least half the
 *   channel's best) and collects at least 30 % of its emitted photons (our choice of threshold);
 * - no probe emits within 15 nm of an excitation line (its emission would be cut by the line's blocking filter and
 *   its channel would sit next to the line; our choice of threshold).
 * Each threshold is a design option (0 turns a check off). The verdict of a proposal uses two more: every target's
 * signal-to-noise after unmixing at least 5 (Rose's criterion) and the worst interference at most 1.
 */
import { SpectraError } from '../core/errors';
import type { WavelengthGrid } from '../core/grid';
import type { ChannelSpec, ExcitationLine } from '../core/panel';
import type { ResolvedDot } from '../dot/resolve';
import { seriesTransmission } from '../light/light-path';
import { BLOCKING_OD_TOLERANCE, DEFAULT_MIN_BLOCKING_OD, filtersAtLines } from '../light/line-blocking';
import { linesOn } from '../signal/crosstalk';

/** Defaults of the practice checks (see the file header for their basis). */
export const PRACTICE_DEFAULTS = Object.freeze({
  minBlockingOD: DEFAULT_MIN_BLOCKING_OD,
  minChannelShare: 0.3,
  lineClearanceNm: 15,
  // Rose's criterion: an object is reliably seen at a signal-to-noise of about 5 (Rose, J. Opt. Soc. Am. 1948, 38,
  // 196; from memory, unverified).
  minSignalToNoise: 5,
  // Our choice: no other probe's light in a target's channel above the target's own signal there.
  maxInterference: 1,
});

/** True when the channel's filters block every line it is read under by at least `minOD`. */
export function blocksItsLines(channel: ChannelSpec, excitation: readonly ExcitationLine[], minOD: number): boolean {
  if (minOD <= 0) return true;
  const panel = { excitation: [...excitation], probes: [], channels: [channel] };
  const on = [linesOn(channel, [...excitation])];
  const [row] = filtersAtLines(panel, on);
  // The evaluation warning's tolerance: a filter whose floor is the threshold meets it.
  return on[0].every((l) => !(row[l] > 10 ** -(minOD - BLOCKING_OD_TOLERANCE)));
}

/** True when an emission peak lies at least `clearanceNm` from every line. */
export function clearOfLines(peakNm: number, excitation: readonly ExcitationLine[], clearanceNm: number): boolean {
  return excitation.every((line) => Math.abs(line.wavelengthNm - peakNm) >= clearanceNm);
}

/**
 * pairAllowed(c, p) of a candidate matrix: channel c contains dot p's emission peak (its filters pass at least half
 * their best transmission there) and passes at least `minShare` of its emitted photons (on the grid).
 */
export function readablePairs(
  dots: readonly Pick<ResolvedDot, 'emission' | 'emissionFrom' | 'emissionPeakNm'>[],
  channels: readonly ChannelSpec[],
  grid: WavelengthGrid,
  minShare: number,
): (c: number, p: number) => boolean {
  const transmissions = channels.map((ch) => seriesTransmission(ch.filters, grid));
  const best = transmissions.map((t) => t.reduce((a, v) => (v > a ? v : a), 0));
  const allowed = channels.map((_, c) =>
    dots.map((dot) => {
      const t = transmissions[c];
      const at = Math.round((dot.emissionPeakNm - grid.startNm) / grid.stepNm);
      if (!(at >= 0 && at < t.length && t[at] >= best[c] / 2)) return false;
      if (minShare <= 0) return true;
      let total = 0;
      let passed = 0;
      const values = dot.emission.values;
      for (let k = 0; k < values.length; k++) {
        const i = dot.emissionFrom + k;
        if (i < 0 || i >= t.length) continue;
        total += values[k];
        passed += values[k] * t[i];
      }
      return total > 0 && passed >= minShare * total;
    }),
  );
  return (c, p) => allowed[c][p];
}

/**
 * The search found no design that meets the constraints (proven when `exhausted`, else within its node budget). The
 * design pipeline answers it with the no_usable_panel verdict; elsewhere it is a refusal naming the option to relax.
 */
export class NoDesignFound extends SpectraError {
  readonly exhausted: boolean;

  constructor(message: string, path: (string | number)[], exhausted: boolean) {
    super('invalid_input', message, path);
    this.name = 'NoDesignFound';
    this.exhausted = exhausted;
  }
}

/** Whether a proposal is usable, and why not. */
export interface DesignVerdict {
  verdict: 'usable' | 'no_usable_panel';
  /** The binding reason, in words (empty when usable). */
  reason: string;
}

/**
 * The verdict of a proposal: usable when every target's signal-to-noise after unmixing reaches `minSignalToNoise`
 * and the worst interference stays at or below `maxInterference`; otherwise the binding reason (the weakest target,
 * or the worst pair).
 */
export function verdictOf(
  names: readonly string[],
  signalToNoise: readonly (number | null)[],
  worst: { value: number; from: string | null; into: string | null },
  thresholds: { minSignalToNoise: number; maxInterference: number },
): DesignVerdict {
  let weakest = -1;
  signalToNoise.forEach((s, t) => {
    const value = s ?? 0;
    if (weakest < 0 || value < (signalToNoise[weakest] ?? 0)) weakest = t;
  });
  const low = weakest >= 0 ? (signalToNoise[weakest] ?? 0) : 0;
  if (weakest >= 0 && low < thresholds.minSignalToNoise) {
    return {
      verdict: 'no_usable_panel',
      reason:
        `${names[weakest]} reaches a signal-to-noise of only ${low.toPrecision(3)} after unmixing (at least ` +
        `${thresholds.minSignalToNoise} needed)`,
    };
  }
  if (worst.value > thresholds.maxInterference) {
    return {
      verdict: 'no_usable_panel',
      reason:
        `the light of ${worst.from} in ${worst.into}'s channel is ${(100 * worst.value).toPrecision(3)} % of ` +
        `${worst.into}'s own (at most ${(100 * thresholds.maxInterference).toPrecision(3)} % allowed)`,
    };
  }
  return { verdict: 'usable', reason: '' };
}
