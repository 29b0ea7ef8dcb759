/**
 * Autofluorescence presets by sample type: which endogenous fluorophores a formalin-fixed paraffin section, a
 * fresh-frozen section or a dish of cultured cells shows, each band's positions cited (autofluorescence-sources.ts),
 * each preset's make-up cited below. The relative weights are this tool's own (ours, unverified): the sources say
 * which fluorophores dominate and that fixation adds background, never by how much.
 *
 * Scale: every preset shares one factor, set so that fresh-frozen tissue's bands (before the cut at the line) sum to 1
 * under a 405 nm line, as the default model's do (0.996, C). So `level` keeps its meaning (level × 1e5 probe
 * equivalents, background.ts), and at one level the fixed section, which has the same tissue bands plus the fixation
 * band, emits more than the frozen one, and cultured cells, without extracellular matrix, less.
 */
import type { WavelengthGrid } from '../core/grid';
import { BACKGROUND_PRESET_IDS, type BackgroundPresetId } from '../core/panel';
import { SpectraError } from '../core/errors';
import { bandsEmission, excitationWeight, type AutofluorescenceBand } from './bands';
import {
  COLLAGEN,
  ELASTIN,
  FLAVINS,
  FORMALDEHYDE_FIXATION,
  LIPOFUSCIN,
  NADPH,
  PORPHYRINS,
  PORPHYRINS_SECOND,
  type CitedBand,
  type Citation,
  type SourceStatus,
} from './autofluorescence-sources';

/** One sample type's preset: what it is in the user's words, its bands with their weights, and why these bands. */
export interface BackgroundPreset {
  id: BackgroundPresetId;
  name: string;
  description: string;
  bands: (CitedBand & { brightness: number })[];
  /** The sources for the preset's make-up (which fluorophores, what fixation adds). */
  basis: Citation[];
}

const weighted = (band: CitedBand, brightness: number) => ({ ...band, brightness });

// The tissue's own bands, the same in a frozen and a fixed section; weights ours.
const TISSUE_BANDS = [
  weighted(COLLAGEN, 0.6),
  weighted(ELASTIN, 0.3),
  weighted(NADPH, 0.8),
  weighted(FLAVINS, 0.3),
  weighted(LIPOFUSCIN, 0.3),
  weighted(PORPHYRINS, 0.05),
  weighted(PORPHYRINS_SECOND, 0.02),
];

const TISSUE_MAKEUP: Citation[] = [
  {
    cite: 'Croce & Bottiroli, Methods Mol. Biol. 2017, 1560 (abstract seen)',
    status: 'P',
    says: 'in cells NAD(P)H and flavins dominate; vitamin A, porphyrins, lipofuscins and proteins add in bulk tissues',
  },
  {
    cite: 'Monici, Biotechnol. Annu. Rev. 2005, 11, 227 (not read: from memory, unverified)',
    status: 'M',
    says: 'collagen and elastin of the extracellular matrix are major tissue autofluorophores',
  },
];

/** The presets, keyed by id (a missing or extra id does not compile). */
export const BACKGROUND_PRESETS: Readonly<Record<BackgroundPresetId, BackgroundPreset>> = Object.freeze({
  'ffpe-tissue': {
    id: 'ffpe-tissue',
    name: 'FFPE tissue section',
    description:
      'A formalin-fixed, paraffin-embedded section, as cut from routine pathology blocks. Fixation adds a broad ' +
      'green background, strongest under violet and blue light, on top of the light of the tissue itself: collagen, ' +
      'elastin, NAD(P)H, flavins, lipofuscin and porphyrins.',
    // The fixation band's weight is ours: the sources say fixed tissue glows more, not how much more.
    bands: [...TISSUE_BANDS, weighted(FORMALDEHYDE_FIXATION, 1.5)],
    basis: [
      FORMALDEHYDE_FIXATION.source,
      {
        cite: 'Photochem. Photobiol. 2007, 83, 450 (abstract seen, authors not read)',
        status: 'P',
        says: 'formalin-fixed bronchial tissue autofluoresces more than in vivo, with a similar spectral shape',
      },
      {
        cite:
          'Davis, Richter, Becker, Moyer, Sandouk, Skinner, Taubenberger, J. Histochem. Cytochem. 2014 ' +
          '(abstract seen)',
        status: 'P',
        says: 'autofluorescence of FFPE tissue hampers fluorescein-range labels in particular',
      },
      {
        cite: 'Baschong, Suetterlin, Laeng, J. Histochem. Cytochem. 2001 (not read: from memory, unverified)',
        status: 'M',
        says: 'archival formaldehyde-fixed paraffin tissue autofluoresces broadly in confocal microscopy',
      },
      {
        cite: 'J. Histochem. Cytochem. 1981, 29, 411 (abstract seen; authors Collins & Goldsmith from memory)',
        status: 'P',
        says:
          'glutaraldehyde fixation makes a band excited at 540 nm and emitting at 560 nm that paraformaldehyde does ' +
          'not: it is not part of this preset',
      },
      ...TISSUE_MAKEUP,
    ],
  },
  'frozen-tissue': {
    id: 'frozen-tissue',
    name: 'Fresh-frozen tissue section',
    description:
      'A cryostat section of unfixed tissue, or one fixed after cutting in cold acetone or methanol: the light of ' +
      'the tissue itself (collagen and elastin in the blue under UV, NAD(P)H, flavins in the green under blue light, ' +
      'lipofuscin broad yellow, porphyrins red). A section fixed in formaldehyde is closer to the FFPE preset.',
    bands: TISSUE_BANDS,
    basis: TISSUE_MAKEUP,
  },
  'cultured-cells': {
    id: 'cultured-cells',
    name: 'Cultured cells',
    description:
      'A monolayer of cultured cells on glass, live or fixed in cold methanol or acetone: mostly NAD(P)H (blue, ' +
      'excited in the UV) and flavins (green, excited by blue light), a little lipofuscin-like pigment, and no ' +
      'extracellular matrix. Formaldehyde fixation adds background this preset leaves out.',
    // The tissue weights of NAD(P)H and flavins, and a twentieth of their lipofuscin (ours).
    bands: [weighted(NADPH, 0.8), weighted(FLAVINS, 0.3), weighted(LIPOFUSCIN, 0.05)],
    basis: [
      {
        cite: 'Aubin, J. Histochem. Cytochem. 1979, 27, 36 (abstract seen)',
        status: 'P',
        says:
          'the autofluorescence of viable cultured mammalian cells, beyond protein emission, comes from NADH and ' +
          'flavins, in cytoplasmic vesicles, not the nucleus',
      },
      {
        cite: 'Croce, Spano, Balzarini, Locatelli, Barni, Pippia, Bottiroli, Proc. SPIE 1996, 2926 (abstract seen)',
        status: 'P',
        says: 'cultured fibroblasts under 366 nm: NAD(P)H at 440–480 nm, flavins and lipopigments beyond 510 nm',
      },
      {
        cite: 'Billinton & Knight, Anal. Biochem. 2001, 291, 175 (scope seen, contents from memory)',
        status: 'M',
        says: 'flavins are the main cellular autofluorescence at green fluorescent protein wavelengths',
      },
    ],
  },
});

/** The line at which the presets' shared scale is set (ours: where the default model's bands sum to about 1). */
export const PRESET_REFERENCE_LINE_NM = 405;

const bandTotal = (bands: readonly AutofluorescenceBand[], excitationNm: number) =>
  bands.reduce((sum, band) => sum + band.brightness * excitationWeight(band, excitationNm), 0);

/** The presets' shared scale: fresh-frozen tissue's bands sum to 1 under the reference line (C). */
const PRESET_SCALE = 1 / bandTotal(BACKGROUND_PRESETS['frozen-tissue'].bands, PRESET_REFERENCE_LINE_NM);

/**
 * A preset's autofluorescence (relative photon density per nm, on the presets' shared scale) under a line at
 * `excitationNm`. An id that is not a preset is refused (the API's schema refuses it first).
 */
export function presetAutofluorescence(id: BackgroundPresetId, excitationNm: number, grid: WavelengthGrid): number[] {
  const preset = Object.hasOwn(BACKGROUND_PRESETS, id) ? BACKGROUND_PRESETS[id] : undefined;
  if (!preset) {
    throw new SpectraError('invalid_input', `unknown background preset ${JSON.stringify(id)}`, [
      'background',
      'preset',
    ]);
  }
  return bandsEmission(preset.bands, excitationNm, grid, PRESET_SCALE);
}

/** The caution every listing of the presets carries. */
export const BACKGROUND_PRESET_CAUTION =
  'Presets show which fluorophores a sample type usually has, not how bright a given sample is: real samples vary by ' +
  'orders of magnitude with tissue, age, fixation time, processing and mounting. A measured background spectrum of ' +
  'an unstained control (background.points) is better than any preset. Band positions are cited with their status; ' +
  'band widths and weights are choices of this tool, unverified.';

/** What `level` means with a preset. */
export const BACKGROUND_PRESET_LEVEL =
  'level × 1e5 probe equivalents (ε × QY = 1e5 M⁻¹ cm⁻¹ at abundance 1) times the spectrum of the preset; all ' +
  'presets share one scale, set so that the bands of fresh-frozen tissue sum to 1 under a ' +
  `${PRESET_REFERENCE_LINE_NM} nm line, as those of the default model do, so at one level a fixed section emits ` +
  'more and cultured cells less (ratios ours)';

/** A band as the listing gives it: excitation bands as objects. */
export interface BackgroundPresetBandInfo {
  fluorophore: string;
  emissionNm: number;
  emissionFwhmNm: number;
  excitation: { peakNm: number; fwhmNm: number; weight: number }[];
  brightness: number;
  source: Citation;
}

/** GET /api/v1/backgrounds: every preset with its bands and sources, what level means, and the caution. */
export interface BackgroundPresetList {
  presets: {
    id: BackgroundPresetId;
    name: string;
    description: string;
    bands: BackgroundPresetBandInfo[];
    basis: Citation[];
  }[];
  level: string;
  caution: string;
  statusMarks: Record<SourceStatus, string>;
}

/** Every preset in the order of BACKGROUND_PRESET_IDS, as plain JSON-ready data. */
export function listBackgroundPresets(): BackgroundPresetList {
  return {
    presets: BACKGROUND_PRESET_IDS.map((id) => BACKGROUND_PRESETS[id]).map((p) => ({
      id: p.id,
      name: p.name,
      description: p.description,
      bands: p.bands.map((b) => ({
        fluorophore: b.name,
        emissionNm: b.emissionNm,
        emissionFwhmNm: b.emissionFwhmNm,
        excitation: b.excitation.map(([peakNm, fwhmNm, weight]) => ({ peakNm, fwhmNm, weight })),
        brightness: b.brightness,
        source: { ...b.source },
      })),
      basis: p.basis.map((c) => ({ ...c })),
    })),
    level: BACKGROUND_PRESET_LEVEL,
    caution: BACKGROUND_PRESET_CAUTION,
    statusMarks: {
      P: 'seen in the paper or its abstract',
      T: 'independent secondary copies agree (paper not read)',
      M: 'from memory, unverified',
    },
  };
}
