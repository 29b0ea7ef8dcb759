import { HC_EV_NM } from './constants';

/**
 * Photon energy in eV of a vacuum wavelength in nm (E = hc/λ, CODATA 2018 hc).
 * @example nmToEv(620) // ≈ 1.99974
 */
export function nmToEv(wavelengthNm: number): number {
  return HC_EV_NM / wavelengthNm;
}

/**
 * Vacuum wavelength in nm of a photon energy in eV (λ = hc/E).
 * @example evToNm(2) // ≈ 619.92
 */
export function evToNm(energyEv: number): number {
  return HC_EV_NM / energyEv;
}

/**
 * Width in nm spanned by an energy interval [centerEv − widthEv/2, centerEv + widthEv/2] (exact, not the
 * small-width approximation Δλ ≈ λ²ΔE/hc, which underestimates the red half).
 */
export function energyWidthToNm(centerEv: number, widthEv: number): number {
  return HC_EV_NM / (centerEv - widthEv / 2) - HC_EV_NM / (centerEv + widthEv / 2);
}
