/**
 * The panel's verdict in two lines, kept in view beside the editors: its worst pair (whose light lands most in
 * another probe's channel) and its noisiest target after unmixing.
 */
import { formatFraction, type CrosstalkView } from './crosstalk-view';

/** A factor with one decimal below 10 and whole above ("1.4×", "12×"), or a dash. */
export const times = (v: number | null | undefined): string =>
  v === null || v === undefined || !Number.isFinite(v) ? '—' : `${v < 10 ? v.toFixed(1) : Math.round(v)}×`;

/**
 * A noise gain or factor: two decimals below 10 (so 1.08× is not rounded to the 1.0× of a panel without crosstalk),
 * whole numbers above.
 */
export const gain = (v: number | null | undefined): string =>
  v === null || v === undefined || !Number.isFinite(v) ? '—' : `${v < 10 ? v.toFixed(2) : Math.round(v)}×`;

/** "Worst pair: A adds 12 % of B's own signal in B's channel.", or why there is none. */
export function worstPairText(v: CrosstalkView): string {
  const label = (id: string) => v.probes.find((p) => p.id === id)?.label ?? id;
  const w = v.worst;
  if (!w?.from || !w.into || w.interference === null) return 'Worst pair: none yet (no two probes to compare).';
  const into = label(w.into);
  const share = formatFraction(w.interference);
  return `Worst pair: ${label(w.from)} adds ${share} of ${into}'s own signal in ${into}'s channel.`;
}

/**
 * "Noisiest after unmixing: A (noise 2.3× what it would be alone).", from the noise gains; a target no channel
 * separates is named first, since its amount cannot be unmixed at all.
 */
export function noisiestText(v: CrosstalkView): string {
  const gains = v.noiseAmplification;
  if (v.probes.length === 0 || gains.length === 0) return 'Noisiest after unmixing: none yet.';
  const lost = gains.findIndex((g) => g === null || !Number.isFinite(g));
  if (lost >= 0) return `Noisiest after unmixing: ${v.probes[lost].label}, which the channels cannot separate.`;
  let k = 0;
  for (let i = 1; i < gains.length; i++) if ((gains[i] as number) > (gains[k] as number)) k = i;
  return `Noisiest after unmixing: ${v.probes[k].label} (noise ${gain(gains[k])} what it would be alone).`;
}
