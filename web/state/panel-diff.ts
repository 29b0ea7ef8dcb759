/**
 * Two panels side by side: the figures the comparison shows for each (probes, channels, worst crosstalk, condition
 * number, each target's unmixing noise) and the differences between them in words. Pure: the figures come from an
 * evaluation the caller computed (the page's computePanel), and probes and channels are matched by their labels.
 */
import type { PanelEvaluation, PanelSpec } from '../../spectra/index';
import { formatFraction } from '../chart/crosstalk-view';
import { describeChannel } from '../io/filter-text';
import { savedName } from './saved-panels';

/** The part of an evaluation the comparison reads. */
export type EvaluationFigures = Pick<PanelEvaluation, 'worst' | 'conditionNumber' | 'noiseAmplification'> & {
  probes: Pick<PanelEvaluation['probes'][number], 'emissionPeakNm'>[];
};

/** One probe as the comparison lists it. */
export interface ProbeFigures {
  label: string;
  /** The material's name (or the dye's). */
  material: string;
  /** Emission peak in nm, or null without an evaluation. */
  peakNm: number | null;
  /** Unmixing noise gain of its target, or null when undefined or not computed. */
  noiseGain: number | null;
}

/** One channel as the comparison lists it. */
export interface ChannelFigures {
  label: string;
  /** Its filters as one writes them ("bandpass 605/20"). */
  filters: string;
}

/** What the comparison shows for one panel. */
export interface PanelFigures {
  name: string;
  probes: ProbeFigures[];
  channels: ChannelFigures[];
  /** The worst pair by label and its interference (a fraction), or null when not computed or undefined. */
  worst: { from: string; into: string; value: number } | null;
  conditionNumber: number | null;
  /** False when the panel could not be computed (its figures are then only what it holds). */
  computed: boolean;
}

/** A name for a material id (the page passes the library's names; by default the id itself). */
export type MaterialNamer = (probe: PanelSpec['probes'][number]) => string;

const byId: MaterialNamer = (p) => (p.material === 'dye' && p.dye ? `dye ${p.dye}` : p.material);

const labelOf = (x: { id: string; label?: string }) => x.label?.trim() || x.id;

/** The figures of a panel, with its evaluation when it could be computed. */
export function panelFigures(
  panel: PanelSpec,
  ev?: EvaluationFigures,
  materialName: MaterialNamer = byId,
): PanelFigures {
  const labels = new Map(panel.probes.map((p) => [p.id, labelOf(p)]));
  const w = ev?.worst;
  return {
    name: savedName(panel),
    probes: panel.probes.map((p, i) => ({
      label: labelOf(p),
      material: materialName(p),
      peakNm: ev?.probes[i]?.emissionPeakNm ?? null,
      noiseGain: ev?.noiseAmplification[i] ?? null,
    })),
    channels: panel.channels.map((c) => ({ label: labelOf(c), filters: describeChannel(c) })),
    worst:
      w && w.from !== null && w.into !== null && w.interference !== null
        ? { from: labels.get(w.from) ?? w.from, into: labels.get(w.into) ?? w.into, value: w.interference }
        : null,
    conditionNumber: ev?.conditionNumber ?? null,
    computed: !!ev,
  };
}

/** A gain or condition number: one decimal below 10, whole above ("—" when undefined). */
export function formatGain(v: number | null): string {
  return v === null || !Number.isFinite(v) ? '—' : v < 10 ? v.toFixed(1) : String(Math.round(v));
}

/** A peak in whole nm ("—" when undefined). */
export function formatPeak(nm: number | null): string {
  return nm === null ? '—' : `${Math.round(nm)} nm`;
}

/** The worst pair as a sentence part: "121 % (Yellow dot into Orange dot's channel)", or "—". */
export function formatWorst(w: PanelFigures['worst']): string {
  return w ? `${formatFraction(w.value)} (${w.from} into ${w.into}’s channel)` : '—';
}

/** "was → now" when the two texts differ, else nothing. */
function change(what: string, was: string, now: string): string[] {
  return was === now ? [] : [`${what} ${was} → ${now}`];
}

/** Added, removed and changed items matched by label, in the order of `a` then the new ones of `b`. */
function matched<T extends { label: string }>(
  kind: string,
  a: readonly T[],
  b: readonly T[],
  changes: (x: T, y: T) => string[],
): string[] {
  const inB = new Map(b.map((y) => [y.label, y]));
  const inA = new Set(a.map((x) => x.label));
  const out: string[] = [];
  for (const x of a) {
    const y = inB.get(x.label);
    out.push(...(y ? changes(x, y).map((c) => `${kind} '${x.label}': ${c}`) : [`${kind} '${x.label}' removed`]));
  }
  for (const y of b) if (!inA.has(y.label)) out.push(`${kind} '${y.label}' added`);
  return out;
}

const probeChanges = (x: ProbeFigures, y: ProbeFigures) => [
  ...change('material', x.material, y.material),
  ...change('peak', formatPeak(x.peakNm), formatPeak(y.peakNm)),
  ...change('unmixing noise', `${formatGain(x.noiseGain)}×`, `${formatGain(y.noiseGain)}×`),
];

/** The second text without the filter kind both begin with: ("bandpass 645/20", "bandpass 640/30") → "640/30". */
function withoutSameKind(was: string, now: string): string {
  const kind = /^[a-z]+ /.exec(was)?.[0];
  return kind && now.startsWith(kind) && !now.includes(' + ') ? now.slice(kind.length) : now;
}

/** How the channel's filters changed: "bandpass 645/20 → 640/30", or nothing. */
const channelChanges = (x: ChannelFigures, y: ChannelFigures) =>
  x.filters === y.filters ? [] : [`${x.filters} → ${withoutSameKind(x.filters, y.filters)}`];

/**
 * The differences from panel `a` to panel `b` in words, e.g. "Channel 'Red': bandpass 645/20 → 640/30", "Probe
 * 'Yellow dot' added", "worst crosstalk 121 % → 38 %". Figures of a panel that could not be computed are not compared.
 */
export function panelDifferences(a: PanelFigures, b: PanelFigures): string[] {
  const both = a.computed && b.computed;
  const out = [
    ...change('Title', `'${a.name}'`, `'${b.name}'`),
    ...matched('Probe', a.probes, b.probes, (x, y) =>
      both ? probeChanges(x, y) : change('material', x.material, y.material),
    ),
    ...matched('Channel', a.channels, b.channels, channelChanges),
  ];
  if (!both) return out;
  const worst = (w: PanelFigures['worst']) => (w ? formatFraction(w.value) : '—');
  if (worst(a.worst) !== worst(b.worst)) out.push(`worst crosstalk ${worst(a.worst)} → ${worst(b.worst)}`);
  const pair = (w: PanelFigures['worst']) => (w ? `${w.from} into ${w.into}` : '—');
  if (a.worst && b.worst) out.push(...change('worst pair', pair(a.worst), pair(b.worst)));
  out.push(...change('condition number', formatGain(a.conditionNumber), formatGain(b.conditionNumber)));
  return out;
}
