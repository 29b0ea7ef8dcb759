// The schema family's public names (re-exported by worker/schemas.ts).
export { LIMITS } from './fields';
export { pointsTable } from './spectrum';
export { BandpassFilter, EdgeFilter, DichroicFilter, TableFilter, Filter } from './filter';
export { MaterialIdSchema, Probe } from './probe';
export { ExcitationLine, Channel, Background, Panel } from './panel';
export { Grid, DotRequest, SampledSpectrumJson, gridPointCount } from './dot';
export { ErrorBody, Health, ShareCreated, Material, Detector, ResolvedDotJson, Evaluation } from './responses';
