/**
 * Measured single-stain controls as plain data: the same shape as the API body, the page's CSV import and the image's
 * region measurements. Every values array is in the order of `channels`.
 */

/** One control row: a probe stained alone, its mean per channel (and optionally its spread). */
export interface ControlRow {
  /** The panel probe's id. */
  probe: string;
  /** Mean signal per channel, in the order of `channels`. */
  values: number[];
  /** Standard deviation per channel of the `n` readings behind each mean. */
  sd?: number[];
  /** Readings (pixels, events, fields) behind each mean. */
  n?: number;
}

/** Single-stain controls and an unstained sample, measured in the same channels. */
export interface ControlsMeasurement {
  /** Panel channel ids, in the order of every values array. */
  channels: string[];
  /** The unstained sample's mean per channel. */
  unstained: number[];
  /** Standard deviation per channel of the unstained readings (with `unstainedN`). */
  unstainedSd?: number[];
  /** Readings behind each unstained mean. */
  unstainedN?: number;
  /** One row per control; several rows for one probe are replicates. */
  controls: ControlRow[];
}

/** The measured spillover of a set of controls. */
export interface MeasuredSpillover {
  channels: string[];
  /** The probes that have a control, in panel order (or first appearance without a panel). */
  probes: string[];
  /** Unstained-subtracted mean signal [c][p]. */
  signal: number[][];
  /** spillover[c][p] = signal[c][p] / signal[primary(p)][p]. */
  spillover: number[][];
  /** Standard error of spillover[c][p]; null where no spread is known (and 0 on the primary channel). */
  se: (number | null)[][];
  /** Index into `channels` of each probe's primary channel. */
  primaryChannel: number[];
  /** Control rows behind each probe (replicates). */
  replicates: number[];
  warnings: string[];
}
