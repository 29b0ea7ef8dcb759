/**
 * Synthetic catalog instances for the design tests: Gaussian emission lines seen through ideal rectangular
 * passbands (collected = brightness × the Gaussian's probability mass inside the band, via @stdlib's erf),
 * plus an out-of-band floor like a finite blocking OD. Seeded, so every instance is reproducible.
 */
import erf from '@stdlib/math-base-special-erf';
import { createRandom } from '../../../spectra/index';

/** A random catalog: probes with peaks, widths and brightness; bandpass channels with centres and widths, in nm. */
export interface SyntheticCatalog {
  collected: number[][];
  peaksNm: number[];
  brightness: number[];
  bands: { centerNm: number; widthNm: number }[];
}

const phi = (x: number) => 0.5 * (1 + erf(x / Math.SQRT2));

/** Builds a catalog of `probes` dots and `channels` bands over 450–750 nm. */
export function syntheticCatalog(seed: number, probes: number, channels: number): SyntheticCatalog {
  const rng = createRandom(seed);
  const peaksNm = Array.from({ length: probes }, () => 450 + 300 * rng.uniform());
  const sigmaNm = Array.from({ length: probes }, () => (20 + 25 * rng.uniform()) / 2.3548);
  const brightness = Array.from({ length: probes }, () => 0.2 + 2.8 * rng.uniform());
  const bands = Array.from({ length: channels }, () => ({
    centerNm: 450 + 300 * rng.uniform(),
    widthNm: 15 + 35 * rng.uniform(),
  }));
  const collected = bands.map(({ centerNm, widthNm }) =>
    peaksNm.map((mu, p) => {
      const inBand = phi((centerNm + widthNm / 2 - mu) / sigmaNm[p]) - phi((centerNm - widthNm / 2 - mu) / sigmaNm[p]);
      return brightness[p] * (inBand + 1e-6); // 1e-6: an OD 6 blocking floor
    }),
  );
  return { collected, peaksNm, brightness, bands };
}

/** Random abundances drawn from {1, 0.3, 0.1, 0.5} (repeats on purpose: equal abundances exercise symmetry). */
export function syntheticAbundances(seed: number, targets: number): number[] {
  const rng = createRandom(seed);
  return Array.from({ length: targets }, () => [1, 0.3, 0.1, 0.5][Math.floor(rng.uniform() * 4)]);
}
