/**
 * A panel reduced to what its figures need: every probe resolved on the grid with its weight per channel under the
 * signal model (docs/api.md, "The signal model"), every channel's light path, and the background (autofluorescence,
 * water Raman) per line.
 */
import { SpectraError } from '../core/errors';
import { DEFAULT_GRID, type WavelengthGrid } from '../core/grid';
import { DOT_INPUT_FIELDS, type DotInput, type PanelSpec, type ProbeSpec } from '../core/panel';
import { cutWarning, extinctionAtNm, resolveDot, type DotFields, type ResolvedDot } from '../dot/resolve';
import { cutEmissionAtLine } from '../dot/line-cut';
import { backgroundEmission } from '../light/background';
import { channelTransmission } from '../light/filters/channel';
import { waterRamanEmission } from '../light/water-raman';
import { linesOn, type EmissionComponent } from './crosstalk';

/** One probe of an evaluated panel: the resolved dot's fields plus its extinction at the lines and its brightness. */
export interface ProbeEvaluation extends Omit<DotFields, 'extinctionAtExcitation' | 'emissionCutFraction'> {
  id: string;
  label?: string;
  /** ε (M⁻¹ cm⁻¹) at the panel's first line, as for a single dot; every line is in extinctionAtLines. */
  extinctionAtExcitation: number;
  /** ε (M⁻¹ cm⁻¹) at each of the panel's lines, in the order of panel.excitation. */
  extinctionAtLines: number[];
  /** Brightness = Σ over the panel's lines of powerRel × ε(λline) × quantumYield × abundance (all lines on). */
  brightness: number;
  /** The same at abundance 1: the probe's own brightness under these lines, for comparing probes. */
  brightnessPerAbundance: number;
  /**
   * Per panel line, the share of the nominal emission removed because it lies at or below that line (no photon is
   * emitted bluer than the exciting one); the rest is renormalised.
   */
  emissionCutAtLines: number[];
  /** Carbon dots only: the modelled emission peak under each line (their emission moves with the excitation). */
  emissionPeakNmByLine?: number[];
}

/** The panel reduced to what the figures need (shared by evaluatePanel, panelSpectra, the design search). */
export interface PanelModel {
  grid: WavelengthGrid;
  /** The resolved dot of each probe (carbon dots: their nominal emission, before the line-dependent shift). */
  dots: ResolvedDot[];
  /** Per probe, its emission components (one; one per line for a carbon dot without measured emission). */
  components: EmissionComponent[][];
  /** Per channel, Π filters × detector QE on the grid. */
  transmissions: number[][];
  /** Per channel, the indices of the lines on while it is read. */
  linesOnByChannel: number[][];
  /** Autofluorescence per line (per unit powerRel), or null without a background. */
  background: number[][] | null;
  /** Water Raman per line (per unit powerRel), or null without `waterRaman`. */
  waterRaman: number[][] | null;
  probeEvaluations: ProbeEvaluation[];
  /** Per probe, the index of its assigned channel (undefined: none assigned). */
  assigned: (number | undefined)[];
}

/** A probe's dot fields (every field resolveDot reads), plus the exciting line when one is given. */
export function dotInputOf(probe: ProbeSpec, excitationNm?: number): DotInput {
  const input: Record<string, unknown> = {};
  for (const field of DOT_INPUT_FIELDS) if (probe[field] !== undefined) input[field] = probe[field];
  if (excitationNm !== undefined) input.excitationNm = excitationNm;
  return input as unknown as DotInput;
}

/** How a panel model gets a probe's resolved dot (the design search passes one that remembers its answers). */
export type DotResolver = (input: DotInput, grid: WavelengthGrid) => ResolvedDot;

const resolveOnGrid: DotResolver = (input, grid) => resolveDot(input, { grid });

/** A model error inside probe p, moved under ['probes', p]. */
function inProbe<T>(p: number, resolve: () => T): T {
  try {
    return resolve();
  } catch (err) {
    if (err instanceof SpectraError) throw new SpectraError(err.code, err.message, ['probes', p, ...err.path]);
    throw err;
  }
}

/** Per channel, the summed weight of the lines on in it (only line `only` when given). */
function channelWeights(linesOnByChannel: number[][], lineWeight: number[], only: number | null): number[] {
  const w = new Array<number>(linesOnByChannel.length).fill(0);
  linesOnByChannel.forEach((on, c) => {
    for (const l of on) if (only === null || l === only) w[c] += lineWeight[l];
  });
  return w;
}

/** The evaluation record of one probe: the dot's scalar fields, ε at every line and its brightness. */
function probeEvaluation(probe: ProbeSpec, dot: ResolvedDot, eps: number[], perAbundance: number): ProbeEvaluation {
  return {
    id: probe.id,
    ...(probe.label !== undefined ? { label: probe.label } : {}),
    material: dot.material,
    diameterNm: dot.diameterNm,
    coreDiameterNm: dot.coreDiameterNm,
    overallDiameterNm: dot.overallDiameterNm,
    hydrodynamicDiameterNm: dot.hydrodynamicDiameterNm,
    firstExcitonNm: dot.firstExcitonNm,
    emissionPeakNm: dot.emissionPeakNm,
    fwhmNm: dot.fwhmNm,
    quantumYield: dot.quantumYield,
    extinctionFirstExciton: dot.extinctionFirstExciton,
    extinctionAtExcitation: eps[0],
    extinctionAtLines: eps,
    model: dot.model,
    measured: { ...dot.measured },
    brightness: perAbundance * (probe.abundance ?? 1),
    brightnessPerAbundance: perAbundance,
    emissionCutAtLines: eps.map(() => 0),
    warnings: dot.warnings.slice(),
  };
}

/** One emission component of a resolved dot. */
function component(dot: Pick<ResolvedDot, 'emission' | 'emissionFrom'>, weightByChannel: number[]): EmissionComponent {
  return { emission: dot.emission.values, from: dot.emissionFrom, weightByChannel };
}

/**
 * Resolves a checked panel's probes, channels and background on the grid (default 300–1000 nm, 1 nm). Model errors
 * name the field, e.g. ['probes', 1, 'emissionPeakNm'] or ['channels', 2, 'filters', 0, 'edgeWidthNm'].
 */
export function buildPanelModel(panel: PanelSpec, grid: WavelengthGrid = DEFAULT_GRID): PanelModel {
  return modelPanel(panel, grid, resolveOnGrid);
}

/** buildPanelModel with the probes' dots from `resolve`. */
export function modelPanel(panel: PanelSpec, grid: WavelengthGrid, resolve: DotResolver): PanelModel {
  const lines = panel.excitation.map((l) => ({ wavelengthNm: l.wavelengthNm, powerRel: l.powerRel ?? 1 }));
  const linesOnByChannel = panel.channels.map((c) => linesOn(c, lines));
  const transmissions = panel.channels.map((c, i) => channelTransmission(c, grid, ['channels', i]));
  const dots: ResolvedDot[] = [];
  const components: EmissionComponent[][] = [];
  const probeEvaluations: ProbeEvaluation[] = [];
  panel.probes.forEach((probe, p) => {
    const dot = inProbe(p, () => resolve(dotInputOf(probe), grid));
    dots.push(dot);
    const abundance = probe.abundance ?? 1;
    // lineWeight[l] = powerRel × ε(λl) × QY × abundance: the line's factor in the signal model.
    const eps = lines.map((line) => extinctionAtNm(dot, line.wavelengthNm));
    const lineWeight = lines.map((line, l) => line.powerRel * eps[l] * dot.quantumYield * abundance);
    let perAbundance = 0;
    lines.forEach((line, l) => (perAbundance += line.powerRel * eps[l] * dot.quantumYield));
    const evaluation = probeEvaluation(probe, dot, eps, perAbundance);
    probeEvaluations.push(evaluation);
    // Carbon dots without a measured emission change colour with the line: one emission per line.
    if (dot.material === 'carbon' && !dot.measured.emission) {
      const perLine = lines.map((line) => inProbe(p, () => resolve(dotInputOf(probe, line.wavelengthNm), grid)));
      evaluation.emissionPeakNmByLine = perLine.map((d) => d.emissionPeakNm);
      evaluation.emissionCutAtLines = perLine.map((d) => d.emissionCutFraction ?? 0);
      components.push(perLine.map((d, l) => component(d, channelWeights(linesOnByChannel, lineWeight, l))));
    } else {
      // No photon bluer than the exciting one: under a line inside the emission, the emission is cut there.
      const cuts = lines.map((line) => cutEmissionAtLine(dot.emission, dot.emissionFrom, grid, line.wavelengthNm));
      evaluation.emissionCutAtLines = cuts.map((c) => c.cutFraction);
      if (cuts.every((c) => c.cutFraction === 0)) {
        components.push([component(dot, channelWeights(linesOnByChannel, lineWeight, null))]);
      } else {
        components.push(
          cuts.map((c, l) =>
            component({ emission: c.spectrum, emissionFrom: c.from }, channelWeights(linesOnByChannel, lineWeight, l)),
          ),
        );
      }
    }
    evaluation.emissionCutAtLines.forEach((f, l) => {
      if (f > 0.001) evaluation.warnings.push(cutWarning(lines[l].wavelengthNm, f, dot.diameterNm !== null));
    });
  });
  const channelIndex = new Map(panel.channels.map((c, i) => [c.id, i]));
  const assigned = panel.probes.map((probe) =>
    probe.channel === undefined ? undefined : channelIndex.get(probe.channel),
  );
  const spec = panel.background;
  // A measured background does not depend on the line: one spectrum serves every line.
  const measured = spec?.points !== undefined ? backgroundEmission(spec, lines[0].wavelengthNm, grid) : null;
  const background =
    spec === undefined ? null : lines.map((l) => measured ?? backgroundEmission(spec, l.wavelengthNm, grid));
  const raman = panel.waterRaman;
  const waterRaman = raman === undefined ? null : lines.map((l) => waterRamanEmission(raman, l.wavelengthNm, grid));
  return {
    grid,
    dots,
    components,
    transmissions,
    linesOnByChannel,
    background,
    waterRaman,
    probeEvaluations,
    assigned,
  };
}
