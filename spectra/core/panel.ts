/**
 * The panel as plain data: the same shape as the API's panel (docs/api.md, "Panels"). The API's zod schema validates
 * requests into exactly this shape (a compile-time check in worker/schemas keeps the two in step), and the page
 * validates with the same schema; the spectral library takes checked panels and knows nothing of zod or HTTP.
 */

/**
 * Material ids of the API contract. `custom` is any other probe, described by measured spectra; `dye` is a dye,
 * counterstain or fluorescent protein of the dye library, named by the probe's `dye`.
 */
export const MATERIAL_IDS = ['cdse', 'cdte', 'cds', 'inp', 'gaas', 'cspbbr3', 'carbon', 'custom', 'dye'] as const;
export type MaterialId = (typeof MATERIAL_IDS)[number];

/** Shell materials a core/shell probe's layers may be made of (`silica`: a non-epitaxial encapsulation). */
export const SHELL_MATERIAL_IDS = ['zns', 'znse', 'cds', 'silica'] as const;
export type ShellMaterialId = (typeof SHELL_MATERIAL_IDS)[number];

/** One shell layer, innermost first. */
export interface ShellLayer {
  material: ShellMaterialId;
  thicknessNm: number;
}

/** Sizing curves a probe may choose (`sizingModel`): CdSe has two published calibrations; Yu 2003 is the default. */
export const SIZING_MODELS = ['yu2003', 'jasieniak2009'] as const;
export type SizingModelId = (typeof SIZING_MODELS)[number];

/** [wavelength in nm, value] pairs, ascending in wavelength. */
export type SpectrumPoints = [number, number][];

export interface ExcitationLine {
  wavelengthNm: number;
  /** Relative power of the line (default 1). */
  powerRel?: number;
}

export interface ProbeSpec {
  id: string;
  label?: string;
  material: MaterialId;
  /** Exactly one of emissionPeakNm / diameterNm for sized materials; carbon dots take emissionPeakNm. */
  emissionPeakNm?: number;
  diameterNm?: number;
  /** Shell layers around the core, innermost first; absent or [] is a bare core. */
  shell?: ShellLayer[];
  /** CdSe only: which published sizing curve turns size into colour (default yu2003). */
  sizingModel?: SizingModelId;
  /** Size dispersion σ/d in percent (default: the material's typical value). */
  sizeDispersionPct?: number;
  /** Emission FWHM override in nm (carbon dots; otherwise predicted from size dispersion). */
  fwhmNm?: number;
  /** 0–1 (default: the material's typical value for water-soluble conjugates). */
  quantumYield?: number;
  /** Relative abundance of the target (default 1). */
  abundance?: number;
  target?: string;
  /** Id of the channel assigned to this probe. */
  channel?: string;
  /** Replaces the model's emission shape. */
  measuredEmission?: { points: SpectrumPoints };
  /** Replaces the model's absorption, in M⁻¹ cm⁻¹. */
  extinction?: { points: SpectrumPoints };
  /** The id of a dye of the dye library (material `dye` only). */
  dye?: string;
  /** Absorption peak of a custom probe's modelled band, nm. */
  absorptionPeakNm?: number;
  /** Molar extinction at the peak of a custom probe's modelled band, M⁻¹ cm⁻¹. */
  extinctionPeak?: number;
}

/** The fields that describe one dot (a probe's own fields, without its place in a panel). */
export const DOT_INPUT_FIELDS = [
  'material',
  'emissionPeakNm',
  'diameterNm',
  'shell',
  'sizingModel',
  'sizeDispersionPct',
  'fwhmNm',
  'quantumYield',
  'measuredEmission',
  'extinction',
  'dye',
  'absorptionPeakNm',
  'extinctionPeak',
] as const satisfies readonly (keyof ProbeSpec)[];

/**
 * One dot as the API's POST /dots/resolve takes it (without the output grid): a probe's dot fields, plus the line
 * that excites it (for extinctionAtExcitation and the carbon-dot excitation dependence).
 */
export interface DotInput extends Pick<ProbeSpec, (typeof DOT_INPUT_FIELDS)[number]> {
  excitationNm?: number;
}

export interface EdgeFilterOptions {
  /** 0–1, default 0.93 (bandpass) / 0.95 (edge filters). */
  peakTransmission?: number;
  /** 10–90 % rise distance of the edge, nm. */
  edgeWidthNm?: number;
  /** Out-of-band optical density (transmission floor 10^-OD). */
  blockingOD?: number;
}

/** Filter kinds of the contract: the `type` of a FilterSpec. */
export const FILTER_TYPES = ['bandpass', 'longpass', 'shortpass', 'dichroic', 'table'] as const;
export type FilterType = (typeof FILTER_TYPES)[number];

export type FilterSpec =
  | ({ type: 'bandpass'; centerNm: number; widthNm: number } & EdgeFilterOptions)
  | ({ type: 'longpass' | 'shortpass'; edgeNm: number } & EdgeFilterOptions)
  | ({ type: 'dichroic'; edgeNm: number; passes: 'above' | 'below' } & EdgeFilterOptions)
  | { type: 'table'; points: SpectrumPoints };

export interface ChannelSpec {
  id: string;
  label?: string;
  filters: FilterSpec[];
  /** The excitation lines on while this channel is read (default: all lines of the panel). */
  excitationNm?: number | number[];
  /** A detector class id (see detectors); default: an ideal detector (QE 1). */
  detector?: string;
}

/** Sample types with an autofluorescence preset (spectra/light/background-presets.ts holds their bands). */
export const BACKGROUND_PRESET_IDS = ['ffpe-tissue', 'frozen-tissue', 'cultured-cells'] as const;
export type BackgroundPresetId = (typeof BACKGROUND_PRESET_IDS)[number];

/**
 * The light path every channel shares: filters in front of every detector (e.g. the main dichroic as the detectors
 * see it) and filters every excitation line passes (clean-up filters).
 */
export interface LightPathSpec {
  emissionFilters?: FilterSpec[];
  excitationFilters?: FilterSpec[];
}

/**
 * Sample autofluorescence times `level`: the default model, a sample type's preset (`preset`), or a measured spectrum
 * (`points`); never both a preset and points.
 */
export interface BackgroundSpec {
  level: number;
  preset?: BackgroundPresetId;
  points?: SpectrumPoints;
}

/**
 * Water Raman under every line (spectra/light/water-raman.ts): `level` 1 means the O–H band carries, under a 405 nm
 * line, as many photons as one probe with ε × QY = 1e5 M⁻¹ cm⁻¹ at abundance 1 (a convention of this tool).
 */
export interface WaterRamanSpec {
  level: number;
}

export interface PanelSpec {
  /** Panel format version; 1 when absent (the only version so far). */
  version?: 1;
  title?: string;
  excitation: ExcitationLine[];
  probes: ProbeSpec[];
  channels: ChannelSpec[];
  background?: BackgroundSpec;
  /** OD every channel should block the lines it is read under by (default 6); less gets a warning. */
  minBlockingOD?: number;
  /** Scattered excitation light reaching the detector unfiltered, in the units of `collected` (default 1e10). */
  scatterLevel?: number;
  /** Filters every channel and every line share (applied in addition to each channel's own). */
  lightPath?: LightPathSpec;
  /** The water Raman band under every line, part of the background (absent: not modelled). */
  waterRaman?: WaterRamanSpec;
  /**
   * Material classes the plan excludes (an institutional rule, a lab policy): a probe whose core or shell contains
   * one is named in the evaluation's warnings. Never a finding that the other probes are safe.
   */
  exclude?: ('cadmium' | 'lead' | 'arsenic')[];
  /**
   * Reference columns measured from single-stain controls: unmixing, noise and spillover use them in place of the
   * modelled columns of these probes (spectra/signal/measured-reference.ts).
   */
  measuredReference?: MeasuredReferenceSpec;
}

/**
 * Each listed probe's signal per channel in its single-stain control (unstained subtracted), in the order of
 * `channels` (channel ids); any scale, since only each column's shape is used.
 */
export interface MeasuredReferenceSpec {
  channels: string[];
  columns: { probe: string; values: number[] }[];
}

// FILTER_TYPES must list exactly the kinds of FilterSpec (a compile error otherwise).
type Same<A, B> = [A] extends [B] ? ([B] extends [A] ? true : false) : false;
type Assert<T extends true> = T;
/** `true` while FILTER_TYPES and FilterSpec['type'] agree. */
export type FilterTypesMatchSpec = Assert<Same<FilterType, FilterSpec['type']>>;
