/**
 * Lot-to-lot sensitivity: how much worse the crosstalk gets when one probe's emission peak moves by ±shiftNm
 * (default 5 nm: batches of the same nominal dot commonly differ by a few nm in peak position; common practice).
 * The probe's emission is translated along the wavelength axis with its shape and its extinction at the lines
 * unchanged: a first-order model of a lot shift (a real shift also changes the width and the absorption a little).
 */
import { collectedColumnOfWindows, crosstalkFigures, type EmissionComponent } from './crosstalk';
import { gridEmissionWindow } from './emission-window';
import { channelSupport, type ConstantEnds } from './linalg/runs';

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

/** Emission translated by shiftNm (positive: to the red), linear between grid points, zero where it leaves the grid. */
export function shiftEmission(emission: Float64Array, shiftNm: number, stepNm: number): Float64Array {
  const out = new Float64Array(emission.length);
  const k = shiftNm / stepNm;
  const whole = Math.floor(k);
  const f = k - whole;
  for (let i = 0; i < out.length; i++) {
    const j = i - whole;
    const a = j >= 0 && j < emission.length ? emission[j] : 0;
    const b = j - 1 >= 0 && j - 1 < emission.length ? emission[j - 1] : 0;
    out[i] = a * (1 - f) + b * f;
  }
  return out;
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

/** Re-evaluates the crosstalk figures with each probe in turn shifted by ±shiftNm; reports the worst cases. */
export function lotShiftSensitivity(
  probes: EmissionComponent[][],
  transmissions: Float64Array[],
  stepNm: number,
  collected: number[][],
  assigned: (number | undefined)[],
  probeIds: string[],
  channelIds: string[],
  shiftNm = LOT_SHIFT_NM,
  ends?: ConstantEnds[],
): LotShiftSensitivity {
  const base = crosstalkFigures(collected, assigned, probeIds, channelIds);
  const baseSpill = worstSpillover(base.spillover, base.primaryChannel);
  const result: LotShiftSensitivity = {
    shiftNm,
    baseline: { worstInterference: base.worst.interference, worstSpillover: baseSpill?.value ?? null },
    worstInterference: null,
    worstSpillover: null,
  };
  const supports = transmissions.map((t, c) => channelSupport(t, ends?.[c]));
  probes.forEach((components, p) => {
    for (const signed of [shiftNm, -shiftNm]) {
      // Shifted arrays are used once: their windows are not kept (collectedColumn would keep them beside the array).
      const moved = components.map((c) => ({
        emission: gridEmissionWindow(shiftEmission(c.emission, signed, stepNm)),
        weightByChannel: c.weightByChannel,
      }));
      const column = collectedColumnOfWindows(moved, supports, stepNm);
      const shifted = collected.map((row, c) => row.map((v, q) => (q === p ? column[c] : v)));
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
