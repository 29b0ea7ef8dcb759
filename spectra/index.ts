// Public surface of the spectral library. Only re-exports live here (a test snapshots this list).
export * from './errors';
export * from './grid';
export * from './panel';
// Filters, light path, detectors (spectral core II).
export { FILTER_DEFAULTS, MAX_BLOCKING_OD, type FilterDefaults } from './filters/defaults';
export { filterTransmission } from './filters/factory';
export { channelTransmission, MAX_FILTERS_PER_CHANNEL } from './filters/channel';
export { MAX_TABLE_POINTS } from './filters/table';
export { listDetectors, detectorQe, DETECTOR_CLASSES, type DetectorClass } from './detectors';
export { parseSpectrumCsv, CSV_LIMITS, type SpectrumCsvKind } from './csv';
export { svd, singularValues, type Svd } from './linalg/svd';
export { pseudoInverse } from './linalg/pinv';
export {
  conditionNumber,
  noiseAmplification,
  unmixLeastSquares,
  unmixNnls,
  unmixingDiagnostics,
  type UnmixResult,
  type UnmixingDiagnostics,
} from './unmix';
// Materials, sizing, line shapes, absorption, one dot (spectral core I).
export * from './constants';
export { nmToEv, evToNm, energyWidthToNm } from './units';
export {
  gaussianDensityPerEv,
  gaussianDensityPerNm,
  centerEvForPeakNm,
  peakNmOfLine,
  fwhmNmOfLine,
  fwhmEvForFwhmNm,
  sampleGaussianLine,
} from './lineshape';
export { intrinsicExtinction, modelExtinctionAtNm, sampleExtinction, type AbsorptionModel } from './absorption';
export { resolveDot, extinctionAtNm, type DotInput, type ResolvedDot } from './dot';
export { listMaterials, getMaterial, CARBON_EMISSION_RANGE_NM } from './materials/table';
export type { Material, MaterialFamily, Toxicity } from './materials/types';
export {
  emissionPeakForDiameterNm,
  diameterForEmissionPeakNm,
  firstExcitonNmForDiameter,
  emissionRangeForMaterialNm,
  isSizedMaterial,
} from './materials/sizing';
export { brusGapEv, brusDiameterNm } from './materials/brus';
export { BULK_PARAMS, type SizedMaterialId, type BulkParams } from './materials/params';
export { YU_2003, yuDiameterNm, yuExtinctionFirstExciton, type YuCurve } from './materials/yu2003';
export { INP_ALMEIDA_2023 } from './materials/almeida2023';
export { stokesShiftEv, STOKES_MODEL } from './materials/stokes';
export { smoothSizeFit, emissionFwhmEv } from './materials/width';
export { CARBON_EXCITATION_MODEL, carbonEmissionPeakNm } from './materials/carbon';
// Design engine, unmixing noise prediction, seeded random numbers.
export {
  ABUNDANCE_WORDS,
  DEFAULT_MIN_SIGNAL_FRACTION,
  abundanceValue,
  interference,
  worstInterference,
  targetSignals,
  type AbundanceInput,
  type CollectedMatrix,
  type DesignAssignment,
  type DesignObjective,
} from './design/objective';
export { CatalogSearch, type CatalogResult, type CatalogSearchStats } from './design/catalog';
export type { CatalogProblem } from './design/problem';
export {
  searchCatalog,
  searchCatalogAsync,
  DEFAULT_NODE_BUDGET,
  type SearchOptions,
  type SearchProgress,
} from './design/search';
export { predictUnmixingNoise, photonMixing, type NoiseInput, type NoisePrediction } from './noise';
export { simulateUnmixing, type MonteCarloOptions, type MonteCarloResult } from './design/monte-carlo';
export { createRandom, logFactorial, type RandomSource } from './random';
export {
  runDesign,
  runDesignAsync,
  designSteps,
  type DesignResult,
  type DesignHooks,
  type DesignObjectiveReport,
} from './design/design';
export {
  EXCLUSION_ELEMENTS,
  MAX_DESIGN_TARGETS,
  DEFAULT_WINDOW_NM,
  type DesignRequest,
  type DesignTarget,
  type Exclusion,
} from './design/request';
export { DEFAULT_FREE_NODE_BUDGET, MAX_NODE_BUDGET, type DesignOptions } from './design/options';
export { freeGridCatalog } from './design/free';
export { bandsOverlap, type Band, type FreeCatalog } from './design/free-catalog';
export {
  defaultAutofluorescence,
  backgroundEmission,
  AUTOFLUORESCENCE_BANDS,
  BACKGROUND_REFERENCE_BRIGHTNESS,
} from './background';
export { overlap, channelSupport, type ChannelSupport, type ConstantEnds } from './linalg/runs';
export {
  collectedMatrix,
  collectedColumn,
  crosstalkFigures,
  linesOn,
  RESOLUTION_THRESHOLD,
  type EmissionComponent,
  type CrosstalkFigures,
  type WorstInterference,
} from './crosstalk';
export { lotShiftSensitivity, shiftEmission, LOT_SHIFT_NM, type LotShiftSensitivity } from './sensitivity';
export {
  evaluatePanel,
  panelSpectra,
  buildPanelModel,
  clearResolvedDotCache,
  type PanelEvaluation,
  type ProbeEvaluation,
  type PanelSpectra,
  type PanelModel,
} from './evaluate';
