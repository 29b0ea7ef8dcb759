/**
 * The API's contract as zod schemas (docs/api.md): they validate requests, give the TypeScript types (z.infer) and
 * generate GET /api/v1/openapi.json. The page validates what it computes and loads with the same schemas, and reads
 * their complaints through issueToError, so both say the same words.
 */
import type { z } from 'zod';
import type {
  BackgroundPresetList as BackgroundPresetListSpec,
  DesignResult,
  Dye as DyeSpec,
  LotShiftSensitivity,
  Material as MaterialSpec,
  PanelEvaluation,
  ControlsMeasurement,
  ControlsReport,
  InstrumentSpec,
  PanelOnInstrumentSpec,
  PanelSpec,
} from '../../spectra/index';
import { Panel, PanelRequest } from './panel';
import { Instrument } from './instrument';
import type { DesignResponse } from './design-response';
import type { Evaluation, LotShiftJson } from './evaluation';
import type { BackgroundPresetList, Material } from './responses';
import type { Dye } from './dyes';
import type { ControlsInput, ControlsSpillover } from './controls';

export { LIMITS, RANGES, SHARE_ID_PATTERN } from './limits';
export { ApiError, type ApiErrorCode } from './errors';
export { issueToError, pathText } from './issues';
export { pointsTable } from './spectrum';
export { BandpassFilter, EdgeFilter, DichroicFilter, TableFilter, Filter } from './filter';
export { MaterialIdSchema, Probe } from './probe';
export {
  ExcitationLine,
  Channel,
  Background,
  EvaluateRequest,
  LightPath,
  Panel,
  PanelRequest,
  WaterRaman,
} from './panel';
export {
  ChannelPreset,
  Instrument,
  InstrumentCreated,
  InstrumentDetector,
  InstrumentLaser,
  InstrumentList,
  NamedFilter,
} from './instrument';
export { Grid, DotRequest, SampledSpectrumJson } from './dot';
export {
  ErrorBody,
  Health,
  ShareCreated,
  Material,
  MaterialList,
  Detector,
  DetectorList,
  CitationJson,
  BackgroundBandJson,
  BackgroundPresetList,
  StockFilterList,
  ResolvedDotJson,
  ToxicityJson,
} from './responses';
export { Dye, DyeList, SourcedValueJson } from './dyes';
export { ComparedEntryJson, ControlRow, ControlsInput, ControlsRequest, ControlsSpillover } from './controls';

/** The contract's error body. */
export type ErrorBody = z.infer<typeof ErrorBody>;
export { Evaluation, ProbeEvaluationJson, WorstJson, LotShiftJson, GridJson } from './evaluation';
export {
  Abundance,
  DesignLock,
  DesignOptions,
  DesignRequest,
  DesignTarget,
  withInstrument,
  type ResolvedDesignRequest,
} from './design';
export {
  DesignResponse,
  DesignObjectiveJson,
  CatalogStatsJson,
  FreeStatsJson,
  NoisePredictionJson,
} from './design-response';

/** A validated panel. */
export type Panel = z.infer<typeof Panel>;
/** A validated panel request (written out, or naming an instrument). */
export type PanelRequest = z.infer<typeof PanelRequest>;
/** A validated instrument profile. */
export type Instrument = z.infer<typeof Instrument>;

// spectra/ cannot import zod, so its types are written by hand. These lines stop compiling when a schema and the
// spectral library's type drift apart (in both directions where both describe the same data).
type Same<A, B> = [A] extends [B] ? ([B] extends [A] ? true : false) : false;
type Assert<T extends true> = T;
/** The zod Panel and spectra's PanelSpec describe the same shape. */
export type PanelMatchesSpec = Assert<Same<Panel, PanelSpec>>;
/** A valid instrument profile is what spectra's resolveOnInstrument takes (the schema narrows detector types). */
export type InstrumentFitsSpec = Assert<Instrument extends InstrumentSpec ? true : false>;
/** A panel request is what spectra's resolveOnInstrument takes. */
export type PanelRequestFitsSpec = Assert<PanelRequest extends PanelOnInstrumentSpec ? true : false>;
/** An evaluation as the API sends it is exactly what evaluatePanel returns. */
export type EvaluationMatchesSpec = Assert<Same<z.infer<typeof Evaluation>, PanelEvaluation>>;
/** The lot-shift figures likewise. */
export type LotShiftMatchesSpec = Assert<Same<z.infer<typeof LotShiftJson>, LotShiftSensitivity>>;
/** A material of GET /api/v1/materials is the library's Material. */
export type MaterialMatchesSpec = Assert<Same<z.infer<typeof Material>, MaterialSpec>>;
/** GET /api/v1/backgrounds answers exactly what listBackgroundPresets returns. */
export type BackgroundPresetListMatchesSpec = Assert<
  Same<z.infer<typeof BackgroundPresetList>, BackgroundPresetListSpec>
>;
/** A dye of GET /api/v1/dyes is the library's Dye. */
export type DyeMatchesSpec = Assert<Same<z.infer<typeof Dye>, DyeSpec>>;
/**
 * What runDesign returns is a valid design answer (the answer may also carry null where a number had no finite value).
 */
export type DesignResponseMatchesSpec = Assert<DesignResult extends z.infer<typeof DesignResponse> ? true : false>;
/** The controls schema and spectra's ControlsMeasurement describe the same shape. */
export type ControlsMatchSpec = Assert<Same<z.infer<typeof ControlsInput>, ControlsMeasurement>>;
/** The controls route answers exactly what controlsReport returns. */
export type ControlsReportMatchesSpec = Assert<Same<z.infer<typeof ControlsSpillover>, ControlsReport>>;
