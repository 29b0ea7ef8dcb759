/**
 * The predicted spillover of each measured entry and its lot-shift band: the panel's model with the probe's emission
 * moved by −shiftNm, 0 and +shiftNm (LOT_SHIFT_NM, the shift the evaluation's lot-to-lot check uses), each time
 * divided by the probe's signal in the measured primary channel; the band is the smallest and largest of the three
 * (a probe's spillover column depends on its own emission only, so other probes' shifts leave it unchanged).
 */
import { DEFAULT_GRID } from '../core/grid';
import type { PanelSpec } from '../core/panel';
import { foldLightPath } from '../light/light-path';
import { collectedMatrix } from '../signal/crosstalk';
import { buildPanelModel } from '../signal/panel-model';
import { LOT_SHIFT_NM, shiftedComponent } from '../signal/sensitivity';

/** A predicted spillover and its band; null where the model gives the probe no signal in the primary channel. */
export interface PredictedEntry {
  predicted: number | null;
  band: [number, number] | null;
}

/**
 * Predicted entries [c][p] for `channels` (panel channel ids) and `probes` (panel probe ids), each probe normalised to
 * its channel `primaryChannel[p]` (an index into `channels`), with the band of a ±shiftNm lot shift.
 */
export function predictedBands(
  input: PanelSpec,
  channels: readonly string[],
  probes: readonly string[],
  primaryChannel: readonly number[],
  shiftNm = LOT_SHIFT_NM,
): PredictedEntry[][] {
  const panel = foldLightPath(input);
  const model = buildPanelModel(panel, DEFAULT_GRID);
  const rows = channels.map((id) => panel.channels.findIndex((c) => c.id === id));
  const transmissions = rows.map((r) => model.transmissions[r]);
  const count = transmissions[0].length;
  const stepNm = model.grid.stepNm;
  const columns = probes.map((id, p) => {
    const components = model.components[panel.probes.findIndex((q) => q.id === id)];
    const ratios = [0, -shiftNm, shiftNm].map((shift) => {
      const moved = shift === 0 ? components : components.map((k) => shiftedComponent(k, shift, stepNm, count));
      const column = collectedMatrix([moved], transmissions, stepNm).map((row) => row[0]);
      const d = column[primaryChannel[p]];
      return d > 0 ? column.map((v) => v / d) : null;
    });
    return ratios;
  });
  return channels.map((_, c) =>
    probes.map((_, p) => {
      const [base, ...shifted] = columns[p];
      if (base === null) return { predicted: null, band: null };
      const all = [base[c], ...shifted.flatMap((r) => (r === null ? [] : [r[c]]))];
      return { predicted: base[c], band: [Math.min(...all), Math.max(...all)] };
    }),
  );
}
