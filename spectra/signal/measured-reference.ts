/**
 * Measured reference columns in place of modelled ones. A probe's single-stain control gives the shape of its column
 * (its light in each channel relative to its primary channel); the model keeps giving its scale (the signal in that
 * primary channel), so the noise figures stay in the model's photon units while the spillover is the measured one.
 */
import type { PanelSpec } from '../core/panel';

/** Where each column of the reference matrix comes from. */
export type ReferenceSource = 'model' | 'measured';

/** The collected matrix with measured columns put in, where each came from, and why any was not used. */
export interface MeasuredColumns {
  collected: number[][];
  source: ReferenceSource[];
  warnings: string[];
}

/**
 * `collected[c][p]` with the panel's measured columns in place of the modelled ones: a measured column is scaled so
 * that its value in the probe's primary channel (its assigned channel, else its brightest measured one) equals the
 * model's there; negative values (noise around zero after the unstained is subtracted) count as 0. The reference may
 * hold more channels than the panel (only the panel's are read); one missing a panel channel, or a column that cannot
 * be scaled, is not used and a warning says so.
 */
export function withMeasuredColumns(
  collected: number[][],
  panel: Pick<PanelSpec, 'probes' | 'channels' | 'measuredReference'>,
  assigned: readonly (number | undefined)[],
): MeasuredColumns {
  const source: ReferenceSource[] = panel.probes.map(() => 'model');
  const ref = panel.measuredReference;
  if (!ref) return { collected, source, warnings: [] };
  const channelIds = panel.channels.map((c) => c.id);
  const unmeasured = channelIds.filter((id) => !ref.channels.includes(id));
  if (unmeasured.length) {
    const warning =
      `the measured reference has no values for channel${unmeasured.length === 1 ? '' : 's'} ` +
      `${unmeasured.join(', ')} (it was taken on ${ref.channels.join(', ')}): the modelled columns are used; ` +
      'measure the controls on every channel of the panel';
    return { collected, source, warnings: [warning] };
  }
  // Where each panel channel is in the reference's lists.
  const at = channelIds.map((id) => ref.channels.indexOf(id));
  const out = collected.map((row) => row.slice());
  const warnings: string[] = [];
  for (const column of ref.columns) {
    const p = panel.probes.findIndex((probe) => probe.id === column.probe);
    if (p < 0) {
      warnings.push(`the measured column of probe ${column.probe} is not used: the panel has no such probe`);
      continue;
    }
    const values = at.map((k) => Math.max(0, column.values[k]));
    let primary = assigned[p];
    if (primary === undefined) primary = values.indexOf(Math.max(...values));
    const channel = channelIds[primary];
    if (!(values[primary] > 0)) {
      warnings.push(`the measured column of probe ${column.probe} is not used: it is dark in its channel ${channel}`);
      continue;
    }
    const modelled = collected[primary][p];
    if (!(modelled > 0)) {
      warnings.push(
        `the measured column of probe ${column.probe} is not used: the model gives it no signal in its channel ` +
          `${channel} to scale it by`,
      );
      continue;
    }
    const scale = modelled / values[primary];
    values.forEach((v, c) => (out[c][p] = v * scale));
    source[p] = 'measured';
  }
  return { collected: out, source, warnings };
}
