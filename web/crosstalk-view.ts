/**
 * What the crosstalk section shows, as plain numbers and labels (the app builds it from a panel evaluation).
 * A null value has no finite meaning (e.g. a probe no channel collects); the warnings say why.
 */
export interface CrosstalkView {
  probes: { id: string; label: string }[];
  channels: { id: string; label: string }[];
  /** interference[t][u]: light of probe t in u's primary channel relative to u's own signal there. */
  interference: (number | null)[][];
  /** spillover[c][p]: probe p's light in channel c relative to its primary channel. */
  spillover: (number | null)[][];
  /** belowResolution[c][p]: spillover too small for the model to tell from zero. */
  belowResolution: boolean[][];
  primaryChannel: number[];
  noiseAmplification: (number | null)[];
  conditionNumber: number | null;
  /** Per channel, signal over sample background; absent when the background is off. */
  signalToBackground?: (number | null)[];
  /** Worst interference after every probe's emission moves by ±5 nm (a batch-to-batch shift), or null. */
  lotShiftWorst: { minusNm: number | null; plusNm: number | null } | null;
  worst: { from: string; into: string; interference: number } | null;
  warnings: string[];
}

/** Smallest fraction the tables print as a number (0.1 %): below it the model's own error dominates (common practice). */
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
