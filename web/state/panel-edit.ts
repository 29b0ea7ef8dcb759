/**
 * Immutable edits of a panel: each returns a new PanelSpec, so the app can keep the last good state and compare.
 */
import {
  LIMITS,
  TYPICAL_SHELLS,
  type ChannelSpec,
  type FilterSpec,
  type PanelSpec,
  type ProbeSpec,
} from '../../spectra/index';
import { filterName } from './instrument';

/** A new, empty panel with one 405 nm line. */
export function newPanel(): PanelSpec {
  return {
    version: 1,
    title: 'Untitled panel',
    excitation: [{ wavelengthNm: 405, powerRel: 1 }],
    probes: [],
    channels: [],
  };
}

/** The first id "<prefix><n>" not yet used. */
export function nextId(prefix: string, used: readonly { id: string }[]): string {
  const taken = new Set(used.map((u) => u.id));
  for (let n = 1; ; n++) if (!taken.has(`${prefix}${n}`)) return `${prefix}${n}`;
}

/** Replaces probe `index` by `probe`. */
export function setProbe(panel: PanelSpec, index: number, probe: ProbeSpec): PanelSpec {
  return { ...panel, probes: panel.probes.map((p, i) => (i === index ? probe : p)) };
}

/** The label a channel's filters give it: their sizes in the trade's notation, e.g. "655/20" or "500 LP + 655/20". */
export function labelFromFilters(filters: readonly FilterSpec[]): string {
  return filters.map(filterName).join(' + ');
}

/**
 * A channel after an edit, its label following its filters unless the user named it. The label counts as named by the
 * user when, at the time of the edit, it is not empty and differs from what the old filters give (so a label typed
 * as exactly "655/20" on a 655/20 filter follows too); an edit that changes the label itself keeps the new label.
 */
export function followFilters(before: ChannelSpec, after: ChannelSpec): ChannelSpec {
  if (JSON.stringify(before.filters) === JSON.stringify(after.filters)) return after;
  if (after.label !== before.label) return after;
  if (before.label && before.label !== labelFromFilters(before.filters)) return after;
  return { ...after, label: labelFromFilters(after.filters) };
}

/** Replaces channel `index` by `channel`, its label following its filters unless the user named it (followFilters). */
export function setChannel(panel: PanelSpec, index: number, channel: ChannelSpec): PanelSpec {
  return { ...panel, channels: panel.channels.map((c, i) => (i === index ? followFilters(c, channel) : c)) };
}

/** Replaces filter `filterIndex` of channel `channelIndex`. */
export function setFilter(panel: PanelSpec, channelIndex: number, filterIndex: number, filter: FilterSpec): PanelSpec {
  const channel = panel.channels[channelIndex];
  return setChannel(panel, channelIndex, {
    ...channel,
    filters: channel.filters.map((f, i) => (i === filterIndex ? filter : f)),
  });
}

/** Adds a CdSe/ZnS dot at 605 nm with CdSe's typical shell (a mid-visible start the user then edits). */
export function addProbe(panel: PanelSpec): PanelSpec {
  const id = nextId('p', panel.probes);
  const shell = TYPICAL_SHELLS.cdse.map((layer) => ({ ...layer }));
  return {
    ...panel,
    probes: [
      ...panel.probes,
      { id, label: `Probe ${id.slice(1)}`, material: 'cdse', emissionPeakNm: 605, shell, abundance: 1 },
    ],
  };
}

/** Adds a bandpass channel at 605/20. */
export function addChannel(panel: PanelSpec): PanelSpec {
  const id = nextId('c', panel.channels);
  return {
    ...panel,
    channels: [
      ...panel.channels,
      { id, label: `Channel ${id.slice(1)}`, filters: [{ type: 'bandpass', centerNm: 605, widthNm: 20 }] },
    ],
  };
}

/** Removes probe `index` (and nothing else: channels keep their ids). */
export function removeProbe(panel: PanelSpec, index: number): PanelSpec {
  return { ...panel, probes: panel.probes.filter((_, i) => i !== index) };
}

/** Removes channel `index` and un-assigns probes that pointed at it. */
export function removeChannel(panel: PanelSpec, index: number): PanelSpec {
  const gone = panel.channels[index]?.id;
  return {
    ...panel,
    channels: panel.channels.filter((_, i) => i !== index),
    probes: panel.probes.map((p) => (p.channel === gone ? { ...p, channel: undefined } : p)),
  };
}

/**
 * Sharpest edge a detector bin gets, nm (10–90 %): bins of a spectral detector are close to rectangular (common
 * practice).
 */
const BIN_EDGE_NM = 1;

/**
 * Adds a spectral detector run: `bins` contiguous bandpass channels of `binWidthNm` each, starting at `startNm`.
 * Returns the panel unchanged if the run would exceed `maxChannels` in total.
 */
export function addSpectralRun(
  panel: PanelSpec,
  startNm: number,
  bins: number,
  binWidthNm: number,
  maxChannels: number = LIMITS.channels,
): PanelSpec {
  const channels = [...panel.channels];
  if (channels.length + bins > maxChannels) return panel;
  for (let k = 0; k < bins; k++) {
    const lo = startNm + k * binWidthNm;
    const id = nextId('c', channels);
    channels.push({
      id,
      label: `bin ${lo}–${lo + binWidthNm}`,
      filters: [{ type: 'bandpass', centerNm: lo + binWidthNm / 2, widthNm: binWidthNm, edgeWidthNm: BIN_EDGE_NM }],
    });
  }
  return { ...panel, channels };
}
