import { z } from 'zod';
import { LIMITS, RANGES, SHARE_ID_PATTERN } from './limits';
import { BACKGROUND_PRESET_IDS, DETECTOR_IDS, EXCLUSION_WORDS } from '../../spectra/index';
import { identifier, ranged, text, wavelengthNm } from './fields';
import { Filter } from './filter';
import { Probe } from './probe';
import { pointsTable } from './spectrum';

/** One excitation line (laser or LED), relative power default 1. */
export const ExcitationLine = z.strictObject({
  wavelengthNm: wavelengthNm(),
  powerRel: ranged(RANGES.powerRel[0], RANGES.powerRel[1]).optional(),
});

/** One detection channel: its filters, the lines on while it is read, its detector class. */
export const Channel = z.strictObject({
  id: identifier(),
  label: text().optional(),
  filters: z
    .array(Filter, { error: 'must be an array of filters' })
    .max(LIMITS.filtersPerChannel, { error: `has more than ${LIMITS.filtersPerChannel} filters` }),
  excitationNm: z
    .union([wavelengthNm(), z.array(wavelengthNm()).min(1, { error: 'must not be empty' }).max(LIMITS.lines)])
    .optional(),
  detector: z.enum(DETECTOR_IDS, { error: `must be one of ${DETECTOR_IDS.join(', ')}` }).optional(),
});

const UNKNOWN_PRESET =
  `must be one of ${BACKGROUND_PRESET_IDS.join(', ')} ` + '(each listed with its bands by GET /api/v1/backgrounds)';

const sharedFilters = z
  .array(Filter, { error: 'must be an array of filters' })
  .max(LIMITS.filtersPerChannel, { error: `has more than ${LIMITS.filtersPerChannel} filters` });

/** The shared light path: filters in front of every detector, and filters on every excitation line. */
export const LightPath = z.strictObject({
  emissionFilters: sharedFilters.optional(),
  excitationFilters: sharedFilters.optional(),
});

/**
 * Sample autofluorescence times `level`: the default model, a sample type's preset, or a measured spectrum; a preset
 * and a measured spectrum exclude each other.
 */
export const Background = z
  .strictObject({
    level: ranged(RANGES.backgroundLevel[0], RANGES.backgroundLevel[1]),
    preset: z.enum(BACKGROUND_PRESET_IDS, { error: UNKNOWN_PRESET }).optional(),
    points: pointsTable(RANGES.spectralValue[1], 'background').shape.points.optional(),
  })
  .superRefine((background, ctx) => {
    if (background.preset !== undefined && background.points !== undefined) {
      ctx.addIssue({
        code: 'custom',
        message: 'must not be given together with points (a measured background replaces any preset)',
        path: ['preset'],
        params: { apiCode: 'invalid_input' },
      });
    }
  });

/** The water Raman band under every line, at `level` (docs/api.md, "The signal model"). */
export const WaterRaman = z.strictObject({
  level: ranged(RANGES.waterRamanLevel[0], RANGES.waterRamanLevel[1]),
});

/**
 * Reference columns measured from single-stain controls (docs/api.md, "Measured reference"): channel ids, and per
 * probe its signal in each of them, unstained subtracted, in that order.
 */
export const MeasuredReference = z
  .strictObject({
    channels: z
      .array(identifier(), { error: 'must be an array of channel ids' })
      .min(1, { error: 'needs at least one channel id' })
      .max(LIMITS.channels, { error: `has more than ${LIMITS.channels} channels` })
      .refine((ids) => new Set(ids).size === ids.length, { error: 'names a channel twice' }),
    columns: z
      .array(
        z.strictObject({
          probe: identifier(),
          values: z
            .array(z.number({ error: 'must be a finite number' }), { error: 'must be an array of numbers' })
            .max(LIMITS.channels, { error: `has more than ${LIMITS.channels} values` }),
        }),
        { error: 'must be an array of measured columns' },
      )
      .min(1, { error: 'needs at least one measured column' })
      .max(LIMITS.probes, { error: `has more than ${LIMITS.probes} columns` }),
  })
  .superRefine((ref, ctx) => {
    const seen = new Set<string>();
    ref.columns.forEach((column, i) => {
      if (column.values.length !== ref.channels.length)
        ctx.addIssue({
          code: 'custom',
          message: `has ${column.values.length} values for ${ref.channels.length} channels: give one per channel`,
          path: ['columns', i, 'values'],
          params: { apiCode: 'invalid_input' },
        });
      if (seen.has(column.probe))
        ctx.addIssue({
          code: 'custom',
          message: `probe '${column.probe}' has two measured columns`,
          path: ['columns', i, 'probe'],
          params: { apiCode: 'duplicate_id' },
        });
      seen.add(column.probe);
    });
  });

/** The fields of a panel; `Panel` takes them written out, `PanelRequest` also takes an instrument reference. */
const panelFields = {
  version: z.literal(1, { error: 'must be 1' }).optional(),
  title: text().optional(),
  excitation: z
    .array(ExcitationLine, { error: 'must be an array of excitation lines' })
    .min(1, { error: 'needs at least one excitation line' })
    .max(LIMITS.lines, { error: `has more than ${LIMITS.lines} lines` }),
  probes: z
    .array(Probe, { error: 'must be an array of probes' })
    .min(1, { error: 'needs at least one probe' })
    .max(LIMITS.probes, { error: `has more than ${LIMITS.probes} probes` }),
  channels: z
    .array(Channel, { error: 'must be an array of channels' })
    .min(1, { error: 'needs at least one channel' })
    .max(LIMITS.channels, { error: `has more than ${LIMITS.channels} channels` }),
  background: Background.optional(),
  minBlockingOD: ranged(RANGES.blockingOD[0], RANGES.blockingOD[1]).optional(),
  scatterLevel: ranged(RANGES.scatterLevel[0], RANGES.scatterLevel[1]).optional(),
  lightPath: LightPath.optional(),
  waterRaman: WaterRaman.optional(),
  exclude: z
    .array(z.enum(EXCLUSION_WORDS, { error: `must be ${EXCLUSION_WORDS.join(', ')}` }))
    .max(EXCLUSION_WORDS.length)
    .refine((list) => new Set(list).size === list.length, { error: 'names a class twice' })
    .optional(),
  measuredReference: MeasuredReference.optional(),
};

/** The id of a stored or example instrument profile (a share id). */
export const InstrumentId = z
  .string({ error: 'must be a string (an instrument id)' })
  .regex(SHARE_ID_PATTERN, { error: 'must be an instrument id: 24 letters, digits, - or _' });

/** A panel with every part written out (docs/api.md, "Panels"): what the models evaluate. */
export const Panel = z.strictObject(panelFields).superRefine(checkReferences);

/** The fields of a panel request: a panel's, with lines and channels optional when an instrument is named. */
const panelRequestFields = {
  ...panelFields,
  excitation: panelFields.excitation.optional(),
  channels: panelFields.channels.optional(),
  instrument: InstrumentId.optional(),
};

/** The cross-field rules of a panel request (written out, or on an instrument). */
function checkPanelRequest(panel: z.infer<z.ZodObject<typeof panelRequestFields>>, ctx: z.RefinementCtx): void {
  const issue = (message: string, path: string[]) =>
    ctx.addIssue({ code: 'custom', message, path, params: { apiCode: 'invalid_input' } });
  if (panel.instrument === undefined) {
    if (panel.excitation === undefined) issue('needs at least one excitation line (or an instrument)', ['excitation']);
    if (panel.channels === undefined) issue('needs at least one channel (or an instrument)', ['channels']);
  } else if (panel.lightPath !== undefined) {
    issue('must not be given with instrument: the shared light path comes from the instrument', ['lightPath']);
  }
  checkReferences({ ...panel, excitation: panel.excitation ?? [], channels: panel.channels ?? [] }, ctx, {
    lines: panel.excitation !== undefined,
    channels: panel.channels !== undefined,
  });
}

/**
 * A panel as the API takes it (docs/api.md, "Panels"): written out, or naming an instrument profile by its id, from
 * which omitted lines and channels and the whole shared light path are taken (spectra's resolveOnInstrument).
 */
export const PanelRequest = z.strictObject(panelRequestFields).superRefine(checkPanelRequest);

/**
 * What POST /api/v1/panels/evaluate takes: a panel request, and `sensitivity` (default true): false leaves out the
 * lot-to-lot shift check (`lotShiftSensitivity` is then null), the larger part of an evaluation's work.
 */
export const EvaluateRequest = z
  .strictObject({ ...panelRequestFields, sensitivity: z.boolean({ error: 'must be true or false' }).optional() })
  .superRefine(checkPanelRequest);

type PanelShape = {
  excitation: { wavelengthNm: number }[];
  probes: { id: string; channel?: string }[];
  channels: { id: string; excitationNm?: number | number[] }[];
};

/**
 * Ids unique; a probe's `channel` names a channel; a channel's `excitationNm` names lines of the panel. `known` says
 * which lists the panel gave (an omitted one comes from an instrument and is checked once written out).
 */
function checkReferences(
  panel: PanelShape,
  ctx: z.RefinementCtx,
  known: { lines: boolean; channels: boolean } = { lines: true, channels: true },
): void {
  const issue = (apiCode: string, message: string, path: (string | number)[]) =>
    ctx.addIssue({ code: 'custom', message, path, params: { apiCode } });
  for (const list of ['probes', 'channels'] as const) {
    const seen = new Set<string>();
    panel[list].forEach((item, i) => {
      if (seen.has(item.id)) issue('duplicate_id', `id '${item.id}' is used twice in ${list}`, [list, i, 'id']);
      seen.add(item.id);
    });
  }
  const channelIds = new Set(panel.channels.map((ch) => ch.id));
  if (!known.channels) return;
  panel.probes.forEach((probe, i) => {
    if (probe.channel !== undefined && !channelIds.has(probe.channel)) {
      issue('unknown_channel', `names channel '${probe.channel}', which is not in channels`, ['probes', i, 'channel']);
    }
  });
  if (!known.lines) return;
  const lines = new Set(panel.excitation.map((line) => line.wavelengthNm));
  panel.channels.forEach((channel, c) => {
    const wanted = channel.excitationNm;
    const list = wanted === undefined ? [] : Array.isArray(wanted) ? wanted : [wanted];
    list.forEach((nm, k) => {
      if (!lines.has(nm)) {
        const path = Array.isArray(wanted) ? ['channels', c, 'excitationNm', k] : ['channels', c, 'excitationNm'];
        issue('invalid_input', `${nm} nm is not one of the panel's excitation lines`, path);
      }
    });
  });
}
