/**
 * The text under the chart's pointer: the wavelength, each curve's value there and each passband's transmission.
 */
import { spectrumAtNm, type SampledSpectrum } from '../../spectra/index';
import type { ChartCurve, ChartPassband, ChartSharedPath } from './types';

const fmt = (v: number) => (v === 0 ? '0' : Math.abs(v) < 0.001 ? v.toExponential(1) : v.toPrecision(3));

/** A transmission as a percentage: one decimal, or two significant digits below 0.1 % (a blocking tail). */
const pct = (t: number) => {
  const p = 100 * t;
  return p === 0 || p >= 0.1 ? p.toFixed(1) : p.toPrecision(2);
};

/** One line of text for the readout (the layers shown); a hint when the pointer is away. */
export function chartReadout(
  hoverNm: number | null,
  curves: readonly ChartCurve[],
  passbands: readonly ChartPassband[],
  background?: SampledSpectrum,
  shared: readonly ChartSharedPath[] = [],
): string {
  if (hoverNm === null)
    return 'Point at the chart (or focus it and use the arrow keys) to read values at a wavelength.';
  const parts = [`${hoverNm} nm`];
  for (const c of curves) parts.push(`${c.label}: ${fmt(spectrumAtNm(c.spectrum, hoverNm))}`);
  if (background) parts.push(`background: ${fmt(spectrumAtNm(background, hoverNm))}`);
  for (const p of passbands) parts.push(`${p.label} T = ${pct(spectrumAtNm(p.transmission, hoverNm))} %`);
  for (const s of shared) parts.push(`${s.label} T = ${pct(spectrumAtNm(s.transmission, hoverNm))} %`);
  return parts.join(' · ');
}
