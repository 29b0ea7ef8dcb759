/**
 * Evaluates a whole panel under the signal model of api-v1: collected, spillover, purity, interference, unmixing
 * diagnostics, background and lot-to-lot sensitivity, from the panel model (panel-model.ts). The big arrays (spectra
 * on the grid) come from panelSpectra instead, so the API can leave them out.
 */
import type { PanelSpec } from '../panel';
import { DEFAULT_GRID, type WavelengthGrid } from '../grid';
import { collectedMatrixOfWindows, crosstalkFigures, type WorstInterference } from '../crosstalk';
import { overlap } from '../linalg/runs';
import { diagnoseMixing } from '../unmix';
import { lotShiftSensitivity, type LotShiftSensitivity } from '../sensitivity';
import { gridComponents, modelPanel, type PanelCoreModel, type ProbeEvaluation } from './panel-model';
import { makeJsonSafe } from './json-safe';
import { evaluationIsFinite } from './finite-check';

/** Everything evaluatePanel returns; JSON-safe (no NaN or Infinity: undefined figures are null with a warning). */
export interface PanelEvaluation {
  grid: WavelengthGrid;
  probes: ProbeEvaluation[];
  /** collected[c][p] in relative detected photons (api-v1 "The signal model"). */
  collected: number[][];
  spillover: (number | null)[][];
  primaryChannel: (number | null)[];
  purity: (number | null)[];
  /** spillover[c][p] below RESOLUTION_THRESHOLD (1e-3): smaller than the Gaussian line model can vouch for. */
  belowResolution: boolean[][];
  conditionNumber: number | null;
  noiseAmplification: (number | null)[];
  /** Present when the panel has a background: autofluorescence collected per channel, same units as collected. */
  backgroundCollected?: number[];
  signalToBackground?: (number | null)[];
  worst: WorstInterference;
  /** Null when options.sensitivity is false. */
  lotShiftSensitivity: LotShiftSensitivity | null;
  warnings: string[];
}

/** Adds the background collected per channel and each channel's signal-to-background (null + warning at 0). */
function addBackground(
  evaluation: PanelEvaluation,
  model: PanelCoreModel,
  panel: PanelSpec,
  channelIds: string[],
): void {
  const { grid, transmissions, linesOnByChannel } = model;
  const background = model.background!;
  const lines = panel.excitation;
  const bg = transmissions.map((t, c) =>
    linesOnByChannel[c].reduce((s, l) => s + (lines[l].powerRel ?? 1) * overlap(background[l], t, grid.stepNm), 0),
  );
  evaluation.backgroundCollected = bg;
  evaluation.signalToBackground = bg.map((b, c) => {
    if (b > 0) return evaluation.collected[c].reduce((a, v) => a + v, 0) / b;
    evaluation.warnings.push(`channel ${channelIds[c]} collects no background: its signal-to-background is undefined`);
    return null;
  });
}

/**
 * Evaluates a panel on `options.grid` (default 300–1000 nm, 1 nm). `options.sensitivity` (default true) adds the
 * lot-to-lot check (each peak moved ±5 nm), which costs about twice the rest. Bad input throws SpectraError naming
 * the field, e.g. ['channels', 2, 'filters', 0, 'widthNm'] or ['probes', 1, 'channel'].
 */
export function evaluatePanel(
  panel: PanelSpec,
  options: { grid?: WavelengthGrid; sensitivity?: boolean } = {},
): PanelEvaluation {
  // Transmissions in reused buffers: nothing in the result holds them.
  const model = modelPanel(panel, options.grid ?? DEFAULT_GRID, true);
  const { grid, components, transmissions, constantEnds, assigned } = model;
  const probeIds = panel.probes.map((p) => p.id);
  const channelIds = panel.channels.map((c) => c.id);
  const collected = collectedMatrixOfWindows(components, transmissions, grid.stepNm, constantEnds);
  const figures = crosstalkFigures(collected, assigned, probeIds, channelIds);
  const diagnostics = diagnoseMixing(collected, probeIds);
  const warnings = [...figures.warnings, ...diagnostics.warnings];
  const evaluation: PanelEvaluation = {
    grid: { ...grid },
    probes: model.probeEvaluations,
    collected,
    spillover: figures.spillover,
    primaryChannel: figures.primaryChannel,
    purity: figures.purity,
    belowResolution: figures.belowResolution,
    conditionNumber: diagnostics.conditionNumber,
    noiseAmplification: diagnostics.noiseAmplification,
    worst: figures.worst,
    lotShiftSensitivity:
      options.sensitivity === false
        ? null
        : lotShiftSensitivity(
            gridComponents(model),
            transmissions,
            grid.stepNm,
            collected,
            assigned,
            probeIds,
            channelIds,
            undefined,
            constantEnds,
          ),
    warnings,
  };
  if (model.background) addBackground(evaluation, model, panel, channelIds);
  // The general guard (a walk that builds each value's path) only when the quick typed scan finds a non-finite number.
  if (!evaluationIsFinite(evaluation)) makeJsonSafe(evaluation, [], warnings);
  return evaluation;
}
