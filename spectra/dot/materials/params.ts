import { BOHR_RADIUS_NM } from '../../core/constants';
/**
 * Bulk parameters of the sized materials for the Brus effective-mass equation and the Stokes-shift and width models.
 * Provenance (status marks as in docs/science.md: P seen in a paper or its abstract, T independent
 * secondary copies of the paper that agree, M from memory and unverified, C computed):
 * - Masses of CdSe (0.13/0.45), InP (0.08/0.6) and GaAs (0.063/0.51), dielectric constants of InP (12.5) and GaAs
 * (12.9):
 *   P, from secondary tables (e.g. Madelung, Semiconductors: Data Handbook, Springer 2004).
 * - All band gaps at 300 K, the CdTe/CdS/CsPbBr3 masses, the CdSe/CdTe/CdS/CsPbBr3 dielectric constants and the
 *   Bohr radii: M, from memory, unverified (same handbook tradition).
 * - CdSe εr = 10.6 is the high end of the quoted 9.5–10.6; with it Brus overestimates the Yu–Qu–Guo–Peng CdSe gap by
 *   +0.43 eV at 4 nm, the figure in docs/science.md (C).
 * - CsPbBr3: reduced mass 0.126 mₑ and effective dielectric constant 7.3, both from one source (Yang et al., ACS
 *   Energy Lett. 2017, 2, 1621; M: from memory, unverified), with equal electron and hole masses (0.252 each, the usual
 *   assumption for lead-halide perovskites, M); Bohr radius εr a₀/μ = 3.07 nm (C). Its size law is empirical
 *   (sizing/cspbbr3.ts); these parameters serve the shell model and the listing.
 * - Homogeneous (single-dot, room-temperature) emission widths: 50–80 meV for CdSe (M); the other values are
 *   assumed similar and are from memory, unverified.
 */
export interface BulkParams {
  bandGapEv: number;
  electronMassRel: number;
  holeMassRel: number;
  /** Reduced exciton mass used by the Brus law, in units of mₑ. */
  reducedMassRel: number;
  dielectricConstant: number;
  bohrRadiusNm: number;
  /** Single-dot emission FWHM at room temperature, eV. */
  homogeneousFwhmEv: number;
}

function reduced(me: number, mh: number): number {
  return (me * mh) / (me + mh);
}

/** Bulk parameters by sized material (see the provenance header above). */
export const BULK_PARAMS = {
  cdse: {
    bandGapEv: 1.74,
    electronMassRel: 0.13,
    holeMassRel: 0.45,
    reducedMassRel: reduced(0.13, 0.45),
    dielectricConstant: 10.6,
    bohrRadiusNm: 5.6,
    homogeneousFwhmEv: 0.07,
  },
  cdte: {
    bandGapEv: 1.5,
    electronMassRel: 0.1,
    holeMassRel: 0.4,
    reducedMassRel: reduced(0.1, 0.4),
    dielectricConstant: 10.2,
    bohrRadiusNm: 7.3,
    homogeneousFwhmEv: 0.07,
  },
  cds: {
    bandGapEv: 2.42,
    electronMassRel: 0.2,
    holeMassRel: 0.7,
    reducedMassRel: reduced(0.2, 0.7),
    dielectricConstant: 8.9,
    bohrRadiusNm: 2.8,
    homogeneousFwhmEv: 0.08,
  },
  inp: {
    bandGapEv: 1.344,
    electronMassRel: 0.08,
    holeMassRel: 0.6,
    reducedMassRel: reduced(0.08, 0.6),
    dielectricConstant: 12.5,
    bohrRadiusNm: 10,
    homogeneousFwhmEv: 0.08,
  },
  gaas: {
    bandGapEv: 1.424,
    electronMassRel: 0.063,
    holeMassRel: 0.51,
    reducedMassRel: reduced(0.063, 0.51),
    dielectricConstant: 12.9,
    bohrRadiusNm: 12,
    homogeneousFwhmEv: 0.06,
  },
  cspbbr3: {
    bandGapEv: 2.36,
    electronMassRel: 0.252,
    holeMassRel: 0.252,
    reducedMassRel: reduced(0.252, 0.252),
    dielectricConstant: 7.3,
    bohrRadiusNm: Math.round(((7.3 * BOHR_RADIUS_NM) / 0.126) * 100) / 100,
    homogeneousFwhmEv: 0.08,
  },
} as const satisfies Record<string, BulkParams>;

/** Materials that have bulk parameters (every material with a size law). */
export type SizedMaterialId = keyof typeof BULK_PARAMS;
