import { nmToEv, evToNm } from '../../core/units';
import { brusGapEv, brusDiameterNm } from './brus';
import { INP_ALMEIDA_2023, inpDiameterNm, inpFirstExcitonEv } from './almeida2023';
import type { SizedMaterialId } from '../materials/params';
import { YU_2003, yuDiameterNm, yuExtinctionFirstExciton, yuFirstExcitonNm, type YuMaterialId } from './yu2003';
import { JASIENIAK_2009, jasieniakExtinctionFirstExciton } from './jasieniak2009';
import { cspbbr3EdgeNm, cspbbr3EmissionEv } from './cspbbr3';
import { firstExcitonEvForEmissionEv, stokesShiftEv } from './stokes';
import type { SizingModelId } from '../../core/panel';

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
  /** True where no published size law backs the numbers: every result says so, and automatic design skips it. */
  illustrative: boolean;
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
    illustrative: false,
  };
}

/** GaAs: the Brus equation alone (no published size law is at hand), so its numbers are illustrative. */
const GAAS_BRUS: SizeLaw = {
  model: 'Brus 1984 effective-mass equation (1.786 Coulomb and −0.248 E*Ry terms, Kayanuma 1988); illustrative',
  sizeMeaning: 'sphere diameter of the core',
  diameterRangeNm: [5, 12],
  firstExcitonEv: (d) => brusGapEv('gaas', d),
  diameterNm: (e) => brusDiameterNm('gaas', e),
  particleVolumeNm3: sphereVolumeNm3,
  publishedExtinction: () => null,
  illustrative: true,
};

/** CsPbBr3 cubes: the empirical size–emission relation (cspbbr3.ts), first exciton = emission + Stokes shift. */
const CSPBBR3_EMPIRICAL: SizeLaw = {
  model: 'empirical CsPbBr3 size–emission relation (E∞ + A/L² through Protesescu et al. 2015 sizes)',
  sizeMeaning: 'cube edge length',
  diameterRangeNm: [4, 15],
  firstExcitonEv: (d) => firstExcitonEvForEmissionEv('cspbbr3', cspbbr3EmissionEv(d)),
  diameterNm: (e) => cspbbr3EdgeNm(e - stokesShiftEv('cspbbr3', e)),
  particleVolumeNm3: (d) => d * d * d,
  publishedExtinction: () => null,
  illustrative: false,
};

/** CdSe by the Jasieniak et al. 2009 calibration (jasieniak2009.ts), offered as `sizingModel: 'jasieniak2009'`. */
export const CDSE_JASIENIAK_2009: SizeLaw = {
  model: 'Jasieniak–Smith–van Embden–Mulvaney–Califano 2009 empirical curve',
  sizeMeaning: 'sphere diameter of the core (as calibrated in Jasieniak et al. 2009)',
  diameterRangeNm: JASIENIAK_2009.diameterRangeNm,
  firstExcitonEv: (d) => nmToEv(yuFirstExcitonNm(JASIENIAK_2009, d)),
  diameterNm: (e) => yuDiameterNm(JASIENIAK_2009, evToNm(e)),
  particleVolumeNm3: sphereVolumeNm3,
  publishedExtinction: (d) => jasieniakExtinctionFirstExciton(nmToEv(yuFirstExcitonNm(JASIENIAK_2009, d))),
  illustrative: false,
};

/**
 * The size law of every sized material. Ranges: Yu curves, the conservative ranges of docs/science.md (C); InP, see
 * almeida2023.ts; CsPbBr3 4–15 nm cube edges (Protesescu et al., Nano Lett. 2015, 15, 3692, P abstract); GaAs 5–12 nm:
 * no empirical curve is at hand, so the range (M) keeps the Brus energies inside 500–800 nm.
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
    illustrative: false,
  },
  gaas: GAAS_BRUS,
  cspbbr3: CSPBBR3_EMPIRICAL,
};

/** The size law a probe asks for: its material's, or CdSe's second curve with sizingModel 'jasieniak2009'. */
export function sizeLawFor(material: SizedMaterialId, sizingModel: SizingModelId | undefined): SizeLaw {
  return material === 'cdse' && sizingModel === 'jasieniak2009' ? CDSE_JASIENIAK_2009 : SIZE_LAWS[material];
}
