/**
 * Evaluates a whole panel under the signal model (docs/api.md, "The signal model"): collected, spillover, purity,
 * interference, unmixing diagnostics, background and lot-to-lot sensitivity. The spectra themselves (large arrays on
 * the grid) come from panelSpectra instead, so the API can leave them out.
 */
import { withMeasuredColumns, type ReferenceSource } from './measured-reference';
import { DEFAULT_GRID, type WavelengthGrid } from '../core/grid';
import type { PanelSpec } from '../core/panel';
import { collectedMatrix, crosstalkFigures, type WorstInterference } from './crosstalk';
import { makeJsonSafe } from './json-safe';
import {
  DEFAULT_MIN_BLOCKING_OD,
  DEFAULT_SCATTER_LEVEL,
  filtersAtLines,
  lineBlocking,
  lineLeak,
} from '../light/line-blocking';
import { foldLightPath } from '../light/light-path';
import { probeExclusions } from '../dot/materials/exclusions';
import { buildPanelModel, type PanelModel, type ProbeEvaluation } from './panel-model';
import { lotShiftSensitivity, type LotShiftSensitivity } from './sensitivity';
import { diagnoseMixing } from './unmix';

/** Everything evaluatePanel returns; JSON-safe (no NaN or Infinity: undefined figures are null with a warning). */
export interface PanelEvaluation {
  grid: WavelengthGrid;
  probes: ProbeEvaluation[];
  /** collected[c][p] in relative detected photons (a measured column: its measured shape at the model's scale). */
  collected: number[][];
  /** Per probe, where its column of `collected` comes from: the model, or the panel's measured reference. */
  referenceColumns: ReferenceSource[];
  spillover: (number | null)[][];
  primaryChannel: (number | null)[];
  purity: (number | null)[];
  /** spillover[c][p] below RESOLUTION_THRESHOLD (1e-3): smaller than the Gaussian line model can vouch for. */
  belowResolution: boolean[][];
  conditionNumber: number | null;
  noiseAmplification: (number | null)[];
  /**
   * Present when the panel has a background or water Raman: the sample's autofluorescence plus its water Raman
   * collected per channel, same units as collected.
   */
  backgroundCollected?: number[];
  /** With backgroundCollected: Σ collected / (backgroundCollected + the channel's line leak). */
  signalToBackground?: (number | null)[];
  /** With `waterRaman`: the water Raman of line l collected in channel c, [c][l] (part of backgroundCollected). */
  waterRamanCollected?: number[][];
  /**
   * Scattered excitation light collected per channel and line, [c][l] = powerRel × scatterLevel × T_c(λ_l) (0 for a
   * line the channel is not read under).
   */
  lineLeak: number[][];
  worst: WorstInterference;
  /** Null when options.sensitivity is false. */
  lotShiftSensitivity: LotShiftSensitivity | null;
  warnings: string[];
}

/** Per channel and line, a background's light collected: powerRel × Σ_λ emission_l(λ) · T_c(λ) · Δλ (0: line off). */
function collectedByLine(model: PanelModel, panel: PanelSpec, emission: number[][]): number[][] {
  const { grid, transmissions, linesOnByChannel } = model;
  // Each line's non-zero stretch, found once: a narrow band (water Raman) then costs its width, not the grid's.
  const stretch = emission.map(nonZeroStretch);
  return transmissions.map((t, c) => {
    const row = new Array<number>(panel.excitation.length).fill(0);
    for (const l of linesOnByChannel[c]) {
      let overlap = 0;
      const [from, to] = stretch[l];
      for (let i = from; i <= to; i++) overlap += emission[l][i] * t[i];
      row[l] = (panel.excitation[l].powerRel ?? 1) * overlap * grid.stepNm;
    }
    return row;
  });
}

/** First and last index of the non-zero values ([0, -1] when all are zero). */
function nonZeroStretch(values: number[]): [number, number] {
  let from = 0;
  while (from < values.length && values[from] === 0) from++;
  let to = values.length - 1;
  while (to >= from && values[to] === 0) to--;
  return from > to ? [0, -1] : [from, to];
}

const sum = (row: number[]) => row.reduce((a, v) => a + v, 0);

/** A warning for each probe whose core or shell is in a class the panel excludes. */
function excludedWarnings(panel: PanelSpec): string[] {
  const excluded = panel.exclude ?? [];
  if (excluded.length === 0) return [];
  return panel.probes.flatMap((p) => {
    const hit = probeExclusions(p).filter((word) => excluded.includes(word));
    const name = p.label ? `${p.label} (${p.id})` : p.id;
    return hit.length ? [`probe ${name} contains ${hit.join(' and ')}, which this panel excludes`] : [];
  });
}

/**
 * The background collected per channel (the sample's autofluorescence and water Raman, lines on in it, times their
 * power), the water Raman part per channel and line, and each channel's signal-to-background, the background being
 * those plus the excitation light leaking in (`leak`, per channel).
 */
function backgroundFigures(
  model: PanelModel,
  panel: PanelSpec,
  collected: number[][],
  leak: number[],
  warnings: string[],
): Pick<PanelEvaluation, 'backgroundCollected' | 'signalToBackground' | 'waterRamanCollected'> {
  const autofluorescence = model.background ? collectedByLine(model, panel, model.background).map(sum) : null;
  const waterRamanCollected = model.waterRaman ? collectedByLine(model, panel, model.waterRaman) : undefined;
  const backgroundCollected = panel.channels.map(
    (_, c) => (autofluorescence?.[c] ?? 0) + (waterRamanCollected ? sum(waterRamanCollected[c]) : 0),
  );
  const signalToBackground = backgroundCollected.map((sample, c) => {
    const b = sample + leak[c];
    if (b > 0) return sum(collected[c]) / b;
    warnings.push(`channel ${panel.channels[c].id} collects no background: its signal-to-background is undefined`);
    return null;
  });
  return { backgroundCollected, signalToBackground, ...(waterRamanCollected ? { waterRamanCollected } : {}) };
}

/**
 * Evaluates a checked panel on `options.grid` (default 300–1000 nm, 1 nm). `options.sensitivity` (default true) adds
 * the lot-to-lot check (each peak moved ±5 nm), which costs about twice the rest. Model errors throw SpectraError
 * naming the field, e.g. ['probes', 1, 'emissionPeakNm'].
 */
export function evaluatePanel(
  input: PanelSpec,
  options: { grid?: WavelengthGrid; sensitivity?: boolean } = {},
): PanelEvaluation {
  const { panel, model, crosstalk, referenceColumns } = modelAndCrosstalk(input, options.grid);
  const { grid } = model;
  const { collected, figures, probeIds } = crosstalk;
  const diagnostics = diagnoseMixing(collected, probeIds);
  const atLines = filtersAtLines(panel, model.linesOnByChannel);
  const leaks = lineBlocking(panel, model.linesOnByChannel, panel.minBlockingOD ?? DEFAULT_MIN_BLOCKING_OD, atLines);
  const warnings = [...figures.warnings, ...diagnostics.warnings, ...leaks.warnings, ...excludedWarnings(panel)];
  const evaluation: PanelEvaluation = {
    grid: { ...grid },
    probes: model.probeEvaluations,
    collected,
    referenceColumns,
    spillover: figures.spillover,
    primaryChannel: figures.primaryChannel,
    purity: figures.purity,
    belowResolution: figures.belowResolution,
    conditionNumber: diagnostics.conditionNumber,
    noiseAmplification: diagnostics.noiseAmplification,
    worst: figures.worst,
    lotShiftSensitivity: options.sensitivity === false ? null : lotShiftSensitivity(crosstalk),
    lineLeak: lineLeak(panel, model.linesOnByChannel, panel.scatterLevel ?? DEFAULT_SCATTER_LEVEL, atLines),
    warnings,
  };
  const leakByChannel = evaluation.lineLeak.map(sum);
  if (model.background || model.waterRaman)
    Object.assign(evaluation, backgroundFigures(model, panel, collected, leakByChannel, warnings));
  makeJsonSafe(evaluation, [], warnings);
  return evaluation;
}

/**
 * The lot-to-lot check of `evaluatePanel` on its own (the same figures as its `lotShiftSensitivity`), for a caller
 * that shows the rest first and adds this check after (it costs about as much as the rest of the evaluation).
 */
export function evaluateLotShift(input: PanelSpec, options: { grid?: WavelengthGrid } = {}): LotShiftSensitivity {
  return lotShiftSensitivity(modelAndCrosstalk(input, options.grid).crosstalk);
}

/**
 * The panel with its shared light path written out, its model on `grid`, and its collected matrix and crosstalk
 * figures with everything the lot-to-lot check reads.
 */
function modelAndCrosstalk(
  input: PanelSpec,
  grid: WavelengthGrid = DEFAULT_GRID,
): {
  panel: PanelSpec;
  model: PanelModel;
  crosstalk: Parameters<typeof lotShiftSensitivity>[0];
  referenceColumns: ReferenceSource[];
} {
  // A shared light path is evaluated as the panel with its parts written out.
  const panel = foldLightPath(input);
  const model = buildPanelModel(panel, grid);
  const { components, transmissions, assigned } = model;
  const probeIds = panel.probes.map((p) => p.id);
  const channelIds = panel.channels.map((c) => c.id);
  const measured = withMeasuredColumns(collectedMatrix(components, transmissions, model.grid.stepNm), panel, assigned);
  const collected = measured.collected;
  const figures = crosstalkFigures(collected, assigned, probeIds, channelIds);
  figures.warnings.push(...measured.warnings);
  const stepNm = model.grid.stepNm;
  return {
    panel,
    model,
    crosstalk: { components, transmissions, stepNm, collected, figures, assigned, probeIds, channelIds },
    referenceColumns: measured.source,
  };
}
