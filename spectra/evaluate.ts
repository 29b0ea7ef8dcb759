/**
 * Evaluates a whole panel under the signal model of api-v1: resolves each probe (spectra/dot.ts), builds each
 * channel's light path, and derives collected, spillover, purity, interference, unmixing diagnostics, background and
 * lot-to-lot sensitivity. The big arrays (spectra on the grid) come from panelSpectra, so the API can leave them out.
 */
import { MATERIAL_IDS, type MaterialId, type PanelSpec, type ProbeSpec } from './panel';
import { DEFAULT_GRID, type WavelengthGrid } from './grid';
import { SpectraError } from './errors';
import { resolveDot, extinctionAtNm, type DotInput, type ResolvedDot } from './dot';
import { channelTransmission } from './filters/channel';
import { backgroundEmission } from './background';
import { collectedMatrix, crosstalkFigures, linesOn, type EmissionComponent, type WorstInterference } from './crosstalk';
import { overlap, type ConstantEnds } from './linalg/runs';
import { diagnoseMixing } from './unmix';
import { lotShiftSensitivity, type LotShiftSensitivity } from './sensitivity';

/** One probe of an evaluated panel: the resolved dot's fields (no arrays) plus its brightness. */
export interface ProbeEvaluation extends Omit<ResolvedDot, 'emission' | 'absorption' | 'extinctionAtExcitation'> {
  id: string;
  label?: string;
  /** ε (M⁻¹ cm⁻¹) at each of the panel's lines, in the order of panel.excitation. */
  extinctionAtExcitation: number[];
  /** Σ over the panel's lines of powerRel × ε(λline) × quantumYield, M⁻¹ cm⁻¹ (all lines on, abundance excluded). */
  brightness: number;
  /** Carbon dots only: the modelled emission peak under each line (their emission moves with the excitation). */
  emissionPeakNmByLine?: number[];
}

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

const LIMITS = { probes: 16, channels: 64, lines: 16, scale: 1e6 };

const bad = (message: string, path: (string | number)[]) => new SpectraError('invalid_input', message, path);

function checkList(panel: PanelSpec, key: 'excitation' | 'probes' | 'channels', max: number): void {
  const value = panel[key] as unknown;
  if (!Array.isArray(value) || value.length === 0) throw bad(`${key} must be a non-empty array`, [key]);
  if (value.length > max) throw bad(`at most ${max} ${key} are allowed, got ${value.length}`, [key]);
  for (let i = 0; i < value.length; i++) {
    if (value[i] === null || typeof value[i] !== 'object') throw bad(`${key}[${i}] must be an object`, [key, i]);
  }
}

function checkScale(value: unknown, key: 'excitation' | 'probes', index: number, field: string): void {
  if (value !== undefined && (typeof value !== 'number' || !(value >= 0 && value <= LIMITS.scale))) {
    throw bad(`${field} must be a number from 0 to ${LIMITS.scale}, got ${String(value)}`, [key, index, field]);
  }
}

function uniqueIds(panel: PanelSpec, key: 'probes' | 'channels'): Set<string> {
  const seen = new Set<string>();
  const items = panel[key];
  for (let i = 0; i < items.length; i++) {
    const id = items[i].id;
    if (typeof id !== 'string' || id === '') throw bad('id must be a non-empty string', [key, i, 'id']);
    if (seen.has(id)) throw bad(`duplicate id ${JSON.stringify(id)}`, [key, i, 'id']);
    seen.add(id);
  }
  return seen;
}

/** Checks what the spectral modules below do not: the panel's arrays, ids, references and scale factors. */
function checkPanelShape(panel: PanelSpec): void {
  if (panel === null || typeof panel !== 'object') throw bad('a panel must be an object', []);
  if (panel.version !== undefined && panel.version !== 1) throw bad('version must be 1', ['version']);
  checkList(panel, 'excitation', LIMITS.lines);
  checkList(panel, 'probes', LIMITS.probes);
  checkList(panel, 'channels', LIMITS.channels);
  panel.excitation.forEach((line, l) => {
    const nm = line.wavelengthNm;
    if (typeof nm !== 'number' || !(nm > 0 && nm < 10000)) throw bad(`wavelengthNm must be a number above 0 nm, got ${String(nm)}`, ['excitation', l, 'wavelengthNm']);
    checkScale(line.powerRel, 'excitation', l, 'powerRel');
  });
  uniqueIds(panel, 'probes');
  const channelIds = uniqueIds(panel, 'channels');
  panel.probes.forEach((probe, p) => {
    checkScale(probe.abundance, 'probes', p, 'abundance');
    if (probe.channel !== undefined && !channelIds.has(probe.channel)) {
      throw new SpectraError('unknown_channel', `channel ${JSON.stringify(probe.channel)} names no channel of the panel`, ['probes', p, 'channel']);
    }
  });
}

const MATERIAL_SET = new Set<MaterialId>(MATERIAL_IDS);

const DOT_FIELDS = ['material', 'emissionPeakNm', 'diameterNm', 'sizeDispersionPct', 'fwhmNm', 'quantumYield', 'measuredEmission', 'extinction'] as const;

// Resolving a dot (sizing law inversion, line shape, absorption on the grid) costs far more than the rest of an
// evaluation, and the same probes come back again and again (editing one probe of a panel, the design search):
// keep the last resolutions, keyed by the exact input and grid. Resolved dots are never mutated after this point.
const RESOLVED_CACHE_SIZE = 256;
const resolvedCache = new Map<string, ResolvedDot>();

/** Empties the cache of resolved dots (for benchmarks that time a cold evaluation). */
export function clearResolvedDotCache(): void {
  resolvedCache.clear();
}

/** resolveDot (cached) with the error path moved under ['probes', p]. */
function resolveProbe(probe: ProbeSpec, p: number, grid: WavelengthGrid, excitationNm?: number): ResolvedDot {
  const input: Record<string, unknown> = {};
  for (const key of DOT_FIELDS) if (probe[key] !== undefined) input[key] = probe[key];
  if (excitationNm !== undefined) input.excitationNm = excitationNm;
  let key = `${grid.startNm} ${grid.stepNm} ${grid.count}`;
  for (const field in input) {
    const value = input[field];
    // Strings and tables go through JSON (quoted, escaped), so no input can forge another input's key.
    key += ` ${field}=${typeof value === 'number' || MATERIAL_SET.has(value as MaterialId) ? value : JSON.stringify(value)}`;
  }
  const hit = resolvedCache.get(key);
  if (hit) return hit;
  try {
    const dot = resolveDot(input as unknown as DotInput, { grid });
    resolvedCache.set(key, dot);
    // Oldest first out: cheaper than a strict LRU and just as good for a few hundred probes.
    if (resolvedCache.size > RESOLVED_CACHE_SIZE) resolvedCache.delete(resolvedCache.keys().next().value!);
    return dot;
  } catch (err) {
    if (err instanceof SpectraError) throw new SpectraError(err.code, err.message, ['probes', p, ...err.path]);
    throw err;
  }
}

/** Per channel, the summed weight of the lines on in it (only line `only` when given). */
function channelWeights(linesOnByChannel: number[][], lineWeight: number[], only: number | null): Float64Array {
  const w = new Float64Array(linesOnByChannel.length);
  for (let c = 0; c < linesOnByChannel.length; c++) {
    for (const k of linesOnByChannel[c]) if (only === null || k === only) w[c] += lineWeight[k];
  }
  return w;
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
    const qy = dot.quantumYield;
    const abundance = probe.abundance ?? 1;
    // lineWeight[l] = powerRel × ε(λl) × QY × abundance: the line's factor in the signal model.
    const eps: number[] = [];
    const lineWeight: number[] = [];
    let brightness = 0;
    for (const line of lines) {
      const e = extinctionAtNm(dot, line.wavelengthNm);
      eps.push(e);
      lineWeight.push(line.powerRel * e * qy * abundance);
      brightness += line.powerRel * e * qy;
    }
    const evaluation: ProbeEvaluation = {
      id: probe.id,
      ...(probe.label !== undefined ? { label: probe.label } : {}),
      material: dot.material,
      diameterNm: dot.diameterNm,
      firstExcitonNm: dot.firstExcitonNm,
      emissionPeakNm: dot.emissionPeakNm,
      fwhmNm: dot.fwhmNm,
      quantumYield: qy,
      extinctionFirstExciton: dot.extinctionFirstExciton,
      extinctionAtExcitation: eps,
      model: dot.model,
      measured: { ...dot.measured },
      brightness,
      warnings: dot.warnings.slice(),
    };
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

// Module-level helpers rather than closures: a bundler that keeps function names wraps every named closure at
// creation, which costs more than the work here.
function checkJsonItem(record: Record<string | number, unknown>, key: string | number, path: (string | number)[], warnings: string[]): void {
  const item = record[key];
  if (typeof item === 'number') {
    if (item - item === 0) return; // false only for NaN and ±Infinity
    record[key] = null;
    warnings.push(`${[...path, key].join('.')} has no finite value and is reported as null`);
  } else if (item !== null && typeof item === 'object' && !ArrayBuffer.isView(item)) {
    path.push(key);
    makeJsonSafe(item, path, warnings);
    path.pop();
  }
}

/** Replaces any non-finite number in place by null, with a warning naming where (a guard; none is expected). */
function makeJsonSafe(value: object, path: (string | number)[], warnings: string[]): void {
  const record = value as Record<string | number, unknown>;
  if (Array.isArray(value)) for (let i = 0; i < value.length; i++) checkJsonItem(record, i, path, warnings);
  else for (const key in value) checkJsonItem(record, key, path, warnings);
}

/**
 * Evaluates a panel on `options.grid` (default 300–1000 nm, 1 nm). `options.sensitivity` (default true) adds the
 * lot-to-lot check (each peak moved ±5 nm), which costs about twice the rest. Bad input throws SpectraError naming
 * the field, e.g. ['channels', 2, 'filters', 0, 'widthNm'] or ['probes', 1, 'channel'].
 */
export function evaluatePanel(panel: PanelSpec, options: { grid?: WavelengthGrid; sensitivity?: boolean } = {}): PanelEvaluation {
  const model = buildPanelModel(panel, options.grid ?? DEFAULT_GRID);
  const { grid, components, transmissions, constantEnds, assigned } = model;
  const probeIds = panel.probes.map((p) => p.id);
  const channelIds = panel.channels.map((c) => c.id);
  const collected = collectedMatrix(components, transmissions, grid.stepNm, constantEnds);
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
    lotShiftSensitivity: options.sensitivity === false ? null
      : lotShiftSensitivity(components, transmissions, grid.stepNm, collected, assigned, probeIds, channelIds, undefined, constantEnds),
    warnings,
  };
  if (model.background) {
    const lines = panel.excitation;
    const bg = transmissions.map((t, c) =>
      model.linesOnByChannel[c].reduce((s, l) => s + (lines[l].powerRel ?? 1) * overlap(model.background![l], t, grid.stepNm), 0));
    evaluation.backgroundCollected = bg;
    evaluation.signalToBackground = bg.map((b, c) => {
      if (b > 0) return collected[c].reduce((a, v) => a + v, 0) / b;
      warnings.push(`channel ${channelIds[c]} collects no background: its signal-to-background is undefined`);
      return null;
    });
  }
  makeJsonSafe(evaluation, [], warnings);
  return evaluation;
}

/** Spectra for charting, as plain arrays on the grid (index i ↔ startNm + i × stepNm). */
export interface PanelSpectra {
  startNm: number;
  stepNm: number;
  count: number;
  /** Unit-area photon density per nm (carbon dots: their nominal emission, before the line-dependent shift). */
  emission: { id: string; values: number[] }[];
  /** Π filters × detector QE, 0–1. */
  channels: { id: string; values: number[] }[];
  /** Background emission with every line on (collected units per nm), or null without a background. */
  background: number[] | null;
}

/** The resolved emission spectra, channel transmissions and background of a panel, for charts. */
export function panelSpectra(panel: PanelSpec, options: { grid?: WavelengthGrid } = {}): PanelSpectra {
  const model = buildPanelModel(panel, options.grid ?? DEFAULT_GRID);
  const { grid } = model;
  let background: number[] | null = null;
  if (model.background) {
    const sum = new Float64Array(grid.count);
    model.background.forEach((b, l) => {
      for (let i = 0; i < sum.length; i++) sum[i] += (panel.excitation[l].powerRel ?? 1) * b[i];
    });
    background = Array.from(sum);
  }
  return {
    startNm: grid.startNm,
    stepNm: grid.stepNm,
    count: grid.count,
    emission: model.dots.map((d, p) => ({ id: panel.probes[p].id, values: Array.from(d.emission.values) })),
    channels: model.transmissions.map((t, c) => ({ id: panel.channels[c].id, values: Array.from(t) })),
    background,
  };
}
