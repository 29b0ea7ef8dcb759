/**
 * The noise figures reported with a design: the proposed panel's collected matrix at abundance 1, scaled to photons,
 * through predictUnmixingNoise. With one number for options.photons (the default) every probe and the sample's light
 * share one photon scale: the brightest target's own signal at its abundance is options.photons detected photons,
 * as the page's own noise reading does, so a dim probe next to a bright one is as noisy as it would be. With one
 * number per target, each target's own channel holds its number at abundance 1 (a scale per target). Each channel's
 * background photons are options.backgroundPhotons plus the sample's light the evaluation collects there: the
 * excitation leak (lineLeak) and, when the request has them, water Raman (inside backgroundCollected), on the
 * channel's own target's scale.
 */
import type { PanelEvaluation } from '../signal/evaluate';
import { photonMixing, predictUnmixingNoise, type NoisePrediction } from '../signal/noise';
import type { ResolvedDesignOptions } from './options';

/** One number per target (or channel): a single number stands for all. */
function perItem(value: number | number[], count: number): number[] {
  return typeof value === 'number' ? new Array<number>(count).fill(value) : value;
}

/**
 * Photons in each target's own channel at abundance 1 when the brightest target's own signal at its abundance is
 * `brightest` photons and every probe shares that scale (0 for a target with no own signal).
 */
function sharedScale(collected: number[][], abundance: number[], brightest: number): number[] {
  const own = abundance.map((_, t) => collected[t][t]);
  const top = Math.max(...own);
  const k = top > 0 ? brightest / top : 0;
  return own.map((x, t) => (x * k) / abundance[t]);
}

/** Noise of a proposed panel whose channel t is target t's own channel. */
export function designNoise(
  evaluation: PanelEvaluation,
  abundance: number[],
  o: ResolvedDesignOptions,
): NoisePrediction & { photons: number[] } {
  const n = abundance.length;
  const atUnitAbundance = evaluation.collected.map((row) => row.map((x, p) => x / abundance[p]));
  const photons = typeof o.photons === 'number' ? sharedScale(evaluation.collected, abundance, o.photons) : o.photons;
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
