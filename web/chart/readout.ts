/**
 * The text under the chart's pointer: the wavelength, each curve's value there and each passband's transmission.
 */
import { spectrumAtNm, type SampledSpectrum } from '../../spectra/index';
import type { ChartCurve, ChartPassband } from './types';

const fmt = (v: number) => (v === 0 ? '0' : Math.abs(v) < 0.001 ? v.toExponential(1) : v.toPrecision(3));

/** One line of text for the readout; a hint when the pointer is away. */
export function chartReadout(
  hoverNm: number | null,
  curves: readonly ChartCurve[],
  passbands: readonly ChartPassband[],
  background?: SampledSpectrum,
): string {
  if (hoverNm === null)
    return 'Point at the chart (or focus it and use the arrow keys) to read values at a wavelength.';
  const parts = [`${hoverNm} nm`];
  for (const c of curves) parts.push(`${c.label}: ${fmt(spectrumAtNm(c.spectrum, hoverNm))}`);
  if (background) parts.push(`background: ${fmt(spectrumAtNm(background, hoverNm))}`);
  for (const p of passbands) parts.push(`${p.label} T = ${(100 * spectrumAtNm(p.transmission, hoverNm)).toFixed(1)} %`);
  return parts.join(' · ');
}
