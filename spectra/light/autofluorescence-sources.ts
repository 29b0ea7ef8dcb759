/**
 * The endogenous fluorophores (and the fixation product) that the sample-type presets are built from: one band each,
 * its excitation and emission positions cited with their status (docs/science.md, section 12). Status marks: P seen in
 * the paper or its abstract; T independent secondary copies agree; M from memory, unverified. Every emission and
 * excitation width, the near-UV flavin band's weight and the porphyrin Q-band weights are this tool's own choices
 * (ours, unverified), set so each band spans the range its source gives.
 */
import type { AutofluorescenceBand } from './bands';

/** How sure a cited statement is: P seen in the paper or its abstract, T secondary copies agree, M from memory. */
export const SOURCE_STATUSES = ['P', 'T', 'M'] as const;
export type SourceStatus = (typeof SOURCE_STATUSES)[number];

/** A source, how sure we are of it, and what the tool takes from it. */
export interface Citation {
  cite: string;
  status: SourceStatus;
  says: string;
}

/** A band without its weight (each preset gives its own), with the source of its positions. */
export interface CitedBand extends Omit<AutofluorescenceBand, 'brightness'> {
  source: Citation;
}

// Table 1 of this review lists excitation and emission ranges of the endogenous fluorophores; the table was read.
const RETINA_REVIEW = 'Dysli et al., Prog. Retin. Eye Res. 2017, 60, 120, Table 1 (author list from memory)';

/** Collagen: ex 280–350, em 370–440 nm (Dysli et al. 2017, Table 1; P). */
export const COLLAGEN: CitedBand = {
  name: 'collagen',
  emissionNm: 400,
  emissionFwhmNm: 70,
  excitation: [[325, 60, 1]],
  source: { cite: RETINA_REVIEW, status: 'P', says: 'collagen: excitation 280–350 nm, emission 370–440 nm' },
};

/** Elastin: ex 300–370, em 420–460 nm (Dysli et al. 2017, Table 1; P). */
export const ELASTIN: CitedBand = {
  name: 'elastin',
  emissionNm: 440,
  emissionFwhmNm: 80,
  excitation: [[340, 60, 1]],
  source: { cite: RETINA_REVIEW, status: 'P', says: 'elastin: excitation 300–370 nm, emission 420–460 nm' },
};

/** NAD(P)H: ex 300–380, em 450–500 nm (Dysli et al. 2017, Table 1; P); 440–480 nm in cultured cells (Croce 1996; P). */
export const NADPH: CitedBand = {
  name: 'NAD(P)H',
  emissionNm: 460,
  emissionFwhmNm: 100,
  excitation: [[340, 60, 1]],
  source: {
    cite: RETINA_REVIEW,
    status: 'P',
    says: 'NAD(P)H, free and bound: excitation 300–380 nm, emission 450–500 nm',
  },
};

/**
 * Flavins: ex 420–500, em 520–570 nm (Dysli et al. 2017, Table 1, for FAD; P). They are also excited in the near UV:
 * cultured cells under 366 nm emit flavin light beyond 510 nm (Croce et al., Proc. SPIE 1996, 2926; P abstract); the
 * 370 nm band's weight 0.7 is ours.
 */
export const FLAVINS: CitedBand = {
  name: 'flavins',
  emissionNm: 530,
  emissionFwhmNm: 90,
  excitation: [
    [450, 60, 1],
    [370, 40, 0.7],
  ],
  source: { cite: RETINA_REVIEW, status: 'P', says: 'FAD: excitation 420–500 nm, emission 520–570 nm' },
};

/**
 * Lipofuscin: ex 340–500 nm, em 540 nm (Dysli et al. 2017, Table 1; P); granules emit yellow under UV excitation
 * (Eldred et al., Science 1982, 216, 757; P abstract, authors M). A broad band at 560 nm spans both.
 */
export const LIPOFUSCIN: CitedBand = {
  name: 'lipofuscin',
  emissionNm: 560,
  emissionFwhmNm: 150,
  excitation: [[420, 160, 1]],
  source: {
    cite: `${RETINA_REVIEW}; Eldred et al., Science 1982, 216, 757 (abstract seen, author list from memory)`,
    status: 'P',
    says: 'lipofuscin: excitation 340–500 nm, emission 540 nm; lipofuscin granules emit yellow light under UV',
  },
};

const PORPHYRIN_SOURCE: Citation = {
  cite: 'Srivastava, Anand, Carper, Appl. Spectrosc. 1973, 27, 444 (abstract seen)',
  status: 'P',
  says:
    'hematoporphyrin in water: emission 625 nm and a weaker band at 675 nm; excitation 505, 540, 570 and 620 nm ' +
    '(the Soret band near 400 nm is from memory; tissue protoporphyrin IX emits some 10 nm further red, from memory)',
};

// The Soret band (M) and the four Q bands of the source (P), which excite both emission bands; weights ours.
const PORPHYRIN_EXCITATION: CitedBand['excitation'] = [
  [400, 30, 1],
  [505, 20, 0.1],
  [540, 20, 0.08],
  [570, 20, 0.06],
  [620, 20, 0.05],
];

/** Porphyrins, main band: em 625 nm (Srivastava et al. 1973; P abstract). */
export const PORPHYRINS: CitedBand = {
  name: 'porphyrins',
  emissionNm: 625,
  emissionFwhmNm: 20,
  excitation: PORPHYRIN_EXCITATION,
  source: PORPHYRIN_SOURCE,
};

/** Porphyrins, second band: em 675 nm (Srivastava et al. 1973; P abstract). */
export const PORPHYRINS_SECOND: CitedBand = {
  name: 'porphyrins (second band)',
  emissionNm: 675,
  emissionFwhmNm: 20,
  excitation: PORPHYRIN_EXCITATION,
  source: PORPHYRIN_SOURCE,
};

/**
 * The broad background that formaldehyde fixation adds: after aldehyde fixation tissue autofluoresces more than after
 * methanol or ethanol–acetic acid, most strongly pale green under violet-blue excitation (Basic Appl. Histochem. 1989,
 * 33, 251; P abstract; authors del Castillo, Llorente, Stockert from memory). Centre 440 nm excitation, 520 nm
 * emission and both 140–150 nm widths are ours, placed in the violet-blue and the green.
 */
export const FORMALDEHYDE_FIXATION: CitedBand = {
  name: 'formaldehyde fixation products',
  emissionNm: 520,
  emissionFwhmNm: 150,
  excitation: [[440, 140, 1]],
  source: {
    cite: 'del Castillo, Llorente, Stockert, Basic Appl. Histochem. 1989, 33, 251 (abstract seen, authors from memory)',
    status: 'P',
    says:
      'aldehyde-fixed tissue autofluoresces more than methanol- or ethanol–acetic acid-fixed tissue; the strongest ' +
      'emission, pale green, under violet-blue excitation',
  },
};
