/**
 * The page's side of instrument profiles: a panel on an instrument is held written out (so every editor works on it
 * as on any panel) together with the profile's id; it is sent and stored as a request naming the profile. Switching
 * instrument, making a profile of the panel's microscope, and what a switch changed are pure functions here.
 */
import {
  instrumentChannels,
  instrumentLightPath,
  instrumentLines,
  type ChannelPresetSpec,
  type FilterSpec,
  type InstrumentSpec,
  type NamedFilterSpec,
  type PanelEvaluation,
  type PanelOnInstrumentSpec,
  type PanelSpec,
} from '../../spectra/index';

/** The profile a panel is on: its id (the link /i/<id>) and its content. */
export interface AttachedInstrument {
  id: string;
  spec: InstrumentSpec;
}

/** The request the API takes for a panel on an instrument: its own parts, the profile's path by reference. */
export function toRequest(panel: PanelSpec, instrument: AttachedInstrument | undefined): PanelOnInstrumentSpec {
  if (!instrument) return panel;
  const { lightPath: _fromProfile, ...own } = panel;
  return { ...own, instrument: instrument.id };
}

/**
 * The panel moved onto an instrument: the profile's lasers, shared path and channel presets replace the panel's own
 * (a profile without presets keeps the panel's channels); probes keep their fields, and a probe's channel choice is
 * kept only when the new channels have that id.
 */
export function switchInstrument(panel: PanelSpec, spec: InstrumentSpec): PanelSpec {
  const presets = instrumentChannels(spec);
  const channels = presets.length ? presets : panel.channels;
  const ids = new Set(channels.map((c) => c.id));
  const lines = new Set(spec.lasers.map((l) => l.wavelengthNm));
  const { lightPath: _old, ...rest } = panel;
  const lightPath = instrumentLightPath(spec);
  return {
    ...rest,
    excitation: instrumentLines(spec),
    channels: channels.map((c) => keepKnownLines(c, lines)),
    probes: panel.probes.map(({ channel, ...probe }) =>
      channel !== undefined && ids.has(channel) ? { ...probe, channel } : probe,
    ),
    ...(lightPath ? { lightPath } : {}),
  };
}

/** A kept channel's lines, less those the new instrument lacks (all lines when none is left). */
function keepKnownLines<C extends { excitationNm?: number | number[] }>(channel: C, lines: Set<number>): C {
  if (channel.excitationNm === undefined) return channel;
  const list = (Array.isArray(channel.excitationNm) ? channel.excitationNm : [channel.excitationNm]).filter((nm) =>
    lines.has(nm),
  );
  const { excitationNm: _old, ...rest } = channel;
  return (list.length === 0 ? rest : { ...rest, excitationNm: list.length === 1 ? list[0] : list }) as C;
}

/** The name a filter is known by in a profile made from a panel: its size in the trade's notation. */
export function filterName(filter: FilterSpec): string {
  switch (filter.type) {
    case 'bandpass':
      return `${filter.centerNm}/${filter.widthNm}`;
    case 'longpass':
      return `${filter.edgeNm} LP`;
    case 'shortpass':
      return `${filter.edgeNm} SP`;
    case 'dichroic':
      return `dichroic ${filter.edgeNm} (passes ${filter.passes})`;
    case 'table':
      return `measured filter ${filter.points[0][0]}–${filter.points[filter.points.length - 1][0]} nm`;
  }
}

/** Named filters, one per distinct filter, each name made unique with a number when two differ but share it. */
function nameFilters(filters: readonly FilterSpec[], taken: Set<string>): Map<string, NamedFilterSpec> {
  const byKey = new Map<string, NamedFilterSpec>();
  for (const filter of filters) {
    const key = JSON.stringify(filter);
    if (byKey.has(key)) continue;
    let name = filterName(filter);
    for (let n = 2; taken.has(name); n++) name = `${filterName(filter)} (${n})`;
    taken.add(name);
    byKey.set(key, { name, filter });
  }
  return byKey;
}

/** What a profile made from a panel needs besides the panel: its name, description and each line's power. */
export interface ProfileFields {
  name: string;
  description: string;
  /** Power at the sample per line of the panel, mW, in the panel's line order. */
  powersMw: number[];
}

/**
 * An instrument profile describing the microscope a panel is set up for: its lines (at the given powers), its shared
 * path as the dichroics and clean-up filters, every distinct channel filter by its size, its detectors, and its
 * channels as presets.
 */
export function profileFromPanel(panel: PanelSpec, fields: ProfileFields): InstrumentSpec {
  const taken = new Set<string>();
  const dichroics = [...nameFilters(panel.lightPath?.emissionFilters ?? [], taken).values()];
  const cleanUp = [...nameFilters(panel.lightPath?.excitationFilters ?? [], taken).values()];
  const filters = nameFilters(
    panel.channels.flatMap((c) => c.filters),
    taken,
  );
  const detectorTypes = [...new Set(panel.channels.flatMap((c) => (c.detector ? [c.detector] : [])))];
  const channels: ChannelPresetSpec[] = panel.channels.map((c) => ({
    id: c.id,
    ...(c.label ? { label: c.label } : {}),
    filters: c.filters.map((f) => filters.get(JSON.stringify(f))!.name),
    ...(c.excitationNm !== undefined ? { excitationNm: c.excitationNm } : {}),
    ...(c.detector ? { detector: c.detector } : {}),
  }));
  return {
    version: 1,
    name: fields.name,
    ...(fields.description ? { description: fields.description } : {}),
    lasers: panel.excitation.map((line, l) => ({ wavelengthNm: line.wavelengthNm, powerMw: fields.powersMw[l] })),
    ...(dichroics.length ? { dichroics } : {}),
    ...(cleanUp.length ? { excitationFilters: cleanUp } : {}),
    ...(filters.size ? { filters: [...filters.values()] } : {}),
    ...(detectorTypes.length ? { detectors: detectorTypes.map((type) => ({ name: type, type })) } : {}),
    ...(channels.length ? { channels } : {}),
  };
}

/** One probe's figures before and after a switch: its channel and the light collected there. */
export interface ProbeChange {
  probe: string;
  before: { channel: string | null; collected: number | null };
  after: { channel: string | null; collected: number | null };
}

/** What a switch of instrument changed, for the page to show next to an undo. */
export interface InstrumentChanges {
  from: string;
  to: string;
  linesNm: { before: number[]; after: number[] };
  channels: { before: number; after: number };
  probes: ProbeChange[];
  /** Warnings the new set-up has that the old did not (line blocking, for instance). */
  newWarnings: string[];
}

function probeFigures(panel: PanelSpec, evaluation: PanelEvaluation, p: number) {
  const c = evaluation.primaryChannel[p];
  if (c === null || c === undefined) return { channel: null, collected: null };
  const channel = panel.channels[c];
  return { channel: channel.label ?? channel.id, collected: evaluation.collected[c][p] };
}

/** Compares a panel's figures before and after a switch of instrument (probes matched by id). */
export function instrumentChanges(
  before: { name: string; panel: PanelSpec; evaluation: PanelEvaluation },
  after: { name: string; panel: PanelSpec; evaluation: PanelEvaluation },
): InstrumentChanges {
  const old = new Set(before.evaluation.warnings);
  return {
    from: before.name,
    to: after.name,
    linesNm: {
      before: before.panel.excitation.map((l) => l.wavelengthNm),
      after: after.panel.excitation.map((l) => l.wavelengthNm),
    },
    channels: { before: before.panel.channels.length, after: after.panel.channels.length },
    probes: after.panel.probes.flatMap((probe, p) => {
      const q = before.panel.probes.findIndex((x) => x.id === probe.id);
      if (q < 0) return [];
      return [
        {
          probe: probe.label ?? probe.id,
          before: probeFigures(before.panel, before.evaluation, q),
          after: probeFigures(after.panel, after.evaluation, p),
        },
      ];
    }),
    newWarnings: after.evaluation.warnings.filter((w) => !old.has(w)),
  };
}
