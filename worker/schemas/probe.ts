import { z } from 'zod';
import { RANGES } from './limits';
import { LIMITS } from './limits';
import {
  DYE_IDS,
  MATERIAL_IDS,
  SHELL_MATERIALS,
  SHELL_MATERIAL_IDS,
  SIZING_MODELS,
  isSizedMaterial,
} from '../../spectra/index';
import { fraction, identifier, ranged, text, wavelengthNm } from './fields';
import { pointsTable } from './spectrum';

/**
 * A material id of the contract (`custom` = any other probe, described by measured data; `dye` = a dye of the dye
 * library, named by `dye`).
 */
export const MaterialIdSchema = z.enum(MATERIAL_IDS, {
  error: `must be one of ${MATERIAL_IDS.join(', ')}`,
});

/** One shell layer around a core: a layer no thicker than its material allows (SHELL_MATERIALS). */
export const ShellLayerSchema = z
  .strictObject({
    material: z.enum(SHELL_MATERIAL_IDS, {
      error: `must be one of ${SHELL_MATERIAL_IDS.join(', ')} (shell materials)`,
    }),
    thicknessNm: ranged(RANGES.shellThicknessNm[0], RANGES.shellThicknessNm[1], 'nm', true),
  })
  .superRefine((layer, ctx) => {
    const m = SHELL_MATERIALS[layer.material];
    if (layer.thicknessNm > m.maxThicknessNm)
      ctx.addIssue({
        code: 'custom',
        message: `must be at most ${m.maxThicknessNm} nm for a ${m.name} layer (thicker layers crack or alloy)`,
        path: ['thicknessNm'],
        params: { apiCode: 'out_of_range' },
      });
  });

/** The fields that describe one dot, shared by a panel's probes and POST /dots/resolve. */
export const dotFields = {
  material: MaterialIdSchema,
  emissionPeakNm: wavelengthNm().optional(),
  diameterNm: ranged(RANGES.diameterNm[0], RANGES.diameterNm[1], 'nm').optional(),
  shell: z
    .array(ShellLayerSchema, { error: 'must be an array of shell layers ({"material", "thicknessNm"})' })
    .max(LIMITS.shellLayers, { error: `has more than ${LIMITS.shellLayers} layers` })
    .refine((layers) => layers.reduce((t, l) => t + l.thicknessNm, 0) <= RANGES.shellThicknessNm[1], {
      error: `layers must add up to at most ${RANGES.shellThicknessNm[1]} nm`,
      params: { apiCode: 'out_of_range' },
    })
    .optional(),
  sizingModel: z.enum(SIZING_MODELS, { error: `must be one of ${SIZING_MODELS.join(', ')}` }).optional(),
  sizeDispersionPct: ranged(RANGES.sizeDispersionPct[0], RANGES.sizeDispersionPct[1], '%').optional(),
  fwhmNm: ranged(RANGES.fwhmNm[0], RANGES.fwhmNm[1], 'nm').optional(),
  quantumYield: fraction().optional(),
  measuredEmission: pointsTable(RANGES.spectralValue[1], 'emission').optional(),
  extinction: pointsTable(RANGES.extinction[1], 'extinction (M-1 cm-1)').optional(),
  dye: identifier().optional(),
  absorptionPeakNm: wavelengthNm().optional(),
  extinctionPeak: ranged(RANGES.extinction[0], RANGES.extinction[1], 'M-1 cm-1').optional(),
};

interface DotLike {
  material: string;
  emissionPeakNm?: number;
  diameterNm?: number;
  sizeDispersionPct?: number;
  measuredEmission?: unknown;
  shell?: unknown[];
  sizingModel?: string;
  dye?: string;
  absorptionPeakNm?: number;
  extinctionPeak?: number;
}

/**
 * How a dot's size is given: a `custom` probe needs `measuredEmission`; every other material needs exactly one of
 * diameterNm / emissionPeakNm, and carbon dots (no sizing curve) take emissionPeakNm.
 */
export function checkDotSize(dot: DotLike, ctx: z.RefinementCtx): void {
  const add = (message: string, field: string) =>
    ctx.addIssue({ code: 'custom', message, path: [field], params: { apiCode: 'invalid_input' } });
  if (dot.material === 'custom') {
    if (dot.measuredEmission === undefined) add("is required for material 'custom'", 'measuredEmission');
    if (dot.diameterNm !== undefined) add('must not be given for custom probes (they have no size law)', 'diameterNm');
    return;
  }
  const hasPeak = dot.emissionPeakNm !== undefined;
  const hasDiameter = dot.diameterNm !== undefined;
  if (dot.material === 'carbon' && hasDiameter) add('carbon dots take emissionPeakNm, not diameterNm', 'diameterNm');
  else if (hasPeak && hasDiameter)
    add('must not be given together with emissionPeakNm (give exactly one of the two)', 'diameterNm');
  else if (!hasPeak && !hasDiameter) add('is required (or diameterNm instead)', 'emissionPeakNm');
}

/** What a dye's record sets, so a dye probe does not take it. */
const SET_BY_DYE = {
  diameterNm: 'must not be given for dye probes (no size law)',
  emissionPeakNm: "must not be given for dye probes: the dye's record gives the peak (measuredEmission replaces it)",
  sizeDispersionPct: 'must not be given for dye probes (no size law)',
  absorptionPeakNm: "must not be given for dye probes: the dye's record gives the absorption (extinction replaces it)",
  extinctionPeak: "must not be given for dye probes: the dye's record gives the absorption (extinction replaces it)",
} as const;

/**
 * Which fields a dot takes by its material: only dots with a size law take `shell`, only CdSe `sizingModel`; a `dye`
 * probe needs `dye`, a dye id of GET /api/v1/dyes, and takes
 * nothing its record sets; `dye` is for dye probes only, and `absorptionPeakNm` and `extinctionPeak` for custom probes
 * only. Then the size rules of checkDotSize.
 */
export function checkDotFields(dot: DotLike, ctx: z.RefinementCtx): void {
  const add = (message: string, field: string, apiCode = 'invalid_input') =>
    ctx.addIssue({ code: 'custom', message, path: [field], params: { apiCode } });
  if (dot.shell !== undefined && dot.shell.length > 0 && !isSizedMaterial(dot.material))
    add(`must not be given for ${dot.material} probes: only dots with a size law take a shell`, 'shell');
  if (dot.sizingModel !== undefined && dot.material !== 'cdse')
    add('is a choice for CdSe only (the other materials have one sizing curve)', 'sizingModel');
  if (dot.material === 'dye') {
    if (dot.dye === undefined) add("is required for material 'dye' (a dye id of GET /api/v1/dyes)", 'dye');
    else if (!DYE_IDS.includes(dot.dye))
      add(`'${dot.dye}' is not a dye id; GET /api/v1/dyes lists them: ${DYE_IDS.join(', ')}`, 'dye', 'unknown_dye');
    for (const [field, message] of Object.entries(SET_BY_DYE))
      if (dot[field as keyof typeof SET_BY_DYE] !== undefined) add(message, field);
    return;
  }
  if (dot.dye !== undefined) add("is only for material 'dye'", 'dye');
  if (dot.material !== 'custom') {
    for (const field of ['absorptionPeakNm', 'extinctionPeak'] as const)
      if (dot[field] !== undefined)
        add('is only for custom probes (this material has its own absorption model)', field);
  }
  checkDotSize(dot, ctx);
}

/** One probe of a panel. */
export const Probe = z
  .strictObject({
    id: identifier(),
    label: text().optional(),
    ...dotFields,
    abundance: ranged(RANGES.abundance[0], RANGES.abundance[1], '', true).optional(),
    target: text().optional(),
    channel: identifier().optional(),
  })
  .superRefine(checkDotFields);
