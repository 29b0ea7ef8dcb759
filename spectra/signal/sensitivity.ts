/**
 * Lot-to-lot sensitivity: how much worse the crosstalk gets when one probe's emission peak moves by ±shiftNm
 * (default 5 nm: batches of the same nominal dot commonly differ by a few nm in peak position; common practice).
 * The probe's emission is translated along the wavelength axis with its shape and its extinction at the lines
 * unchanged: a first-order model of a lot shift (a real shift also changes the width and the absorption a little).
 */
import type { SampledSpectrum } from '../core/grid';
import { collectedMatrix, crosstalkFigures, type CrosstalkFigures, type EmissionComponent } from './crosstalk';

/** Default peak shift for the lot-to-lot check, nm (common practice). */
export const LOT_SHIFT_NM = 5;

/** The worst crosstalk found over every probe shifted by +shiftNm and by −shiftNm, one probe at a time. */
export interface LotShiftSensitivity {
  shiftNm: number;
  /** Worst interference and worst off-primary spillover of the unshifted panel. */
  baseline: { worstInterference: number | null; worstSpillover: number | null };
  /** The shift (probe and signed nm) that gives the largest worst interference, and the pair it makes. */
  worstInterference: { interference: number; from: string; into: string; shiftedProbe: string; shiftNm: number } | null;
  /** The shift that gives the largest spillover of any probe outside its primary channel. */
  worstSpillover: { spillover: number; probe: string; channel: string; shiftedProbe: string; shiftNm: number } | null;
}

/**
 * Samples translated by `points` grid steps (positive: to the red), linear between samples: the result is held on one
 * more point than the input (a shifted line straddles one more grid interval) and starts `offset` points later.
 */
function shiftSamples(values: number[], points: number): { offset: number; values: number[] } {
  const offset = Math.floor(points);
  const f = points - offset;
  const out = new Array<number>(values.length + 1);
  for (let j = 0; j <= values.length; j++) {
    const a = j < values.length ? values[j] : 0;
    const b = j > 0 ? values[j - 1] : 0;
    out[j] = a * (1 - f) + b * f;
  }
  return { offset, values: out };
}

/** A sampled spectrum translated by shiftNm along the wavelength axis (positive: to the red), linear between points. */
export function shiftEmission(spectrum: SampledSpectrum, shiftNm: number): SampledSpectrum {
  const { offset, values } = shiftSamples(spectrum.values, shiftNm / spectrum.stepNm);
  return { startNm: spectrum.startNm + offset * spectrum.stepNm, stepNm: spectrum.stepNm, values };
}

function worstSpillover(
  spillover: (number | null)[][],
  primary: (number | null)[],
): { value: number; c: number; p: number } | null {
  let best: { value: number; c: number; p: number } | null = null;
  spillover.forEach((row, c) =>
    row.forEach((s, p) => {
      if (s !== null && c !== primary[p] && (best === null || s > best.value)) best = { value: s, c, p };
    }),
  );
  return best;
}

/** A component with its emission translated by shiftNm (weights unchanged), cut to the grid's `count` points. */
export function shiftedComponent(component: EmissionComponent, shiftNm: number, stepNm: number, count: number) {
  const shifted = shiftSamples(component.emission, shiftNm / stepNm);
  const start = component.from + shifted.offset;
  const from = Math.max(0, start);
  const emission = shifted.values.slice(from - start, Math.max(from - start, count - start));
  return { emission, from, weightByChannel: component.weightByChannel };
}

/** What the lot-shift check starts from: an evaluated panel's emissions, light paths, matrix and figures. */
export interface EvaluatedCrosstalk {
  components: EmissionComponent[][];
  transmissions: number[][];
  stepNm: number;
  collected: number[][];
  /** crosstalkFigures of `collected` (the unshifted panel). */
  figures: CrosstalkFigures;
  assigned: (number | undefined)[];
  probeIds: string[];
  channelIds: string[];
}

/** Re-evaluates the crosstalk figures with each probe in turn shifted by ±shiftNm; reports the worst cases. */
export function lotShiftSensitivity(panel: EvaluatedCrosstalk, shiftNm = LOT_SHIFT_NM): LotShiftSensitivity {
  const { components: probes, transmissions, stepNm, collected, figures: base, assigned, probeIds, channelIds } = panel;
  const baseSpill = worstSpillover(base.spillover, base.primaryChannel);
  const result: LotShiftSensitivity = {
    shiftNm,
    baseline: { worstInterference: base.worst.interference, worstSpillover: baseSpill?.value ?? null },
    worstInterference: null,
    worstSpillover: null,
  };
  probes.forEach((components, p) => {
    for (const signed of [shiftNm, -shiftNm]) {
      const moved = components.map((c) => shiftedComponent(c, signed, stepNm, transmissions[0].length));
      const column = collectedMatrix([moved], transmissions, stepNm);
      const shifted = collected.map((row, c) => row.map((v, q) => (q === p ? column[c][0] : v)));
      const figures = crosstalkFigures(shifted, assigned, probeIds, channelIds);
      const w = figures.worst;
      if (
        w.interference !== null &&
        (result.worstInterference === null || w.interference > result.worstInterference.interference)
      ) {
        result.worstInterference = {
          interference: w.interference,
          from: w.from!,
          into: w.into!,
          shiftedProbe: probeIds[p],
          shiftNm: signed,
        };
      }
      const s = worstSpillover(figures.spillover, figures.primaryChannel);
      if (s && (result.worstSpillover === null || s.value > result.worstSpillover.spillover)) {
        result.worstSpillover = {
          spillover: s.value,
          probe: probeIds[s.p],
          channel: channelIds[s.c],
          shiftedProbe: probeIds[p],
          shiftNm: signed,
        };
      }
    }
  });
  return result;
}
