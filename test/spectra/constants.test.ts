import { describe, expect, it } from 'vitest';
import * as math from 'mathjs';
import {
  AVOGADRO_PER_MOL,
  BOHR_RADIUS_NM,
  CONFINEMENT_EV_NM2,
  COULOMB_EV_NM,
  ELECTRON_MASS_KG,
  ELEMENTARY_CHARGE_C,
  GAUSSIAN_FWHM_PER_SIGMA,
  HBAR_J_S,
  HC_EV_NM,
  PLANCK_J_S,
  RYDBERG_EV,
  SPEED_OF_LIGHT_M_PER_S,
  VACUUM_PERMITTIVITY_F_PER_M,
  energyWidthToNm,
  evToNm,
  nmToEv,
} from '../../spectra/index';

// Reference: CODATA 2018 as shipped by mathjs 15 (read in SI units; its eV unit uses an older e, so it is avoided).
const si = (name: keyof typeof math, unit: string) => (math[name] as unknown as math.Unit).toNumber(unit);
const h = si('planckConstant', 'J s');
const c = si('speedOfLight', 'm / s');
const e = si('elementaryCharge', 'C');
const me = si('electronMass', 'kg');
const eps0 = si('electricConstant', 'F / m');

describe('constants (CODATA 2018 via mathjs)', () => {
  it.each([
    ['PLANCK_J_S', PLANCK_J_S, h],
    ['SPEED_OF_LIGHT_M_PER_S', SPEED_OF_LIGHT_M_PER_S, c],
    ['ELEMENTARY_CHARGE_C', ELEMENTARY_CHARGE_C, e],
    ['ELECTRON_MASS_KG', ELECTRON_MASS_KG, me],
    ['VACUUM_PERMITTIVITY_F_PER_M', VACUUM_PERMITTIVITY_F_PER_M, eps0],
    ['AVOGADRO_PER_MOL', AVOGADRO_PER_MOL, si('avogadro', 'mol^-1')],
    ['HBAR_J_S', HBAR_J_S, si('reducedPlanckConstant', 'J s')],
    ['BOHR_RADIUS_NM', BOHR_RADIUS_NM, si('bohrRadius', 'nm')],
  ])('%s equals the CODATA 2018 value to 1e-12 relative', (_name, ours, ref) => {
    expect(Math.abs(ours / ref - 1)).toBeLessThan(1e-12);
  });

  it('RYDBERG_EV equals R∞·h·c/e from the CODATA 2018 Rydberg constant to 1e-11 relative', () => {
    const ref = (si('rydberg', 'm^-1') * h * c) / e;
    expect(Math.abs(RYDBERG_EV / ref - 1)).toBeLessThan(1e-11);
  });

  it('HC_EV_NM equals h·c/e·1e9 from CODATA 2018 and the handy value 1239.841984 eV nm (docs/science.md, C)', () => {
    expect(Math.abs(HC_EV_NM / (((h * c) / e) * 1e9) - 1)).toBeLessThan(1e-13);
    expect(HC_EV_NM).toBeCloseTo(1239.841984, 5);
  });

  it(
    'CONFINEMENT_EV_NM2 and COULOMB_EV_NM match ħ²π²/2mₑ = 0.376030 eV nm² and e²/4πε0 = 1.439965 eV nm (science ' +
      'notes, C)',
    () => {
      const hbar = h / (2 * Math.PI);
      expect(Math.abs(CONFINEMENT_EV_NM2 / (((hbar ** 2 * Math.PI ** 2) / (2 * me) / e) * 1e18) - 1)).toBeLessThan(
        1e-12,
      );
      expect(CONFINEMENT_EV_NM2).toBeCloseTo(0.37603, 5);
      expect(COULOMB_EV_NM).toBeCloseTo(1.439965, 5);
    },
  );

  it('GAUSSIAN_FWHM_PER_SIGMA is 2√(2 ln 2) ≈ 2.3548 (exact mathematics)', () => {
    expect(GAUSSIAN_FWHM_PER_SIGMA).toBeCloseTo(2.354820045, 8);
  });
});

describe('unit conversions', () => {
  it('nmToEv(620) equals hc/λ from CODATA 2018 (≈ 1.99974 eV)', () => {
    expect(nmToEv(620)).toBeCloseTo((h * c) / (620e-9 * e), 12);
  });

  it('evToNm(nmToEv(λ)) returns λ for 300–1000 nm', () => {
    for (let nm = 300; nm <= 1000; nm += 70) expect(evToNm(nmToEv(nm))).toBeCloseTo(nm, 9);
  });

  it('energyWidthToNm(2 eV, 0.1 eV) equals the exact difference of the two end wavelengths', () => {
    expect(energyWidthToNm(2, 0.1)).toBeCloseTo(HC_EV_NM / 1.95 - HC_EV_NM / 2.05, 12);
    // The small-width approximation λ²ΔE/hc is below the exact width (convexity of 1/E).
    expect(energyWidthToNm(2, 0.1)).toBeGreaterThan((evToNm(2) ** 2 * 0.1) / HC_EV_NM);
  });
});
