/**
 * The noise figures reported with a design: the proposed panel's collected matrix at abundance 1, scaled to photons
 * (options.photons detected in each target's own channel at abundance 1), through predictUnmixingNoise.
 */
import type { PanelEvaluation } from '../signal/evaluate';
import { photonMixing, predictUnmixingNoise, type NoisePrediction } from '../signal/noise';
import type { ResolvedDesignOptions } from './options';

/** One number per target (or channel): a single number stands for all. */
function perItem(value: number | number[], count: number): number[] {
  return typeof value === 'number' ? new Array<number>(count).fill(value) : value;
}

/** Noise of a proposed panel whose channel t is target t's own channel. */
export function designNoise(
  evaluation: PanelEvaluation,
  abundance: number[],
  o: ResolvedDesignOptions,
): NoisePrediction & { photons: number[] } {
  const n = abundance.length;
  const photons = perItem(o.photons, n);
  const atUnitAbundance = evaluation.collected.map((row) => row.map((x, p) => x / abundance[p]));
  const primary = abundance.map((_, t) => t);
  const prediction = predictUnmixingNoise({
    mixingPhotons: photonMixing(atUnitAbundance, primary, photons),
    abundance,
    backgroundPhotons: perItem(o.backgroundPhotons, n),
    readNoiseElectrons: o.readNoiseElectrons,
    excessNoiseFactor: o.excessNoiseFactor,
    primaryChannel: primary,
  });
  return { ...prediction, photons };
}
