import type { MaterialId } from '../../core/panel';
import type { Material } from './types';

/**
 * Descriptive data per material (the computed parts, emission range and size-law fields, are added in catalog.ts).
 * Typical values, with status: FWHM, QY and dispersion figures of docs/science.md (mostly M: from memory,
 * unverified); Yu et al. 2003 state 5–10 % size dispersion (T); CsPbBr3 FWHM 12–42 nm and QY up to 90 %
 * (Protesescu et al. 2015, P abstract); carbon-dot QY mostly below 15 % (P). Hydrodynamic diameters of water-soluble
 * conjugates are from memory, unverified.
 */
export type MaterialRecord = Omit<
  Material,
  | 'id'
  | 'emissionRangeNm'
  | 'diameterRangeNm'
  | 'sizingModel'
  | 'sizingModels'
  | 'illustrative'
  | 'typicalShell'
  | 'typicalShellEmissionRangeNm'
  | 'sizeMeaning'
  | 'bulkBandGapEv'
  | 'electronMassRel'
  | 'holeMassRel'
  | 'dielectricConstant'
  | 'bohrRadiusNm'
  | 'toxicity'
>;

const YU = 'Yu, Qu, Guo, Peng, Chem. Mater. 2003';
const BRUS = ['Brus, J. Chem. Phys. 1984', 'Kayanuma, Phys. Rev. B 1988'];
const BULK =
  'Madelung, Semiconductors: Data Handbook, Springer 2004 (bulk parameters; several from memory, unverified)';
const ABS = ['Leatherdale, Woo, Mikulec, Bawendi, J. Phys. Chem. B 2002', 'Hens, Moreels, J. Mater. Chem. 2012'];
const CAD_WARN =
  'diameterNm is the core; commercial dots carry shells (typicalShell) that red-shift the peak and add absorption: ' +
  'give the shell, and enter a product by its emission peak so the core is sized under it.';

/** Descriptive records by material id. */
export const RECORDS: Record<MaterialId, MaterialRecord> = {
  cdse: {
    name: 'CdSe',
    family: 'II-VI',
    elements: ['Cd', 'Se'],
    typicalFwhmNm: 30,
    typicalQuantumYield: 0.5,
    typicalSizeDispersionPct: 7,
    typicalHydrodynamicDiameterNm: 15,
    warnings: [
      CAD_WARN,
      'The Yu 2003 curve is used only over 1.5–8 nm. The Jasieniak et al. 2009 calibration (sizingModel ' +
        "'jasieniak2009') differs by a few tenths of a nm in size and far more in extinction for small dots; each " +
        'CdSe result states both figures at its colour.',
    ],
    sources: [
      YU,
      'Jasieniak, Smith, van Embden, Mulvaney, Califano, J. Phys. Chem. C 2009',
      ...BRUS,
      BULK,
      ...ABS,
      'Nasilowski et al., Nano Lett. 2015',
      'IARC Monographs Vol. 100C 2012',
    ],
  },
  cdte: {
    name: 'CdTe',
    family: 'II-VI',
    elements: ['Cd', 'Te'],
    typicalFwhmNm: 42,
    typicalQuantumYield: 0.4,
    typicalSizeDispersionPct: 8,
    typicalHydrodynamicDiameterNm: 10,
    warnings: [
      CAD_WARN,
      'The Yu 2003 CdTe curve is nearly flat in diameter for first excitons between about 560 and 610 nm: sizes ' +
        'there are ill-conditioned (0.1 nm moves the peak by ~10 nm).',
    ],
    sources: [YU, ...BRUS, BULK, ...ABS, 'IARC Monographs Vol. 100C 2012'],
  },
  cds: {
    name: 'CdS',
    family: 'II-VI',
    elements: ['Cd', 'S'],
    typicalFwhmNm: 25,
    typicalQuantumYield: 0.3,
    typicalSizeDispersionPct: 8,
    typicalHydrodynamicDiameterNm: 12,
    warnings: [CAD_WARN, 'CdS dots emit in the violet and blue and need UV or violet excitation.'],
    sources: [YU, ...BRUS, BULK, ...ABS, 'IARC Monographs Vol. 100C 2012'],
  },
  inp: {
    name: 'InP',
    family: 'III-V',
    elements: ['In', 'P'],
    typicalFwhmNm: 45,
    typicalQuantumYield: 0.5,
    typicalSizeDispersionPct: 10,
    typicalHydrodynamicDiameterNm: 15,
    warnings: [
      'diameterNm is the equivalent-sphere diameter of the tetrahedral core (≈ 0.608 × edge length).',
      'The edge-length and volume fits of Almeida et al. 2023, as quoted, disagree (exponent −0.684 against −0.753 ' +
        'implied by the volume fit): the tool uses the edge-length fit; they differ by up to ~12 nm at the smallest ' +
        'cores and by at most 6 nm for cores of 2 nm and more.',
      'InP extinction is a nominal model (from memory, unverified): supply a measured extinction where brightness ' +
        'matters.',
    ],
    sources: [
      'Almeida et al., Nano Lett. 2023',
      'Won et al., Nature 2019',
      'Allocca et al., Environ. Sci. Technol. 2019',
      ...BRUS,
      BULK,
      'IARC Monographs Vol. 86 2006',
    ],
  },
  gaas: {
    name: 'GaAs',
    family: 'III-V',
    elements: ['Ga', 'As'],
    typicalFwhmNm: 60,
    typicalQuantumYield: 0.1,
    typicalSizeDispersionPct: 10,
    typicalHydrodynamicDiameterNm: null,
    warnings: [
      'Illustrative only: no empirical sizing curve, the Brus equation alone, which overestimates the gap of small ' +
        'dots (by +0.43 eV for 4 nm CdSe) and ignores GaAs’s non-parabolic conduction band. Automatic design leaves ' +
        'GaAs out unless allowedMaterials names it.',
      'Colloidal GaAs dots are rarely used as probes; QY and width are nominal (from memory, unverified).',
    ],
    sources: [...BRUS, BULK, 'IARC Monographs Vol. 100C 2012'],
  },
  cspbbr3: {
    name: 'CsPbBr3',
    family: 'perovskite',
    elements: ['Cs', 'Pb', 'Br'],
    typicalFwhmNm: 20,
    typicalQuantumYield: 0.7,
    typicalSizeDispersionPct: 8,
    typicalHydrodynamicDiameterNm: null,
    warnings: [
      'Unstable in water, heat and light unless encapsulated (e.g. silica or polymer shells).',
      'Weak confinement above ~10 nm edge (Bohr diameter ≈ 7 nm, Protesescu et al. 2015): emission barely moves with ' +
        'size there.',
      'Sizing by an empirical relation through two published sizes (approximate; the anchor points are from ' +
        'memory, unverified).',
    ],
    sources: [
      'Protesescu et al., Nano Lett. 2015',
      'Brennan, Herr, Kuno et al., J. Am. Chem. Soc. 2017',
      'Yang et al., ACS Energy Lett. 2017',
      'IARC Monographs Vol. 87 2006',
    ],
  },
  carbon: {
    name: 'Carbon dots',
    family: 'carbon',
    elements: ['C', 'H', 'O', 'N'],
    typicalFwhmNm: 90,
    typicalQuantumYield: 0.1,
    typicalSizeDispersionPct: null,
    typicalHydrodynamicDiameterNm: 5,
    warnings: [
      'Carbon-dot emission usually depends on the excitation wavelength (surface states); the tool models that shift ' +
        'approximately when excitationNm is given.',
      'No size law: give emissionPeakNm (and fwhmNm if known).',
    ],
    sources: ['Mintz, Zhou, Leblanc, Nanoscale 2019'],
  },
  custom: {
    name: 'Custom probe',
    family: 'other',
    elements: [],
    typicalFwhmNm: 40,
    typicalQuantumYield: 0.5,
    typicalSizeDispersionPct: null,
    typicalHydrodynamicDiameterNm: null,
    warnings: [
      'Described by measured data: measuredEmission is required. Without a measured extinction, a log-normal ' +
        'absorption band is modelled at absorptionPeakNm with peak ε extinctionPeak; when they are not given, at ' +
        'the emission peak less a nominal Stokes shift and with a nominal 1e5 M⁻¹ cm⁻¹, with a warning.',
      'typicalFwhmNm and typicalQuantumYield are placeholders, not properties of any real probe.',
    ],
    sources: ['Siano, Metzler, J. Chem. Phys. 1969'],
  },
  dye: {
    name: 'Dye, stain or fluorescent protein',
    family: 'other',
    elements: [],
    typicalFwhmNm: 40,
    typicalQuantumYield: 0.5,
    typicalSizeDispersionPct: null,
    typicalHydrodynamicDiameterNm: null,
    warnings: [
      "A probe of material 'dye' names a dye of GET /api/v1/dyes in its dye field; that record gives its peaks, " +
        'widths, ε, quantum yield, sources and hazards.',
      'typicalFwhmNm and typicalQuantumYield are placeholders: each dye has its own.',
    ],
    sources: ['Siano, Metzler, J. Chem. Phys. 1969', 'see GET /api/v1/dyes for the sources of each dye'],
  },
};
