/**
 * The dye library: common non-dot probes that share a slide with dots, as plain data. Names are generic chemical
 * names or the proteins' published names. Each number carries the source it is cited from and its status (P seen in
 * the paper or its abstract, T secondary copies agree, M from memory and unverified, ours a nominal value of this
 * tool); docs/science.md lists the same table. Peaks, ε and QY hold only under the stated conditions: bound and free
 * DNA stains, solvents, pH and conjugation all move them.
 *
 * Band widths are read by eye from typical spectra (M) and the asymmetries are nominal (ours): the log-normal bands
 * they build (lognormal.ts) are approximate shapes, and a measured emission or extinction replaces them.
 */
import { DEFER, SUPPLIER_SDS } from '../materials/toxicity';
import type { Toxicity } from '../materials/types';
import { NOMINAL_ABSORPTION_ASYMMETRY, NOMINAL_EMISSION_ASYMMETRY } from '../lognormal';
import type { Dye, SourcedValue, ValueStatus } from './types';

const value = (v: number, status: ValueStatus, source: string): SourcedValue => ({ value: v, status, source });
const memory = (v: number, source: string) => value(v, 'M', `${source} (from memory, unverified)`);
const width = (nm: number) => value(nm, 'M', 'read by eye from typical spectra (from memory, unverified)');
const absorptionRho = () => value(NOMINAL_ABSORPTION_ASYMMETRY, 'ours', 'nominal blue tail of absorption bands');
const emissionRho = () => value(NOMINAL_EMISSION_ASYMMETRY, 'ours', 'nominal red tail of emission bands');

const LAKOWICZ = 'Lakowicz, Principles of Fluorescence Spectroscopy, 3rd ed., Springer 2006';
const KAPUSCINSKI = 'Kapuscinski, Biotech. Histochem. 1995';
const MAGDE = 'Magde, Wong, Seybold, Photochem. Photobiol. 2002';
const SJOBACK = 'Sjöback, Nygren, Kubista, Spectrochim. Acta A 1995';
const KUBIN = 'Kubin, Fletcher, J. Lumin. 1982';
const MARKOVA =
  'Markova, Fedyunyayeva, Povrozin, Semenova, Khabuseva, Terpetschnig, Patsenker, Dyes Pigm. 2013 (abstract: ' +
  'a series of sulfonated indodicarbocyanines';
const CORMACK = 'Cormack, Valdivia, Falkow, Gene 1996';
const PATTERSON = 'Patterson, Knobel, Sharif, Kain, Piston, Biophys. J. 1997';
const SHANER = 'Shaner, Campbell, Steinbach, Giepmans, Palmer, Tsien, Nat. Biotechnol. 2004';

const NOT_SAFE = 'A low or moderate rating is not a finding of safety: the hazard depends on dose, route and exposure.';
const HANDLING =
  'Wear gloves and eye protection, avoid skin contact and aerosols, and collect stock solutions, stained material ' +
  'and waste as your safety office requires; do not pour them down the drain.';
const UV =
  'It is excited in the near UV: shield eyes and skin from the lamp or laser as your light-safety rules require.';

const dnaStain = (...notes: string[]): Toxicity => ({
  level: 'high',
  notes: [
    'Binds DNA: DNA-binding stains are mutagens or suspected mutagens, and are handled as such (common practice).',
    ...notes,
  ],
  cautions: [DEFER, SUPPLIER_SDS, HANDLING],
});

const smallMolecule = (level: 'moderate' | 'low', note: string): Toxicity => ({
  level,
  notes: [note],
  cautions: [DEFER, SUPPLIER_SDS, NOT_SAFE],
});

const PROTEIN: Toxicity = {
  level: 'low',
  notes: [
    'A protein expressed by the sample: the hazard lies mostly with the expression system (plasmids, viral vectors, ' +
      'modified cells and organisms), which biosafety rules govern.',
  ],
  cautions: [DEFER, 'Work with expression vectors and modified organisms under your biosafety rules.', NOT_SAFE],
};

/** The dye library, in a fixed order: counterstains, small-molecule dyes, fluorescent proteins. */
export const DYES: readonly Dye[] = [
  {
    id: 'dapi',
    name: 'DAPI (4′,6-diamidino-2-phenylindole)',
    kind: 'nuclear-counterstain',
    conditions: 'bound to double-stranded DNA (minor groove, A-T rich sites), aqueous buffer',
    absorptionPeakNm: value(358, 'T', `${KAPUSCINSKI} (review); secondary copies agree`),
    emissionPeakNm: value(461, 'T', `${KAPUSCINSKI} (review); secondary copies agree`),
    extinctionPeak: memory(27000, `cited as ${KAPUSCINSKI}`),
    quantumYield: memory(0.6, `cited as ${KAPUSCINSKI}`),
    absorptionFwhmNm: width(55),
    emissionFwhmNm: width(90),
    absorptionAsymmetry: absorptionRho(),
    emissionAsymmetry: emissionRho(),
    toxicity: dnaStain(UV),
    notes: ['Free in solution it fluoresces far more weakly (QY about 0.04, from memory): the values are for DNA.'],
  },
  {
    id: 'ethoxyphenyl-bisbenzimide',
    name: "Ethoxyphenyl bisbenzimide (2'-(4-ethoxyphenyl)-5-(4-methylpiperazin-1-yl)-2,5'-bi-1H-benzimidazole)",
    kind: 'nuclear-counterstain',
    conditions: 'bound to double-stranded DNA (minor groove), aqueous buffer',
    absorptionPeakNm: memory(350, `cited as ${LAKOWICZ}`),
    emissionPeakNm: memory(461, `cited as ${LAKOWICZ}`),
    extinctionPeak: memory(45000, `cited as ${LAKOWICZ}`),
    quantumYield: memory(0.4, `cited as ${LAKOWICZ}`),
    absorptionFwhmNm: width(55),
    emissionFwhmNm: width(90),
    absorptionAsymmetry: absorptionRho(),
    emissionAsymmetry: emissionRho(),
    toxicity: dnaStain('It enters living cells.', UV),
    notes: ['Cell-permeant; unbound dye emits weakly and further to the red (from memory).'],
  },
  {
    id: 'propidium-iodide',
    name: 'Propidium iodide',
    kind: 'nuclear-counterstain',
    conditions: 'bound to double-stranded DNA (intercalated), aqueous buffer',
    absorptionPeakNm: memory(535, `cited as ${LAKOWICZ}`),
    emissionPeakNm: memory(617, `cited as ${LAKOWICZ}`),
    extinctionPeak: memory(5900, `cited as ${LAKOWICZ}; whether bound or free is not recalled`),
    quantumYield: memory(0.15, `cited as ${LAKOWICZ} (0.1–0.2 quoted)`),
    absorptionFwhmNm: width(90),
    emissionFwhmNm: width(80),
    absorptionAsymmetry: absorptionRho(),
    emissionAsymmetry: emissionRho(),
    toxicity: dnaStain('It is excluded by intact membranes, so it stains dead and fixed cells.'),
    notes: ['Binds RNA too; bound dye fluoresces many times more than free dye (from memory).'],
  },
  {
    id: 'fluorescein',
    name: 'Fluorescein (dianion)',
    kind: 'small-molecule-dye',
    conditions: '0.1 M NaOH (the dianion); fluorescence falls steeply below about pH 7',
    absorptionPeakNm: memory(490, SJOBACK),
    emissionPeakNm: value(515, 'P', 'Martin, Lindqvist, J. Lumin. 1975 (abstract)'),
    extinctionPeak: memory(76900, SJOBACK),
    quantumYield: memory(0.925, MAGDE),
    absorptionFwhmNm: width(40),
    emissionFwhmNm: width(40),
    absorptionAsymmetry: absorptionRho(),
    emissionAsymmetry: emissionRho(),
    toxicity: smallMolecule(
      'low',
      'Widely used, with few reported hazards at staining strengths (from memory, unverified).',
    ),
    notes: ['A quantum-yield standard; conjugates to proteins are dimmer (from memory).'],
  },
  {
    id: 'rhodamine-6g',
    name: 'Rhodamine 6G',
    kind: 'small-molecule-dye',
    conditions: 'ethanol',
    absorptionPeakNm: memory(530, KUBIN),
    emissionPeakNm: memory(552, KUBIN),
    extinctionPeak: memory(116000, `cited as ${KUBIN}`),
    quantumYield: memory(0.95, `${KUBIN}; ${MAGDE} agree`),
    absorptionFwhmNm: width(30),
    emissionFwhmNm: width(35),
    absorptionAsymmetry: absorptionRho(),
    emissionAsymmetry: emissionRho(),
    toxicity: smallMolecule(
      'moderate',
      'Typical safety data sheets list it as harmful if swallowed and damaging to the eyes (from memory, unverified).',
    ),
    notes: ['A quantum-yield standard in ethanol; in water it aggregates and dims (from memory).'],
  },
  {
    id: 'tetramethylrhodamine',
    name: 'Tetramethylrhodamine',
    kind: 'small-molecule-dye',
    conditions: 'conjugated to protein, aqueous buffer near pH 7',
    absorptionPeakNm: memory(555, `cited as ${LAKOWICZ}`),
    emissionPeakNm: memory(580, `cited as ${LAKOWICZ}`),
    extinctionPeak: memory(85000, `cited as ${LAKOWICZ}`),
    quantumYield: memory(0.3, `cited as ${LAKOWICZ}; conjugates vary widely`),
    absorptionFwhmNm: width(35),
    emissionFwhmNm: width(40),
    absorptionAsymmetry: absorptionRho(),
    emissionAsymmetry: emissionRho(),
    toxicity: smallMolecule('moderate', 'Toxicological data are limited (from memory): handle it as harmful.'),
    notes: ['The degree of labelling changes QY through self-quenching.'],
  },
  {
    id: 'indodicarbocyanine',
    name: 'Sulfonated indodicarbocyanine (pentamethine cyanine)',
    kind: 'small-molecule-dye',
    conditions: 'free dye in aqueous buffer',
    absorptionPeakNm: value(650, 'P', `${MARKOVA} absorbing at 649–653 nm)`),
    emissionPeakNm: value(670, 'P', `${MARKOVA} emitting at 668–672 nm)`),
    extinctionPeak: value(250000, 'P', `${MARKOVA}, ε 240,000–256,000 M⁻¹ cm⁻¹)`),
    quantumYield: value(0.3, 'P', `${MARKOVA}, QY 0.28–0.32 free and up to 0.43 bound to IgG)`),
    absorptionFwhmNm: width(35),
    emissionFwhmNm: width(35),
    absorptionAsymmetry: absorptionRho(),
    emissionAsymmetry: emissionRho(),
    toxicity: smallMolecule('moderate', 'Toxicological data are limited (from memory): handle it as harmful.'),
    notes: [
      'Values are representative of the series (each within the ranges of the abstract), not of one compound.',
      'Ozone and strong light bleach cyanines (from memory).',
    ],
  },
  {
    id: 'egfp',
    name: 'EGFP (GFP F64L/S65T)',
    kind: 'fluorescent-protein',
    conditions: 'purified protein, aqueous buffer near pH 7.4',
    absorptionPeakNm: memory(488, `${CORMACK}; ${PATTERSON}`),
    emissionPeakNm: memory(507, `${CORMACK}; ${PATTERSON}`),
    extinctionPeak: memory(56000, `cited as ${PATTERSON}`),
    quantumYield: memory(0.6, `cited as ${PATTERSON}`),
    absorptionFwhmNm: width(40),
    emissionFwhmNm: width(35),
    absorptionAsymmetry: absorptionRho(),
    emissionAsymmetry: emissionRho(),
    toxicity: PROTEIN,
    notes: ['Fluorescence falls in acidic compartments (pKa near 6, from memory).'],
  },
  {
    id: 'mcherry',
    name: 'mCherry',
    kind: 'fluorescent-protein',
    conditions: 'purified protein, aqueous buffer near pH 7.4',
    absorptionPeakNm: value(587, 'T', `${SHANER}; secondary copies agree`),
    emissionPeakNm: value(610, 'T', `${SHANER}; secondary copies agree`),
    extinctionPeak: memory(72000, SHANER),
    quantumYield: memory(0.22, SHANER),
    absorptionFwhmNm: width(50),
    emissionFwhmNm: width(50),
    absorptionAsymmetry: absorptionRho(),
    emissionAsymmetry: emissionRho(),
    toxicity: PROTEIN,
    notes: ['A monomer derived from a coral red fluorescent protein.'],
  },
  {
    id: 'mturquoise2',
    name: 'mTurquoise2',
    kind: 'fluorescent-protein',
    conditions: 'purified protein, aqueous buffer near pH 7.4',
    absorptionPeakNm: memory(434, 'Goedhart et al., Nat. Commun. 2012'),
    emissionPeakNm: memory(474, 'Goedhart et al., Nat. Commun. 2012'),
    extinctionPeak: memory(30000, 'Goedhart et al., Nat. Commun. 2012'),
    quantumYield: memory(0.93, 'Goedhart et al., Nat. Commun. 2012'),
    absorptionFwhmNm: width(45),
    emissionFwhmNm: width(55),
    absorptionAsymmetry: absorptionRho(),
    emissionAsymmetry: emissionRho(),
    toxicity: PROTEIN,
    notes: ['Its bands have two vibronic humps that one log-normal band only approximates.'],
  },
  {
    id: 'venus',
    name: 'Venus',
    kind: 'fluorescent-protein',
    conditions: 'purified protein, aqueous buffer near pH 7.4',
    absorptionPeakNm: memory(515, 'Nagai et al., Nat. Biotechnol. 2002'),
    emissionPeakNm: memory(528, 'Nagai et al., Nat. Biotechnol. 2002'),
    extinctionPeak: memory(92200, 'Nagai et al., Nat. Biotechnol. 2002'),
    quantumYield: memory(0.57, 'Nagai et al., Nat. Biotechnol. 2002'),
    absorptionFwhmNm: width(30),
    emissionFwhmNm: width(35),
    absorptionAsymmetry: absorptionRho(),
    emissionAsymmetry: emissionRho(),
    toxicity: PROTEIN,
    notes: ['A yellow variant of the jellyfish protein; a small Stokes shift puts its emission near its excitation.'],
  },
  {
    id: 'mkate2',
    name: 'mKate2',
    kind: 'fluorescent-protein',
    conditions: 'purified protein, aqueous buffer near pH 7.4',
    absorptionPeakNm: memory(588, 'Shcherbo et al., Biochem. J. 2009'),
    emissionPeakNm: memory(633, 'Shcherbo et al., Biochem. J. 2009'),
    extinctionPeak: memory(62500, 'Shcherbo et al., Biochem. J. 2009'),
    quantumYield: memory(0.4, 'Shcherbo et al., Biochem. J. 2009'),
    absorptionFwhmNm: width(60),
    emissionFwhmNm: width(60),
    absorptionAsymmetry: absorptionRho(),
    emissionAsymmetry: emissionRho(),
    toxicity: PROTEIN,
    notes: ['Far-red emission reaches past 650 nm, where tissue absorbs and autofluoresces less.'],
  },
  {
    id: 'tagrfp',
    name: 'TagRFP',
    kind: 'fluorescent-protein',
    conditions: 'purified protein, aqueous buffer near pH 7.4',
    absorptionPeakNm: memory(555, 'Merzlyak et al., Nat. Methods 2007'),
    emissionPeakNm: memory(584, 'Merzlyak et al., Nat. Methods 2007'),
    extinctionPeak: memory(100000, 'Merzlyak et al., Nat. Methods 2007'),
    quantumYield: memory(0.48, 'Merzlyak et al., Nat. Methods 2007'),
    absorptionFwhmNm: width(40),
    emissionFwhmNm: width(45),
    absorptionAsymmetry: absorptionRho(),
    emissionAsymmetry: emissionRho(),
    toxicity: PROTEIN,
    notes: ['A monomeric red protein from a sea anemone.'],
  },
];
