/**
 * No anti-Stokes emission: under a line at λ_ex, a dot emits no photon of shorter wavelength (higher energy) than the
 * photon it absorbed. Only the part of the size distribution that absorbs the line emits, and its emission lies to the
 * red of the line (size-selective excitation; e.g. Norris & Bawendi, Phys. Rev. B 1996 use it to narrow ensemble
 * spectra). This tool takes the simplest form of that: the emission on the blue side of the line is removed and the
 * rest is renormalised to unit area, because the absorbed photons (ε at the line, which the absorption model already
 * limits to the dots that absorb) are all re-emitted to the red with the same quantum yield. The removed share is
 * reported so that a user sees how much of the nominal spectrum the line cuts away.
 */
import type { SampledSpectrum, WavelengthGrid } from '../core/grid';

/** An emission cut at a line: unit area on the grid (or all zero), held from grid index `from`. */
export interface CutEmission {
  spectrum: SampledSpectrum;
  from: number;
  /** Share of the nominal emission's area that lay at or below the line's wavelength (0–1). */
  cutFraction: number;
}

/**
 * Cuts a unit-area emission (values held from grid index `from`) at `lineNm`: every grid point at or below the line is
 * zero, the rest is renormalised to unit area. A line to the red of all the emission leaves nothing (cutFraction 1,
 * all zero: the dot does not absorb there either).
 */
export function cutEmissionAtLine(
  emission: SampledSpectrum,
  from: number,
  grid: WavelengthGrid,
  lineNm: number,
): CutEmission {
  const values = emission.values;
  // First held index strictly to the red of the line.
  let k = Math.floor((lineNm - grid.startNm) / grid.stepNm) + 1 - from;
  if (k <= 0) return { spectrum: emission, from, cutFraction: 0 };
  if (k > values.length) k = values.length;
  let total = 0;
  let removed = 0;
  for (let i = 0; i < values.length; i++) {
    total += values[i];
    if (i < k) removed += values[i];
  }
  const cutFraction = total > 0 ? removed / total : 0;
  if (removed === 0) return { spectrum: emission, from, cutFraction: 0 };
  const kept = values.slice(k);
  const keptSum = total - removed;
  const scale = keptSum > 0 ? 1 / (keptSum * grid.stepNm) : 0;
  for (let i = 0; i < kept.length; i++) kept[i] *= scale;
  const start = from + k;
  return {
    spectrum: { startNm: grid.startNm + start * grid.stepNm, stepNm: grid.stepNm, values: kept },
    from: start,
    cutFraction,
  };
}
