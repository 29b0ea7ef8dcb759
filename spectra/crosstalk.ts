/**
 * Crosstalk under the signal model of api-v1 ("The signal model"):
 *   collected[c][p] = Σ over lines l on in c of powerRel_l × ε_p(λl) × QY_p × abundance_p × Σλ em_p(λ) T_c(λ) Δλ,
 * with T_c = Π filters × detector QE. A probe's emission may depend on the line (carbon dots), so each probe is a list
 * of components: one emission spectrum and, per channel, the summed weight of the lines that excite that emission.
 * Spillover follows the flow-cytometry definition (Bagwell & Adams, Ann. N.Y. Acad. Sci. 1993, 677, 167; Roederer,
 * Cytometry 2001, 45, 194; both from memory): signal in a channel over the signal in the probe's primary channel.
 */
import type { ChannelSpec, ExcitationLine } from './panel';
import { SpectraError } from './errors';
import { channelSupport, type ChannelSupport, type ConstantEnds } from './linalg/runs';
import { gridEmissionWindow, runSums, windowOverlap, type EmissionWindow } from './emission-window';

/** One emission spectrum of a probe and its weight in each channel (Σ powerRel × ε × QY × abundance over lines on). */
export interface EmissionComponent {
  emission: Float64Array;
  weightByChannel: Float64Array;
}

/**
 * Below this relative size a spillover or interference is flagged as under the model's resolution: modelled line
 * shapes are Gaussian, whose tails fall far faster than the red tails of real dot ensembles, so values under 1e-3 of
 * the primary signal say "small", not how small (a choice of this tool; common practice treats < 0.1 % as negligible).
 */
export const RESOLUTION_THRESHOLD = 1e-3;

// Two lines closer than this are the same line (a channel's excitationNm names lines of the panel).
const LINE_MATCH_NM = 0.5;

/** Indices of the panel's lines that are on while channel c is read (default: all). Errors name the field. */
export function linesOn(channel: ChannelSpec, lines: ExcitationLine[], path: (string | number)[]): number[] {
  if (channel.excitationNm === undefined) return lines.map((_, l) => l);
  const wanted = Array.isArray(channel.excitationNm) ? channel.excitationNm : [channel.excitationNm];
  if (wanted.length === 0)
    throw new SpectraError('invalid_input', 'excitationNm must name at least one line', [...path, 'excitationNm']);
  return [
    ...new Set(
      wanted.map((nm, k) => {
        const at = Array.isArray(channel.excitationNm) ? [...path, 'excitationNm', k] : [...path, 'excitationNm'];
        const l =
          typeof nm === 'number' ? lines.findIndex((line) => Math.abs(line.wavelengthNm - nm) < LINE_MATCH_NM) : -1;
        if (l < 0) {
          throw new SpectraError(
            'invalid_input',
            `excitationNm ${String(nm)} is not one of the panel's lines (${lines.map((x) => x.wavelengthNm).join(', ')} nm)`,
            at,
          );
        }
        return l;
      }),
    ),
  ].sort((a, b) => a - b);
}

/** One emission of a probe as its nonzero window (see emission-window.ts) and its weight in each channel. */
export interface WindowComponent {
  emission: EmissionWindow;
  weightByChannel: Float64Array;
}

// Grid-long emission arrays given to collectedColumn come back call after call (a design search, the dot cache of
// buildPanelModel): keep their windows beside them (found by a scan of the whole array), dropped with the array.
const windowOf = new WeakMap<Float64Array, EmissionWindow>();

function cachedWindow(em: Float64Array): EmissionWindow {
  let w = windowOf.get(em);
  if (!w) {
    w = gridEmissionWindow(em);
    windowOf.set(em, w);
  }
  return w;
}

// Scratch for the run sums of one emission (grown to the most channels seen).
let leftSums = new Float64Array(64);
let rightSums = new Float64Array(64);

/** collectedColumn for emissions held as windows (what panel evaluation uses). */
export function collectedColumnOfWindows(
  components: WindowComponent[],
  supports: ChannelSupport[],
  stepNm: number,
): number[] {
  const channels = supports.length;
  if (leftSums.length < channels) {
    leftSums = new Float64Array(channels);
    rightSums = new Float64Array(channels);
  }
  const column = new Array<number>(channels).fill(0);
  for (let k = 0; k < components.length; k++) {
    const { emission, weightByChannel } = components[k];
    runSums(emission, supports, leftSums, rightSums);
    for (let c = 0; c < channels; c++) {
      const w = weightByChannel[c];
      if (w !== 0) column[c] += w * windowOverlap(emission, supports[c], leftSums[c], rightSums[c]) * stepNm;
    }
  }
  return column;
}

/**
 * One probe's column of collected (one value per channel), Σλ em T Δλ taken over each channel's runs and window.
 * The emission's sums over the left runs are accumulated from the blue end, those over the right runs from the red
 * end, so a tiny tail is never the difference of two large sums (it matters against a 10^-12 blocking floor). Only
 * the part of the channel's window where the emission is not 0 is summed point by point.
 * Emission arrays must not be changed after their first use here (their nonzero windows are kept).
 */
export function collectedColumn(components: EmissionComponent[], supports: ChannelSupport[], stepNm: number): number[] {
  return collectedColumnOfWindows(
    components.map((c) => ({ emission: cachedWindow(c.emission), weightByChannel: c.weightByChannel })),
    supports,
    stepNm,
  );
}

/** collected[c][p] for every channel and probe; `ends[c]` (optional) is what channelTransmission reported. */
export function collectedMatrix(
  probes: EmissionComponent[][],
  transmissions: Float64Array[],
  stepNm: number,
  ends?: ConstantEnds[],
): number[][] {
  const supports = transmissions.map((t, c) => channelSupport(t, ends?.[c]));
  const columns = probes.map((components) => collectedColumn(components, supports, stepNm));
  return transmissions.map((_, c) => columns.map((col) => col[c]));
}

/** collectedMatrix for emissions held as windows (panel evaluation's form). */
export function collectedMatrixOfWindows(
  probes: WindowComponent[][],
  transmissions: Float64Array[],
  stepNm: number,
  ends?: ConstantEnds[],
): number[][] {
  const supports = transmissions.map((t, c) => channelSupport(t, ends?.[c]));
  const columns = probes.map((components) => collectedColumnOfWindows(components, supports, stepNm));
  return transmissions.map((_, c) => columns.map((col) => col[c]));
}

/** The worst pair: the probe whose light intrudes most, relative to the victim's own signal in its primary channel. */
export interface WorstInterference {
  from: string | null;
  into: string | null;
  interference: number | null;
}

/** Figures read off a collected matrix. */
export interface CrosstalkFigures {
  primaryChannel: (number | null)[];
  spillover: (number | null)[][];
  purity: (number | null)[];
  belowResolution: boolean[][];
  worst: WorstInterference;
  warnings: string[];
}

/**
 * Primary channel (the assigned one, else the argmax), spillover[c][p] = collected[c][p] / collected[primary(p)][p],
 * purity[c] = share of channel c's probe signal from probes whose primary channel is c, and the worst
 * interference(t→u) = collected[primary(u)][t] / collected[primary(u)][u]. Undefined ratios are null with a warning.
 */
export function crosstalkFigures(
  collected: number[][],
  assigned: (number | undefined)[],
  probeIds: string[],
  channelIds: string[],
): CrosstalkFigures {
  // Plain loops (no callbacks): this runs on every evaluation and 2 × probes more times in the lot-shift check.
  const warnings: string[] = [];
  const channels = collected.length;
  const probes = probeIds.length;
  const primaryChannel: (number | null)[] = [];
  const primarySignal: number[] = [];
  for (let p = 0; p < probes; p++) {
    let c: number | null;
    if (assigned[p] !== undefined) c = assigned[p]!;
    else {
      let best = 0;
      for (let k = 1; k < channels; k++) if (collected[k][p] > collected[best][p]) best = k;
      c = collected[best][p] > 0 ? best : null;
    }
    primaryChannel.push(c);
    primarySignal.push(c === null ? 0 : collected[c][p]);
  }
  for (let p = 0; p < probes; p++) {
    if (primarySignal[p] > 0) continue;
    const c = primaryChannel[p];
    warnings.push(
      c === null
        ? `probe ${probeIds[p]} gives no signal in any channel (is any line absorbed by it?): its spillover is undefined`
        : `probe ${probeIds[p]} gives no signal in its channel ${channelIds[c]}: its spillover is undefined`,
    );
  }
  const spillover: (number | null)[][] = [];
  const belowResolution: boolean[][] = [];
  const purity: (number | null)[] = [];
  for (let c = 0; c < channels; c++) {
    const row = collected[c];
    const spillRow: (number | null)[] = [];
    const belowRow: boolean[] = [];
    let total = 0;
    let own = 0;
    for (let p = 0; p < row.length; p++) {
      const v = row[p];
      const s = primarySignal[p] > 0 ? v / primarySignal[p] : null;
      spillRow.push(s);
      belowRow.push(s !== null && s < RESOLUTION_THRESHOLD);
      total += v;
      own += primaryChannel[p] === c ? v : 0;
    }
    spillover.push(spillRow);
    belowResolution.push(belowRow);
    if (total > 0) purity.push(own / total);
    else {
      warnings.push(`channel ${channelIds[c]} collects no probe signal: its purity is undefined`);
      purity.push(null);
    }
  }
  const worst: WorstInterference = { from: null, into: null, interference: null };
  for (let u = 0; u < probes; u++) {
    const cu = primaryChannel[u];
    if (cu === null || !(primarySignal[u] > 0)) continue;
    for (let t = 0; t < probes; t++) {
      if (t === u) continue;
      const value = collected[cu][t] / primarySignal[u];
      if (worst.interference === null || value > worst.interference) {
        worst.from = probeIds[t];
        worst.into = probeIds[u];
        worst.interference = value;
      }
    }
  }
  if (probes > 1 && worst.interference !== null && worst.interference < RESOLUTION_THRESHOLD) {
    warnings.push(
      `the worst interference (${worst.interference.toExponential(1)}) is below the model's resolution (${RESOLUTION_THRESHOLD}): real red tails may be larger`,
    );
  }
  return { primaryChannel, spillover, purity, belowResolution, worst, warnings };
}
