/**
 * The reference an image is unmixed with: one column per probe, one value per channel. The page is given the panel's
 * reference columns; without them it uses the panel's modelled collected signal (evaluatePanel's `collected`,
 * collected[channel][probe] in relative detected photons, each probe at its panel abundance).
 */
import { evaluatePanel, type PanelSpec } from '../../spectra/index';

/** The panel's reference columns, each in the order of `channels` (panel channel ids). */
export interface ImageReference {
  channels: string[];
  columns: { probe: string; values: number[] }[];
}

/** The modelled reference of a panel: its evaluation's collected signal, one column per probe. */
export function modelledReference(panel: PanelSpec): ImageReference {
  const { collected } = evaluatePanel(panel);
  return {
    channels: panel.channels.map((c) => c.id),
    columns: panel.probes.map((p, j) => ({ probe: p.id, values: collected.map((row) => row[j]) })),
  };
}

/**
 * The reference as the engine takes it, [channel][probe] in the panel's channel order, with the probe ids of its
 * columns. Throws a sentence when the reference lacks one of the panel's channels.
 */
export function referenceByChannel(
  reference: ImageReference,
  panel: PanelSpec,
): { byChannel: number[][]; probes: string[] } {
  const rows = panel.channels.map((channel) => {
    const at = reference.channels.indexOf(channel.id);
    if (at < 0) throw new Error(`The reference has no values for channel '${channel.label ?? channel.id}'.`);
    return reference.columns.map((col) => col.values[at]);
  });
  return { byChannel: rows, probes: reference.columns.map((c) => c.probe) };
}
