/**
 * The noise figures reported with a design: the proposed panel's collected matrix at abundance 1, scaled to photons
 * (options.photons detected in each target's own channel at abundance 1), through predictUnmixingNoise. Each channel's
 * background photons are options.backgroundPhotons plus the sample's light the evaluation collects there: the
 * excitation leak (lineLeak) and, when the request has them, water Raman (inside backgroundCollected). They are turned
 * into photons with the channel's own target's scale (its photons over its own collected signal at abundance 1).
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
  const given = perItem(o.backgroundPhotons, n);
  const mixingPhotons = photonMixing(atUnitAbundance, primary, photons);
  // Sample light in channel t (collected units), in photons at target t's scale: photons[t] / atUnitAbundance[t][t].
  const backgroundPhotons = given.map((b, t) => {
    const sample = (evaluation.backgroundCollected?.[t] ?? 0) + evaluation.lineLeak[t].reduce((a, v) => a + v, 0);
    return b + (sample > 0 ? (sample * mixingPhotons[t][t]) / atUnitAbundance[t][t] : 0);
  });
  const prediction = predictUnmixingNoise({
    mixingPhotons,
    abundance,
    backgroundPhotons,
    readNoiseElectrons: o.readNoiseElectrons,
    excessNoiseFactor: o.excessNoiseFactor,
    primaryChannel: primary,
  });
  return { ...prediction, photons };
}
