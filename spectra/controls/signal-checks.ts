/**
 * The checks of a control's unstained-subtracted signal: a dark primary channel is refused, and a negative signal is
 * kept as noise (with a warning) when within 2 SE of zero or within a small tolerance of the primary signal, refused
 * beyond both.
 */
import { SpectraError } from '../core/errors';
import type { PanelSpec } from '../core/panel';
import { channelName, probeName } from './checks';

/**
 * A primary channel whose subtracted signal is under this fraction of the control's brightest channel is called dark:
 * the control is most likely in the wrong channel or the assignment is wrong (our convention).
 */
export const DARK_PRIMARY_FRACTION = 0.1;

/**
 * A negative subtracted signal down to this fraction of the control's primary signal is taken as noise around zero
 * and kept with a warning, whatever its standard error (our convention: half a percent, five times the model's
 * resolution of 1e-3). Without it a 2 SE rule alone refuses good controls: over a panel's many near-zero entries some
 * fall past 2 SE by chance, and an SE from three replicates is itself uncertain (Student's t with 2 degrees of freedom
 * puts about 18 % of estimates past 2 SE; common practice).
 */
export const NEGATIVE_TOLERANCE = 0.005;

/** With a known error, a negative subtracted signal within this many standard errors of zero is kept with a warning. */
export const NEGATIVE_SE_LIMIT = 2;

/** Where a control is: its probe, its first row, the panel and the channels, for the messages. */
export interface At {
  probe: string;
  first: number;
  panel: PanelSpec | undefined;
  channels: string[];
}

/** Throws when the primary channel is at or under the unstained level or dark beside the brightest channel. */
export function checkPrimary(signal: number[], primary: number, at: At): void {
  const d = signal[primary];
  const brightest = Math.max(...signal);
  const where = `channel ${channelName(at.channels[primary], at.panel)}`;
  const name = probeName(at.probe, at.panel);
  if (d <= 0) {
    throw new SpectraError(
      'invalid_input',
      `the control of ${name} is no brighter than the unstained sample in its primary ${where}: ` +
        `check that the right sample and channel were measured`,
      ['controls', at.first, 'values', primary],
    );
  }
  if (d < DARK_PRIMARY_FRACTION * brightest) {
    throw new SpectraError(
      'invalid_input',
      `the control of ${name} is dark in its primary ${where}: under ${DARK_PRIMARY_FRACTION * 100} % of its ` +
        `brightest channel; check the probe's channel assignment or the sample`,
      ['controls', at.first, 'values', primary],
    );
  }
}

/** Warns for a negative signal within the noise; throws for one beyond it. */
export function checkNegatives(
  signal: number[],
  se: (number | null)[],
  primary: number,
  at: At,
  warnings: string[],
): void {
  signal.forEach((n, c) => {
    if (n >= 0) return;
    const s = se[c];
    const tolerance = NEGATIVE_TOLERANCE * signal[primary];
    const what = `the control of ${probeName(at.probe, at.panel)} in channel ${channelName(at.channels[c], at.panel)}`;
    const pct = `${NEGATIVE_TOLERANCE * 100} % of its primary signal`;
    if (s !== null && -n <= NEGATIVE_SE_LIMIT * s) {
      warnings.push(
        `${what} is below the unstained sample by ${fmt(-n)}, within ${NEGATIVE_SE_LIMIT} SE: kept as noise`,
      );
      return;
    }
    if (-n <= tolerance) {
      warnings.push(`${what} is below the unstained sample by ${fmt(-n)}, within ${pct}: kept as noise`);
      return;
    }
    const limit = s === null ? pct : `${NEGATIVE_SE_LIMIT} SE or ${pct}`;
    throw new SpectraError(
      'invalid_input',
      `${what} is below the unstained sample by ${fmt(-n)}, more than ${limit} explains: ` +
        `check that the unstained sample was imaged with the same settings`,
      ['controls', at.first, 'values', c],
    );
  });
}

const fmt = (v: number) => Number(v.toPrecision(3)).toString();
