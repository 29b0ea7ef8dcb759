import { nmToEv, evToNm } from '../../core/units';
import { brusGapEv, brusDiameterNm } from './brus';
import { INP_ALMEIDA_2023, inpDiameterNm, inpFirstExcitonEv } from './almeida2023';
import type { SizedMaterialId } from '../materials/params';
import { YU_2003, yuDiameterNm, yuExtinctionFirstExciton, yuFirstExcitonNm, type YuMaterialId } from './yu2003';

/**
 * One material's size law: core size ↔ first-exciton energy, plus what the size means and the particle volume.
 * Every law names its published model in `model`.
 */
export interface SizeLaw {
  model: string;
  sizeMeaning: string;
  diameterRangeNm: readonly [number, number];
  firstExcitonEv(diameterNm: number): number;
  /** Inverse of firstExcitonEv (NaN where no size has that energy). */
  diameterNm(firstExcitonEv: number): number;
  particleVolumeNm3(diameterNm: number): number;
  /** Published first-exciton molar extinction (M⁻¹ cm⁻¹), or null where no vetted law exists. */
  publishedExtinction(diameterNm: number): number | null;
}

const sphereVolumeNm3 = (d: number) => (Math.PI * d * d * d) / 6;

function yuLaw(id: YuMaterialId): SizeLaw {
  const curve = YU_2003[id];
  return {
    model: 'Yu–Qu–Guo–Peng 2003 empirical curve',
    sizeMeaning: 'sphere diameter of the core (as sized by TEM in Yu et al. 2003)',
    diameterRangeNm: curve.diameterRangeNm,
    firstExcitonEv: (d) => nmToEv(yuFirstExcitonNm(curve, d)),
    diameterNm: (e) => yuDiameterNm(curve, evToNm(e)),
    particleVolumeNm3: sphereVolumeNm3,
    publishedExtinction: (d) => yuExtinctionFirstExciton(curve, d),
  };
}

function brusLaw(
  id: 'gaas' | 'cspbbr3',
  range: readonly [number, number],
  sizeMeaning: string,
  cube: boolean,
): SizeLaw {
  return {
    model: 'Brus 1984 effective-mass equation (1.786 Coulomb and −0.248 E*Ry terms, Kayanuma 1988)',
    sizeMeaning,
    diameterRangeNm: range,
    firstExcitonEv: (d) => brusGapEv(id, d),
    diameterNm: (e) => brusDiameterNm(id, e),
    particleVolumeNm3: cube ? (d) => d * d * d : sphereVolumeNm3,
    publishedExtinction: () => null,
  };
}

/**
 * The size law of every sized material. Ranges: Yu curves, the conservative ranges of docs/science.md (C); InP, see
 * almeida2023.ts; GaAs 5–12 nm and CsPbBr3 4–15 nm cube edges (Protesescu et al., Nano Lett. 2015, 15, 3692, P
 * abstract) trimmed to 5 nm at the small end, where Brus is far too blue for CsPbBr3 (M); GaAs: no empirical curve is
 * at hand, so the range (M) keeps the Brus energies inside 500–800 nm.
 */
export const SIZE_LAWS: Record<SizedMaterialId, SizeLaw> = {
  cdse: yuLaw('cdse'),
  cdte: yuLaw('cdte'),
  cds: yuLaw('cds'),
  inp: {
    model: 'Almeida et al. 2023 empirical curve (equivalent-sphere diameter d ≈ 0.608 × tetrahedron edge)',
    sizeMeaning: 'equivalent-sphere diameter of the tetrahedral core (d ≈ 0.608 × edge length)',
    diameterRangeNm: INP_ALMEIDA_2023.diameterRangeNm,
    firstExcitonEv: inpFirstExcitonEv,
    diameterNm: inpDiameterNm,
    particleVolumeNm3: sphereVolumeNm3,
    publishedExtinction: () => null,
  },
  gaas: brusLaw('gaas', [5, 12], 'sphere diameter of the core', false),
  cspbbr3: brusLaw('cspbbr3', [5, 15], 'cube edge length', true),
};
