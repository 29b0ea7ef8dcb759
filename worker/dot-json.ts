import type { ResolvedDot, SampledSpectrum } from '../spectra/index';

/** A sampled spectrum as JSON: `{startNm, stepNm, values}` with a plain array. */
export function spectrumJson(s: SampledSpectrum): { startNm: number; stepNm: number; values: number[] } {
  return { startNm: s.startNm, stepNm: s.stepNm, values: Array.from(s.values) };
}

/**
 * A resolved dot as the API answers it (shared/api-v1.md "One dot"): the library's fields unchanged, the emission as
 * `spectrum` and the absorption (ε, M⁻¹ cm⁻¹) as `absorption`, both with plain arrays.
 */
export function dotJson(dot: ResolvedDot) {
  const { emission, absorption, ...fields } = dot;
  return { ...fields, spectrum: spectrumJson(emission), absorption: spectrumJson(absorption) };
}
