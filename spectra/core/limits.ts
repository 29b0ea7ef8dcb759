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
  /**
   * Work units one design request on the API may plan (spectra/design/cost.ts counts them): about 0.7–0.9 s at the
   * 1.2–1.5 ns a unit measured in Node 20 on the development machine (docs/api.md, "Work per request"), leaving room
   * under the 2 s the API allows a request for the work the units do not count (our convention).
   */
  designWorkUnits: 600_000_000,
  /**
   * Bytes of working arrays one design request on the API may allocate: 64 MiB, half the memory of one Workers
   * isolate (128 MB: from the platform documentation, as remembered; verify), our convention.
   */
  designBytes: 64 * 2 ** 20,
  /**
   * Replicate rows of one probe's single-stain control: three to five replicates are usual, eight leaves room (our
   * convention).
   */
  controlReplicates: 8,
  /** Control rows in one set of controls: every probe of a full panel with its full replicates (16 × 8). */
  controlRows: 16 * 8,
  /** Work units between two pauses of a running design: about 12–15 ms at the measured rate (our convention). */
  designChunkUnits: 10_000_000,
  /**
   * Bytes a pilot image may occupy in the page while it is unmixed, counted before it is decoded as pixels ×
   * pages × 4 bytes (one 32-bit float per value) × 4 (the decoded planes, the abundance maps, the residual and the
   * drawn maps): 1 GiB, our convention for a browser tab, not a measured limit. A file itself may be at most a
   * quarter of it (an uncompressed 32-bit image of that size). One page per channel or lambda bin.
   */
  imageBytes: 2 ** 30,
  /** Pages (channels or lambda bins) one pilot image may hold: twice the panel's channel limit, our convention. */
  imagePages: 128,
});
