/**
 * Crosstalk under the signal model (docs/api.md, "The signal model"):
 *   collected[c][p] = Σ over lines l on in c of powerRel_l × ε_p(λl) × QY_p × abundance_p × Σλ em_p(λ) T_c(λ) Δλ,
 * with T_c = Π filters × detector QE. A probe's emission may depend on the line (carbon dots), so each probe is a list
 * of components: one emission spectrum and, per channel, the summed weight of the lines that excite that emission.
 * Spillover follows the flow-cytometry definition (Bagwell & Adams, Ann. N.Y. Acad. Sci. 1993, 677, 167; Roederer,
 * Cytometry 2001, 45, 194; both from memory): signal in a channel over the signal in the probe's primary channel.
 */
import type { ChannelSpec, ExcitationLine } from '../core/panel';
import { dotAt } from '../kernels/dot';

/**
 * One emission spectrum of a probe, held from grid index `from` on (0 elsewhere), and its weight in each channel:
 * Σ powerRel × ε × QY × abundance over the lines that excite this emission and are on in that channel.
 */
export interface EmissionComponent {
  emission: number[];
  from: number;
  weightByChannel: number[];
}

/**
 * Below this relative size a spillover or interference is flagged as under the model's resolution: modelled line
 * shapes are Gaussian, whose tails fall far faster than the red tails of real dot ensembles, so values under 1e-3 of
 * the primary signal say "small", not how small (a choice of this tool; common practice treats < 0.1 % as negligible).
 */
export const RESOLUTION_THRESHOLD = 1e-3;

/** Indices of the panel's lines that are on while a channel is read (default: all). */
export function linesOn(channel: ChannelSpec, lines: ExcitationLine[]): number[] {
  if (channel.excitationNm === undefined) return lines.map((_, l) => l);
  const wanted = Array.isArray(channel.excitationNm) ? channel.excitationNm : [channel.excitationNm];
  // Each wavelength names the first line at it (a panel may list one wavelength twice).
  const on = new Set(wanted.map((nm) => lines.findIndex((line) => line.wavelengthNm === nm)));
  on.delete(-1);
  return [...on].sort((a, b) => a - b);
}

/** Σλ em(λ) T(λ) Δλ over the points where the emission is held (T on every grid point). */
function overlap(component: EmissionComponent, transmission: number[], stepNm: number): number {
  return dotAt(component.emission, transmission, component.from) * stepNm;
}

/** collected[c][p] for every channel and probe: Σ over the probe's components of weight × overlap. */
export function collectedMatrix(probes: EmissionComponent[][], transmissions: number[][], stepNm: number): number[][] {
  return transmissions.map((t, c) =>
    probes.map((components) => {
      let sum = 0;
      for (const component of components) {
        const w = component.weightByChannel[c];
        if (w !== 0) sum += w * overlap(component, t, stepNm);
      }
      return sum;
    }),
  );
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
        ? `probe ${probeIds[p]} gives no signal in any channel (is any line absorbed by it?): its spillover is ` +
            `undefined`
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
      `the worst interference (${worst.interference.toExponential(1)}) is below the model's resolution ` +
        `(${RESOLUTION_THRESHOLD}): real red tails may be larger`,
    );
  }
  return { primaryChannel, spillover, purity, belowResolution, worst, warnings };
}
