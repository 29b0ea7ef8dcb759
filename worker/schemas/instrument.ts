import { z } from 'zod';
import { DETECTOR_IDS } from '../../spectra/index';
import { LIMITS, RANGES } from './limits';
import { identifier, ranged, text, wavelengthNm } from './fields';
import { Filter } from './filter';

/** A part's name within a profile: 1–200 characters. */
const partName = () => text().min(1, { error: 'must not be empty' });

/** A filter under the name the instrument's users know it by. */
export const NamedFilter = z.strictObject({ name: partName(), filter: Filter });

const namedFilters = (max: number) =>
  z
    .array(NamedFilter, { error: 'must be an array of named filters' })
    .max(max, { error: `has more than ${max} filters` });

/** One laser or LED line: wavelength and power at the sample. */
export const InstrumentLaser = z.strictObject({
  name: text().optional(),
  wavelengthNm: wavelengthNm(),
  powerMw: ranged(RANGES.laserPowerMw[0], RANGES.laserPowerMw[1], 'mW', true),
});

/** One detector: a name and its detector class. */
export const InstrumentDetector = z.strictObject({
  name: partName(),
  type: z.enum(DETECTOR_IDS, { error: `must be one of ${DETECTOR_IDS.join(', ')}` }),
});

/** A channel as the instrument usually runs it, its filters and detector named from the profile's lists. */
export const ChannelPreset = z.strictObject({
  id: identifier(),
  label: text().optional(),
  filters: z
    .array(partName(), { error: 'must be an array of filter names' })
    .max(LIMITS.filtersPerChannel, { error: `has more than ${LIMITS.filtersPerChannel} filters` }),
  excitationNm: z
    .union([wavelengthNm(), z.array(wavelengthNm()).min(1, { error: 'must not be empty' }).max(LIMITS.lines)])
    .optional(),
  detector: partName().optional(),
});

/** An instrument profile as the API takes it (docs/api.md, "Instruments"). */
export const Instrument = z
  .strictObject({
    version: z.literal(1, { error: 'must be 1' }),
    name: partName(),
    description: z
      .string({ error: 'must be a string' })
      .max(LIMITS.descriptionLength, { error: `must be at most ${LIMITS.descriptionLength} characters` })
      .optional(),
    lasers: z
      .array(InstrumentLaser, { error: 'must be an array of lasers' })
      .min(1, { error: 'needs at least one laser' })
      .max(LIMITS.lines, { error: `has more than ${LIMITS.lines} lasers` }),
    dichroics: namedFilters(LIMITS.filtersPerChannel).optional(),
    excitationFilters: namedFilters(LIMITS.filtersPerChannel).optional(),
    filters: namedFilters(LIMITS.instrumentFilters).optional(),
    detectors: z
      .array(InstrumentDetector, { error: 'must be an array of detectors' })
      .max(LIMITS.channels, { error: `has more than ${LIMITS.channels} detectors` })
      .optional(),
    channels: z
      .array(ChannelPreset, { error: 'must be an array of channel presets' })
      .max(LIMITS.channels, { error: `has more than ${LIMITS.channels} channels` })
      .optional(),
  })
  .superRefine(checkProfile);

type ProfileShape = {
  lasers: { wavelengthNm: number }[];
  dichroics?: { name: string }[];
  excitationFilters?: { name: string }[];
  filters?: { name: string }[];
  detectors?: { name: string }[];
  channels?: { id: string; filters: string[]; excitationNm?: number | number[]; detector?: string }[];
};

/** Names unique across the profile's filter lists, lines and ids unique, and every preset names parts it has. */
function checkProfile(profile: ProfileShape, ctx: z.RefinementCtx): void {
  const issue = (apiCode: string, message: string, path: (string | number)[]) =>
    ctx.addIssue({ code: 'custom', message, path, params: { apiCode } });
  const filterNames = new Set<string>();
  for (const list of ['dichroics', 'excitationFilters', 'filters'] as const) {
    (profile[list] ?? []).forEach((f, i) => {
      if (filterNames.has(f.name)) {
        issue('duplicate_id', `name '${f.name}' is used twice among the profile's filters`, [list, i, 'name']);
      }
      filterNames.add(f.name);
    });
  }
  const lines = new Set<number>();
  profile.lasers.forEach((laser, i) => {
    if (lines.has(laser.wavelengthNm)) {
      issue('duplicate_id', `${laser.wavelengthNm} nm is listed twice in lasers`, ['lasers', i, 'wavelengthNm']);
    }
    lines.add(laser.wavelengthNm);
  });
  const detectors = new Set<string>();
  (profile.detectors ?? []).forEach((d, i) => {
    if (detectors.has(d.name))
      issue('duplicate_id', `name '${d.name}' is used twice in detectors`, ['detectors', i, 'name']);
    detectors.add(d.name);
  });
  const emission = new Set((profile.filters ?? []).map((f) => f.name));
  const ids = new Set<string>();
  (profile.channels ?? []).forEach((ch, c) => {
    if (ids.has(ch.id)) issue('duplicate_id', `id '${ch.id}' is used twice in channels`, ['channels', c, 'id']);
    ids.add(ch.id);
    ch.filters.forEach((name, f) => {
      if (!emission.has(name)) {
        issue('invalid_input', `names filter '${name}', which is not in the profile's filters`, [
          'channels',
          c,
          'filters',
          f,
        ]);
      }
    });
    if (ch.detector !== undefined && !detectors.has(ch.detector)) {
      issue('invalid_input', `names detector '${ch.detector}', which is not in the profile's detectors`, [
        'channels',
        c,
        'detector',
      ]);
    }
    const wanted = ch.excitationNm;
    const list = wanted === undefined ? [] : Array.isArray(wanted) ? wanted : [wanted];
    list.forEach((nm, k) => {
      if (!lines.has(nm)) {
        const path = Array.isArray(wanted) ? ['channels', c, 'excitationNm', k] : ['channels', c, 'excitationNm'];
        issue('invalid_input', `${nm} nm is not one of the profile's lasers`, path);
      }
    });
  });
}

/** What POST /api/v1/instruments answers: the profile's id and the page link that opens it. */
export const InstrumentCreated = z.strictObject({ id: z.string(), url: z.string() });

/** GET /api/v1/instruments: the example profiles that every installation serves. */
export const InstrumentList = z.strictObject({
  instruments: z.array(z.strictObject({ id: z.string(), name: z.string(), description: z.string(), url: z.string() })),
});
