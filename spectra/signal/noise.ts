/**
 * Unmixing noise of a design, analytic. Measured channel counts y = M a + b + noise, with M[c][p] the detected
 * photons in channel c from probe p at abundance 1 and b the mean background photons; unmixed by least squares
 * after subtracting the known background, â = M⁺ (y − b). Each channel's variance is
 *   v_c = F_c · (M a + b)_c + σ_read,c²
 * (Poisson shot noise, scaled by the excess noise factor F of a multiplying detector, plus Gaussian read noise),
 * channels independent, so Cov(â) = M⁺ diag(v) M⁺ᵀ (docs/science.md, unmixing noise: M⁺ diag(M a) M⁺ᵀ for pure
 * Poisson).
 *
 * F here multiplies the variance (in the notation where F is an SD factor it is F²): about 2 for an electron-
 * multiplying CCD at high gain (Robbins & Hadwen, IEEE Trans. Electron Devices 2003, 50, 1227), about 1.1–1.5 for
 * photomultiplier tubes; both from memory, unverified here.
 */
import { SpectraError } from '../core/errors';
import { pseudoInverse } from './linalg/pinv';
import { singularValues } from './linalg/svd';
import { checkMatrix } from './linalg/matrix';
import { spreadingMatrix } from './spreading';

/** A design's photon budget and detector noise. */
export interface NoiseInput {
  /** mixingPhotons[c][p]: expected detected photons in channel c from probe p at abundance 1. */
  mixingPhotons: number[][];
  /** Abundance of each probe's target (the unit of the unmixed estimates). */
  abundance: number[];
  /** Mean background photons per channel (autofluorescence, stray light, dark counts); default 0. */
  backgroundPhotons?: number[];
  /** Read noise per channel as an SD in photon-equivalent electrons (one number: every channel); default 0. */
  readNoiseElectrons?: number | number[];
  /** Excess noise factor on the variance, ≥ 1 (one number: every channel); default 1 (an ideal counting detector). */
  excessNoiseFactor?: number | number[];
  /** Primary channel of each probe for the spreading normalisation (default: where its column is largest). */
  primaryChannel?: number[];
}

/** Predicted noise of the least-squares unmixed abundances (null entries: not defined, see warnings). */
export interface NoisePrediction {
  /** Cov(â)[i][j], in abundance units squared. */
  covariance: (number | null)[][];
  /** SD of each unmixed abundance. */
  sd: (number | null)[];
  /** abundance / SD, per probe. */
  signalToNoise: (number | null)[];
  /** Spillover spreading, see spreadingMatrix: [i][j] = extra SD of i per √photon of j, both in primary-channel
   * photons. */
  spreading: (number | null)[][];
  primaryChannel: number[];
  /** Per-channel variance v_c used (photons²). */
  channelVariance: number[];
  warnings: string[];
}

/** The checked input in flat form, shared with the Monte Carlo. */
export interface NoiseModel {
  m: number[][];
  pinv: number[][] | null;
  abundance: number[];
  background: number[];
  readSd: number[];
  excess: number[];
  primary: number[];
  warnings: string[];
}

function perChannel(
  value: number | number[] | undefined,
  fallback: number,
  rows: number,
  name: string,
  min: number,
): number[] {
  const list =
    value === undefined
      ? new Array(rows).fill(fallback)
      : typeof value === 'number'
        ? new Array(rows).fill(value)
        : value;
  if (!Array.isArray(list) || list.length !== rows)
    throw new SpectraError('invalid_input', `${name} must be a number or one number per channel (${rows})`, [name]);
  list.forEach((x, i) => {
    if (typeof x !== 'number' || !Number.isFinite(x) || x < min)
      throw new SpectraError(
        'invalid_input',
        `${name} must be finite and ≥ ${min}, got ${String(x)}`,
        typeof value === 'number' ? [name] : [name, i],
      );
  });
  return list;
}

/** Checks a noise input and computes the pseudo-inverse once; throws `invalid_input` naming the field. */
export function noiseModel(input: NoiseInput): NoiseModel {
  const { rows, cols } = checkMatrix(input.mixingPhotons, 'mixingPhotons');
  const m = input.mixingPhotons;
  m.forEach((row, c) =>
    row.forEach((x, p) => {
      if (x < 0) throw new SpectraError('invalid_input', 'mixingPhotons must be ≥ 0', ['mixingPhotons', c, p]);
    }),
  );
  const abundance = input.abundance;
  if (!Array.isArray(abundance) || abundance.length !== cols)
    throw new SpectraError('invalid_input', `abundance must list ${cols} numbers (one per probe)`, ['abundance']);
  abundance.forEach((a, p) => {
    if (typeof a !== 'number' || !Number.isFinite(a) || a < 0)
      throw new SpectraError('invalid_input', 'abundance must be finite and ≥ 0', ['abundance', p]);
  });
  const background = perChannel(input.backgroundPhotons, 0, rows, 'backgroundPhotons', 0);
  const readSd = perChannel(input.readNoiseElectrons, 0, rows, 'readNoiseElectrons', 0);
  const excess = perChannel(input.excessNoiseFactor, 1, rows, 'excessNoiseFactor', 1);
  const primary =
    input.primaryChannel ?? m[0].map((_, p) => m.reduce((best, row, c) => (row[p] > m[best][p] ? c : best), 0));
  if (primary.length !== cols || primary.some((c) => !Number.isInteger(c) || c < 0 || c >= rows)) {
    throw new SpectraError('invalid_input', `primaryChannel must list ${cols} channel indices below ${rows}`, [
      'primaryChannel',
    ]);
  }
  const warnings: string[] = [];
  let pinv: number[][] | null = null;
  const s = cols <= rows ? singularValues(m) : [];
  if (cols > rows) warnings.push(`${cols} probes but only ${rows} channels: least-squares unmixing is not defined`);
  else if (!(s[cols - 1] > Math.max(rows, cols) * Number.EPSILON * s[0]))
    warnings.push("the probes' channel signatures are linearly dependent: unmixing noise is unbounded");
  else pinv = pseudoInverse(m);
  return { m, pinv, abundance, background, readSd, excess, primary, warnings };
}

/**
 * Analytic covariance of least-squares unmixed abundances under shot, background, read and excess noise.
 * @example predictUnmixingNoise({ mixingPhotons: [[1000, 50], [30, 800]], abundance: [1, 0.1] }).sd
 */
export function predictUnmixingNoise(input: NoiseInput): NoisePrediction {
  const model = noiseModel(input);
  const { m, pinv, abundance, background, readSd, excess, primary } = model;
  const rows = m.length;
  const cols = m[0].length;
  const variance = m.map(
    (row, c) => excess[c] * (row.reduce((sum, x, p) => sum + x * abundance[p], 0) + background[c]) + readSd[c] ** 2,
  );
  if (!pinv) {
    const nulls = () => new Array<null>(cols).fill(null);
    return {
      covariance: m[0].map(nulls),
      sd: nulls(),
      signalToNoise: nulls(),
      spreading: m[0].map(nulls),
      primaryChannel: primary,
      channelVariance: variance,
      warnings: model.warnings,
    };
  }
  const covariance = pinv.map((ri) => pinv.map((rj) => ri.reduce((sum, x, c) => sum + x * variance[c] * rj[c], 0)));
  const sd = covariance.map((row, i) => Math.sqrt(Math.max(0, row[i])));
  const warnings = [...model.warnings];
  const signalToNoise = sd.map((s, p) => (s > 0 ? abundance[p] / s : null));
  if (signalToNoise.some((x) => x === null))
    warnings.push(
      'a probe has zero predicted noise (no photons, no read noise): its signal-to-noise ratio is undefined',
    );
  if (rows === 0) warnings.push('no channels');
  return {
    covariance,
    sd,
    signalToNoise,
    spreading: spreadingMatrix(m, pinv, excess, primary),
    primaryChannel: primary,
    channelVariance: variance,
    warnings,
  };
}

/**
 * Turns a collected matrix (relative units, abundance 1) into photons: each probe's column is scaled so that its
 * primary channel holds `photonsPrimary[p]` detected photons at abundance 1.
 */
export function photonMixing(collected: number[][], primaryChannel: number[], photonsPrimary: number[]): number[][] {
  checkMatrix(collected, 'collected');
  const scale = primaryChannel.map((c, p) => {
    const x = collected[c]?.[p];
    const n = photonsPrimary[p];
    if (typeof n !== 'number' || !Number.isFinite(n) || n < 0)
      throw new SpectraError('invalid_input', 'photons must be finite and ≥ 0', ['photons', p]);
    if (!(typeof x === 'number' && x > 0))
      throw new SpectraError('invalid_input', `probe ${p + 1} collects no light in its primary channel`, [
        'primaryChannel',
        p,
      ]);
    return n / x;
  });
  return collected.map((row) => row.map((x, p) => x * scale[p]));
}
