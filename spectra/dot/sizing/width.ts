import { GAUSSIAN_FWHM_PER_SIGMA } from '../../core/constants';
import type { SizeLaw } from './laws';
import { fitPowerLaw, powerLawSlopeEvPerNm, type PowerLawFit } from './monotone';
import { BULK_PARAMS, type SizedMaterialId } from '../materials/params';

// One fit per size law, made on first use and kept: resolveDot runs per probe on every panel evaluation.
const fits = new Map<SizeLaw, PowerLawFit>();

/** The cached smooth monotone fit of a size law (see monotone.ts). */
export function smoothSizeFit(law: SizeLaw): PowerLawFit {
  let fit = fits.get(law);
  if (!fit) {
    fit = fitPowerLaw(law.firstExcitonEv, law.diameterRangeNm);
    fits.set(law, fit);
  }
  return fit;
}

/**
 * Ensemble emission FWHM in eV: the inhomogeneous width from size dispersion, σE = |dE/dd| · d · pct/100 with dE/dd of
 * the smooth fit (never the raw curve's derivative), combined in quadrature with the single-dot homogeneous width
 * (params.ts), FWHM = 2√(2 ln 2) σE. Both are Gaussian in energy, so their variances add.
 */
export function emissionFwhmEv(
  material: SizedMaterialId,
  law: SizeLaw,
  diameterNm: number,
  sizeDispersionPct: number,
): number {
  const sigmaInhomEv = powerLawSlopeEvPerNm(smoothSizeFit(law), diameterNm) * diameterNm * (sizeDispersionPct / 100);
  const sigmaHomEv = BULK_PARAMS[material].homogeneousFwhmEv / GAUSSIAN_FWHM_PER_SIGMA;
  return GAUSSIAN_FWHM_PER_SIGMA * Math.hypot(sigmaInhomEv, sigmaHomEv);
}
