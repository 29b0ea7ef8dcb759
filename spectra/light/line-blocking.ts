/**
 * How well each channel blocks the excitation lines it is read under. Emission filters for fluorescence are commonly
 * specified to block the laser lines by at least OD 6 (common practice): less lets scattered excitation light reach
 * the detector, where it swamps weak fluorescence. A channel that blocks a line it sees by less than the panel's
 * threshold gets a warning naming the channel and the line.
 */
import type { PanelSpec } from '../core/panel';
import { seriesAtNm } from './light-path';
import { detectorQe } from './detectors';

/** OD a channel's filters should reach at every line it is read under (common practice), unless a panel says else. */
export const DEFAULT_MIN_BLOCKING_OD = 6;

/**
 * How far below a blocking threshold, in OD, a filter may fall and still meet it: a bandpass whose floor is exactly
 * the threshold adds a few 1e-15 of its edges' tails at a line 35 nm away (440/40 at 405 nm), which must not fail an
 * OD 6 check. 1e-6 OD is a relative 2.3e-6 in transmission (our choice; far below any filter's tolerance).
 */
export const BLOCKING_OD_TOLERANCE = 1e-6;

/** Transmission of a channel's filters (all in series; the detector's QE aside) at one wavelength. */
export function filtersTransmissionAtNm(channel: PanelSpec['channels'][number], wavelengthNm: number): number {
  return seriesAtNm(channel.filters, wavelengthNm, ['filters']);
}

/**
 * The transmission of each channel's filters at each line it is read under, [c][l] (0 for a line it is not read
 * under): what the blocking check and the leak both read, computed once.
 */
export function filtersAtLines(panel: PanelSpec, linesOnByChannel: number[][]): number[][] {
  return panel.channels.map((channel, c) => {
    const row = new Array<number>(panel.excitation.length).fill(0);
    for (const l of linesOnByChannel[c]) row[l] = filtersTransmissionAtNm(channel, panel.excitation[l].wavelengthNm);
    return row;
  });
}

/** One channel's blocking of one line it sees: the optical density −log10 T of its filters at the line. */
export interface LineBlocking {
  channel: number;
  line: number;
  od: number;
}

/**
 * The blocking of every line in every channel read under it (`linesOnByChannel[c]`: indices into panel.excitation),
 * and a warning for each below `minOD` (default DEFAULT_MIN_BLOCKING_OD).
 */
export function lineBlocking(
  panel: PanelSpec,
  linesOnByChannel: number[][],
  minOD = DEFAULT_MIN_BLOCKING_OD,
  atLines = filtersAtLines(panel, linesOnByChannel),
): { blocking: LineBlocking[]; warnings: string[] } {
  const blocking: LineBlocking[] = [];
  const warnings: string[] = [];
  panel.channels.forEach((channel, c) => {
    for (const l of linesOnByChannel[c]) {
      const lineNm = panel.excitation[l].wavelengthNm;
      const t = atLines[c][l];
      const od = t > 0 ? -Math.log10(t) : Infinity;
      blocking.push({ channel: c, line: l, od });
      if (od < minOD - BLOCKING_OD_TOLERANCE) {
        const name = channel.label ? `${channel.label} (${channel.id})` : channel.id;
        warnings.push(
          `channel ${name} blocks the ${lineNm} nm line it is read under by only OD ${od.toFixed(1)} (less than OD ` +
            `${minOD}): scattered excitation light will reach its detector`,
        );
      }
    }
  });
  return { blocking, warnings };
}

/**
 * Scattered excitation light reaching the detector before any filter, in the units of `collected`: a sample property
 * (`scatterLevel` of a panel). Default 1e10, this tool's convention (ours, M): a tissue section scatters about 1e5
 * times the light of a bright probe (ε × QY = 1e5 M⁻¹ cm⁻¹ at abundance 1, the background's reference) towards the
 * detector, so a filter at OD 6 lets through a tenth of such a probe's light: the reason emission filters are
 * specified at OD ≥ 6 at the laser lines (common practice). Real samples differ by orders of magnitude (clear cells
 * scatter far less, thick or fatty tissue more).
 */
export const DEFAULT_SCATTER_LEVEL = 1e10;

/**
 * Excitation light leaking into each channel, lineLeak[c][l] = powerRel × scatterLevel × T_c(λ_l) for every line l the
 * channel is read under (0 for the others), with T_c the channel's filters times its detector's QE at the line.
 */
export function lineLeak(
  panel: PanelSpec,
  linesOnByChannel: number[][],
  scatterLevel: number,
  atLines = filtersAtLines(panel, linesOnByChannel),
): number[][] {
  return panel.channels.map((channel, c) => {
    const row = new Array<number>(panel.excitation.length).fill(0);
    for (const l of linesOnByChannel[c]) {
      const line = panel.excitation[l];
      const grid = { startNm: line.wavelengthNm, stepNm: 1, count: 1 };
      const qe = channel.detector === undefined ? 1 : detectorQe(channel.detector, grid)[0];
      row[l] = (line.powerRel ?? 1) * scatterLevel * atLines[c][l] * qe;
    }
    return row;
  });
}
