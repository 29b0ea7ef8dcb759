/**
 * Every size limit of the product, said once: the API's schemas, the page and the design engine import them from
 * here. They guard the work one request may cause; none is a physical limit.
 */
export const LIMITS = Object.freeze({
  /** Probes in one panel, and targets in one design (each target gets one probe). */
  probes: 16,
  /** Detection channels in one panel (a spectral detector run of 32 bins fits twice). */
  channels: 64,
  /** Excitation lines in one panel. */
  lines: 16,
  /** Shell layers around one core. */
  shellLayers: 4,
  /** Filters stacked in one channel. */
  filtersPerChannel: 8,
  /** Points of a measured table (filter, emission, extinction, background) in a panel. */
  tablePoints: 1000,
  /** Points of a wavelength grid a spectrum may be returned on. */
  gridPoints: 4001,
  /** Largest search node budget one design request may ask for (bounds one request's CPU). */
  nodeBudget: 5_000_000,
});
