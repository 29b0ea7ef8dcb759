/**
 * A catalog design's candidate matrix with the measured reference columns of the candidate probes they cover (the
 * panel's controls): the search then weighs those probes' spillover as measured. A column takes the shape measured
 * and the model's scale, as in an evaluation (spectra/signal/measured-reference.ts), scaled at the probe's brightest
 * measured candidate channel.
 */
import type { ChannelSpec, MeasuredReferenceSpec, ProbeSpec } from '../core/panel';
import { withMeasuredColumns, type ReferenceSource } from '../signal/measured-reference';

/** The matrix with measured columns put in, per probe where its column comes from, and why any was not used. */
export function measuredCandidates(
  collected: number[][],
  probes: ProbeSpec[],
  channels: ChannelSpec[],
  reference: MeasuredReferenceSpec | undefined,
): { collected: number[][]; source: ReferenceSource[]; warnings: string[] } {
  if (!reference) return { collected, source: probes.map(() => 'model'), warnings: [] };
  // Columns of probes the request does not offer (a panel's other probes) are no concern of the search.
  const offered = new Set(probes.map((p) => p.id));
  const columns = reference.columns.filter((c) => offered.has(c.probe));
  const measuredReference = { ...reference, columns };
  return withMeasuredColumns(
    collected,
    { probes, channels, measuredReference },
    probes.map(() => undefined),
  );
}

/**
 * The part of `reference` a proposed panel keeps: its channels, and the columns of its probes that the search used
 * measured; undefined when none.
 */
export function proposalReference(
  reference: MeasuredReferenceSpec | undefined,
  measuredProbes: ReadonlySet<string>,
  panel: { probes: { id: string }[]; channels: { id: string }[] },
): MeasuredReferenceSpec | undefined {
  if (!reference) return undefined;
  const at = panel.channels.map((c) => reference.channels.indexOf(c.id));
  if (at.some((k) => k < 0)) return undefined;
  const kept = new Set(panel.probes.map((p) => p.id));
  const columns = reference.columns
    .filter((c) => kept.has(c.probe) && measuredProbes.has(c.probe))
    .map((c) => ({ probe: c.probe, values: at.map((k) => c.values[k]) }));
  return columns.length ? { channels: panel.channels.map((c) => c.id), columns } : undefined;
}
