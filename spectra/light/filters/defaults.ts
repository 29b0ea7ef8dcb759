/**
 * Default filter parameters, used wherever a panel leaves a field out. None of these has a single published source:
 * they are typical catalogue figures for hard-coated interference filters and dichroic mirrors (common practice;
 * the numbers are from memory, not from one data sheet). A measured table always replaces them.
 */

/** Defaults of one filter kind: peak transmission (0–1), 10–90 % edge width (nm), out-of-band optical density. */
export interface FilterDefaults {
  peakTransmission: number;
  edgeWidthNm: number;
  blockingOD: number;
}

/**
 * Bandpass emission filter: peak 0.93, edge 2 nm, blocking OD 6 (common practice, from memory).
 * Longpass / shortpass: peak 0.95, edge 2 nm, OD 6 (common practice, from memory).
 * Dichroic mirror used in the emission path: peak 0.95, a softer 4 nm edge and only OD 2, because a beam splitter
 * reflects most but not all of the light it turns away (common practice, from memory).
 */
export const FILTER_DEFAULTS: Readonly<Record<'bandpass' | 'edgepass' | 'dichroic', Readonly<FilterDefaults>>> =
  Object.freeze({
    bandpass: Object.freeze({ peakTransmission: 0.93, edgeWidthNm: 2, blockingOD: 6 }),
    edgepass: Object.freeze({ peakTransmission: 0.95, edgeWidthNm: 2, blockingOD: 6 }),
    dichroic: Object.freeze({ peakTransmission: 0.95, edgeWidthNm: 4, blockingOD: 2 }),
  });

/** Largest blocking optical density accepted: 10^-12 is already far below any stray light a real setup has. */
export const MAX_BLOCKING_OD = 12;
