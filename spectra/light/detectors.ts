/**
 * Generic detector classes and their quantum efficiency (QE, detected photons per incident photon, 0–1).
 *
 * Provenance: every curve below is an APPROXIMATE shape written from memory of typical published curves for the
 * class, not taken from any data sheet or paper, and unverified. Real units differ by generation, window, coating
 * and temperature by tens of percent. A measured curve should replace these wherever one is available.
 */
import type { WavelengthGrid } from '../core/grid';
import { SpectraError } from '../core/errors';
import { sampleTable } from '../core/grid';

/** One detector class: id (what a channel names), display name, caveats, and QE points [nm, QE 0–1]. */
export interface DetectorClass {
  id: string;
  name: string;
  notes: string;
  qePoints: readonly (readonly [number, number])[];
}

/** The detector a channel that names none is read with: QE 1 at every wavelength. */
export const DEFAULT_DETECTOR_ID = 'ideal';

const APPROX = 'Approximate curve from memory of typical values for the class, not from a data sheet; real units vary.';

// A GaAsP photocathode's QE, shared by the photomultiplier and the hybrid detector built on it (from memory).
const GAASP_QE: DetectorClass['qePoints'] = [
  [300, 0.02],
  [350, 0.15],
  [400, 0.3],
  [450, 0.4],
  [500, 0.45],
  [550, 0.44],
  [600, 0.38],
  [650, 0.28],
  [700, 0.1],
  [720, 0.03],
  [750, 0],
];

/** The detector classes a channel may name (from memory, approximate: see the file header). */
export const DETECTOR_CLASSES: readonly DetectorClass[] = Object.freeze([
  {
    id: DEFAULT_DETECTOR_ID,
    name: 'Ideal detector (QE 1)',
    notes: 'Counts every photon: the default when a channel names no detector.',
    qePoints: [
      [1, 1],
      [100000, 1],
    ],
  },
  {
    id: 'pmt-bialkali',
    name: 'Photomultiplier, bialkali photocathode',
    notes: `Blue-green sensitive, falls steeply beyond ~600 nm; poor for red and near-infrared dots. ${APPROX}`,
    qePoints: [
      [300, 0.2],
      [350, 0.26],
      [400, 0.27],
      [450, 0.24],
      [500, 0.17],
      [550, 0.08],
      [600, 0.03],
      [650, 0.007],
      [700, 0.001],
      [750, 0],
    ],
  },
  {
    id: 'pmt-multialkali',
    name: 'Photomultiplier, multialkali (red-extended) photocathode',
    notes: `Lower peak QE than bialkali but reaches into the near infrared. ${APPROX}`,
    qePoints: [
      [300, 0.18],
      [400, 0.22],
      [500, 0.17],
      [600, 0.1],
      [700, 0.05],
      [800, 0.02],
      [850, 0.005],
      [900, 0],
    ],
  },
  {
    id: 'pmt-gaasp',
    name: 'Photomultiplier, GaAsP photocathode',
    notes: `High QE across the visible, cut off beyond ~720 nm. ${APPROX}`,
    qePoints: GAASP_QE,
  },
  {
    id: 'hybrid-gaasp',
    name: 'Hybrid photodetector, GaAsP photocathode',
    notes: `Same photocathode as a GaAsP photomultiplier (so the same QE shape), with lower excess noise. ${APPROX}`,
    qePoints: GAASP_QE,
  },
  {
    id: 'scmos',
    name: 'Scientific CMOS camera, front-illuminated',
    notes: `Peak near 550–600 nm, useful far into the near infrared at reduced QE. ${APPROX}`,
    qePoints: [
      [300, 0.05],
      [350, 0.15],
      [400, 0.45],
      [450, 0.65],
      [500, 0.75],
      [550, 0.82],
      [600, 0.78],
      [650, 0.68],
      [700, 0.58],
      [750, 0.45],
      [800, 0.33],
      [850, 0.22],
      [900, 0.13],
      [950, 0.06],
      [1000, 0.03],
      [1100, 0],
    ],
  },
  {
    id: 'scmos-bsi',
    name: 'Scientific CMOS camera, back-illuminated',
    notes: `Above 0.9 QE over much of the visible. ${APPROX}`,
    qePoints: [
      [300, 0.4],
      [400, 0.75],
      [450, 0.88],
      [500, 0.93],
      [600, 0.95],
      [700, 0.85],
      [800, 0.6],
      [900, 0.3],
      [1000, 0.08],
      [1100, 0],
    ],
  },
  {
    id: 'emccd',
    name: 'Electron-multiplying CCD camera, back-illuminated',
    notes:
      'High QE; the multiplication adds an excess noise factor of about √2 on the SD, 2 on the variance (from ' +
      `memory, unverified), that QE does not show. ${APPROX}`,
    qePoints: [
      [300, 0.35],
      [400, 0.6],
      [450, 0.85],
      [500, 0.93],
      [550, 0.95],
      [600, 0.95],
      [650, 0.93],
      [700, 0.88],
      [750, 0.8],
      [800, 0.65],
      [850, 0.5],
      [900, 0.3],
      [950, 0.15],
      [1000, 0.05],
      [1100, 0],
    ],
  },
  {
    id: 'si-apd',
    name: 'Silicon avalanche photodiode',
    notes: `Red and near-infrared sensitive, weak in the blue. ${APPROX}`,
    qePoints: [
      [300, 0.05],
      [400, 0.3],
      [500, 0.55],
      [600, 0.68],
      [650, 0.7],
      [700, 0.68],
      [800, 0.5],
      [900, 0.3],
      [1000, 0.1],
      [1100, 0],
    ],
  },
]);

/** The generic detector classes, for listing (id, display name, caveats). */
export function listDetectors(): { id: string; name: string; notes: string }[] {
  return DETECTOR_CLASSES.map(({ id, name, notes }) => ({ id, name, notes }));
}

/** Ids of the detector classes, in listing order. */
export const DETECTOR_IDS = DETECTOR_CLASSES.map((d) => d.id);

/**
 * Quantum efficiency (0–1) of a detector class on a grid, linear between the class's points and 0 beyond them.
 * An unknown id throws SpectraError `unknown_detector`.
 */
export function detectorQe(id: string, grid: WavelengthGrid): number[] {
  const detector = DETECTOR_CLASSES.find((d) => d.id === id);
  if (!detector) {
    throw new SpectraError(
      'unknown_detector',
      `unknown detector ${JSON.stringify(id)}; known: ${DETECTOR_IDS.join(', ')}`,
      ['detector'],
    );
  }
  return sampleTable(detector.qePoints, grid);
}
