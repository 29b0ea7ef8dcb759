/**
 * Settings of a design search and of the noise figures reported with it, with their documented defaults.
 */
import { FILTER_DEFAULTS } from '../light/filters/defaults';
import { DEFAULT_MIN_SIGNAL_FRACTION } from './objective';
import { DEFAULT_NODE_BUDGET } from './search';
import { PRACTICE_DEFAULTS } from './practice';

/** Options of POST /api/v1/panels/design (every field optional). */
export interface DesignOptions {
  /** Most search nodes before the best found is returned with exact: false (default DEFAULT_NODE_BUDGET; free mode
   * DEFAULT_FREE_NODE_BUDGET, or DEFAULT_FREE_NODE_BUDGET_LARGE above 8 targets). */
  nodeBudget?: number;
  /**
   * Signal floor as a fraction of the brightest target's own signal (free mode default 0.05; catalog: off unless set).
   */
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
  /**
   * Detected photons for the noise figures. One number (default 1000): the brightest target's own signal at its
   * abundance, one photon scale for every probe. One per target: each target's own channel at abundance 1.
   */
  photons?: number | number[];
  /** Mean background photons per channel (one number: every channel). Default 0. */
  backgroundPhotons?: number | number[];
  /** Detector read noise SD, photon-equivalent electrons. Default 0. */
  readNoiseElectrons?: number;
  /** Excess noise factor on the variance (≈ 2 EMCCD at high gain, 1.1–1.5 photomultipliers; from memory). Default 1. */
  excessNoiseFactor?: number;
  /** Least OD every channel must block each line it is read under by (default 6, common practice; 0: no check). */
  minBlockingOD?: number;
  /** Least share of a probe's emitted photons its channel must pass (default 0.3; 0: only the peak check). */
  minChannelShare?: number;
  /** Least distance of a probe's emission peak from every line, nm (default 15; 0: no check). */
  lineClearanceNm?: number;
  /** Least signal-to-noise after unmixing of every target for a usable verdict (default 5, the Rose criterion). */
  minSignalToNoise?: number;
  /** Largest worst interference for a usable verdict (default 1: no probe's light above a target's own). */
  maxInterference?: number;
}

/** Options with every default filled in. */
export type ResolvedDesignOptions = Required<Omit<DesignOptions, 'minSignalFraction'>> & { minSignalFraction: number };

/**
 * Default node budget of free mode. Its grid catalog is large (about 140 dots × 110 bands for a 400 nm window), so
 * one node costs far more than in catalog mode; 5,000 nodes keep a 6- or 8-plex near a second in Node, and panels of
 * more than 8 targets get 20,000, which a 12-plex under 405 nm needs to find a design within the interference ceiling
 * (bench/suites/design.ts).
 */
export const DEFAULT_FREE_NODE_BUDGET = 5_000;

/** Free mode's default node budget for panels of more than 8 targets (see DEFAULT_FREE_NODE_BUDGET). */
export const DEFAULT_FREE_NODE_BUDGET_LARGE = 20_000;

/**
 * The defaults of the search and noise options other than the node budget and the signal floor (which depend on the
 * mode). Our choices: passbands every 10 nm at 20, 30 and 40 nm FWHM within 20–60 nm (common stock widths of emission
 * filters, common practice), 1,000 photons in each target's own channel, an ideal counting detector.
 */
export const DESIGN_DEFAULTS = Object.freeze({
  lineClearance: false,
  peakStepNm: 10,
  bandStepNm: 10,
  bandwidthsNm: Object.freeze([20, 30, 40]),
  bandwidthRangeNm: Object.freeze([20, 60] as const),
  edgeWidthNm: FILTER_DEFAULTS.bandpass.edgeWidthNm,
  refine: true,
  photons: 1000,
  backgroundPhotons: 0,
  readNoiseElectrons: 0,
  excessNoiseFactor: 1,
});

/**
 * Fills in the defaults; `free` selects the free-mode node budget (by the number of `targets`) and signal floor. The
 * API's schema checks ranges.
 */
export function resolveOptions(options: DesignOptions = {}, free: boolean, targets = 0): ResolvedDesignOptions {
  const freeBudget = targets > 8 ? DEFAULT_FREE_NODE_BUDGET_LARGE : DEFAULT_FREE_NODE_BUDGET;
  const d = DESIGN_DEFAULTS;
  return {
    nodeBudget: options.nodeBudget ?? (free ? freeBudget : DEFAULT_NODE_BUDGET),
    minSignalFraction: options.minSignalFraction ?? (free ? DEFAULT_MIN_SIGNAL_FRACTION : 0),
    lineClearance: options.lineClearance ?? d.lineClearance,
    peakStepNm: options.peakStepNm ?? d.peakStepNm,
    bandStepNm: options.bandStepNm ?? d.bandStepNm,
    bandwidthsNm: options.bandwidthsNm ?? [...d.bandwidthsNm],
    bandwidthRangeNm: options.bandwidthRangeNm ?? [d.bandwidthRangeNm[0], d.bandwidthRangeNm[1]],
    edgeWidthNm: options.edgeWidthNm ?? d.edgeWidthNm,
    refine: options.refine ?? d.refine,
    photons: options.photons ?? d.photons,
    backgroundPhotons: options.backgroundPhotons ?? d.backgroundPhotons,
    readNoiseElectrons: options.readNoiseElectrons ?? d.readNoiseElectrons,
    excessNoiseFactor: options.excessNoiseFactor ?? d.excessNoiseFactor,
    minBlockingOD: options.minBlockingOD ?? PRACTICE_DEFAULTS.minBlockingOD,
    minChannelShare: options.minChannelShare ?? PRACTICE_DEFAULTS.minChannelShare,
    lineClearanceNm: options.lineClearanceNm ?? PRACTICE_DEFAULTS.lineClearanceNm,
    minSignalToNoise: options.minSignalToNoise ?? PRACTICE_DEFAULTS.minSignalToNoise,
    maxInterference: options.maxInterference ?? PRACTICE_DEFAULTS.maxInterference,
  };
}
