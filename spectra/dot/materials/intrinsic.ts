import type { MaterialId } from '../../core/panel';

/**
 * Intrinsic absorption far above the band edge, μi at 350 nm (cm⁻¹): the absorption coefficient of the dot's material
 * including the local-field factor in its solvent, so that ε(350 nm) = N_A · V · μi / (1000 ln 10) (Hens & Moreels,
 * J. Mater. Chem. 2012, 22, 10406). Provenance:
 * - CdSe 1.313e5: from Leatherdale, Woo, Mikulec, Bawendi, J. Phys. Chem. B 2002, 106, 7619 (abstract, P):
 *   C_abs(350 nm) = 5.501e5 · a³ cm² with a the radius in cm, so μi = 5.501e5 / (4π/3) (C).
 * - All others: nominal values of the same order from bulk optical constants and a typical local-field factor;
 *   from memory, unverified. A measured extinction replaces them.
 * `firstExcitonShare` is the first-exciton ε as a share of ε(350 nm) for materials without a published law:
 * 0.2, from the CdSe figures at 4 nm (5857·4^2.65 ≈ 2.3e5 over ≈ 1.15e6; C, by analogy; unverified for them).
 */
export const INTRINSIC_350NM_PER_CM: Record<Exclude<MaterialId, 'carbon' | 'custom' | 'dye'>, number> = {
  cdse: 5.501e5 / ((4 * Math.PI) / 3),
  cdte: 1.8e5,
  cds: 1.1e5,
  inp: 1.0e5,
  gaas: 1.5e5,
  cspbbr3: 1.0e5,
};

/** First-exciton ε over ε(350 nm) where no published first-exciton law exists (C, see above). */
export const FIRST_EXCITON_SHARE = 0.2;

/**
 * Carbon dots (no size law): ε(λ) = 1e5 · exp(−(λ − 350 nm)/60 nm) M⁻¹ cm⁻¹, an exponential tail from the near-UV
 * n–π* band into the visible, as their absorption spectra usually look; the magnitude is an order-of-magnitude nominal
 * value per particle, from memory, unverified.
 */
export const CARBON_ABSORPTION = { epsilonAt350: 1e5, decayNm: 60 } as const;

/**
 * Custom probes without a measured extinction get a log-normal absorption band (lognormal.ts). Without
 * absorptionPeakNm it peaks a nominal Stokes shift of 800 cm⁻¹ above the measured emission peak (about 20–30 nm in
 * the visible; typical of bright xanthene and cyanine dyes and fluorescent proteins, from memory, unverified; the dye
 * library's small-molecule dyes and proteins span 460–1,940 cm⁻¹, C); without extinctionPeak its peak ε is a nominal
 * 1e5 M⁻¹ cm⁻¹ (the order of magnitude of bright organic dyes, common practice). Either default comes with a warning.
 */
export const CUSTOM_ABSORPTION = { stokesShiftPerCm: 800, extinctionPeak: 1e5 } as const;
