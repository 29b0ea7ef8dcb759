/**
 * Settings of a design search and of the noise figures reported with it, with their documented defaults.
 */
import { SpectraError } from '../errors';
import { FILTER_DEFAULTS } from '../filters/defaults';
import { DEFAULT_MIN_SIGNAL_FRACTION } from './objective';
import { DEFAULT_NODE_BUDGET } from './search';

/** Options of POST /api/v1/panels/design (every field optional). */
export interface DesignOptions {
  /** Most search nodes before the best found is returned with exact: false (default DEFAULT_NODE_BUDGET; free mode DEFAULT_FREE_NODE_BUDGET). */
  nodeBudget?: number;
  /** Signal floor as a fraction of the brightest target's own signal (free mode default 0.05; catalog: off unless set). */
  minSignalFraction?: number;
  /** Catalog mode: drop channels that pass an excitation line (free mode always does). Default false. */
  lineClearance?: boolean;
  /** Free mode grid: emission peaks every this many nm (default 10). */
  peakStepNm?: number;
  /** Free mode grid: passband centres every this many nm (default 10). */
  bandStepNm?: number;
  /** Free mode grid: passband widths (FWHM) tried by the exact search, nm (default [20, 30, 40]). */
  bandwidthsNm?: number[];
  /** Manufacturable passband widths, nm, for the grid and the refinement (default [20, 60]). */
  bandwidthRangeNm?: [number, number];
  /** 10–90 % edge width of proposed bandpass filters, nm; also the clearance kept around each line (default 2). */
  edgeWidthNm?: number;
  /** Free mode: refine the grid optimum on a 1 nm grid (default true). */
  refine?: boolean;
  /** Detected photons in each target's primary channel at abundance 1 (one number: every target). Default 1000. */
  photons?: number | number[];
  /** Mean background photons per channel (one number: every channel). Default 0. */
  backgroundPhotons?: number | number[];
  /** Detector read noise SD, photon-equivalent electrons. Default 0. */
  readNoiseElectrons?: number;
  /** Excess noise factor on the variance (≈ 2 EMCCD at high gain, 1.1–1.5 photomultipliers; from memory). Default 1. */
  excessNoiseFactor?: number;
}

/** Options with every default filled in. */
export type ResolvedDesignOptions = Required<Omit<DesignOptions, 'minSignalFraction'>> & { minSignalFraction: number };

/**
 * Default node budget of free mode. Its grid catalog is large (about 140 dots × 110 bands for a 400 nm window), so
 * one node costs far more than in catalog mode; 5,000 nodes keep a 6-plex near a second in Node (bench/suites/design.ts).
 */
export const DEFAULT_FREE_NODE_BUDGET = 5_000;

/** Largest node budget a request may ask for (keeps one request's CPU bounded). */
export const MAX_NODE_BUDGET = 5_000_000;

function check(ok: boolean, field: string, message: string): void {
  if (!ok) throw new SpectraError('invalid_input', `options.${field} ${message}`, ['options', field]);
}

/** Fills defaults and checks ranges; `free` selects the free-mode default of the signal floor. */
export function resolveOptions(options: DesignOptions = {}, free: boolean): ResolvedDesignOptions {
  const o: ResolvedDesignOptions = {
    nodeBudget: options.nodeBudget ?? (free ? DEFAULT_FREE_NODE_BUDGET : DEFAULT_NODE_BUDGET),
    minSignalFraction: options.minSignalFraction ?? (free ? DEFAULT_MIN_SIGNAL_FRACTION : 0),
    lineClearance: options.lineClearance ?? false,
    peakStepNm: options.peakStepNm ?? 10,
    bandStepNm: options.bandStepNm ?? 10,
    bandwidthsNm: options.bandwidthsNm ?? [20, 30, 40],
    bandwidthRangeNm: options.bandwidthRangeNm ?? [20, 60],
    edgeWidthNm: options.edgeWidthNm ?? FILTER_DEFAULTS.bandpass.edgeWidthNm,
    refine: options.refine ?? true,
    photons: options.photons ?? 1000,
    backgroundPhotons: options.backgroundPhotons ?? 0,
    readNoiseElectrons: options.readNoiseElectrons ?? 0,
    excessNoiseFactor: options.excessNoiseFactor ?? 1,
  };
  check(
    Number.isInteger(o.nodeBudget) && o.nodeBudget >= 1 && o.nodeBudget <= MAX_NODE_BUDGET,
    'nodeBudget',
    `must be an integer from 1 to ${MAX_NODE_BUDGET}`,
  );
  check(o.minSignalFraction >= 0 && o.minSignalFraction <= 1, 'minSignalFraction', 'must lie between 0 and 1');
  check(
    Number.isInteger(o.peakStepNm) && o.peakStepNm >= 1 && o.peakStepNm <= 50,
    'peakStepNm',
    'must be an integer from 1 to 50 nm',
  );
  check(
    Number.isInteger(o.bandStepNm) && o.bandStepNm >= 1 && o.bandStepNm <= 50,
    'bandStepNm',
    'must be an integer from 1 to 50 nm',
  );
  const [wMin, wMax] = o.bandwidthRangeNm;
  check(
    Number.isInteger(wMin) && Number.isInteger(wMax) && wMin >= 5 && wMin <= wMax && wMax <= 200,
    'bandwidthRangeNm',
    'must be [min, max] whole nm with 5 ≤ min ≤ max ≤ 200',
  );
  check(
    o.bandwidthsNm.length >= 1 &&
      o.bandwidthsNm.length <= 8 &&
      o.bandwidthsNm.every((w) => Number.isInteger(w) && w >= wMin && w <= wMax),
    'bandwidthsNm',
    `must list 1–8 whole widths inside bandwidthRangeNm (${wMin}–${wMax} nm)`,
  );
  check(o.edgeWidthNm >= 0 && o.edgeWidthNm <= 20, 'edgeWidthNm', 'must lie between 0 and 20 nm');
  check(
    o.readNoiseElectrons >= 0 && Number.isFinite(o.readNoiseElectrons),
    'readNoiseElectrons',
    'must be finite and ≥ 0',
  );
  check(o.excessNoiseFactor >= 1 && o.excessNoiseFactor <= 10, 'excessNoiseFactor', 'must lie between 1 and 10');
  return o;
}
