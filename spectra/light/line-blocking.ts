/**
 * How well each channel blocks the excitation lines it is read under. Emission filters for fluorescence are commonly
 * specified to block the laser lines by at least OD 6 (common practice): less lets scattered excitation light reach
 * the detector, where it swamps weak fluorescence. A channel that blocks a line it sees by less than the panel's
 * threshold gets a warning naming the channel and the line.
 */
import type { PanelSpec } from '../core/panel';
import { filterTransmission } from './filters/filter';

/** OD a channel's filters should reach at every line it is read under (common practice), unless a panel says else. */
export const DEFAULT_MIN_BLOCKING_OD = 6;

/** Transmission of a channel's filters (all in series; the detector's QE aside) at one wavelength. */
export function filtersTransmissionAtNm(channel: PanelSpec['channels'][number], wavelengthNm: number): number {
  const grid = { startNm: wavelengthNm, stepNm: 1, count: 1 };
  let t = 1;
  channel.filters.forEach((filter, f) => (t *= filterTransmission(filter, grid, ['filters', f])[0]));
  return t;
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
): { blocking: LineBlocking[]; warnings: string[] } {
  const blocking: LineBlocking[] = [];
  const warnings: string[] = [];
  panel.channels.forEach((channel, c) => {
    for (const l of linesOnByChannel[c]) {
      const lineNm = panel.excitation[l].wavelengthNm;
      const t = filtersTransmissionAtNm(channel, lineNm);
      const od = t > 0 ? -Math.log10(t) : Infinity;
      blocking.push({ channel: c, line: l, od });
      // A hair of tolerance: a filter whose floor is exactly the threshold meets it.
      if (od < minOD - 1e-9) {
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
