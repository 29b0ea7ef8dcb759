/**
 * A panel reduced to what its figures need: every probe resolved on the grid (with its weight per channel under the
 * signal model of api-v1), every channel's light path, and the background. evaluatePanel and panelSpectra share it.
 */
import type { PanelSpec } from '../panel';
import { DEFAULT_GRID, type WavelengthGrid } from '../grid';
import { extinctionAtNm, type ResolvedDot } from '../dot';
import { channelTransmission } from '../filters/channel';
import { backgroundEmission } from '../background';
import { linesOn, type EmissionComponent } from '../crosstalk';
import type { ConstantEnds } from '../linalg/runs';
import { checkPanelShape } from './panel-checks';
import { resolveProbe } from './dot-cache';

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

/** The panel reduced to what the figures need (shared by evaluatePanel and panelSpectra). */
export interface PanelModel {
  grid: WavelengthGrid;
  dots: ResolvedDot[];
  components: EmissionComponent[][];
  transmissions: Float64Array[];
  /** Per channel, the index range outside which its transmission is constant (speeds up the overlap sums). */
  constantEnds: ConstantEnds[];
  linesOnByChannel: number[][];
  /** Background emission per line (per unit powerRel), or null without a background. */
  background: Float64Array[] | null;
  probeEvaluations: ProbeEvaluation[];
  assigned: (number | undefined)[];
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
function probeEvaluation(probe: PanelSpec['probes'][number], dot: ResolvedDot, eps: number[], brightnessPerAbundance: number): ProbeEvaluation {
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

/** Validates the panel and resolves probes, channels and background on the grid. */
export function buildPanelModel(panel: PanelSpec, grid: WavelengthGrid = DEFAULT_GRID): PanelModel {
  checkPanelShape(panel);
  const lines = panel.excitation.map((l) => ({ wavelengthNm: l.wavelengthNm, powerRel: l.powerRel ?? 1 }));
  const channelIndex = new Map(panel.channels.map((c, i) => [c.id, i]));
  const linesOnByChannel = panel.channels.map((c, i) => linesOn(c, lines, ['channels', i]));
  const constantEnds: ConstantEnds[] = panel.channels.map(() => ({ first: 0, end: grid.count }));
  const transmissions = panel.channels.map((c, i) => channelTransmission(c, grid, ['channels', i], constantEnds[i]));
  const dots: ResolvedDot[] = [];
  const probeEvaluations: ProbeEvaluation[] = [];
  const components: EmissionComponent[][] = [];
  for (let p = 0; p < panel.probes.length; p++) {
    const probe = panel.probes[p];
    const dot = resolveProbe(probe, p, grid);
    dots.push(dot);
    const abundance = probe.abundance ?? 1;
    // lineWeight[l] = powerRel × ε(λl) × QY × abundance: the line's factor in the signal model.
    const eps: number[] = [];
    const lineWeight: number[] = [];
    let brightness = 0;
    for (const line of lines) {
      const e = extinctionAtNm(dot, line.wavelengthNm);
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
      components.push(perLine.map((d, l) => ({ emission: d.emission.values, weightByChannel: channelWeights(linesOnByChannel, lineWeight, l) })));
    } else {
      components.push([{ emission: dot.emission.values, weightByChannel: channelWeights(linesOnByChannel, lineWeight, null) }]);
    }
  }
  const assigned = panel.probes.map((probe) => (probe.channel === undefined ? undefined : channelIndex.get(probe.channel)));
  const spec = panel.background;
  // A measured background does not depend on the line: one spectrum serves every line.
  const measured = spec?.points !== undefined ? backgroundEmission(spec, lines[0].wavelengthNm, grid) : null;
  const background = spec === undefined ? null : lines.map((l) => measured ?? backgroundEmission(spec, l.wavelengthNm, grid));
  return { grid, dots, components, transmissions, constantEnds, linesOnByChannel, background, probeEvaluations, assigned };
}
