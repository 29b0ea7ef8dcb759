/**
 * Shell materials of core/shell probes, and where every core's and shell's band edges sit on one energy scale.
 * Provenance (status marks as in docs/science.md):
 * - Bulk band gaps near room temperature: ZnS ≈ 3.6–3.7 eV, ZnSe ≈ 2.7 eV, CdS 2.42 eV (Madelung, Semiconductors:
 *   Data Handbook, Springer 2004; M, from memory, unverified). Amorphous silica: ≈ 9 eV (M).
 * - Carrier masses of ZnS (0.28/0.61), ZnSe (0.16/0.57), CdS (0.2/0.7): same handbook tradition (M). Silica's masses
 *   are nominal: its barriers are so high that they do not matter.
 * - Valence-band positions on a common scale (CdSe's valence band = 0) are this tool's choice, made to reproduce the
 *   band offsets usually quoted for the common pairs (M, from memory, unverified; review: Reiss, Protière, Li, Small
 *   2009, 5, 154): CdSe/ZnS type I with ≈ 0.9 eV conduction- and ≈ 1 eV valence-band offsets; CdSe/CdS quasi type II
 *   (conduction bands within ≈ 0.1 eV, valence offset ≈ 0.6 eV); CdSe/ZnSe with a small valence offset (≈ 0.15 eV);
 *   CdTe/CdS type II (the electron prefers CdS); InP/ZnSe with a moderate conduction offset (≈ 0.6 eV; quoted values
 *   range from ≈ 0.3 to ≈ 0.6 eV, and the upper end keeps the ZnSe shift of red InP probes near the 20–40 nm usually
 *   seen, M); GaAs/ZnSe valence offset ≈ 1 eV (a lattice-matched heterojunction). Offsets between other pairs
 *   follow from the same scale and are rougher still.
 * - One monolayer: half the wurtzite c lattice constant, ZnS 0.31 nm, ZnSe 0.33 nm, CdS 0.34 nm (M).
 * - Intrinsic absorption above the shell's gap: μi(E) = μ½ · √((E − Eg)/0.5 eV), capped 1.5 eV above the gap, with
 *   μ½ = 6.9e4 cm⁻¹ for the II–VI shells: the CdSe value of Leatherdale, Woo, Mikulec, Bawendi, J. Phys. Chem. B 2002
 *   (μi = 1.31e5 cm⁻¹ at 350 nm, 1.8 eV above CdSe's gap) carried back along the same square-root edge (C, by
 *   analogy; unverified for ZnS, ZnSe and CdS). Silica does not absorb in the visible or near UV.
 */
import type { ShellMaterialId } from '../../core/panel';
import type { Toxicity } from '../materials/types';

/** What the shell model needs of one shell material, plus what the API lists. */
export interface ShellMaterial {
  id: ShellMaterialId;
  name: string;
  elements: string[];
  bandGapEv: number;
  electronMassRel: number;
  holeMassRel: number;
  /** Valence-band top on the common scale (CdSe = 0), eV; the conduction band is this plus the gap. */
  valenceBandEv: number;
  monolayerNm: number;
  /** False for an encapsulation that does not grow on the crystal (silica): carriers do not leak into it. */
  epitaxial: boolean;
  /**
   * Thickest layer of this material the tool accepts, nm: epitaxial shells grow only so far before strain makes them
   * crack or alloy (ZnS ≈ 10 monolayers, ZnSe ≈ 6 nm as in thick-shell InP probes, CdS ≈ 10 nm as in giant-shell
   * dots; from memory, unverified, Reiss, Protière, Li, Small 2009), silica encapsulations up to 20 nm (ours).
   */
  maxThicknessNm: number;
  /** Intrinsic absorption 0.5 eV above the gap, cm⁻¹ (0: transparent in the range the tool models). */
  intrinsicHalfEvPerCm: number;
  toxicity: Toxicity;
  sources: string[];
}

const HANDBOOK = 'Madelung, Semiconductors: Data Handbook, Springer 2004 (from memory, unverified)';
const REVIEW = 'Reiss, Protière, Li, Small 2009 (band offsets, from memory, unverified)';
const ABSORPTION = 'Leatherdale, Woo, Mikulec, Bawendi, J. Phys. Chem. B 2002 (carried to shells by analogy)';
const II_VI_MU_HALF = 6.9e4;

const DEFER =
  "Follow local regulations, your institution's safety rules and licensed practice for handling, use in living " +
  'systems and disposal; they take precedence over anything shown here.';
const NANO =
  'A shell changes the hazard of the whole particle but does not remove the core’s: treat a core/shell dot as at ' +
  'least as hazardous as its most hazardous layer.';

/** Every shell material, by id. */
export const SHELL_MATERIALS: Record<ShellMaterialId, ShellMaterial> = {
  zns: {
    id: 'zns',
    name: 'ZnS',
    elements: ['Zn', 'S'],
    bandGapEv: 3.6,
    electronMassRel: 0.28,
    holeMassRel: 0.61,
    valenceBandEv: -0.96,
    monolayerNm: 0.31,
    epitaxial: true,
    maxThicknessNm: 3,
    intrinsicHalfEvPerCm: II_VI_MU_HALF,
    toxicity: {
      level: 'moderate',
      notes: [
        'Zinc sulfide is not classified as a carcinogen (not listed by IARC); as a nanoparticle layer its hazard is ' +
          'not established. ZnS shells reduce but do not stop the release of core ions (Derfus, Chan, Bhatia, Nano ' +
          'Lett. 2004, from memory).',
      ],
      cautions: [DEFER, NANO],
    },
    sources: [HANDBOOK, REVIEW, ABSORPTION, 'Dabbousi et al., J. Phys. Chem. B 1997'],
  },
  znse: {
    id: 'znse',
    name: 'ZnSe',
    elements: ['Zn', 'Se'],
    bandGapEv: 2.7,
    electronMassRel: 0.16,
    holeMassRel: 0.57,
    valenceBandEv: -0.16,
    monolayerNm: 0.33,
    epitaxial: true,
    maxThicknessNm: 6,
    intrinsicHalfEvPerCm: II_VI_MU_HALF,
    toxicity: {
      level: 'moderate',
      notes: [
        'Selenium compounds are toxic in excess (WHO, Environmental Health Criteria 58: Selenium, 1987; from ' +
          'memory, unverified); zinc selenide has no IARC classification of its own (selenium and selenium ' +
          'compounds: Group 3, IARC Monographs Vol. 9 and Suppl. 7; from memory, unverified).',
      ],
      cautions: [DEFER, NANO],
    },
    sources: [HANDBOOK, REVIEW, ABSORPTION, 'Won et al., Nature 2019'],
  },
  cds: {
    id: 'cds',
    name: 'CdS',
    elements: ['Cd', 'S'],
    bandGapEv: 2.42,
    electronMassRel: 0.2,
    holeMassRel: 0.7,
    valenceBandEv: -0.58,
    monolayerNm: 0.34,
    epitaxial: true,
    maxThicknessNm: 10,
    intrinsicHalfEvPerCm: II_VI_MU_HALF,
    toxicity: {
      level: 'high',
      notes: [
        'Cadmium and cadmium compounds: IARC Group 1, carcinogenic to humans (IARC Monographs Vol. 100C, 2012). A ' +
          'CdS shell adds cadmium to any core, including a cadmium-free one.',
      ],
      cautions: [
        DEFER,
        NANO,
        'Collect waste as hazardous heavy-metal waste where your rules require it; do not pour it down the drain.',
      ],
    },
    sources: [HANDBOOK, REVIEW, ABSORPTION, 'IARC Monographs Vol. 100C 2012'],
  },
  silica: {
    id: 'silica',
    name: 'Silica (encapsulation)',
    elements: ['Si', 'O'],
    bandGapEv: 9,
    electronMassRel: 0.5,
    holeMassRel: 5,
    valenceBandEv: -4.5,
    monolayerNm: 0.5,
    epitaxial: false,
    maxThicknessNm: 20,
    intrinsicHalfEvPerCm: 0,
    toxicity: {
      level: 'low',
      notes: [
        'Amorphous silica encapsulation is used to hold core ions in (e.g. Pb²⁺ of perovskite dots); it slows but ' +
          'does not guarantee containment.',
        'Crystalline silica dust (quartz, cristobalite): IARC Group 1, carcinogenic to humans by inhalation (IARC ' +
          'Monographs Vol. 100C, 2012); amorphous silica is not classified as such, but avoid inhaling any dust.',
      ],
      cautions: [DEFER, NANO],
    },
    sources: [HANDBOOK, 'IARC Monographs Vol. 100C 2012'],
  },
};

/**
 * Valence-band top of each sized core material on the same scale (CdSe = 0), eV, chosen with the shells' values above
 * to reproduce the quoted offsets (M, from memory, unverified): CdS −0.58, CdTe +0.64 (CdTe/CdS valence offset ≈ 1.2
 * eV), InP +0.6 (InP/ZnSe valence offset ≈ 0.76 eV), GaAs +0.94 (GaAs/ZnSe ≈ 1.1 eV), CsPbBr3 −0.3 (rough;
 * perovskite dots are usually encapsulated rather than epitaxially shelled).
 */
export const CORE_VALENCE_BAND_EV = {
  cdse: 0,
  cdte: 0.64,
  cds: -0.58,
  inp: 0.6,
  gaas: 0.94,
  cspbbr3: -0.3,
} as const;

/**
 * The shell a probe of each core material usually carries as sold for bioimaging, and so the shell the page gives a
 * new probe (typical constructions, Reiss, Protière, Li, Small 2009; thicknesses are nominal, from memory, unverified):
 * CdSe/ZnS of about three monolayers; CdTe/CdS of about two (aqueous CdTe probes); CdS/ZnS; InP/ZnSe/ZnS with a
 * thick ZnSe inner shell (Won et al., Nature 2019 used a thick ZnSe shell; the figure here is smaller and nominal);
 * CsPbBr3 in a silica encapsulation; GaAs: none (colloidal GaAs probes are not an established product).
 */
export const TYPICAL_SHELLS = {
  cdse: [{ material: 'zns', thicknessNm: 0.9 }],
  cdte: [{ material: 'cds', thicknessNm: 0.7 }],
  cds: [{ material: 'zns', thicknessNm: 0.9 }],
  inp: [
    { material: 'znse', thicknessNm: 1.5 },
    { material: 'zns', thicknessNm: 0.6 },
  ],
  gaas: [],
  cspbbr3: [{ material: 'silica', thicknessNm: 5 }],
} as const satisfies Record<
  keyof typeof CORE_VALENCE_BAND_EV,
  readonly { material: ShellMaterialId; thicknessNm: number }[]
>;
