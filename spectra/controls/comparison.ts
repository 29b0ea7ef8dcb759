/**
 * Measured against predicted spillover, entry by entry. The prediction's uncertainty is its lot-shift band (each
 * probe's emission moved by ±LOT_SHIFT_NM); the measurement's is its standard error. An entry is flagged when it lies
 * further from the band than COMPARISON_SE_LIMIT standard errors (it disagrees beyond both uncertainties), and never
 * for a distance under the model's resolution (RESOLUTION_THRESHOLD, 1e-3 of the primary signal: the Gaussian line
 * model cannot vouch for less, spectra/signal/crosstalk.ts). Each flag is said in words: "Mito dot spills 7.9 % into
 * Red; predicted 3.1 % (band 2.4–4.0 %): 4.8 points above, 3.2 SE" (the SE count is from the prediction itself).
 */
import type { PanelSpec } from '../core/panel';
import { RESOLUTION_THRESHOLD } from '../signal/crosstalk';
import { predictedBands } from './bands';
import type { MeasuredSpillover } from './types';

/** Standard errors between a measured spillover and the predicted band beyond which they disagree (about 95 %). */
export const COMPARISON_SE_LIMIT = 2;

/** One entry compared: the prediction, its band, whether it is flagged and the sentence saying why. */
export interface ComparedEntry {
  predicted: number | null;
  band: [number, number] | null;
  flagged: boolean;
  sentence: string | null;
}

/** The comparison [c][p] in the measured matrix's order, and the sentences of the flagged entries. */
export interface SpilloverComparison {
  entries: ComparedEntry[][];
  sentences: string[];
}

/** Percent with one decimal from 1 % up, two significant digits under it. */
export function percentText(fraction: number): string {
  const pct = fraction * 100;
  return Math.abs(pct) >= 1 ? pct.toFixed(1) : Number(pct.toPrecision(2)).toString();
}

const nameOf = (item: { id: string; label?: string } | undefined, id: string) => item?.label || id;

/** Compares a measured spillover with the panel's model (the panel the controls were checked against). */
export function compareSpillover(measured: MeasuredSpillover, panel: PanelSpec): SpilloverComparison {
  const { channels, probes, primaryChannel, spillover, se } = measured;
  const predicted = predictedBands(panel, channels, probes, primaryChannel);
  const sentences: string[] = [];
  const entries = channels.map((channel, c) =>
    probes.map((probe, p): ComparedEntry => {
      const { predicted: value, band } = predicted[c][p];
      if (value === null || band === null || c === primaryChannel[p]) {
        return { predicted: value, band, flagged: false, sentence: null };
      }
      const m = spillover[c][p];
      const s = se[c][p];
      const fromBand = Math.max(band[0] - m, m - band[1], 0);
      const seAway = s !== null && s > 0 ? Math.abs(m - value) / s : null;
      const flagged = fromBand > Math.max(RESOLUTION_THRESHOLD, COMPARISON_SE_LIMIT * (s ?? 0));
      if (!flagged) return { predicted: value, band, flagged, sentence: null };
      const probeText = nameOf(
        panel.probes.find((q) => q.id === probe),
        probe,
      );
      const channelText = nameOf(
        panel.channels.find((q) => q.id === channel),
        channel,
      );
      const points = Math.abs(m - value) * 100;
      const sentence =
        `${probeText} spills ${percentText(m)} % into ${channelText}; predicted ${percentText(value)} % ` +
        `(band ${percentText(band[0])}–${percentText(band[1])} %): ${points.toFixed(1)} points ` +
        `${m > value ? 'above' : 'below'}${seAway === null ? '' : `, ${seAway.toFixed(1)} SE`}`;
      sentences.push(sentence);
      return { predicted: value, band, flagged, sentence };
    }),
  );
  return { entries, sentences };
}
