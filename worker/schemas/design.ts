/**
 * The body of POST /api/v1/panels/design (and of the page's design worker): targets with abundances, excitation
 * lines, material limits, the emission window, optional candidates (catalog mode) and search options. The candidate
 * probes and channels use the panel schemas, so a candidate is written exactly like a panel's probe or channel.
 */
import { z } from 'zod';
import {
  ABUNDANCE_WORDS,
  DESIGN_DEFAULTS,
  EXCLUSION_WORDS,
  type DesignRequest as DesignRequestSpec,
} from '../../spectra/index';
import { ranged, text, wavelengthNm } from './fields';
import { LIMITS, RANGES } from './limits';
import { Channel, ExcitationLine, WaterRaman } from './panel';
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

/** One target of a design. */
export const DesignTarget = z.strictObject({
  name: text().min(1, { error: 'must not be empty' }),
  abundance: Abundance,
});

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
      .max(LIMITS.lines, { error: `has more than ${LIMITS.lines} lines` }),
    allowedMaterials: z.array(MaterialIdSchema).min(1, { error: 'must name at least one material' }).optional(),
    exclude: z.array(z.enum(EXCLUSION_WORDS, { error: `must be ${wordList(EXCLUSION_WORDS)}` })).optional(),
    windowNm: z.tuple([wavelengthNm(), wavelengthNm()], { error: 'must be [min, max] in nm' }).optional(),
    candidates: z
      .strictObject({
        probes: z
          .array(Probe)
          .min(1, { error: 'needs at least one probe' })
          .max(LIMITS.probes, { error: `has more than ${LIMITS.probes} probes` }),
        channels: z
          .array(Channel)
          .min(1, { error: 'needs at least one channel' })
          .max(LIMITS.channels, { error: `has more than ${LIMITS.channels} channels` }),
      })
      .optional(),
    options: DesignOptions.optional(),
    scatterLevel: ranged(RANGES.scatterLevel[0], RANGES.scatterLevel[1]).optional(),
    waterRaman: WaterRaman.optional(),
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
    for (const list of ['probes', 'channels'] as const) {
      const ids = new Set<string>();
      request.candidates?.[list].forEach((item, i) => {
        if (ids.has(item.id))
          issue(`id '${item.id}' is used twice in candidate ${list}`, ['candidates', list, i, 'id']);
        ids.add(item.id);
      });
    }
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
      if (offered !== undefined && offered < n)
        issue(`has ${offered} ${list}; ${n} targets need at least ${n}`, ['candidates', list]);
    }
  });

/** A validated design request. */
export type DesignRequest = z.infer<typeof DesignRequest>;

// The zod request must stay assignable to the spectral library's DesignRequest (a compile error otherwise).
type Assert<T extends true> = T;
/** `true` while a validated request is a valid spectra DesignRequest. */
export type DesignRequestMatchesSpec = Assert<DesignRequest extends DesignRequestSpec ? true : false>;
