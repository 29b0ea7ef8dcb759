/**
 * A design request as plain data (the API's zod schema validates into this shape) and its checks: abundances as
 * numbers, the wavelength window, the materials left after the allowed list and the element exclusions.
 */
import { SpectraError } from '../errors';
import { DEFAULT_GRID, gridEndNm } from '../grid';
import { listMaterials } from '../materials/table';
import type { Material } from '../materials/types';
import type { ChannelSpec, ExcitationLine, MaterialId, ProbeSpec } from '../panel';
import { abundanceValue, type AbundanceInput } from './objective';
import type { DesignOptions } from './options';

/** One target to label: a name and its relative abundance (number > 0 or high / medium / low). */
export interface DesignTarget {
  name: string;
  abundance: AbundanceInput;
}

/** Exclusions by element, named in words. */
export const EXCLUSION_ELEMENTS = Object.freeze({ cadmium: 'Cd', lead: 'Pb', arsenic: 'As' } as const);
export type Exclusion = keyof typeof EXCLUSION_ELEMENTS;

/** What POST /api/v1/panels/design takes. With `candidates` the search is exact over them (catalog mode). */
export interface DesignRequest {
  targets: DesignTarget[];
  excitation: ExcitationLine[];
  allowedMaterials?: MaterialId[];
  exclude?: Exclusion[];
  windowNm?: [number, number];
  candidates?: { probes: ProbeSpec[]; channels: ChannelSpec[] };
  options?: DesignOptions;
}

/** Most targets one design takes (a panel holds at most 16 probes). */
export const MAX_DESIGN_TARGETS = 16;

/** Default emission window of free mode, nm: our choice, the visible range up to the near-infrared edge of common cameras. */
export const DEFAULT_WINDOW_NM: readonly [number, number] = Object.freeze([400, 800]) as readonly [number, number];

/** The checked essentials of a request. */
export interface NormalizedTargets {
  names: string[];
  abundance: number[];
}

/** Checks the targets: 1–16, unique names, abundances > 0 (words mapped by ABUNDANCE_WORDS). */
export function normalizeTargets(targets: DesignTarget[]): NormalizedTargets {
  if (!Array.isArray(targets) || targets.length === 0)
    throw new SpectraError('invalid_input', 'a design needs at least one target', ['targets']);
  if (targets.length > MAX_DESIGN_TARGETS) {
    throw new SpectraError(
      'invalid_input',
      `at most ${MAX_DESIGN_TARGETS} targets are allowed, got ${targets.length}`,
      ['targets'],
    );
  }
  const seen = new Set<string>();
  const names = targets.map((t, i) => {
    if (typeof t?.name !== 'string' || t.name === '')
      throw new SpectraError('invalid_input', 'a target needs a name', ['targets', i, 'name']);
    if (seen.has(t.name))
      throw new SpectraError('invalid_input', `target name "${t.name}" is used twice`, ['targets', i, 'name']);
    seen.add(t.name);
    return t.name;
  });
  return { names, abundance: targets.map((t, i) => abundanceValue(t.abundance, ['targets', i, 'abundance'])) };
}

/** Checks the window: two finite numbers, min < max, inside the wavelength grid. */
export function normalizeWindow(windowNm: [number, number] | undefined): [number, number] {
  if (windowNm === undefined) return [DEFAULT_WINDOW_NM[0], DEFAULT_WINDOW_NM[1]];
  const [lo, hi] = windowNm;
  if (!Number.isFinite(lo) || !Number.isFinite(hi) || !(lo < hi)) {
    throw new SpectraError('invalid_input', `windowNm must be [min, max] with min < max, got [${lo}, ${hi}]`, [
      'windowNm',
    ]);
  }
  if (lo < DEFAULT_GRID.startNm || hi > gridEndNm(DEFAULT_GRID)) {
    throw new SpectraError(
      'out_of_range',
      `windowNm must lie within ${DEFAULT_GRID.startNm}–${gridEndNm(DEFAULT_GRID)} nm`,
      ['windowNm'],
    );
  }
  return [lo, hi];
}

/**
 * The materials free mode may use: the allowed list (default: every material with a size law or accepted range, i.e.
 * not `custom`), minus those containing an excluded element, minus those whose emission cannot reach the window.
 */
export function allowedMaterials(
  request: Pick<DesignRequest, 'allowedMaterials' | 'exclude'>,
  windowNm: [number, number],
): Material[] {
  const excluded = new Set<string>((request.exclude ?? []).map((word) => EXCLUSION_ELEMENTS[word]));
  const wanted = request.allowedMaterials ? new Set<string>(request.allowedMaterials) : null;
  const field = wanted ? 'allowedMaterials' : 'exclude';
  const usable = listMaterials().filter(
    (m) => m.id !== 'custom' && m.emissionRangeNm !== null && (!wanted || wanted.has(m.id)),
  );
  const clean = usable.filter((m) => !m.elements.some((e) => excluded.has(e)));
  if (clean.length === 0)
    throw new SpectraError('invalid_input', 'no material is left after the allowed list and the exclusions', [field]);
  const reach = clean.filter((m) => m.emissionRangeNm![1] >= windowNm[0] && m.emissionRangeNm![0] <= windowNm[1]);
  if (reach.length === 0) {
    throw new SpectraError(
      'invalid_input',
      `none of ${clean.map((m) => m.id).join(', ')} emits inside ${windowNm[0]}–${windowNm[1]} nm`,
      ['windowNm'],
    );
  }
  return reach;
}
