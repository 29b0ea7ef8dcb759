/**
 * Empirical size–emission relation of CsPbBr3 nanocubes: E_PL(L) = E∞ + A / L² (L = cube edge, nm), the effective-mass
 * confinement form (kinetic energy ∝ 1/L²) through two published points: a 4.0 nm cube emitting at 470 nm and an
 * 11.8 nm cube at 512 nm (Protesescu et al., Nano Lett. 2015, 15, 3692, size series of 3.8–11.8 nm cubes; Brennan,
 * Herr, Kuno et al., J. Am. Chem. Soc. 2017, 139, 12201 report the same span; the two points are M: from memory,
 * unverified). Solving gives A = 3.912 eV nm² and E∞ = 2.3935 eV (518 nm): the reach ends at 514 nm for a 15 nm cube.
 * The first exciton is the emission plus the tool's Stokes shift (stokes.ts).
 * Consistent exciton parameters for the Bohr radius: reduced mass 0.126 mₑ and effective dielectric constant 7.3, both
 * from Yang et al., ACS Energy Lett. 2017, 2, 1621 (M) give a_B = εr a₀ / μ = 3.07 nm (C), a Bohr diameter of 6.1 nm
 * against the ≈ 7 nm Protesescu et al. quote (P, abstract).
 */
import { HC_EV_NM } from '../../core/constants';

const ANCHORS_NM: readonly [readonly [number, number], readonly [number, number]] = [
  [4.0, 470],
  [11.8, 512],
];

function solve(): { limitEv: number; confinementEvNm2: number } {
  const [[l1, p1], [l2, p2]] = ANCHORS_NM;
  const e1 = HC_EV_NM / p1;
  const e2 = HC_EV_NM / p2;
  const a = (e1 - e2) / (1 / (l1 * l1) - 1 / (l2 * l2));
  return { limitEv: e2 - a / (l2 * l2), confinementEvNm2: a };
}

/** The relation's two constants (computed from the anchors above). */
export const CSPBBR3_EMISSION_LAW = Object.freeze({ anchorsNm: ANCHORS_NM, ...solve() });

/** Emission peak energy (eV) of a CsPbBr3 cube of edge `edgeNm`. */
export function cspbbr3EmissionEv(edgeNm: number): number {
  return CSPBBR3_EMISSION_LAW.limitEv + CSPBBR3_EMISSION_LAW.confinementEvNm2 / (edgeNm * edgeNm);
}

/** Inverse of {@link cspbbr3EmissionEv}: the edge (nm) of the cube emitting at `emissionEv`; NaN at or below E∞. */
export function cspbbr3EdgeNm(emissionEv: number): number {
  const excess = emissionEv - CSPBBR3_EMISSION_LAW.limitEv;
  return excess > 0 ? Math.sqrt(CSPBBR3_EMISSION_LAW.confinementEvNm2 / excess) : Number.NaN;
}
