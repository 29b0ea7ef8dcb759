/**
 * Core/shell dots: how shell layers move the first exciton, what they add to the absorption, and the particle's size.
 *
 * Red shift. A shell lowers the confinement energy because the carriers' wavefunctions leak into it. Each carrier's
 * leak is an effective growth of the core, ℓ. In a deep well with a barrier ΔE above the carrier's band in the core,
 * the BenDaniel–Duke boundary condition (continuity of ψ and ψ′/m; BenDaniel & Duke, Phys. Rev. 1966) makes the well
 * act as if it were wider by L = (m_shell/m_core)/κ on each side, κ = √(2 m_shell ΔE)/ħ. That deep-well limit
 * overstates the leak of small dots, whose carriers sit high in the well, so the tool scales it by LEAK_SCALE, an
 * empirical factor of its own (ours) set so that two monolayers of ZnS move a 2.3 nm CdSe core's first exciton by
 * about 20 nm, within the 5–30 nm the shell-growth literature reports for small cores (Dabbousi et al., J. Phys. Chem.
 * B 1997; magnitude from memory, unverified). The layer's thickness t limits the leak through ℓ = t·L/(t + L). A layer
 * with no barrier (ΔE ≤ 0: quasi type II or type II for that carrier) lets the carrier spread over its whole thickness.
 * Outer layers count in proportion to how far the carrier reaches through the inner ones; carriers do not leak into
 * a non-epitaxial encapsulation (silica), nor through it.
 * The confinement energy is taken from the core's size law through its smooth power-law fit E = a + b d^−p
 * (monotone.ts), so the shift of carrier c is f_c · b (d^−p − (d + 2ℓ_c)^−p), with f_e = m_h/(m_e + m_h) and
 * f_h = m_e/(m_e + m_h) the carriers' shares of the kinetic confinement energy in the effective-mass model (Brus,
 * J. Chem. Phys. 1984). This is this tool's approximation, checked against published shell-growth shifts in the tests
 * (Dabbousi et al. 1997 for CdSe/ZnS; Reiss, Protière, Li, Small 2009 for the review); it ignores strain, alloying at
 * the interface and the change of the Coulomb term.
 *
 * Absorption. Each layer absorbs like its own volume of bulk material above its band gap (the volume-scaled intrinsic
 * absorption of Leatherdale et al., J. Phys. Chem. B 2002 and Hens & Moreels, J. Mater. Chem. 2012, extended to the
 * shell material): ε(λ) = N_A · V_layer · μi(E) / (1000 ln 10), μi from materials.ts (computed in absorption.ts).
 */
import { CONFINEMENT_EV_NM2 } from '../../core/constants';
import type { ShellLayer } from '../../core/panel';
import type { ShellAbsorptionPart } from '../absorption';
import { BULK_PARAMS, type SizedMaterialId } from '../materials/params';
import type { PowerLawFit } from '../sizing/monotone';
import { CORE_VALENCE_BAND_EV, SHELL_MATERIALS } from './materials';

/** ħ²/2m₀ in eV nm² (the confinement constant ħ²π²/2m₀ over π², CODATA 2018 via constants.ts). */
const HBAR2_OVER_2M0_EV_NM2 = CONFINEMENT_EV_NM2 / (Math.PI * Math.PI);

/** Total shell thickness, nm. */
export function shellThicknessNm(shell: readonly ShellLayer[]): number {
  let t = 0;
  for (const layer of shell) t += layer.thicknessNm;
  return t;
}

/** How far each carrier reaches into the shell (the effective growth of the core on each side), nm. */
export interface CarrierReach {
  electronNm: number;
  holeNm: number;
  /** True when some layer offers a carrier no barrier (quasi type II or type II for it). */
  spreads: boolean;
}

/** Empirical scale of the deep-well leak (ours; see the header for how it was set). */
export const LEAK_SCALE = 0.25;

// Effective extension (nm) of a well into a barrier ΔE (eV), masses m_core and m_shell in units of m₀: the
// BenDaniel–Duke deep-well extension (m_shell/m_core)/κ, scaled by LEAK_SCALE.
function barrierLeakNm(mCore: number, mShell: number, barrierEv: number): number {
  return LEAK_SCALE * (mShell / mCore) * Math.sqrt(HBAR2_OVER_2M0_EV_NM2 / (mShell * barrierEv));
}

/** The electron's and hole's reach into the shell of a `material` core. */
export function carrierReach(material: SizedMaterialId, shell: readonly ShellLayer[]): CarrierReach {
  const core = BULK_PARAMS[material];
  const coreVb = CORE_VALENCE_BAND_EV[material];
  const coreCb = coreVb + core.bandGapEv;
  let electronNm = 0;
  let holeNm = 0;
  let electronWeight = 1;
  let holeWeight = 1;
  let spreads = false;
  for (const layer of shell) {
    const m = SHELL_MATERIALS[layer.material];
    const t = layer.thicknessNm;
    // Carriers do not leak into a non-epitaxial encapsulation (ligands and an amorphous layer lie between).
    if (!(t > 0) || !m.epitaxial) break;
    const electronBarrier = m.valenceBandEv + m.bandGapEv - coreCb;
    const holeBarrier = coreVb - m.valenceBandEv;
    const reach = (barrier: number, mCore: number, mShell: number) => {
      if (!(barrier > 0)) {
        spreads = true;
        return t;
      }
      const leak = barrierLeakNm(mCore, mShell, barrier);
      return (t * leak) / (t + leak);
    };
    const le = reach(electronBarrier, core.electronMassRel, m.electronMassRel);
    const lh = reach(holeBarrier, core.holeMassRel, m.holeMassRel);
    electronNm += electronWeight * le;
    holeNm += holeWeight * lh;
    electronWeight *= le / t;
    holeWeight *= lh / t;
  }
  return { electronNm, holeNm, spreads };
}

/**
 * Red shift (eV, ≥ 0) of the first exciton of a `material` core of size `coreNm` under `shell`, from the core law's
 * smooth fit (see the header).
 */
export function shellShiftEv(
  material: SizedMaterialId,
  coreNm: number,
  shell: readonly ShellLayer[],
  fit: PowerLawFit,
): number {
  if (shell.length === 0) return 0;
  const { electronMassRel: me, holeMassRel: mh } = BULK_PARAMS[material];
  const reach = carrierReach(material, shell);
  const confinement = (d: number) => fit.prefactorEvNmP * Math.pow(d, -fit.exponent);
  const base = confinement(coreNm);
  const electronShare = mh / (me + mh);
  return (
    electronShare * (base - confinement(coreNm + 2 * reach.electronNm)) +
    (1 - electronShare) * (base - confinement(coreNm + 2 * reach.holeNm))
  );
}

/** Each layer's volume (nm³) and absorption parameters; `volumeOf` gives the particle volume for a size (nm). */
export function shellAbsorptionParts(
  coreNm: number,
  shell: readonly ShellLayer[],
  volumeOf: (sizeNm: number) => number,
): ShellAbsorptionPart[] {
  const parts: ShellAbsorptionPart[] = [];
  let inner = coreNm;
  for (const layer of shell) {
    const outer = inner + 2 * layer.thicknessNm;
    const m = SHELL_MATERIALS[layer.material];
    parts.push({
      bandGapEv: m.bandGapEv,
      volumeNm3: volumeOf(outer) - volumeOf(inner),
      intrinsicHalfEvPerCm: m.intrinsicHalfEvPerCm,
    });
    inner = outer;
  }
  return parts;
}
