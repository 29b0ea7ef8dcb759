/**
 * Instrument profiles: a microscope described once (its lasers, the dichroics and clean-up filters every channel
 * shares, the emission filters it has, its detectors and its usual channels) so that a panel can name it instead of
 * writing those parts out. Resolving a panel against its instrument gives the panel with the parts written out, and
 * evaluating a panel that names an instrument is evaluating that written-out panel.
 */
import { SpectraError } from '../core/errors';
import type { ChannelSpec, ExcitationLine, FilterSpec, LightPathSpec, PanelSpec } from '../core/panel';
import { foldLightPath } from './light-path';

/** A filter the instrument has, under the name its users know it by (unique within the profile). */
export interface NamedFilterSpec {
  name: string;
  filter: FilterSpec;
}

/** One laser (or LED line): its wavelength and its power at the sample. */
export interface InstrumentLaser {
  name?: string;
  wavelengthNm: number;
  powerMw: number;
}

/** One detector of the instrument: a name and its detector class (see detectors). */
export interface InstrumentDetector {
  name: string;
  type: string;
}

/** A channel as the instrument usually runs it: filters and detector named from the profile's own lists. */
export interface ChannelPresetSpec {
  id: string;
  label?: string;
  /** Names from the profile's `filters`. */
  filters: string[];
  excitationNm?: number | number[];
  /** A name from the profile's `detectors`. */
  detector?: string;
}

/** An instrument profile (docs/api.md, "Instruments"). */
export interface InstrumentSpec {
  version: 1;
  name: string;
  description?: string;
  lasers: InstrumentLaser[];
  /** In front of every detector: the main dichroic (or a per-line stack) as the detectors see it. */
  dichroics?: NamedFilterSpec[];
  /** On every line on its way to the sample (clean-up filters). */
  excitationFilters?: NamedFilterSpec[];
  /** The emission filters the instrument has (filter wheel, cubes). */
  filters?: NamedFilterSpec[];
  detectors?: InstrumentDetector[];
  channels?: ChannelPresetSpec[];
}

/**
 * A panel that may name an instrument: without `instrument` it is a written-out panel; with it, omitted lines and
 * channels come from the instrument, and the shared light path always does.
 */
export type PanelOnInstrumentSpec = Omit<PanelSpec, 'excitation' | 'channels'> & {
  instrument?: string;
  excitation?: ExcitationLine[];
  channels?: ChannelSpec[];
};

/** A line of the instrument as a panel line: a laser's power in mW is the line's relative power. */
export function instrumentLines(instrument: InstrumentSpec): ExcitationLine[] {
  return instrument.lasers.map((laser) => ({ wavelengthNm: laser.wavelengthNm, powerRel: laser.powerMw }));
}

/** The instrument's shared light path (undefined when it has no dichroic and no clean-up filter). */
export function instrumentLightPath(instrument: InstrumentSpec): LightPathSpec | undefined {
  const emissionFilters = (instrument.dichroics ?? []).map((d) => d.filter);
  const excitationFilters = (instrument.excitationFilters ?? []).map((f) => f.filter);
  if (!emissionFilters.length && !excitationFilters.length) return undefined;
  return {
    ...(emissionFilters.length ? { emissionFilters } : {}),
    ...(excitationFilters.length ? { excitationFilters } : {}),
  };
}

/**
 * The instrument's channel presets written out: filter and detector names replaced by what they name. The profile's
 * schema guarantees every name is in its lists; a missing one is still refused here, naming the preset.
 */
export function instrumentChannels(instrument: InstrumentSpec): ChannelSpec[] {
  const filters = new Map((instrument.filters ?? []).map((f) => [f.name, f.filter]));
  const detectors = new Map((instrument.detectors ?? []).map((d) => [d.name, d.type]));
  return (instrument.channels ?? []).map((preset, c) => ({
    id: preset.id,
    ...(preset.label !== undefined ? { label: preset.label } : {}),
    filters: preset.filters.map((name, f) => {
      const filter = filters.get(name);
      if (!filter)
        throw new SpectraError('invalid_input', `names filter '${name}', which the instrument lacks`, [
          'instrument',
          'channels',
          c,
          'filters',
          f,
        ]);
      return filter;
    }),
    ...(preset.excitationNm !== undefined ? { excitationNm: preset.excitationNm } : {}),
    ...(preset.detector !== undefined ? { detector: detectorOf(detectors, preset.detector, c) } : {}),
  }));
}

function detectorOf(detectors: Map<string, string>, name: string, c: number): string {
  const type = detectors.get(name);
  if (type === undefined) {
    throw new SpectraError('invalid_input', `names detector '${name}', which the instrument lacks`, [
      'instrument',
      'channels',
      c,
      'detector',
    ]);
  }
  return type;
}

function nmList(lines: readonly { wavelengthNm: number }[]): string {
  return lines.map((l) => `${l.wavelengthNm}`).join(', ');
}

/**
 * The panel with its instrument's parts written out:
 * - lines: the panel's own, each of which must be one of the instrument's lasers (a line without `powerRel` takes
 *   the laser's mW), or all the lasers when the panel lists none;
 * - channels: the panel's own, or the instrument's presets when the panel lists none;
 * - the light path: the instrument's dichroics and clean-up filters (a panel naming an instrument carries none).
 * A panel without `instrument` is returned as it is (its lines and channels must then be present).
 */
export function resolveOnInstrument(panel: PanelOnInstrumentSpec, instrument: InstrumentSpec | undefined): PanelSpec {
  const { instrument: id, excitation, channels, ...rest } = panel;
  if (id !== undefined && instrument === undefined) {
    throw new SpectraError('invalid_input', `instrument '${id}' is not loaded`, ['instrument']);
  }
  if (id === undefined || instrument === undefined) {
    if (!excitation) throw new SpectraError('invalid_input', 'needs at least one excitation line', ['excitation']);
    if (!channels) throw new SpectraError('invalid_input', 'needs at least one channel', ['channels']);
    return { ...rest, excitation, channels };
  }
  if (rest.lightPath !== undefined) {
    throw new SpectraError(
      'invalid_input',
      'must not be given with instrument: the shared light path comes from the instrument',
      ['lightPath'],
    );
  }
  const lasers = new Map(instrument.lasers.map((laser) => [laser.wavelengthNm, laser]));
  const lines = excitation
    ? excitation.map((line, i) => {
        const laser = lasers.get(line.wavelengthNm);
        if (!laser) {
          throw new SpectraError(
            'invalid_input',
            `${line.wavelengthNm} nm is not a line of the instrument '${instrument.name}' ` +
              `(it has ${nmList(instrument.lasers)} nm)`,
            ['excitation', i, 'wavelengthNm'],
          );
        }
        return { ...line, powerRel: line.powerRel ?? laser.powerMw };
      })
    : instrumentLines(instrument);
  const lightPath = instrumentLightPath(instrument);
  const resolvedChannels = channels ?? instrumentChannels(instrument);
  if (!resolvedChannels.length) {
    throw new SpectraError(
      'invalid_input',
      `needs at least one channel (the instrument '${instrument.name}' has no channel presets)`,
      ['channels'],
    );
  }
  return { ...rest, excitation: lines, channels: resolvedChannels, ...(lightPath ? { lightPath } : {}) };
}

/** The lines and channels a search may choose from on an instrument (see instrumentChoices). */
export interface InstrumentChoices {
  excitation: ExcitationLine[];
  channels: ChannelSpec[];
}

/**
 * The instrument's lines and channel presets as a panel on it is evaluated, for a search that chooses among its
 * channels: the lines of `excitation` (each one of its lasers, without powerRel at the laser's mW) or all its
 * lasers, each line's power through the clean-up filters, and each preset with the dichroics in front of its filters
 * (foldLightPath). A preset read under given lines keeps those in use; one read under none of them is left out.
 * Refusals name ['instrument'] (no presets), ['excitation', i, 'wavelengthNm'] (a line it lacks) or ['excitation'].
 */
export function instrumentChoices(instrument: InstrumentSpec, excitation?: ExcitationLine[]): InstrumentChoices {
  if (!instrument.channels?.length) {
    throw new SpectraError(
      'invalid_input',
      `the instrument '${instrument.name}' has no channel presets to choose from`,
      ['instrument'],
    );
  }
  const lines = excitation ? { excitation } : {};
  const panel = foldLightPath(resolveOnInstrument({ instrument: 'in use', probes: [], ...lines }, instrument));
  const inUse = new Set(panel.excitation.map((line) => line.wavelengthNm));
  const channels = panel.channels.flatMap((channel) => {
    if (channel.excitationNm === undefined) return [channel];
    const wanted = Array.isArray(channel.excitationNm) ? channel.excitationNm : [channel.excitationNm];
    const kept = wanted.filter((nm) => inUse.has(nm));
    if (kept.length === 0) return [];
    return [{ ...channel, excitationNm: kept.length === 1 ? kept[0] : kept }];
  });
  if (channels.length === 0) {
    throw new SpectraError(
      'invalid_input',
      `no channel of the instrument '${instrument.name}' is read under these lines (each is read under others)`,
      ['excitation'],
    );
  }
  return { excitation: panel.excitation, channels };
}
