/**
 * Which page of a pilot image each panel channel reads. Without OME-XML, page i is channel i. With it, a channel
 * takes the page whose OME channel name is the channel's label or id, else the page whose emission wavelength is
 * nearest the channel's passband centre (the transmission-weighted mean wavelength of its filters and detector),
 * each page used once while any is left. The user can change every choice.
 */
import { channelTransmission, DEFAULT_GRID, type ChannelSpec } from '../../spectra/index';
import type { OmeChannel } from '../io/ome-xml';

/** The passband centre of a channel in nm: Σ λ·T(λ) / Σ T(λ) on the default grid; null when nothing passes. */
export function passbandCentreNm(channel: ChannelSpec): number | null {
  const t = channelTransmission(channel, DEFAULT_GRID);
  let weight = 0;
  let sum = 0;
  t.forEach((v, i) => {
    weight += v;
    sum += v * (DEFAULT_GRID.startNm + i * DEFAULT_GRID.stepNm);
  });
  return weight > 0 ? sum / weight : null;
}

const same = (a: string | undefined, b: string) => a !== undefined && a.trim().toLowerCase() === b.trim().toLowerCase();

/** The proposed page index for each channel, in the panel's channel order (needs pages ≥ channels). */
export function proposeMapping(
  channels: readonly ChannelSpec[],
  pages: number,
  ome: readonly OmeChannel[] | null,
): number[] {
  if (!ome || ome.length !== pages) return channels.map((_, c) => c);
  const used = new Set<number>();
  const chosen: (number | null)[] = channels.map((channel) => {
    const page = ome.findIndex((o, i) => !used.has(i) && (same(channel.label, o.name) || same(channel.id, o.name)));
    if (page < 0) return null;
    used.add(page);
    return page;
  });
  return chosen.map((page, c) => {
    if (page !== null) return page;
    const centre = passbandCentreNm(channels[c]);
    let best = -1;
    let bestGap = Infinity;
    ome.forEach((o, i) => {
      const gap = centre === null || o.emissionNm === null ? Infinity : Math.abs(o.emissionNm - centre);
      if (!used.has(i) && (gap < bestGap || best < 0)) {
        best = i;
        bestGap = gap;
      }
    });
    // Every page already taken: the nearest one overall (the user sees the same page twice in the table).
    if (best < 0) best = Math.min(c, pages - 1);
    used.add(best);
    return best;
  });
}
