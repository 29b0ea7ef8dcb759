/**
 * The body of POST /api/v1/panels/design (and of the page's design worker): targets with abundances and locks,
 * excitation lines, material limits, the emission window, optional candidates (catalog mode), owned probes and
 * channels, channel choices or an instrument (free mode) and search options. Candidate, owned and chosen probes and
 * channels use the panel schemas, so each is written exactly like a panel's probe or channel.
 */
import { z } from 'zod';
import {
  ABUNDANCE_WORDS,
  DESIGN_DEFAULTS,
  EXCLUSION_WORDS,
  instrumentChoices,
  type DesignRequest as DesignRequestSpec,
  type InstrumentSpec,
} from '../../spectra/index';
import { ApiError } from './errors';
import { identifier, ranged, text, wavelengthNm } from './fields';
import { LIMITS, RANGES } from './limits';
import { Channel, ExcitationLine, InstrumentId, MeasuredReference, WaterRaman } from './panel';
import { MaterialIdSchema, Probe } from './probe';

const ABUNDANCE_NAMES = Object.keys(ABUNDANCE_WORDS) as [
  keyof typeof ABUNDANCE_WORDS,
  ...(keyof typeof ABUNDANCE_WORDS)[],
];
const wordList = (words: readonly string[]) => `${words.slice(0, -1).join(', ')} or ${words[words.length - 1]}`;

const positive = (max: number, unit = '') => ranged(0, max, unit, true);

/** A relative abundance: a number > 0, or one of the abundance words (ABUNDANCE_WORDS: high, medium, low). */
export const Abundance = z.union([positive(RANGES.abundance[1]), z.enum(ABUNDANCE_NAMES)], {
  error: `must be a number greater than 0 or one of ${ABUNDANCE_NAMES.join(', ')}`,
});

/** What a target must use: the id of a probe and/or of a channel (a candidate or an owned one). */
export const DesignLock = z.strictObject({ probe: identifier().optional(), channel: identifier().optional() });

/** One target of a design. */
export const DesignTarget = z.strictObject({
  name: text().min(1, { error: 'must not be empty' }),
  abundance: Abundance,
  lock: DesignLock.optional(),
});

const probeList = () =>
  z
    .array(Probe, { error: 'must be an array of probes' })
    .max(LIMITS.probes, { error: `has more than ${LIMITS.probes} probes` });
const channelList = () =>
  z
    .array(Channel, { error: 'must be an array of channels' })
    .max(LIMITS.channels, { error: `has more than ${LIMITS.channels} channels` });

const wholeNm = (min: number, max: number) =>
  z
    .number({ error: 'must be a whole number of nm' })
    .int({ error: 'must be a whole number of nm' })
    .min(min, { error: `must be at least ${min} nm` })
    .max(max, { error: `must be at most ${max} nm` });
const perItem = (max: number) => z.union([ranged(0, max), z.array(ranged(0, max)).min(1).max(LIMITS.channels)]);

/** Search and noise options (spectra/design/options.ts documents each default). */
export const DesignOptions = z.strictObject({
  nodeBudget: z
    .number()
    .int({ error: 'must be a whole number' })
    .min(1, { error: 'must be at least 1' })
    .max(LIMITS.nodeBudget, { error: `must be at most ${LIMITS.nodeBudget.toLocaleString('en-US')}` })
    .optional(),
  minSignalFraction: ranged(0, 1).optional(),
  lineClearance: z.boolean({ error: 'must be true or false' }).optional(),
  peakStepNm: wholeNm(1, 50).optional(),
  bandStepNm: wholeNm(1, 50).optional(),
  bandwidthsNm: z.array(wholeNm(5, 200)).min(1).max(8).optional(),
  bandwidthRangeNm: z.tuple([wholeNm(5, 200), wholeNm(5, 200)]).optional(),
  edgeWidthNm: ranged(0, 20, 'nm').optional(),
  refine: z.boolean({ error: 'must be true or false' }).optional(),
  photons: perItem(1e12).optional(),
  backgroundPhotons: perItem(1e12).optional(),
  readNoiseElectrons: ranged(0, 1e6).optional(),
  excessNoiseFactor: ranged(1, 10).optional(),
  minBlockingOD: ranged(RANGES.blockingOD[0], RANGES.blockingOD[1]).optional(),
  minChannelShare: ranged(0, 1).optional(),
  lineClearanceNm: ranged(0, 100, 'nm').optional(),
  minSignalToNoise: ranged(0, 1e6).optional(),
  maxInterference: ranged(0, 1e6).optional(),
});

const NO_EXCITATION = 'needs at least one excitation line (or an instrument, whose lines are then used)';

/** The design request. Exclusions name material classes in words (EXCLUSIONS: cadmium, lead, arsenic). */
export const DesignRequest = z
  .strictObject({
    targets: z
      .array(DesignTarget, { error: 'must be an array of targets' })
      .min(1, { error: 'needs at least one target' })
      .max(LIMITS.probes, { error: `has more than ${LIMITS.probes} targets` }),
    excitation: z
      .array(ExcitationLine, { error: 'must be an array of excitation lines' })
      .min(1, { error: 'needs at least one excitation line' })
      .max(LIMITS.lines, { error: `has more than ${LIMITS.lines} lines` })
      .optional(),
    allowedMaterials: z.array(MaterialIdSchema).min(1, { error: 'must name at least one material' }).optional(),
    exclude: z.array(z.enum(EXCLUSION_WORDS, { error: `must be ${wordList(EXCLUSION_WORDS)}` })).optional(),
    windowNm: z.tuple([wavelengthNm(), wavelengthNm()], { error: 'must be [min, max] in nm' }).optional(),
    candidates: z
      .strictObject({
        probes: probeList().min(1, { error: 'needs at least one probe' }),
        channels: channelList().min(1, { error: 'needs at least one channel' }),
      })
      .optional(),
    owned: z.strictObject({ probes: probeList().optional(), channels: channelList().optional() }).optional(),
    channelChoices: channelList().min(1, { error: 'needs at least one channel' }).optional(),
    instrument: InstrumentId.optional(),
    options: DesignOptions.optional(),
    scatterLevel: ranged(RANGES.scatterLevel[0], RANGES.scatterLevel[1]).optional(),
    waterRaman: WaterRaman.optional(),
    measuredReference: MeasuredReference.optional(),
  })
  .superRefine((request, ctx) => {
    const issue = (message: string, path: (string | number)[]) =>
      ctx.addIssue({ code: 'custom', message, path, params: { apiCode: 'invalid_input' } });
    if (request.windowNm && !(request.windowNm[0] < request.windowNm[1]))
      issue('must be [min, max] with min < max (the window is empty)', ['windowNm']);
    const names = new Set<string>();
    request.targets.forEach((t, i) => {
      if (names.has(t.name)) issue(`names target '${t.name}' twice`, ['targets', i, 'name']);
      names.add(t.name);
    });
    if (request.excitation === undefined && request.instrument === undefined) issue(NO_EXCITATION, ['excitation']);
    for (const list of ['probes', 'channels'] as const) {
      const ids = new Set<string>();
      request.candidates?.[list].forEach((item, i) => {
        if (ids.has(item.id))
          issue(`id '${item.id}' is used twice in candidate ${list}`, ['candidates', list, i, 'id']);
        ids.add(item.id);
      });
    }
    checkModes(request, issue);
    checkOwned(request, ctx);
    checkLocks(request, issue);
    const range = request.options?.bandwidthRangeNm;
    if (range && range[0] > range[1]) issue('must be [min, max] with min ≤ max', ['options', 'bandwidthRangeNm']);
    const [wMin, wMax] = range ?? DESIGN_DEFAULTS.bandwidthRangeNm;
    const widths = request.options?.bandwidthsNm;
    if (widths && widths.some((w) => w < wMin || w > wMax))
      issue(`must list 1–8 whole widths inside bandwidthRangeNm (${wMin}–${wMax} nm)`, ['options', 'bandwidthsNm']);
    const n = request.targets.length;
    for (const field of ['photons', 'backgroundPhotons'] as const) {
      const value = request.options?.[field];
      if (Array.isArray(value) && value.length !== n) issue(`must be a number or ${n} numbers`, ['options', field]);
    }
    for (const list of ['probes', 'channels'] as const) {
      const offered = request.candidates?.[list].length;
      const owned = request.owned?.[list]?.length ?? 0;
      const also = owned ? ` (and ${owned} owned)` : '';
      if (offered !== undefined && offered + owned < n)
        issue(`has ${offered} ${list}${also}; ${n} targets need at least ${n}`, ['candidates', list]);
    }
    const choices = request.channelChoices?.length;
    const ownedChannels = request.owned?.channels?.length ?? 0;
    if (choices !== undefined && choices + ownedChannels < n) {
      const also = ownedChannels ? ` (and ${ownedChannels} owned)` : '';
      issue(`has ${choices} channels${also}; ${n} targets need at least ${n}`, ['channelChoices']);
    }
  });

type Issue = (message: string, path: (string | number)[]) => void;

/** Catalog mode (candidates) chooses its own channels: neither channel choices nor an instrument go with it. */
function checkModes(request: DesignRequest, issue: Issue): void {
  if (request.channelChoices && request.candidates)
    issue('must not be given with candidates: catalog mode chooses among candidates.channels', ['channelChoices']);
  if (request.instrument !== undefined && request.candidates)
    issue(
      'must not be given with candidates: catalog mode chooses among candidates.channels (leave candidates out to ' +
        "choose among the instrument's channels)",
      ['instrument'],
    );
  if (request.instrument !== undefined && request.channelChoices)
    issue("must not be given with channelChoices: the instrument's channels are the choices", ['instrument']);
}

/** Owned ids are unique in their list and differ from the candidates' and the channel choices' ids. */
function checkOwned(request: DesignRequest, ctx: z.RefinementCtx): void {
  const duplicate = (message: string, path: (string | number)[]) =>
    ctx.addIssue({ code: 'custom', message, path, params: { apiCode: 'duplicate_id' } });
  const choiceIds = new Set<string>();
  request.channelChoices?.forEach((channel, i) => {
    if (choiceIds.has(channel.id))
      duplicate(`id '${channel.id}' is used twice in channelChoices`, ['channelChoices', i, 'id']);
    choiceIds.add(channel.id);
  });
  for (const list of ['probes', 'channels'] as const) {
    const single = list === 'probes' ? 'probe' : 'channel';
    const candidateIds = new Set(request.candidates?.[list].map((item) => item.id));
    const seen = new Set<string>();
    request.owned?.[list]?.forEach((item, i) => {
      const path = ['owned', list, i, 'id'];
      if (seen.has(item.id)) duplicate(`id '${item.id}' is used twice in owned ${list}`, path);
      else if (candidateIds.has(item.id)) duplicate(`id '${item.id}' is also a candidate ${single}'s id`, path);
      else if (list === 'channels' && choiceIds.has(item.id))
        duplicate(`id '${item.id}' is also the id of one of channelChoices`, path);
      seen.add(item.id);
    });
  }
}

/**
 * Each lock names something (a probe, a channel or both) the request offers: in catalog mode a candidate or an owned
 * item, in free mode an owned item; no two targets lock the same probe or the same channel.
 */
function checkLocks(request: DesignRequest, issue: Issue): void {
  const catalog = request.candidates !== undefined;
  const offered = {
    probe: new Set([...(request.candidates?.probes ?? []), ...(request.owned?.probes ?? [])].map((p) => p.id)),
    channel: new Set([...(request.candidates?.channels ?? []), ...(request.owned?.channels ?? [])].map((c) => c.id)),
  };
  const lockedBy = { probe: new Map<string, number>(), channel: new Map<string, number>() };
  request.targets.forEach((target, t) => {
    const lock = target.lock;
    if (lock === undefined) return;
    if (lock.probe === undefined && lock.channel === undefined)
      issue('must name a probe or a channel to use for this target (or be left out)', ['targets', t, 'lock']);
    for (const kind of ['probe', 'channel'] as const) {
      const id = lock[kind];
      if (id === undefined) continue;
      const path = ['targets', t, 'lock', kind];
      if (!offered[kind].has(id)) {
        const where = catalog
          ? `among the candidate or owned ${kind}s`
          : `among the owned ${kind}s (in free mode a lock names an owned ${kind})`;
        issue(`names ${kind} '${id}', which is not ${where}`, path);
        continue;
      }
      const first = lockedBy[kind].get(id);
      if (first === undefined) lockedBy[kind].set(id, t);
      else
        issue(
          `contradictory locks: targets '${request.targets[first].name}' and '${target.name}' both lock ${kind} ` +
            `'${id}', which can serve only one target`,
          path,
        );
    }
  });
}

/** A validated design request. */
export type DesignRequest = z.infer<typeof DesignRequest>;

/**
 * A validated request as the spectral library takes it: `instrument` resolved (its lines and channels written in,
 * see withInstrument), so the excitation lines are there.
 */
export type ResolvedDesignRequest = Omit<DesignRequest, 'instrument' | 'excitation'> & {
  excitation: NonNullable<DesignRequest['excitation']>;
};

// The zod request, its instrument resolved, must stay assignable to the spectral library's DesignRequest.
type Assert<T extends true> = T;
/** `true` while a validated request without its instrument is a valid spectra DesignRequest. */
export type DesignRequestMatchesSpec = Assert<ResolvedDesignRequest extends DesignRequestSpec ? true : false>;

/**
 * A validated request as the spectral library takes it. Without `instrument`, the request itself. With it (the
 * caller has loaded the profile), the instrument's lines and channel presets as a panel on it is evaluated (spectra's
 * instrumentChoices: the request's lines, or all the lasers) become its `excitation` and `channelChoices`; an owned
 * channel with the id of one of the instrument's takes its place (so a target can lock a channel of the microscope).
 * Besides the refusals of instrumentChoices, fewer channels than targets, or every preset owned while a target locks
 * no channel, is refused at `instrument`.
 */
export function withInstrument(request: DesignRequest, instrument: InstrumentSpec | undefined): ResolvedDesignRequest {
  const { instrument: id, excitation, ...rest } = request;
  if (id === undefined) {
    if (!excitation) throw new ApiError(400, 'invalid_input', `excitation ${NO_EXCITATION}`, ['excitation']);
    return { ...rest, excitation };
  }
  if (!instrument) throw new ApiError(400, 'unknown_instrument', `instrument '${id}' is not loaded`, ['instrument']);
  const choices = instrumentChoices(instrument, excitation);
  const owned = new Set(request.owned?.channels?.map((c) => c.id));
  const channelChoices = choices.channels.filter((c) => !owned.has(c.id));
  const n = request.targets.length;
  if (channelChoices.length + owned.size < n) {
    const also = owned.size ? ` (with ${owned.size} owned)` : '';
    const offered = channelChoices.length + owned.size;
    throw new ApiError(
      400,
      'invalid_input',
      `the instrument '${instrument.name}' offers ${offered} channels under these lines${also}; ${n} targets need ` +
        `at least ${n}`,
      ['instrument'],
    );
  }
  if (channelChoices.length === 0) {
    // Every preset is owned: fine when every target locks its channel (nothing is left to choose), else refused.
    const open = request.targets.find((t) => t.lock?.channel === undefined);
    if (open) {
      throw new ApiError(
        400,
        'invalid_input',
        `every channel of the instrument '${instrument.name}' is owned, so none is left to choose for target ` +
          `'${open.name}' (lock a channel for it, or own fewer)`,
        ['instrument'],
      );
    }
    return { ...rest, excitation: choices.excitation };
  }
  return { ...rest, excitation: choices.excitation, channelChoices };
}
