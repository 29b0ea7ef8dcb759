/**
 * The grid catalog of free mode: dots of every allowed material at emission peaks every `peakStepNm` across the part
 * of its reach inside the window, and bandpass channels centred every `bandStepNm` at each coarse width, inside the
 * window and clear of every excitation line by half the width plus the edge width. Two passbands conflict when their
 * FWHM intervals overlap (free-mode designs use non-overlapping bands).
 */
import type { Material } from '../dot/materials/types';
import type { ChannelSpec, ExcitationLine, ProbeSpec } from '../core/panel';
import type { ResolvedDesignOptions } from './options';
import { designProbe, designReachNm } from './request';
import { isStockBandpass } from '../light/filters/stock';
import { blocksItsLines, clearOfLines } from './practice';

/** A bandpass filter's centre and width (FWHM), nm. */
export interface Band {
  centerNm: number;
  widthNm: number;
}

/** The grid catalog: probes, channels (one bandpass each) with their bands, and the conflict rule. */
export interface FreeCatalog {
  probes: ProbeSpec[];
  channels: ChannelSpec[];
  bands: Band[];
  conflict: (a: number, b: number) => boolean;
}

/** True when two passbands' FWHM intervals overlap (touching is allowed). */
export function bandsOverlap(a: Band, b: Band): boolean {
  return Math.abs(a.centerNm - b.centerNm) < (a.widthNm + b.widthNm) / 2;
}

/** True when a passband, widened by the edge width on both sides, contains an excitation line. */
export function bandPassesLine(band: Band, excitation: ExcitationLine[], edgeWidthNm: number): boolean {
  return excitation.some((l) => Math.abs(l.wavelengthNm - band.centerNm) <= band.widthNm / 2 + edgeWidthNm);
}

/** The bandpass channel of a band, with the design's edge width. */
export function bandChannel(id: string, band: Band, edgeWidthNm: number): ChannelSpec {
  return { id, filters: [{ type: 'bandpass', centerNm: band.centerNm, widthNm: band.widthNm, edgeWidthNm }] };
}

/** Peaks on the grid (multiples of the step) inside both the material's reach and the window. */
export function peaksFor(material: Material, windowNm: [number, number], stepNm: number): number[] {
  const [r0, r1] = designReachNm(material);
  const lo = Math.max(Math.ceil(r0), windowNm[0]);
  const hi = Math.min(Math.floor(r1), windowNm[1]);
  const out: number[] = [];
  for (let nm = Math.ceil(lo / stepNm) * stepNm; nm <= hi; nm += stepNm) out.push(nm);
  return out;
}

/** Builds the grid catalog for the allowed materials, window, lines and options. */
export function freeCatalog(
  materials: Material[],
  windowNm: [number, number],
  excitation: ExcitationLine[],
  o: ResolvedDesignOptions,
): FreeCatalog {
  const probes: ProbeSpec[] = [];
  for (const m of materials) {
    for (const peak of peaksFor(m, windowNm, o.peakStepNm)) {
      if (clearOfLines(peak, excitation, o.lineClearanceNm)) probes.push(designProbe(`${m.id}-${peak}`, m, peak));
    }
  }
  const bands: Band[] = [];
  for (const widthNm of o.bandwidthsNm) {
    const first = Math.ceil((windowNm[0] + widthNm / 2) / o.bandStepNm) * o.bandStepNm;
    for (let centerNm = first; centerNm + widthNm / 2 <= windowNm[1]; centerNm += o.bandStepNm) {
      const band = { centerNm, widthNm };
      if (bandPassesLine(band, excitation, o.edgeWidthNm) || !isStockBandpass(centerNm, widthNm)) continue;
      if (blocksItsLines(bandChannel('c', band, o.edgeWidthNm), excitation, o.minBlockingOD)) bands.push(band);
    }
  }
  const channels = bands.map((b) => bandChannel(`bp-${b.centerNm}-${b.widthNm}`, b, o.edgeWidthNm));
  return { probes, channels, bands, conflict: (a, b) => bandsOverlap(bands[a], bands[b]) };
}
