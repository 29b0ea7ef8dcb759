/**
 * A fast test that an evaluation holds no NaN or ±Infinity, field by known field. evaluatePanel runs the general
 * guard (json-safe.ts: a walk of every value that builds paths for its warnings) only when this finds one, which is
 * rare: extreme inputs (e.g. a measured extinction of 1e300) can overflow. The tables below are typed against
 * PanelEvaluation and ProbeEvaluation, so a field added there without a check here does not compile.
 */
import type { PanelEvaluation } from './evaluate-panel';
import type { ProbeEvaluation } from './panel-model';

// False only for NaN and ±Infinity (and non-numbers, which no number field should hold); null passes.
function ok(v: unknown): boolean {
  return v === null || (typeof v === 'number' && v - v === 0);
}

function okList(list: readonly unknown[] | undefined): boolean {
  if (list === undefined) return true;
  for (let i = 0; i < list.length; i++) if (!ok(list[i])) return false;
  return true;
}

function okRows(rows: readonly (readonly unknown[])[]): boolean {
  for (let i = 0; i < rows.length; i++) if (!okList(rows[i])) return false;
  return true;
}

// Any value: numbers checked, arrays and objects walked (for the small nested records).
function okDeep(value: unknown): boolean {
  if (value === null || typeof value !== 'object') return typeof value !== 'number' || value - value === 0;
  for (const item of Object.values(value)) if (!okDeep(item)) return false;
  return true;
}

const yes = (): boolean => true;

// How to check each field of a probe's record (text and flags need no check).
const PROBE_FIELDS: { [K in keyof Required<ProbeEvaluation>]: (p: ProbeEvaluation) => boolean } = {
  id: yes,
  label: yes,
  material: yes,
  model: yes,
  measured: yes,
  warnings: yes,
  diameterNm: (p) => ok(p.diameterNm),
  firstExcitonNm: (p) => ok(p.firstExcitonNm),
  emissionPeakNm: (p) => ok(p.emissionPeakNm),
  fwhmNm: (p) => ok(p.fwhmNm),
  quantumYield: (p) => ok(p.quantumYield),
  extinctionFirstExciton: (p) => ok(p.extinctionFirstExciton),
  extinctionAtExcitation: (p) => ok(p.extinctionAtExcitation),
  extinctionAtLines: (p) => okList(p.extinctionAtLines),
  brightness: (p) => ok(p.brightness),
  brightnessPerAbundance: (p) => ok(p.brightnessPerAbundance),
  emissionPeakNmByLine: (p) => okList(p.emissionPeakNmByLine),
};
const PROBE_CHECKS = Object.values(PROBE_FIELDS);

// How to check each field of an evaluation.
const FIELDS: { [K in keyof Required<PanelEvaluation>]: (e: PanelEvaluation) => boolean } = {
  grid: (e) => ok(e.grid.startNm) && ok(e.grid.stepNm) && ok(e.grid.count),
  probes: (e) => e.probes.every((p) => PROBE_CHECKS.every((check) => check(p))),
  collected: (e) => okRows(e.collected),
  spillover: (e) => okRows(e.spillover),
  primaryChannel: (e) => okList(e.primaryChannel),
  purity: (e) => okList(e.purity),
  belowResolution: yes,
  conditionNumber: (e) => ok(e.conditionNumber),
  noiseAmplification: (e) => okList(e.noiseAmplification),
  backgroundCollected: (e) => okList(e.backgroundCollected),
  signalToBackground: (e) => okList(e.signalToBackground),
  worst: (e) => okDeep(e.worst),
  lotShiftSensitivity: (e) => okDeep(e.lotShiftSensitivity),
  warnings: yes,
};
const CHECKS = Object.values(FIELDS);

/** True when every number of the evaluation is finite (nulls allowed). */
export function evaluationIsFinite(evaluation: PanelEvaluation): boolean {
  for (let i = 0; i < CHECKS.length; i++) if (!CHECKS[i](evaluation)) return false;
  return true;
}
