/**
 * The limits of the API's input, in one place: the sizes from the spectral library (how much work one request may
 * cause), the HTTP layer's own, and the ranges every number must lie in. Ranges are physical plausibility bounds
 * (common practice for fluorescence microscopy: UV to short-wave infrared light, colloidal dots from clusters to large
 * shells), not validity ranges of any model: a model with a narrower range answers `out_of_range` itself.
 */
import { LIMITS as SIZE_LIMITS, MAX_BLOCKING_OD } from '../../spectra/index';

/** Sizes: the spectral library's (probes, channels, lines, filters per channel, table and grid points, node budget)
 * plus the HTTP layer's (id and text lengths, request body). */
export const LIMITS = Object.freeze({
  ...SIZE_LIMITS,
  /** Characters of a probe or channel id. */
  idLength: 64,
  /** Characters of a title, label or target name. */
  textLength: 200,
  /** Characters of an instrument profile's description. */
  descriptionLength: 1000,
  /** Named filters of one instrument profile (emission filters; dichroics and clean-up filters count per list). */
  instrumentFilters: 48,
  /** Bytes of a request body (256 KiB). */
  bodyBytes: 256 * 1024,
});

/** [min, max] of each kind of number the API takes. */
export const RANGES = Object.freeze({
  wavelengthNm: [200, 2000],
  diameterNm: [0.5, 30],
  /** One shell layer and all layers together, nm (each material also has its own cap: SHELL_MATERIALS). */
  shellThicknessNm: [0, 20],
  sizeDispersionPct: [0, 30],
  fwhmNm: [1, 500],
  filterWidthNm: [0.1, 1000],
  edgeWidthNm: [0, 200],
  blockingOD: [0, MAX_BLOCKING_OD],
  powerRel: [0, 1e6],
  /** A laser's power at the sample, mW (microscope lines run from well under 1 mW to a few W: common practice). */
  laserPowerMw: [0, 1e4],
  abundance: [0, 1e6],
  backgroundLevel: [0, 1e6],
  /** Water Raman `level` (1: the background's reference brightness under a 405 nm line). */
  waterRamanLevel: [0, 1e6],
  /** Scattered excitation light reaching the detector unfiltered, in the units of `collected`. */
  scatterLevel: [0, 1e15],
  /** Largest value of a measured emission or background table. */
  spectralValue: [0, 1e15],
  /**
   * A measured mean signal of a control or the unstained sample, in the instrument's units (counts, grey levels);
   * negative allowed for data already offset-corrected.
   */
  measuredSignal: [-1e15, 1e15],
  /** A measured standard deviation, same units. */
  measuredSd: [0, 1e15],
  /** Readings (pixels, events) behind one measured mean. */
  readings: [1, 1e12],
  /** Largest molar extinction of a measured table, M⁻¹ cm⁻¹. */
  extinction: [0, 1e9],
} as const);

/** A share id (of a stored panel or instrument): exactly 24 base64url characters (worker/share-id.ts makes them). */
export const SHARE_ID_PATTERN = /^[A-Za-z0-9_-]{24}$/;
