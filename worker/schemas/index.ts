// The schema family's public names (re-exported by worker/schemas.ts).
export { LIMITS } from './fields';
export { pointsTable } from './spectrum';
export { BandpassFilter, EdgeFilter, DichroicFilter, TableFilter, Filter } from './filter';
export { MaterialIdSchema, Probe } from './probe';
export { ExcitationLine, Channel, Background, Panel } from './panel';
export { Grid, DotRequest, SampledSpectrumJson, gridPointCount } from './dot';
export {
  ErrorBody,
  Health,
  ShareCreated,
  Material,
  MaterialList,
  Detector,
  DetectorList,
  ResolvedDotJson,
} from './responses';
export { Evaluation, ProbeEvaluationJson, WorstJson, LotShiftJson, GridJson } from './evaluation';
export {
  DesignResponse,
  DesignObjectiveJson,
  CatalogStatsJson,
  FreeStatsJson,
  NoisePredictionJson,
} from './design-response';
