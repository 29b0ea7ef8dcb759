/**
 * What the crosstalk section shows, as plain numbers and labels (the app builds it from a panel evaluation), with the
 * tables' number format and their one-hue shade ramp. A null value has no finite meaning (e.g. a probe no channel
 * collects); the warnings say why.
 */
import type { PanelEvaluation } from '../../spectra/index';

/** The evaluation's figures the tables print as they are (spillover, primary channels, noise gains, warnings…). */
type EvaluationFigures = Pick<
  PanelEvaluation,
  | 'spillover'
  | 'belowResolution'
  | 'primaryChannel'
  | 'noiseAmplification'
  | 'conditionNumber'
  | 'signalToBackground'
  | 'warnings'
>;

/** The crosstalk section's numbers and labels. */
export interface CrosstalkView extends EvaluationFigures {
  /** `measured`: its reference column comes from its single-stain control (the panel's measuredReference). */
  probes: { id: string; label: string; measured?: boolean }[];
  channels: { id: string; label: string }[];
  /** interference[t][u]: light of probe t in u's primary channel relative to u's own signal there. */
  interference: (number | null)[][];
  /** Shot-noise reading at a nominal photon budget; null or absent when it cannot be computed. */
  shotNoise?: ShotNoiseView | null;
  /** Worst interference now and after the most harmful ±shiftNm move of one probe's emission (lot to lot), or null. */
  lotShift: {
    shiftNm: number;
    baseline: number | null;
    worst: number | null;
    shiftedProbe: string;
    signedShiftNm: number;
    from: string;
    into: string;
  } | null;
  worst: PanelEvaluation['worst'] | null;
  /** True while the lot-to-lot check is still to be computed (the page adds it once the edits pause). */
  lotShiftPending?: boolean;
}

/** Each target's predicted SD under Poisson shot noise after least-squares unmixing, at a nominal photon budget. */
export interface ShotNoiseView {
  /** Detected photons of the brightest target in its own channel (nominal, not a measurement). */
  photons: number;
  /** SD of the unmixed amount over the target's amount (null: undefined). */
  relativeSd: (number | null)[];
  /** relativeSd over the SD the target would have alone: √(own + background photons)/own photons in its channel. */
  factor: (number | null)[];
  /** True when the panel's background photons were included. */
  withBackground: boolean;
}

/**
 * Smallest fraction the tables print as a number (0.1 %): below it the model's own error dominates (common practice).
 */
export const SMALLEST_SHOWN = 0.001;

/** A fraction as a percentage with two significant digits, or "< 0.1 %" / "—" (no value). */
export function formatFraction(value: number | null | undefined, below = false): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—';
  if (below || value < SMALLEST_SHOWN) return '< 0.1 %';
  const pct = value * 100;
  return `${pct >= 10 ? Math.round(pct) : Number(pct.toPrecision(2))} %`;
}

/** Lightness (CSS %) of a cell: one hue, darker for more crosstalk on a log scale from 0.1 % to 100 %. */
export function cellLightness(value: number | null | undefined): number {
  if (value === null || value === undefined || !Number.isFinite(value) || value <= SMALLEST_SHOWN) return 98;
  const t = Math.min(1, (Math.log10(value) + 3) / 3);
  return 98 - t * 72;
}

/** Number of shades in the cell ramp: enough to rank values, few enough to tell apart in greyscale. */
export const SHADES = 10;

/** Ramp step 0 (palest) … SHADES − 1 (darkest) of a cell, carried as class "s<k>" (CSP: no style attribute). */
export function shadeOf(value: number | null | undefined): number {
  return Math.round(((98 - cellLightness(value)) / 72) * (SHADES - 1));
}

/** Lightness (CSS %) of ramp step k. */
export function shadeLightness(k: number): number {
  return 98 - (72 * k) / (SHADES - 1);
}
