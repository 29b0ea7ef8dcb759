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
export { conditionNumber, noiseAmplification, unmixLeastSquares, unmixNnls, unmixingDiagnostics, type UnmixResult, type UnmixingDiagnostics } from './unmix';
