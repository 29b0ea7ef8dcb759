import { SpectraError } from '../core/errors';
import { sampleTable, type SampledSpectrum, type Table, type WavelengthGrid } from '../core/grid';

// Fractional index where v crosses `half` between samples a and b (linear).
function crossingIndex(v: number[], half: number, a: number, b: number): number {
  return v[a] === v[b] ? a : a + ((half - v[a]) / (v[b] - v[a])) * (b - a);
}

/**
 * Peak wavelength (parabolic refinement around the largest sample), FWHM and the two half-maximum wavelengths (linear
 * crossings), nm.
 */
export function peakAndFwhmNm(s: SampledSpectrum): {
  peakNm: number;
  fwhmNm: number;
  halfMaxNm: [number, number];
  truncated: boolean;
} {
  const v = s.values;
  let k = 0;
  for (let i = 1; i < v.length; i++) if (v[i] > v[k]) k = i;
  let offset = 0;
  if (k > 0 && k < v.length - 1) {
    const denom = v[k - 1] - 2 * v[k] + v[k + 1];
    if (denom < 0) offset = (0.5 * (v[k - 1] - v[k + 1])) / denom;
  }
  const half = v[k] / 2;
  let left = k;
  while (left > 0 && v[left] > half) left--;
  let right = k;
  while (right < v.length - 1 && v[right] > half) right++;
  const truncated = v[left] > half || v[right] > half;
  const leftIdx = v[left] > half ? left : crossingIndex(v, half, left, left + 1);
  const rightIdx = v[right] > half ? right : crossingIndex(v, half, right - 1, right);
  return {
    peakNm: s.startNm + (k + offset) * s.stepNm,
    fwhmNm: (rightIdx - leftIdx) * s.stepNm,
    halfMaxNm: [s.startNm + leftIdx * s.stepNm, s.startNm + rightIdx * s.stepNm],
    truncated,
  };
}

/**
 * A measured emission resampled onto the grid (linear, zero outside the table), negative values clipped to zero,
 * renormalised to unit area (sum × step = 1). Values are read as photon counts per nm; spectra recorded per unit
 * energy or as power must be converted first.
 */
export function resampleMeasuredEmission(points: Table, grid: WavelengthGrid, path: (string | number)[]) {
  const warnings: string[] = [];
  const values = sampleTable(points, grid, 0);
  let sum = 0;
  let clipped = false;
  for (let i = 0; i < values.length; i++) {
    if (values[i] < 0) {
      values[i] = 0;
      clipped = true;
    }
    sum += values[i];
  }
  if (clipped) warnings.push('Measured emission had negative values; they were set to zero.');
  if (!(sum > 0))
    throw new SpectraError('invalid_table', 'measured emission has no positive value on the wavelength grid', path);
  for (let i = 0; i < values.length; i++) values[i] /= sum * grid.stepNm;
  const spectrum: SampledSpectrum = { startNm: grid.startNm, stepNm: grid.stepNm, values };
  const { peakNm, fwhmNm, halfMaxNm, truncated } = peakAndFwhmNm(spectrum);
  if (truncated)
    warnings.push(
      'Measured emission does not fall to half maximum on both sides within the grid: its FWHM is a lower bound.',
    );
  return { spectrum, peakNm, fwhmNm, halfMaxNm, warnings };
}
