/**
 * The spectral library's public names: what the worker, the page and the benchmarks use, plus the reference functions
 * that docs/science.md documents (published models the tests check against their sources). Only re-exports live
 * here; a test snapshots the list, so it changes only on purpose.
 */

// Core: plain data, units, grids, limits, tables.
export { SpectraError, type SpectraErrorCode } from './core/errors';
export * from './core/constants';
export { nmToEv, evToNm, energyWidthToNm } from './core/units';
export {
  DEFAULT_GRID,
  gridPointCount,
  makeGrid,
  spectrumAtNm,
  spectrumOnGrid,
  type SampledSpectrum,
  type Table,
  type WavelengthGrid,
} from './core/grid';
export {
  BACKGROUND_PRESET_IDS,
  FILTER_TYPES,
  MATERIAL_IDS,
  SHELL_MATERIAL_IDS,
  SIZING_MODELS,
  type BackgroundPresetId,
  type ShellLayer,
  type ShellMaterialId,
  type SizingModelId,
  type BackgroundSpec,
  type ChannelSpec,
  type DotInput,
  type EdgeFilterOptions,
  type ExcitationLine,
  type FilterSpec,
  type FilterType,
  type LightPathSpec,
  type MaterialId,
  type PanelSpec,
  type ProbeSpec,
  type SpectrumPoints,
  type WaterRamanSpec,
} from './core/panel';
export { LIMITS } from './core/limits';
export { CSV_LIMITS, parseSpectrumCsv, resampleTable, type SpectrumCsvKind } from './core/tables';
export { createRandom, type RandomSource } from './core/random';

// One probe: materials, size laws, line shape, absorption.
export { listMaterials } from './dot/materials/catalog';
export type { Material, MaterialFamily, Toxicity } from './dot/materials/types';
export { EXCLUSIONS, EXCLUSION_WORDS, exclusionsOf, type Exclusion } from './dot/materials/exclusions';
export { BULK_PARAMS } from './dot/materials/params';
export {
  diameterForEmissionPeakNm,
  emissionPeakForDiameterNm,
  emissionRangeForMaterialNm,
  firstExcitonNmForDiameter,
  isSizedMaterial,
  type SizingOptions,
} from './dot/sizing/sizing';
export { JASIENIAK_2009 } from './dot/sizing/jasieniak2009';
export { CSPBBR3_EMISSION_LAW, cspbbr3EmissionEv } from './dot/sizing/cspbbr3';
export { INP_ALMEIDA_2023, inpFirstExcitonEv } from './dot/sizing/almeida2023';
export { SHELL_MATERIALS, TYPICAL_SHELLS, type ShellMaterial } from './dot/shells/materials';
export { LEAK_SCALE, carrierReach, shellShiftEv } from './dot/shells/shell';
export { cutEmissionAtLine } from './dot/line-cut';
export { YU_2003, yuDiameterNm } from './dot/sizing/yu2003';
export { brusDiameterNm, brusGapEv } from './dot/sizing/brus';
export {
  centerEvForPeakNm,
  fwhmEvForFwhmNm,
  fwhmNmOfLine,
  gaussianDensityPerEv,
  gaussianDensityPerNm,
  peakNmOfLine,
  sampleGaussianLine,
} from './dot/lineshape';
export {
  logNormalBandForNm,
  logNormalEmissionBand,
  logNormalShape,
  sampleLogNormalLine,
  type LogNormalBand,
} from './dot/lognormal';
export { intrinsicExtinction, sampleExtinction, type AbsorptionModel } from './dot/absorption';
export { DYE_IDS, listDyes } from './dot/dyes/catalog';
export {
  DYE_KINDS,
  VALUE_STATUSES,
  type Dye,
  type DyeKind,
  type SourcedValue,
  type ValueStatus,
} from './dot/dyes/types';
export { extinctionAtNm, resolveDot, type DotFields, type ResolvedDot } from './dot/resolve';

// The light path: filters, detectors, sample background.
export { FILTER_DEFAULTS, MAX_BLOCKING_OD } from './light/filters/defaults';
export { filterTransmission } from './light/filters/filter';
export { foldLightPath, seriesTransmission } from './light/light-path';
export {
  instrumentChannels,
  instrumentChoices,
  instrumentLightPath,
  instrumentLines,
  resolveOnInstrument,
  type ChannelPresetSpec,
  type InstrumentDetector,
  type InstrumentChoices,
  type InstrumentLaser,
  type InstrumentSpec,
  type NamedFilterSpec,
  type PanelOnInstrumentSpec,
} from './light/instrument';
export { EXAMPLE_INSTRUMENTS } from './light/example-instruments';
export {
  DEFAULT_MIN_BLOCKING_OD,
  DEFAULT_SCATTER_LEVEL,
  lineBlocking,
  lineLeak,
  type LineBlocking,
} from './light/line-blocking';
export {
  STOCK_BANDPASS_RULE,
  isStockBandpass,
  listStockBandpasses,
  nearestStockBandpass,
  type StockBandpass,
} from './light/filters/stock';
export { channelTransmission } from './light/filters/channel';
export { DEFAULT_DETECTOR_ID, DETECTOR_IDS, detectorQe, listDetectors, type DetectorClass } from './light/detectors';
export { AUTOFLUORESCENCE_BANDS, BACKGROUND_REFERENCE_BRIGHTNESS, defaultAutofluorescence } from './light/background';
export { listBackgroundPresets, presetAutofluorescence, type BackgroundPresetList } from './light/background-presets';
export { SOURCE_STATUSES, type Citation, type SourceStatus } from './light/autofluorescence-sources';
export {
  WATER_RAMAN_FWHM_CM1,
  WATER_RAMAN_REFERENCE_NM,
  WATER_RAMAN_SHIFT_CM1,
  ramanPeakNm,
  ramanRelativeStrength,
  waterRamanBand,
  waterRamanEmission,
} from './light/water-raman';

// Signals: crosstalk, unmixing, noise, lot-to-lot sensitivity, whole-panel evaluation.
export {
  collectedMatrix,
  crosstalkFigures,
  type CrosstalkFigures,
  type EmissionComponent,
  type WorstInterference,
} from './signal/crosstalk';
export { svd, singularValues, type Svd } from './signal/linalg/svd';
export { pseudoInverse } from './signal/linalg/pinv';
export {
  conditionNumber,
  noiseAmplification,
  unmixLeastSquares,
  unmixNnls,
  type UnmixResult,
  type UnmixingDiagnostics,
} from './signal/unmix';
export { photonMixing, predictUnmixingNoise, type NoiseInput, type NoisePrediction } from './signal/noise';
export { simulateUnmixing, type MonteCarloOptions, type MonteCarloResult } from './signal/monte-carlo';
export { lotShiftSensitivity, shiftEmission, type LotShiftSensitivity } from './signal/sensitivity';
export type { PanelModel, ProbeEvaluation } from './signal/panel-model';
export { evaluateLotShift, evaluatePanel, type PanelEvaluation } from './signal/evaluate';
export { LOT_SHIFT_NM } from './signal/sensitivity';
export { panelSpectra, type PanelSpectra } from './signal/panel-spectra';

// Images: unmixing a pilot image pixel by pixel, and the mean of a region per plane.
export type { PixelUnmixMethod, PixelUnmixOutput, PixelUnmixer } from './image/types';
export { allocateUnmixOutput, pixelUnmixer } from './image/unmixer';
export { regionMeans, type PixelRegion } from './image/region';

// Design: the objective, the exact catalog search, the whole pipeline.
export {
  ABUNDANCE_WORDS,
  worstInterference,
  type AbundanceInput,
  type CollectedMatrix,
  type DesignAssignment,
  type DesignObjective,
} from './design/objective';
export type { CatalogResult } from './design/catalog';
export type { CatalogProblem } from './design/problem';
export { searchCatalog, type SearchOptions, type SearchProgress } from './design/search';
export { DESIGN_DEFAULTS, type DesignOptions } from './design/options';
export {
  DEFAULT_WINDOW_NM,
  LEFT_OUT_BY_DEFAULT,
  type DesignLock,
  type DesignRequest,
  type DesignTarget,
} from './design/request';
export { PRACTICE_DEFAULTS } from './design/practice';
export {
  estimateDesignCost,
  planBoundedDesign,
  GET_UNDER_HINT,
  type DesignCost,
  type DesignRefusal,
  type DesignWorkPlan,
} from './design/cost';
export {
  runDesign,
  runDesignAsync,
  type DesignHooks,
  type DesignObjectiveReport,
  type DesignResult,
} from './design/design';
