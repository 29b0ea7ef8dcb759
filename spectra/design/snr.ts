/**
 * The design objective on one photon scale: each target's predicted signal-to-noise after unmixing, computed as the
 * design's noise figures compute it (design-noise.ts over signal/noise.ts), but straight from the search's candidate
 * matrix so that a search can score many designs.
 *
 * For a design where target t takes probe p_t read in channel c_t, with L[c][p] the collected light at abundance 1
 * and a_t the abundances:
 *  - photon scale: with one number P for options.photons, every probe shares k = P / max_t a_t·L[c_t][p_t] (the
 *    brightest target's own signal is P photons: one exposure, set by the brightest channel); with one number per
 *    target, target t's own channel holds photons[t] at abundance 1 (k_t = photons[t] / L[c_t][p_t]);
 *  - mixing photons M[i][j] = k_j·L[c_i][p_j] (channel of target i, probe of target j), background photons of channel
 *    i: b_i + k_i·S[c_i] with S the sample's light collected there (excitation leak, water Raman);
 *  - channel variance v_i = F·(Σ_j M[i][j]·a_j + background_i) + r²; Cov(â) = M⁻¹ diag(v) M⁻ᵀ;
 *  - S/N_t = a_t / √Cov[t][t]; the objective is the worst (smallest) S/N, ties broken by the total spillover spreading
 *    Σ_{i≠j} SS[i][j] (Nguyen et al., Cytometry A 2013; signal/spreading.ts).
 */

/** The noise settings of a design (ResolvedDesignOptions' noise fields). */
export interface SnrSettings {
  /** One number: the brightest target's own photons (shared scale); one per target: each at abundance 1. */
  photons: number | readonly number[];
  /** Mean background photons of each target's channel (one number: every channel). */
  backgroundPhotons: number | readonly number[];
  readNoiseElectrons: number;
  excessNoiseFactor: number;
}

/** What scoring needs of a candidate problem. */
export interface SnrProblem {
  probes: number;
  channels: number;
  /** L[c][p] at index c · probes + p (collected light at abundance 1). */
  light: ArrayLike<number>;
  /** The sample's light collected in each candidate channel (leak and water Raman), collected units. */
  sample: ArrayLike<number>;
  abundance: ArrayLike<number>;
  settings: SnrSettings;
}

/** The score of a complete design: its worst S/N (0 when it cannot be unmixed), which target, and the spreading. */
export interface SnrScore {
  worst: number;
  weakest: number;
  spreading: number;
  signalToNoise: number[];
}

/** Relative tolerance within which two worst S/N values tie (and the spreading decides). */
export const SCORE_TIE = 1e-9;

/** True when score a is better than b: a higher worst S/N, or a tie and less spreading. */
export function betterScore(a: SnrScore, b: SnrScore | null): boolean {
  if (b === null) return true;
  const scale = Math.max(Math.abs(a.worst), Math.abs(b.worst));
  if (Math.abs(a.worst - b.worst) > SCORE_TIE * scale) return a.worst > b.worst;
  return a.spreading < b.spreading;
}

const itemOf = (value: number | readonly number[], i: number) => (typeof value === 'number' ? value : value[i]);

/** The inverse of a square matrix (row-major, n × n) by Gauss–Jordan elimination with partial pivoting; null when
 * singular to working precision. */
export function invertSquare(a: Float64Array, n: number): Float64Array | null {
  const m = Float64Array.from(a);
  const inv = new Float64Array(n * n);
  for (let i = 0; i < n; i++) inv[i * n + i] = 1;
  let largest = 0;
  for (const x of m) largest = Math.max(largest, Math.abs(x));
  const tiny = largest * n * Number.EPSILON;
  for (let col = 0; col < n; col++) {
    let pivot = col;
    for (let r = col + 1; r < n; r++) if (Math.abs(m[r * n + col]) > Math.abs(m[pivot * n + col])) pivot = r;
    const p = m[pivot * n + col];
    if (!(Math.abs(p) > tiny)) return null;
    if (pivot !== col) {
      for (let k = 0; k < n; k++) {
        [m[col * n + k], m[pivot * n + k]] = [m[pivot * n + k], m[col * n + k]];
        [inv[col * n + k], inv[pivot * n + k]] = [inv[pivot * n + k], inv[col * n + k]];
      }
    }
    for (let k = 0; k < n; k++) {
      m[col * n + k] /= p;
      inv[col * n + k] /= p;
    }
    for (let r = 0; r < n; r++) {
      const f = m[r * n + col];
      if (r === col || f === 0) continue;
      for (let k = 0; k < n; k++) {
        m[r * n + k] -= f * m[col * n + k];
        inv[r * n + k] -= f * inv[col * n + k];
      }
    }
  }
  return inv;
}

/** Photons per unit of collected light of each target's probe (the scale k_t above); 0 when it has no own light. */
export function photonScales(problem: SnrProblem, probeOf: ArrayLike<number>, channelOf: ArrayLike<number>): number[] {
  const { light, probes, abundance, settings } = problem;
  const n = probeOf.length;
  const own = Array.from({ length: n }, (_, t) => light[channelOf[t] * probes + probeOf[t]]);
  if (typeof settings.photons === 'number') {
    const top = Math.max(...own.map((x, t) => x * abundance[t]));
    const k = top > 0 ? settings.photons / top : 0;
    return own.map(() => k);
  }
  return own.map((x, t) => (x > 0 ? (settings.photons as readonly number[])[t] / x : 0));
}

/** The score of a complete design (target t: probe probeOf[t] in channel channelOf[t]). */
export function scoreDesign(problem: SnrProblem, probeOf: ArrayLike<number>, channelOf: ArrayLike<number>): SnrScore {
  const { light, probes, abundance, sample, settings } = problem;
  const n = probeOf.length;
  const k = photonScales(problem, probeOf, channelOf);
  const m = new Float64Array(n * n);
  for (let i = 0; i < n; i++)
    for (let j = 0; j < n; j++) m[i * n + j] = k[j] * light[channelOf[i] * probes + probeOf[j]];
  const unusable: SnrScore = { worst: 0, weakest: 0, spreading: Infinity, signalToNoise: new Array(n).fill(0) };
  const inv = invertSquare(m, n);
  if (!inv) return unusable;
  const F = settings.excessNoiseFactor;
  const variance = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    let photons = itemOf(settings.backgroundPhotons, i) + k[i] * sample[channelOf[i]];
    for (let j = 0; j < n; j++) photons += m[i * n + j] * abundance[j];
    variance[i] = F * photons + settings.readNoiseElectrons ** 2;
  }
  const signalToNoise: number[] = [];
  let worst = Infinity;
  let weakest = 0;
  let spreading = 0;
  for (let t = 0; t < n; t++) {
    let v = 0;
    for (let c = 0; c < n; c++) v += inv[t * n + c] ** 2 * variance[c];
    const snr = v > 0 ? abundance[t] / Math.sqrt(v) : 0;
    signalToNoise.push(snr);
    if (snr < worst) {
      worst = snr;
      weakest = t;
    }
    for (let j = 0; j < n; j++) {
      if (j === t || !(m[j * n + j] > 0)) continue;
      let sum = 0;
      for (let c = 0; c < n; c++) sum += inv[t * n + c] ** 2 * F * m[c * n + j];
      spreading += m[t * n + t] * Math.sqrt(sum / m[j * n + j]);
    }
  }
  if (!Number.isFinite(worst)) return unusable;
  return { worst, weakest, spreading, signalToNoise };
}
