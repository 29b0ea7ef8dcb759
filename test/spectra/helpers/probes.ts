import type { ProbeSpec } from '../../../spectra/index';

/**
 * A made-up custom probe with a measured Gaussian emission (σ in nm) and a flat measured extinction of 1e5, so no size
 * law is involved. The emission is sampled every nm from 301 to 999 nm within ±reachSigmas σ of the peak, with `floor`
 * added to every point (a floor of 1e-300 keeps the spectrum nonzero across the whole grid).
 */
export function gaussianProbe(
  id: string,
  peakNm: number,
  sigmaNm: number,
  { reachSigmas = 8, floor = 0, ...extra }: Partial<ProbeSpec> & { reachSigmas?: number; floor?: number } = {},
): ProbeSpec {
  const points: [number, number][] = [];
  const from = Math.max(301, peakNm - reachSigmas * sigmaNm);
  const to = Math.min(999, peakNm + reachSigmas * sigmaNm);
  for (let nm = from; nm <= to; nm += 1) points.push([nm, Math.exp(-0.5 * ((nm - peakNm) / sigmaNm) ** 2) + floor]);
  return {
    id,
    material: 'custom',
    quantumYield: 0.5,
    measuredEmission: { points },
    extinction: {
      points: [
        [300, 1e5],
        [1000, 1e5],
      ],
    },
    ...extra,
  };
}
