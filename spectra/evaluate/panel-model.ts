/**
 * A panel reduced to what its figures need: every probe resolved on the grid (with its weight per channel under the
 * signal model of api-v1), every channel's light path, and the background. evaluatePanel works on the internal form
 * (emission windows, reused transmission buffers); buildPanelModel gives the public one (grid-long arrays).
 */
import type { PanelSpec } from '../panel';
import { DEFAULT_GRID, type WavelengthGrid } from '../grid';
import { dotFromCore, type ResolvedDot } from '../dot';
import { coreEmissionValues, coreExtinctionAtNm, type DotCore } from '../dot-core';
import { channelTransmissionInto } from '../filters/channel';
import { backgroundEmission } from '../background';
import { linesOn, type EmissionComponent, type WindowComponent } from '../crosstalk';
import type { ConstantEnds } from '../linalg/runs';
import { checkPanelShape } from './panel-checks';
import { resolveProbe } from './dot-cache';
import { reusedBuffer } from './transmission-buffers';

/** One probe of an evaluated panel: the resolved dot's fields (no arrays) plus its brightness. */
export interface ProbeEvaluation extends Omit<ResolvedDot, 'emission' | 'absorption' | 'extinctionAtExcitation'> {
  id: string;
  label?: string;
  /** ε (M⁻¹ cm⁻¹) at the panel's first excitation line, as for a single dot (api-v1); every line is in extinctionAtLines. */
  extinctionAtExcitation: number;
  /** ε (M⁻¹ cm⁻¹) at each of the panel's lines, in the order of panel.excitation. */
  extinctionAtLines: number[];
  /** Brightness = Σ over the panel's lines of powerRel × ε(λline) × quantumYield × abundance (all lines on). */
  brightness: number;
  /** The same at abundance 1: the probe's own brightness under these lines, for comparing probes. */
  brightnessPerAbundance: number;
  /** Carbon dots only: the modelled emission peak under each line (their emission moves with the excitation). */
  emissionPeakNmByLine?: number[];
}

/** What the public and the internal panel models share: grid, light paths, lines, background, probe records. */
interface PanelModelParts {
  grid: WavelengthGrid;
  transmissions: Float64Array[];
  /** Per channel, the index range outside which its transmission is constant (speeds up the overlap sums). */
  constantEnds: ConstantEnds[];
  linesOnByChannel: number[][];
  /** Background emission per line (per unit powerRel), or null without a background. */
  background: Float64Array[] | null;
  probeEvaluations: ProbeEvaluation[];
  assigned: (number | undefined)[];
}

/** The panel reduced to what the figures need (shared by evaluatePanel and panelSpectra). */
export interface PanelModel extends PanelModelParts {
  dots: ResolvedDot[];
  components: EmissionComponent[][];
}

/** Per channel, the summed weight of the lines on in it (only line `only` when given). */
function channelWeights(linesOnByChannel: number[][], lineWeight: number[], only: number | null): Float64Array {
  const w = new Float64Array(linesOnByChannel.length);
  for (let c = 0; c < linesOnByChannel.length; c++) {
    for (const k of linesOnByChannel[c]) if (only === null || k === only) w[c] += lineWeight[k];
  }
  return w;
}

/** The evaluation record of one probe: the dot's scalar fields, ε at every line and its brightness. */
function probeEvaluation(
  probe: PanelSpec['probes'][number],
  dot: DotCore,
  eps: number[],
  brightnessPerAbundance: number,
): ProbeEvaluation {
  return {
    id: probe.id,
    ...(probe.label !== undefined ? { label: probe.label } : {}),
    material: dot.material,
    diameterNm: dot.diameterNm,
    firstExcitonNm: dot.firstExcitonNm,
    emissionPeakNm: dot.emissionPeakNm,
    fwhmNm: dot.fwhmNm,
    quantumYield: dot.quantumYield,
    extinctionFirstExciton: dot.extinctionFirstExciton,
    extinctionAtExcitation: eps[0],
    extinctionAtLines: eps,
    model: dot.model,
    measured: { ...dot.measured },
    brightness: brightnessPerAbundance * (probe.abundance ?? 1),
    brightnessPerAbundance,
    warnings: dot.warnings.slice(),
  };
}

/** The internal panel model: resolved cores, emission windows, and transmissions that may live in reused buffers. */
export interface PanelCoreModel extends PanelModelParts {
  cores: DotCore[];
  /** Per probe, the cores of its emission components (one; one per line for a carbon dot without measured emission). */
  componentCores: DotCore[][];
  components: WindowComponent[][];
}

/**
 * Validates the panel and resolves probes, channels and background on the grid (internal form). With `reuse`, the
 * transmissions are written into buffers that the next call with `reuse` overwrites.
 */
export function modelPanel(panel: PanelSpec, grid: WavelengthGrid, reuse: boolean): PanelCoreModel {
  checkPanelShape(panel);
  const lines = panel.excitation.map((l) => ({ wavelengthNm: l.wavelengthNm, powerRel: l.powerRel ?? 1 }));
  const channelIndex = new Map(panel.channels.map((c, i) => [c.id, i]));
  const linesOnByChannel = panel.channels.map((c, i) => linesOn(c, lines, ['channels', i]));
  const constantEnds: ConstantEnds[] = panel.channels.map(() => ({ first: 0, end: grid.count }));
  const transmissions = panel.channels.map((c, i) =>
    channelTransmissionInto(c, grid, ['channels', i], constantEnds[i], reuse ? reusedBuffer(grid.count, i) : undefined),
  );
  const cores: DotCore[] = [];
  const componentCores: DotCore[][] = [];
  const probeEvaluations: ProbeEvaluation[] = [];
  const components: WindowComponent[][] = [];
  for (let p = 0; p < panel.probes.length; p++) {
    const probe = panel.probes[p];
    const dot = resolveProbe(probe, p, grid);
    cores.push(dot);
    const abundance = probe.abundance ?? 1;
    // lineWeight[l] = powerRel × ε(λl) × QY × abundance: the line's factor in the signal model.
    const eps: number[] = [];
    const lineWeight: number[] = [];
    let brightness = 0;
    for (const line of lines) {
      const e = coreExtinctionAtNm(dot, line.wavelengthNm);
      eps.push(e);
      lineWeight.push(line.powerRel * e * dot.quantumYield * abundance);
      brightness += line.powerRel * e * dot.quantumYield;
    }
    const evaluation = probeEvaluation(probe, dot, eps, brightness);
    probeEvaluations.push(evaluation);
    // Carbon dots without a measured emission change colour with the line: one emission per line.
    if (dot.material === 'carbon' && !dot.measured.emission) {
      const perLine = lines.map((line) => resolveProbe(probe, p, grid, line.wavelengthNm));
      evaluation.emissionPeakNmByLine = perLine.map((d) => d.emissionPeakNm);
      componentCores.push(perLine);
      components.push(
        perLine.map((d, l) => ({
          emission: d.emissionWindow,
          weightByChannel: channelWeights(linesOnByChannel, lineWeight, l),
        })),
      );
    } else {
      componentCores.push([dot]);
      components.push([
        { emission: dot.emissionWindow, weightByChannel: channelWeights(linesOnByChannel, lineWeight, null) },
      ]);
    }
  }
  const assigned = panel.probes.map((probe) =>
    probe.channel === undefined ? undefined : channelIndex.get(probe.channel),
  );
  const spec = panel.background;
  // A measured background does not depend on the line: one spectrum serves every line.
  const measured = spec?.points !== undefined ? backgroundEmission(spec, lines[0].wavelengthNm, grid) : null;
  const background =
    spec === undefined ? null : lines.map((l) => measured ?? backgroundEmission(spec, l.wavelengthNm, grid));
  return {
    grid,
    cores,
    componentCores,
    components,
    transmissions,
    constantEnds,
    linesOnByChannel,
    background,
    probeEvaluations,
    assigned,
  };
}

/** The components of a probe with grid-long emission arrays (the public EmissionComponent form). */
export function gridComponents(model: PanelCoreModel): EmissionComponent[][] {
  return model.components.map((list, p) =>
    list.map((c, k) => ({
      emission: coreEmissionValues(model.componentCores[p][k]),
      weightByChannel: c.weightByChannel,
    })),
  );
}

/** Validates the panel and resolves probes, channels and background on the grid. */
export function buildPanelModel(panel: PanelSpec, grid: WavelengthGrid = DEFAULT_GRID): PanelModel {
  const model = modelPanel(panel, grid, false);
  const { transmissions, constantEnds, linesOnByChannel, background, probeEvaluations, assigned } = model;
  const dots = model.cores.map(dotFromCore);
  return {
    grid,
    dots,
    components: gridComponents(model),
    transmissions,
    constantEnds,
    linesOnByChannel,
    background,
    probeEvaluations,
    assigned,
  };
}
