/**
 * The page's local computation: evaluatePanel and panelSpectra from the spectral library, turned into what the chart,
 * the crosstalk tables and the probe read-outs show. Runs on every edit of a panel the API's schema accepts; what the
 * models themselves refuse comes back as the library's error with its field path.
 */
import {
  DEFAULT_GRID,
  DESIGN_DEFAULTS,
  evaluateLotShift,
  evaluatePanel,
  listDetectors,
  listMaterials,
  panelSpectra,
  predictUnmixingNoise,
  seriesTransmission,
  SpectraError,
  type PanelEvaluation,
  type PanelSpec,
  type ProbeEvaluation,
  type SampledSpectrum,
} from '../../spectra/index';
import type { ChartCurve, ChartHandle, ChartPassband, ChartSharedPath } from '../chart/types';
import type { CrosstalkView, ShotNoiseView } from '../chart/crosstalk-view';
import type { ResolvedForSheet } from '../io/csv-export';
import type { FieldError } from './error-map';

/** Every material the library knows, loaded once. */
export const MATERIALS = listMaterials();
/** Every detector class the library knows. */
export const DETECTORS = listDetectors();

/** What the model predicts for one probe, for the read-out under its fields. */
export interface ProbePrediction extends Pick<
  ProbeEvaluation,
  'material' | 'diameterNm' | 'overallDiameterNm' | 'firstExcitonNm' | 'emissionPeakNm' | 'fwhmNm' | 'warnings'
> {
  /** The dye the prediction was made for (dye probes), so a card can tell an out-of-date prediction. */
  dye: string | null;
  /** Collected-light brightness at the excitation relative to the brightest probe of the panel, 0–1. */
  relativeBrightness: number;
  /** True when the emission shape is the probe's measured spectrum. */
  measured: boolean;
}

/** What one evaluation gives the page. */
export interface Computed {
  evaluation: PanelEvaluation;
  chart: { curves: ChartCurve[]; passbands: ChartPassband[]; shared: ChartSharedPath[]; background?: SampledSpectrum };
  crosstalk: CrosstalkView;
  predictions: ProbePrediction[];
  resolved: ResolvedForSheet[];
}

const grid = DEFAULT_GRID;

/** Handles of a channel's editable filters (bandpass edges at centre ∓ width/2, edge filters at their edge). */
function handlesOf(panel: PanelSpec, c: number): ChartHandle[] {
  return panel.channels[c].filters.flatMap((f, j): ChartHandle[] => {
    if (f.type === 'bandpass')
      return [
        { channelIndex: c, filterIndex: j, edge: 'low', wavelengthNm: f.centerNm - f.widthNm / 2 },
        { channelIndex: c, filterIndex: j, edge: 'high', wavelengthNm: f.centerNm + f.widthNm / 2 },
      ];
    if (f.type === 'longpass' || f.type === 'shortpass' || f.type === 'dichroic')
      return [{ channelIndex: c, filterIndex: j, edge: 'edge', wavelengthNm: f.edgeNm }];
    return [];
  });
}

/** Interference t→u = collected[primary(u)][t] / collected[primary(u)][u] (api-v1, "worst"). */
function interferenceOf(ev: PanelEvaluation): (number | null)[][] {
  const n = ev.probes.length;
  return Array.from({ length: n }, (_, t) =>
    Array.from({ length: n }, (_, u) => {
      const c = ev.primaryChannel[u];
      if (c === null) return null;
      const own = ev.collected[c][u];
      const v = ev.collected[c][t] / own;
      return own > 0 && Number.isFinite(v) ? v : null;
    }),
  );
}

/**
 * Nominal photon budget of the shot-noise reading: detected photons of the brightest target in its own channel
 * (our convention, the design response's default budget; real counts depend on the instrument).
 */
export const NOMINAL_PHOTONS = DESIGN_DEFAULTS.photons;

/**
 * Shot-noise picture at the nominal budget: collected (and background) scaled so the brightest target's own signal
 * is NOMINAL_PHOTONS, unmixed by least squares (predictUnmixingNoise, ideal counting detector, no read noise).
 * "Alone" is the same target with no other probe, read in its own channel: √(own + background)/own. The background
 * is the sample's autofluorescence and water Raman plus the excitation light leaking into the channel.
 * Null when some probe has no primary channel or no signal; a null entry when its estimate is undefined.
 */
function shotNoiseOf(ev: PanelEvaluation, panel: PanelSpec): ShotNoiseView | null {
  const prim = ev.primaryChannel as number[];
  if (!prim.length || prim.some((c) => c === null)) return null;
  const abundance = panel.probes.map((p) => p.abundance ?? 1);
  // collected already holds each target's abundance: its own signal is collected[primary][p], and the mixing matrix
  // per unit abundance is collected divided by it.
  const own = prim.map((c, p) => ev.collected[c][p]);
  const k = NOMINAL_PHOTONS / Math.max(...own); // photons per collected unit; not finite when nothing is collected
  if (!(k > 0 && Number.isFinite(k))) return null;
  // The background of each channel: the sample's autofluorescence and water Raman (backgroundCollected, with either)
  // plus the excitation light leaking through its filters.
  const background = ev.lineLeak.map((row, c) => (ev.backgroundCollected?.[c] ?? 0) + row.reduce((a, v) => a + v, 0));
  try {
    const noise = predictUnmixingNoise({
      mixingPhotons: ev.collected.map((row) => row.map((x, p) => (abundance[p] > 0 ? (x * k) / abundance[p] : 0))),
      abundance,
      primaryChannel: prim,
      backgroundPhotons: background.map((b) => b * k),
    });
    const relativeSd = noise.sd.map((s, p) => (s !== null && abundance[p] > 0 ? s / abundance[p] : null));
    const factor = relativeSd.map((r, p) => {
      const n = own[p] * k;
      const alone = Math.sqrt(n + background[prim[p]] * k) / n;
      return r !== null && n > 0 && Number.isFinite(r / alone) ? r / alone : null;
    });
    return { photons: NOMINAL_PHOTONS, relativeSd, factor, withBackground: background.some((b) => b > 0) };
  } catch (e) {
    if (e instanceof SpectraError) return null; // e.g. a probe with no light in its primary channel
    throw e;
  }
}

/** What the chart calls each part of the shared light path. */
export const SHARED_PATH_LABELS = {
  emission: 'shared emission path (in every channel)',
  excitation: 'excitation clean-up (on every line)',
} as const;

/** The panel's shared light path, part by part (none without one), as transmission on the grid. */
function sharedPathsOf(panel: PanelSpec): ChartSharedPath[] {
  const path = panel.lightPath;
  const parts = [
    { id: 'emission' as const, filters: path?.emissionFilters ?? [] },
    { id: 'excitation' as const, filters: path?.excitationFilters ?? [] },
  ];
  return parts
    .filter((part) => part.filters.length > 0)
    .map((part) => ({
      id: part.id,
      label: SHARED_PATH_LABELS[part.id],
      transmission: {
        startNm: grid.startNm,
        stepNm: grid.stepNm,
        values: seriesTransmission(part.filters, grid, ['lightPath', `${part.id}Filters`]),
      },
    }));
}

const maxOf = (values: readonly number[]) => {
  let m = 0;
  for (let i = 0; i < values.length; i++) if (values[i] > m) m = values[i];
  return m;
};

/** The lot-to-lot check as the crosstalk section shows it, or null when it found no pair. */
function lotShiftView(lot: PanelEvaluation['lotShiftSensitivity']): CrosstalkView['lotShift'] {
  const wi = lot?.worstInterference;
  return lot && wi
    ? {
        shiftNm: lot.shiftNm,
        baseline: lot.baseline.worstInterference,
        worst: wi.interference,
        shiftedProbe: wi.shiftedProbe,
        signedShiftNm: wi.shiftNm,
        from: wi.from,
        into: wi.into,
      }
    : null;
}

/**
 * `computed` (made with `sensitivity: false` for `panel`) with its lot-to-lot check added: the page shows the rest
 * of the figures first and adds this check, which costs about as much again, once the edits pause.
 */
export function withLotShift(computed: Computed, panel: PanelSpec): Computed {
  const lot = evaluateLotShift(panel, { grid });
  const { lotShiftPending: _, ...crosstalk } = computed.crosstalk;
  return {
    ...computed,
    evaluation: { ...computed.evaluation, lotShiftSensitivity: lot },
    crosstalk: { ...crosstalk, lotShift: lotShiftView(lot) },
  };
}

const sameSpectrum = (a: SampledSpectrum, b: SampledSpectrum) =>
  a.startNm === b.startNm &&
  a.stepNm === b.stepNm &&
  a.values.length === b.values.length &&
  a.values.every((v, i) => v === b.values[i]);

/**
 * Gives each layer whose spectrum equals the one of the same id in `before` that earlier spectrum object, so the chart
 * (which keeps a path per spectrum object) redraws only the layers an edit changed.
 */
function keepUnchanged<T extends { id: string }>(
  now: T[],
  before: readonly T[] | undefined,
  spectrumOf: (layer: T) => SampledSpectrum,
  setSpectrum: (layer: T, spectrum: SampledSpectrum) => void,
): void {
  if (!before) return;
  const earlier = new Map(before.map((layer) => [layer.id, spectrumOf(layer)]));
  for (const layer of now) {
    const old = earlier.get(layer.id);
    if (old && sameSpectrum(old, spectrumOf(layer))) setSpectrum(layer, old);
  }
}

/**
 * Evaluates the panel and shapes the result for display, or returns the first input error. With `byBrightness`, each
 * curve is its unit-area emission × brightness × abundance (the photons it sends, as in the signal model) and the
 * background is in the same units; otherwise each curve peaks at 1 and the background keeps its ratio to the brightest.
 */
export function computePanel(
  panel: PanelSpec,
  options: { byBrightness: boolean; sensitivity?: boolean },
  previous?: Computed,
): { ok: true; value: Computed } | { ok: false; error: FieldError } {
  let ev: PanelEvaluation;
  let spectra: ReturnType<typeof panelSpectra>;
  let shared: ChartSharedPath[];
  try {
    ev = evaluatePanel(panel, { grid, sensitivity: options.sensitivity ?? true });
    spectra = panelSpectra(panel, { grid });
    shared = sharedPathsOf(panel);
  } catch (e) {
    if (e instanceof SpectraError) return { ok: false, error: { code: e.code, message: e.message, path: e.path } };
    const message = `The panel could not be computed: ${e instanceof Error ? e.message : String(e)}`;
    return { ok: false, error: { code: 'internal_error', message, path: [] } };
  }
  const onGrid = (values: number[]): SampledSpectrum => ({ startNm: grid.startNm, stepNm: grid.stepNm, values });
  const photons = ev.probes.map((d) => d.brightness);
  const signalCurves = spectra.emission.map((e, j) => e.values.map((v) => v * photons[j]));
  const tallest = Math.max(1e-300, ...signalCurves.map(maxOf));
  const curves: ChartCurve[] = spectra.emission.map((e, j) => {
    const values = options.byBrightness
      ? signalCurves[j].map((v) => v / tallest)
      : e.values.map((v) => v / Math.max(1e-300, maxOf(e.values)));
    return {
      id: panel.probes[j].id,
      label: panel.probes[j].label || panel.probes[j].id,
      peakNm: ev.probes[j].emissionPeakNm,
      spectrum: onGrid(values),
    };
  });
  const passbands: ChartPassband[] = panel.channels.map((c, i) => ({
    id: c.id,
    label: c.label || c.id,
    handles: handlesOf(panel, i),
    transmission: onGrid(spectra.channels[i].values),
  }));
  keepUnchanged(
    curves,
    previous?.chart.curves,
    (c) => c.spectrum,
    (c, spectrum) => (c.spectrum = spectrum),
  );
  keepUnchanged(
    passbands,
    previous?.chart.passbands,
    (p) => p.transmission,
    (p, t) => (p.transmission = t),
  );
  const background = spectra.background ? onGrid(spectra.background.map((v) => v / tallest)) : undefined;
  const crosstalk: CrosstalkView = {
    probes: panel.probes.map((p, j) => ({
      id: p.id,
      label: p.label || p.id,
      ...(ev.referenceColumns[j] === 'measured' ? { measured: true } : {}),
    })),
    channels: panel.channels.map((c) => ({ id: c.id, label: c.label || c.id })),
    interference: interferenceOf(ev),
    spillover: ev.spillover,
    belowResolution: ev.belowResolution,
    primaryChannel: ev.primaryChannel,
    noiseAmplification: ev.noiseAmplification,
    conditionNumber: ev.conditionNumber,
    shotNoise: shotNoiseOf(ev, panel),
    signalToBackground: ev.signalToBackground,
    lotShift: lotShiftView(ev.lotShiftSensitivity),
    ...(options.sensitivity === false ? { lotShiftPending: true } : {}),
    worst: ev.worst,
    warnings: ev.warnings,
  };
  const maxBright = Math.max(0, ...ev.probes.map((d) => d.brightnessPerAbundance));
  const predictions: ProbePrediction[] = ev.probes.map((d, p) => ({
    material: d.material,
    dye: panel.probes[p].dye ?? null,
    diameterNm: d.diameterNm,
    overallDiameterNm: d.overallDiameterNm,
    firstExcitonNm: d.firstExcitonNm,
    emissionPeakNm: d.emissionPeakNm,
    fwhmNm: d.fwhmNm,
    relativeBrightness: maxBright > 0 ? d.brightnessPerAbundance / maxBright : 0,
    measured: d.measured.emission,
    warnings: d.warnings,
  }));
  return {
    ok: true,
    value: {
      evaluation: ev,
      chart: { curves, passbands, shared, background },
      crosstalk,
      predictions,
      resolved: ev.probes,
    },
  };
}
