/**
 * A brute-force reference for catalog design on the signal-to-noise objective, written independently of the
 * designer's search: every one-to-one assignment of targets to (probe, channel) candidates is built as a panel the
 * way the designer builds its proposal (probes labelled by target, with abundance and channel; channels in target
 * order), evaluated with evaluatePanel (the project's physics), checked against the practice constraints, and scored
 * with the unmixing-noise model re-derived here with ml-matrix's inverse (an npm reference library):
 *
 *   C[c][p] = evaluation.collected (abundance a_p inside);  k = P / max_t C[t][t]  (one photon scale, P photons);
 *   M[c][p] = k·C[c][p] / a_p  (photons at abundance 1);  b_c = B + k·(backgroundCollected[c] + Σ_l lineLeak[c][l]);
 *   v_c = F·(Σ_p M[c][p]·a_p + b_c) + r²  (Poisson shot noise times the excess noise factor, plus read noise);
 *   Cov = M⁻¹ diag(v) M⁻ᵀ  (least-squares unmixing of a square system, propagated);  S/N_t = a_t / √Cov[t][t];
 *   SS[i][j] = M[i][i]·√(Σ_c (M⁻¹)²_ic·F·M[c][j] / M[j][j])  (spillover spreading after Nguyen, Perfetto, Mahnke,
 *   Chattopadhyay & Roederer, Cytometry A 2013, 83A, 306, with each target read in its own channel).
 *
 * The best assignment maximises min_t S/N_t; among those within a relative 1e-9 of it, the least Σ_{i≠j} SS[i][j].
 */
import { Matrix, inverse } from 'ml-matrix';
import {
  evaluatePanel,
  resolveDot,
  type ChannelSpec,
  type DesignOptions,
  type ExcitationLine,
  type PanelEvaluation,
  type PanelSpec,
  type ProbeSpec,
} from '../../../spectra/index';
import { DEFAULT_GRID } from '../../../spectra/core/grid';
import { blocksItsLines, clearOfLines, readablePairs } from '../../../spectra/design/practice';

/** The detector and photon settings of the noise model (the designer's option names). */
export interface NoiseSettings {
  photons: number;
  /** One number for every channel, or one per channel (channel t is target t's). */
  backgroundPhotons: number | number[];
  excessNoiseFactor: number;
  readNoiseElectrons: number;
}

/** Noise figures of one square mixing matrix. */
export interface NoiseFigures {
  signalToNoise: number[];
  worstSignalToNoise: number;
  totalSpreading: number;
}

/**
 * S/N per target and total spreading of a square mixing matrix M (photons at abundance 1, channel t = target t's),
 * with abundances a, background photons b per channel, excess noise factor F and read noise r.
 */
export function noiseFigures(m: number[][], a: number[], b: number[], excess: number, read: number): NoiseFigures {
  const n = a.length;
  const inv = inverse(new Matrix(m));
  const v = m.map((row, c) => excess * (row.reduce((s, x, p) => s + x * a[p], 0) + b[c]) + read * read);
  const signalToNoise = a.map((at, t) => {
    let variance = 0;
    for (let c = 0; c < n; c++) variance += inv.get(t, c) ** 2 * v[c];
    return at / Math.sqrt(variance);
  });
  let totalSpreading = 0;
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      if (i === j) continue;
      let sum = 0;
      for (let c = 0; c < n; c++) sum += inv.get(i, c) ** 2 * excess * m[c][j];
      totalSpreading += m[i][i] * Math.sqrt(sum / m[j][j]);
    }
  }
  return { signalToNoise, worstSignalToNoise: Math.min(...signalToNoise), totalSpreading };
}

/** The noise figures of an evaluated proposal whose probe t is read in channel t, from its evaluation alone. */
export function proposalNoise(evaluation: PanelEvaluation, abundance: number[], s: NoiseSettings): NoiseFigures {
  const C = evaluation.collected;
  const k = s.photons / Math.max(...abundance.map((_, t) => C[t][t]));
  const m = C.map((row) => row.map((x, p) => (k * x) / abundance[p]));
  const given = (c: number) => (typeof s.backgroundPhotons === 'number' ? s.backgroundPhotons : s.backgroundPhotons[c]);
  const b = C.map(
    (_, c) =>
      given(c) +
      k * ((evaluation.backgroundCollected?.[c] ?? 0) + evaluation.lineLeak[c].reduce((sum, x) => sum + x, 0)),
  );
  return noiseFigures(m, abundance, b, s.excessNoiseFactor, s.readNoiseElectrons);
}

/** A catalog design request as the reference takes it (numbers for abundances). */
export interface ReferenceRequest {
  targets: { name: string; abundance: number }[];
  excitation: ExcitationLine[];
  candidates: { probes: ProbeSpec[]; channels: ChannelSpec[] };
  /** The sample's scattered excitation (the panel's scatterLevel; absent: the signal model's default). */
  scatterLevel?: number;
  options?: DesignOptions;
}

/** One scored assignment: probe and channel index per target, and its figures. */
export interface ScoredAssignment {
  probe: number[];
  channel: number[];
  worstInterference: number;
  figures: NoiseFigures;
}

/** What the enumeration saw: the best feasible assignment (null: none) and how many passed each stage. */
export interface ReferenceOutcome {
  best: ScoredAssignment | null;
  /** Assignments whose probes and channels pass the blocking, clearance and readability checks. */
  readable: ScoredAssignment[];
  /** Of those, the ones within the interference ceiling. */
  feasible: ScoredAssignment[];
  enumerated: number;
}

/**
 * The defaults the designer documents for these options (spectra/design/options.ts and practice.ts): 1000 photons,
 * no background, an ideal counting detector; OD 6 blocking at each line (common practice), 30 % of a probe's light in
 * its channel and 15 nm from every line (the designer's own thresholds), no probe's light above a target's own.
 */
const DEFAULTS = {
  photons: 1000,
  backgroundPhotons: 0,
  excessNoiseFactor: 1,
  readNoiseElectrons: 0,
  minBlockingOD: 6,
  minChannelShare: 0.3,
  lineClearanceNm: 15,
  maxInterference: 1,
};

/** The request's options with the designer's documented defaults filled in. */
export function referenceOptions(
  options: DesignOptions = {},
): Omit<typeof DEFAULTS, 'backgroundPhotons'> & NoiseSettings {
  const o = { ...DEFAULTS, ...options };
  if (typeof o.photons !== 'number') throw new Error('the reference handles one number for photons');
  return { ...o, photons: o.photons };
}

/** Every one-to-one assignment of the request's targets to (probe, channel) candidates, scored. */
export function enumerateSnrDesigns(request: ReferenceRequest): ReferenceOutcome {
  const o = referenceOptions(request.options);
  const settings: NoiseSettings = o;
  const { probes, channels } = request.candidates;
  const names = request.targets.map((t) => t.name);
  const abundance = request.targets.map((t) => t.abundance);
  const n = names.length;
  const dots = probes.map((p) => resolveDot(p, { grid: DEFAULT_GRID }));
  const blocks = channels.map((ch) => blocksItsLines(ch, request.excitation, o.minBlockingOD));
  const clear = dots.map((d) => clearOfLines(d.emissionPeakNm, request.excitation, o.lineClearanceNm));
  const readable = readablePairs(dots, channels, DEFAULT_GRID, o.minChannelShare);
  const usable = (p: number, c: number) => blocks[c] && clear[p] && readable(c, p);
  const outcome: ReferenceOutcome = { best: null, readable: [], feasible: [], enumerated: 0 };
  const probe: number[] = [];
  const channel: number[] = [];
  const visit = (t: number) => {
    if (t === n) {
      outcome.enumerated++;
      if (!probe.every((p, u) => usable(p, channel[u]))) return;
      const scored = score(request, names, abundance, probe, channel, settings);
      outcome.readable.push(scored);
      if (scored.worstInterference <= o.maxInterference) outcome.feasible.push(scored);
      return;
    }
    for (let p = 0; p < probes.length; p++) {
      if (probe.includes(p)) continue;
      for (let c = 0; c < channels.length; c++) {
        if (channel.includes(c)) continue;
        probe.push(p);
        channel.push(c);
        visit(t + 1);
        probe.pop();
        channel.pop();
      }
    }
  };
  visit(0);
  const top = Math.max(...outcome.feasible.map((s) => s.figures.worstSignalToNoise));
  for (const s of outcome.feasible) {
    if (s.figures.worstSignalToNoise < top * (1 - 1e-9)) continue;
    if (!outcome.best || s.figures.totalSpreading < outcome.best.figures.totalSpreading) outcome.best = s;
  }
  return outcome;
}

/** Builds the proposal of one assignment as the designer does, evaluates it, and scores it. */
function score(
  request: ReferenceRequest,
  names: string[],
  abundance: number[],
  probe: number[],
  channel: number[],
  settings: NoiseSettings,
): ScoredAssignment {
  const chosen = channel.map((c) => request.candidates.channels[c]);
  const panel: PanelSpec = {
    version: 1,
    title: 'reference',
    excitation: request.excitation,
    probes: probe.map((p, t) => ({
      ...request.candidates.probes[p],
      label: names[t],
      target: names[t],
      abundance: abundance[t],
      channel: chosen[t].id,
    })),
    channels: chosen,
    ...(request.scatterLevel !== undefined ? { scatterLevel: request.scatterLevel } : {}),
  };
  const evaluation = evaluatePanel(panel, { sensitivity: false });
  const C = evaluation.collected;
  let worstInterference = 0;
  for (let u = 0; u < names.length; u++)
    for (let t = 0; t < names.length; t++)
      if (t !== u) worstInterference = Math.max(worstInterference, C[u][t] / C[u][u]);
  return {
    probe: [...probe],
    channel: [...channel],
    worstInterference,
    figures: proposalNoise(evaluation, abundance, settings),
  };
}
