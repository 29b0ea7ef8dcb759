/**
 * What the compact rows of the probe and channel editors say about each probe and channel while closed: one short
 * text per column, and the columns' headings.
 */
import { SHELL_MATERIALS, listDyes, type ChannelSpec, type ProbeSpec } from '../../spectra/index';
import { describeChannel, describeChannelExcitation } from '../io/filter-text';
import type { ProbePrediction } from './compute';

/** Headings of the probe rows' columns, the name first. */
export const PROBE_COLUMNS = ['Probe', 'Made of', 'Peak', 'FWHM', 'Channel', 'Brightness'] as const;

/** Headings of the channel rows' columns, the name first. */
export const CHANNEL_COLUMNS = ['Channel', 'Filters', 'Excitation', 'Detector'] as const;

/** A number with `digits` decimals, or a dash when there is none. */
export const fmt = (v: number | null | undefined, digits = 0): string =>
  v === null || v === undefined || !Number.isFinite(v) ? '—' : v.toFixed(digits);

/** A share 0–1 as a whole percentage, "< 1 %" for a share that is small but not zero. */
export const percent = (share: number): string => (share > 0 && share < 0.005 ? '< 1 %' : `${fmt(share * 100)} %`);

const DYES = listDyes();

/** How the page names a channel with no detector class chosen. */
export const IDEAL_DETECTOR = 'ideal (QE 1)';

/** "CdSe/ZnS" (core, then each shell layer, inside out), a dye's name, or the material's name. */
export function madeOf(probe: ProbeSpec, materialName: string): string {
  if (probe.material === 'dye') return DYES.find((d) => d.id === probe.dye)?.name ?? materialName;
  const layers = (probe.shell ?? []).map((l) => SHELL_MATERIALS[l.material].name.replace(/ \(.*\)$/, ''));
  return [materialName, ...layers].join('/');
}

/**
 * The cells after a probe row's name: what it is made of, its emission peak and FWHM (predicted; dashes while the
 * prediction is out of date), its channel (assigned, or "auto: " the channel that collects most of its light, index
 * `primary` of `channels`, when known) and its relative brightness.
 */
export function probeCells(
  probe: ProbeSpec,
  materialName: string,
  prediction: ProbePrediction | undefined,
  channels: readonly Pick<ChannelSpec, 'id' | 'label'>[],
  primary?: number | null,
): string[] {
  const pr = prediction;
  const peakNm = pr ? pr.emissionPeakNm : probe.emissionPeakNm;
  const assigned = channels.find((c) => c.id === probe.channel);
  const most = primary === null || primary === undefined ? undefined : channels[primary];
  const channel = assigned ? assigned.label || assigned.id : most && pr ? `auto: ${most.label || most.id}` : 'auto';
  return [
    madeOf(probe, materialName),
    peakNm === undefined ? '—' : `${fmt(peakNm)} nm`,
    pr ? `${fmt(pr.fwhmNm)} nm` : '—',
    channel,
    pr ? percent(pr.relativeBrightness) : '—',
  ];
}

/** The cells after a channel row's name: its filters, its excitation lines and its detector's name. */
export function channelCells(channel: ChannelSpec, detectors: readonly { id: string; name: string }[]): string[] {
  const detector = detectors.find((d) => d.id === channel.detector);
  return [describeChannel(channel), describeChannelExcitation(channel), detector ? detector.name : IDEAL_DETECTOR];
}
