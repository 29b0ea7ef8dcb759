/**
 * Excitation dependence of carbon-dot emission (approximate, illustrative). Carbon-dot emission usually moves to the
 * red as the excitation moves to the red, through surface and edge states (Mintz, Zhou, Leblanc, Nanoscale 2019, P),
 * though some dots are excitation-independent. Model: the given emission peak holds for near-UV excitation up to
 * `referenceNm`; beyond it the peak moves by `slope` nm per nm of excitation, and stays at least `minStokesNm` above
 * the
 * excitation. Reported slopes vary widely between preparations; 0.5 and 360 nm are from memory, unverified.
 */
export const CARBON_EXCITATION_MODEL = { referenceNm: 360, slope: 0.5, minStokesNm: 20 } as const;

/** Emission peak (nm) of a carbon dot whose peak under near-UV excitation is `peakNm`, excited at `excitationNm`. */
export function carbonEmissionPeakNm(peakNm: number, excitationNm: number): number {
  const m = CARBON_EXCITATION_MODEL;
  const shifted = peakNm + m.slope * Math.max(0, excitationNm - m.referenceNm);
  return Math.max(shifted, excitationNm + m.minStokesNm);
}

/** Carbon dots: emission peaks accepted, nm (blue to deep red, as reported; from memory, unverified). */
export const CARBON_EMISSION_RANGE_NM: readonly [number, number] = [400, 750];
