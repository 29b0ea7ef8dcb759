import type { MaterialId } from '../../core/panel';
import type { Toxicity } from './types';

/**
 * Hazard notes per material. Classifications: IARC Monographs, cadmium and cadmium compounds Group 1 (Vol. 100C, 2012),
 * inorganic lead compounds Group 2A (Vol. 87, 2006), indium phosphide Group 2A (Vol. 86, 2006), gallium arsenide
 * Group 1 (Vol. 100C, 2012), all P via secondary sources. Nothing here calls a probe safe: the cautions defer to local
 * regulations, institutional safety rules and licensed practice.
 */
/** The caution every hazard note carries: local rules come first. */
export const DEFER =
  "Follow local regulations, your institution's safety rules and licensed practice for handling, storage, use in " +
  'living systems and disposal; they take precedence over anything shown here.';
const NANO =
  'Handle dispersions and dry powders so as to avoid inhalation, ingestion and skin contact (e.g. gloves and a fume ' +
  'hood or enclosure as your safety office requires).';
const WASTE =
  'Collect waste as hazardous heavy-metal waste where your rules require it; do not pour it down the drain.';
const NOT_SAFE = 'A low rating is not a finding of safety: toxicity depends on size, surface, coating, dose and route.';
/** The caution of every probe the tool knows too little about. */
export const SUPPLIER_SDS = "Follow the supplier's safety data sheet.";

const cadmium = (massPct: string): Toxicity => ({
  level: 'high',
  notes: [
    'Cadmium and cadmium compounds: IARC Group 1, carcinogenic to humans (IARC Monographs Vol. 100C, 2012).',
    `Cadmium is about ${massPct} of the core by mass (computed from atomic masses).`,
    'Oxidation (air, UV, acidic or oxidising media) releases Cd²⁺; ZnS shells and coatings reduce but do not remove ' +
      'this (Derfus, Chan, Bhatia, Nano Lett. 2004, from memory).',
    'Toxicity depends on size, charge, coating and dose (Hardman, Environ. Health Perspect. 2006).',
  ],
  cautions: [DEFER, NANO, WASTE],
});

/** Toxicity by material id. */
export const TOXICITY: Record<MaterialId, Toxicity> = {
  cdse: cadmium('58.7 %'),
  cdte: cadmium('46.8 %'),
  cds: cadmium('77.8 %'),
  inp: {
    level: 'moderate',
    notes: [
      'Indium phosphide: IARC Group 2A, probably carcinogenic to humans (IARC Monographs Vol. 86, 2006).',
      'Generally less toxic than cadmium dots but not non-toxic; core and shell both matter (Allocca et al., ' +
        'Environ. Sci. Technol. 2019).',
    ],
    cautions: [DEFER, NANO, NOT_SAFE],
  },
  gaas: {
    level: 'high',
    notes: [
      'Gallium arsenide: IARC Group 1, carcinogenic to humans (IARC Monographs Vol. 100C, 2012).',
      'Dissolution can release arsenic species.',
    ],
    cautions: [DEFER, NANO, WASTE],
  },
  cspbbr3: {
    level: 'high',
    notes: [
      'Inorganic lead compounds: IARC Group 2A, probably carcinogenic to humans (IARC Monographs Vol. 87, 2006).',
      'CsPbBr3 is about 35.7 % lead by mass (computed from atomic masses).',
      'Lead-halide perovskites degrade quickly in water, heat and light, releasing Pb²⁺ unless encapsulated (silica ' +
        'or polymer shells are used to hold it in).',
    ],
    cautions: [
      DEFER,
      NANO,
      WASTE,
      'Use only encapsulated material in aqueous or biological media, and expect lead release if the shell fails.',
    ],
  },
  carbon: {
    level: 'low',
    notes: [
      'Carbon dots are generally reported as low toxicity, but the evidence is thin and varies with synthesis and ' +
        'surface chemistry: low, not proven.',
    ],
    cautions: [DEFER, NANO, NOT_SAFE],
  },
  custom: {
    level: 'high',
    notes: [
      'Unknown material: the tool knows nothing of its hazards, so it is rated high as a precaution, not as an ' +
        'assessment.',
    ],
    cautions: [SUPPLIER_SDS, DEFER],
  },
  dye: {
    level: 'high',
    notes: [
      'Hazards differ by dye: each dye of GET /api/v1/dyes carries its own notes. DNA-binding stains among them are ' +
        'mutagens or suspected mutagens, so the library as a whole is rated high, as a precaution.',
    ],
    cautions: [SUPPLIER_SDS, DEFER],
  },
};
