/**
 * A design request as plain data (the API's zod schema validates into this shape) and its checks: abundances as
 * numbers, the wavelength window, the materials left after the allowed list and the element exclusions.
 */
import { SpectraError } from '../core/errors';
import { DEFAULT_GRID, gridEndNm } from '../core/grid';
import { listMaterials } from '../dot/materials/catalog';
import type { Material } from '../dot/materials/types';
import { EXCLUSIONS, type Exclusion } from '../dot/materials/exclusions';
import type {
  ChannelSpec,
  ExcitationLine,
  MaterialId,
  MeasuredReferenceSpec,
  ProbeSpec,
  WaterRamanSpec,
} from '../core/panel';
import { abundanceValue, type AbundanceInput } from './objective';
import type { DesignOptions } from './options';

/**
 * What a user already owns for one target: the id of a probe and/or a channel the design must use for it. In catalog
 * mode the ids name candidates (or `owned` items); in free mode they name `owned` items.
 */
export interface DesignLock {
  probe?: string;
  channel?: string;
}

/** One target to label: a name, its relative abundance (number > 0 or high / medium / low), and any lock. */
export interface DesignTarget {
  name: string;
  abundance: AbundanceInput;
  lock?: DesignLock;
}

/** What POST /api/v1/panels/design takes. With `candidates` the search is exact over them (catalog mode). */
export interface DesignRequest {
  targets: DesignTarget[];
  excitation: ExcitationLine[];
  allowedMaterials?: MaterialId[];
  exclude?: Exclusion[];
  windowNm?: [number, number];
  candidates?: { probes: ProbeSpec[]; channels: ChannelSpec[] };
  options?: DesignOptions;
  /** The sample's scattered excitation light, as a panel's (default DEFAULT_SCATTER_LEVEL); joins the noise figures. */
  scatterLevel?: number;
  /** The sample's water Raman, as a panel's; joins the noise figures. */
  waterRaman?: WaterRamanSpec;
  /**
   * Probes and channels the user already has. They join the candidates (catalog mode) or the generated grid (free
   * mode), and targets' locks name them; the rest of the panel is designed around them.
   */
  owned?: { probes?: ProbeSpec[]; channels?: ChannelSpec[] };
  /**
   * Free mode: the channels to choose from instead of stock bandpass sizes, e.g. an instrument profile's channels.
   * Not with `candidates` (catalog mode has its own channels).
   */
  channelChoices?: ChannelSpec[];
  /**
   * Reference columns measured from single-stain controls (a panel's measuredReference): in catalog mode they replace
   * the modelled columns of the candidate probes they cover, when every candidate channel was measured.
   */
  measuredReference?: MeasuredReferenceSpec;
}

/** Default emission window of free mode, nm: our choice, the visible range up to the near-infrared edge of common
 * cameras. */
export const DEFAULT_WINDOW_NM: readonly [number, number] = Object.freeze([400, 800]) as readonly [number, number];

/** The targets' names and abundances as numbers. */
export interface DesignTargets {
  names: string[];
  abundance: number[];
}

/** The targets of a checked request: names, and abundances with the words turned into numbers. */
export function targetsOf(targets: DesignTarget[]): DesignTargets {
  return { names: targets.map((t) => t.name), abundance: targets.map((t) => abundanceValue(t.abundance)) };
}

/** The emission window (default DEFAULT_WINDOW_NM); it must lie within the wavelength grid the design works on. */
export function normalizeWindow(windowNm: [number, number] | undefined): [number, number] {
  if (windowNm === undefined) return [DEFAULT_WINDOW_NM[0], DEFAULT_WINDOW_NM[1]];
  const [lo, hi] = windowNm;
  if (!(lo >= DEFAULT_GRID.startNm && hi <= gridEndNm(DEFAULT_GRID))) {
    throw new SpectraError(
      'out_of_range',
      `windowNm must lie within ${DEFAULT_GRID.startNm}–${gridEndNm(DEFAULT_GRID)} nm`,
      ['windowNm'],
    );
  }
  return [lo, hi];
}

/**
 * Emission peaks free mode offers for a material: the reach under its typical shell (designs propose probes as they
 * are sold), or the accepted range of a material without a size law (carbon dots).
 */
export function designReachNm(m: Material): [number, number] {
  return m.typicalShellEmissionRangeNm ?? m.emissionRangeNm!;
}

/**
 * A designed probe of material `m` at `emissionPeakNm`, with the material's typical shell when it has one (no shell
 * key for a material whose typical shell is empty or that has none).
 */
export function designProbe(id: string, m: Material, emissionPeakNm: number): ProbeSpec {
  const shell = m.typicalShell && m.typicalShell.length > 0 ? { shell: m.typicalShell.map((l) => ({ ...l })) } : {};
  return { id, material: m.id, emissionPeakNm, ...shell };
}

/**
 * Materials a design leaves out unless the request's allowedMaterials names them, with the reason (said in the
 * design's warnings): probes unsuitable for aqueous stains on fixed cells and tissue, the usual sample.
 */
export const LEFT_OUT_BY_DEFAULT: Readonly<Partial<Record<MaterialId, string>>> = Object.freeze({
  // Lead-halide perovskite nanocrystals degrade in water unless encapsulated (Protesescu et al., Nano Lett. 2015,
  // 15, 3692, who made them in non-polar solvent; water instability: common practice, from memory).
  cspbbr3:
    'CsPbBr3 nanocrystals degrade in water without encapsulation (and contain lead); name it in allowedMaterials ' +
    'for an encapsulated product',
  carbon:
    'carbon dots emit broadly and change colour with the line, which spreads light into every channel; name it in ' +
    'allowedMaterials to include it',
});

/** The reasons for the materials a request leaves out by default (none when it names its materials). */
export function defaultLeftOut(request: Pick<DesignRequest, 'allowedMaterials'>): string[] {
  if (request.allowedMaterials) return [];
  const illustrative = listMaterials()
    .filter((m) => m.illustrative)
    .map((m) => `${m.name} is left out: its model is illustrative, not fitted to published sizes`);
  return [...Object.entries(LEFT_OUT_BY_DEFAULT).map(([id, why]) => `${id} is left out: ${why}`), ...illustrative];
}

/**
 * The materials free mode may use: the allowed list (default: every material with a size law or accepted range, i.e.
 * not `custom`, not an illustrative one such as GaAs and none of LEFT_OUT_BY_DEFAULT, unless the list names it),
 * minus those containing an excluded element, minus those whose emission cannot reach the window.
 */
export function allowedMaterials(
  request: Pick<DesignRequest, 'allowedMaterials' | 'exclude'>,
  windowNm: [number, number],
): Material[] {
  const excluded = new Set<string>((request.exclude ?? []).map((word) => EXCLUSIONS[word]));
  const wanted = request.allowedMaterials ? new Set<string>(request.allowedMaterials) : null;
  const field = wanted ? 'allowedMaterials' : 'exclude';
  const usable = listMaterials().filter(
    (m) =>
      m.emissionRangeNm !== null &&
      (wanted ? wanted.has(m.id) : !m.illustrative && LEFT_OUT_BY_DEFAULT[m.id as MaterialId] === undefined),
  );
  const clean = usable.filter((m) => !m.elements.some((e) => excluded.has(e)));
  if (clean.length === 0)
    throw new SpectraError('invalid_input', 'no material is left after the allowed list and the exclusions', [field]);
  const reach = clean.filter((m) => designReachNm(m)[1] >= windowNm[0] && designReachNm(m)[0] <= windowNm[1]);
  if (reach.length === 0) {
    throw new SpectraError(
      'invalid_input',
      `none of ${clean.map((m) => m.id).join(', ')} emits inside ${windowNm[0]}–${windowNm[1]} nm`,
      ['windowNm'],
    );
  }
  return reach;
}
