/**
 * Physical constants, CODATA 2018 (Tiesinga, Mohr, Newell, Taylor, Rev. Mod. Phys. 2021, 93, 025010;
 * https://physics.nist.gov/cuu/Constants/). The 2018 edition is pinned on purpose: CODATA 2022 changed the last
 * digits of ε0 and mₑ. Derived constants are computed here from the exact SI ones so they never drift apart.
 */

/** Planck constant h, J s (exact since the 2019 SI redefinition). */
export const PLANCK_J_S = 6.62607015e-34;

/** Speed of light in vacuum c, m/s (exact). */
export const SPEED_OF_LIGHT_M_PER_S = 299792458;

/** Elementary charge e, C (exact). */
export const ELEMENTARY_CHARGE_C = 1.602176634e-19;

/** Avogadro constant N_A, 1/mol (exact). */
export const AVOGADRO_PER_MOL = 6.02214076e23;

/** Vacuum electric permittivity ε0, F/m (CODATA 2018; not exact). */
export const VACUUM_PERMITTIVITY_F_PER_M = 8.8541878128e-12;

/** Electron rest mass mₑ, kg (CODATA 2018). */
export const ELECTRON_MASS_KG = 9.1093837015e-31;

/** Rydberg energy R∞hc, eV (CODATA 2018). */
export const RYDBERG_EV = 13.605693122994;

/** Bohr radius a0, nm (CODATA 2018: 5.29177210903e-11 m). */
export const BOHR_RADIUS_NM = 0.0529177210903;

/** Reduced Planck constant ħ = h/2π, J s (CODATA 2018 lists 1.054571817e-34). */
export const HBAR_J_S = PLANCK_J_S / (2 * Math.PI);

/** hc in eV nm (≈ 1239.841984): converts photon energy and vacuum wavelength. */
export const HC_EV_NM = ((PLANCK_J_S * SPEED_OF_LIGHT_M_PER_S) / ELEMENTARY_CHARGE_C) * 1e9;

/** ħ²π²/(2mₑ) in eV nm² (≈ 0.376030): the kinetic prefactor of the Brus equation for a free-electron mass. */
export const CONFINEMENT_EV_NM2 =
  ((HBAR_J_S ** 2 * Math.PI ** 2) / (2 * ELECTRON_MASS_KG) / ELEMENTARY_CHARGE_C) * 1e18;

/** e²/(4πε0) in eV nm (≈ 1.439965): the Coulomb prefactor of the Brus equation. */
export const COULOMB_EV_NM = (ELEMENTARY_CHARGE_C / (4 * Math.PI * VACUUM_PERMITTIVITY_F_PER_M)) * 1e9;

/** FWHM of a Gaussian over its standard deviation, 2√(2 ln 2) ≈ 2.3548 (exact mathematics). */
export const GAUSSIAN_FWHM_PER_SIGMA = 2 * Math.sqrt(2 * Math.LN2);
