/**
 * Seeded Monte Carlo of least-squares unmixing, to confirm the analytic covariance of noise.ts. Each draw samples
 * every channel's count, y_c = F_c · Poisson((M a + b)_c / F_c) + σ_read,c · N(0, 1), and unmixes â = M⁺ (y − b).
 * The scaled Poisson matches the first two moments of a multiplying detector (mean λ, variance F λ); the real
 * electron-multiplication output distribution is not Poisson (Basden, Haniff & Mackay, MNRAS 2003, 345, 985;
 * from memory), which does not matter for a covariance.
 */
import { SpectraError } from '../core/errors';
import { noiseModel, type NoiseInput } from './noise';
import { createRandom } from '../core/random';

/** Number of draws and seed (the same seed gives the same figures). */
export interface MonteCarloOptions {
  /** Default 20,000; at most 1,000,000. */
  draws?: number;
  /** Default 1. */
  seed?: number;
}

/** Sample mean and covariance of the unmixed abundances, and the standard error of each covariance entry. */
export interface MonteCarloResult {
  draws: number;
  seed: number;
  mean: number[] | null;
  covariance: number[][] | null;
  /**
   * Standard error of each sample covariance entry estimated from the same draws, √((m₂₂ − s²ᵢⱼ)/N) with m₂₂ the
   * mean of (xᵢ − x̄ᵢ)²(xⱼ − x̄ⱼ)²: the large-sample variance of a sample (co)variance, which holds for any
   * distribution with finite fourth moments (e.g. Kendall & Stuart, The Advanced Theory of Statistics, Vol. 1,
   * the sampling variance of moments; from memory). For normal data it reduces to σ²√(2/N) on the diagonal.
   */
  covarianceStandardError: number[][] | null;
  warnings: string[];
}

/** Monte Carlo of the unmixed abundances' mean and covariance; nulls (and a warning) when M cannot be unmixed. */
export function simulateUnmixing(input: NoiseInput, options: MonteCarloOptions = {}): MonteCarloResult {
  const draws = options.draws ?? 20_000;
  const seed = options.seed ?? 1;
  if (!Number.isInteger(draws) || draws < 2 || draws > 1_000_000)
    throw new SpectraError('invalid_input', 'draws must be an integer from 2 to 1,000,000', ['draws']);
  const model = noiseModel(input);
  const { m, pinv, abundance, background, readSd, excess } = model;
  if (!pinv)
    return { draws, seed, mean: null, covariance: null, covarianceStandardError: null, warnings: model.warnings };
  const rows = m.length;
  const cols = m[0].length;
  const rng = createRandom(seed);
  const mean = m.map((row, c) => row.reduce((sum, x, p) => sum + x * abundance[p], 0) + background[c]);
  const samples = new Float64Array(draws * cols);
  const y = new Float64Array(rows);
  for (let k = 0; k < draws; k++) {
    for (let c = 0; c < rows; c++) {
      const count = excess[c] === 1 ? rng.poisson(mean[c]) : excess[c] * rng.poisson(mean[c] / excess[c]);
      y[c] = count + (readSd[c] > 0 ? readSd[c] * rng.normal() : 0) - background[c];
    }
    for (let i = 0; i < cols; i++) {
      let sum = 0;
      for (let c = 0; c < rows; c++) sum += pinv[i][c] * y[c];
      samples[k * cols + i] = sum;
    }
  }
  const avg = new Array<number>(cols).fill(0);
  for (let k = 0; k < draws; k++) for (let i = 0; i < cols; i++) avg[i] += samples[k * cols + i] / draws;
  const covariance = avg.map(() => new Array<number>(cols).fill(0));
  const m22 = avg.map(() => new Array<number>(cols).fill(0));
  for (let k = 0; k < draws; k++) {
    for (let i = 0; i < cols; i++) {
      const di = samples[k * cols + i] - avg[i];
      for (let j = 0; j < cols; j++) {
        const dj = samples[k * cols + j] - avg[j];
        covariance[i][j] += (di * dj) / (draws - 1);
        m22[i][j] += (di * di * dj * dj) / draws;
      }
    }
  }
  const covarianceStandardError = covariance.map((row, i) =>
    row.map((s, j) => Math.sqrt(Math.max(0, m22[i][j] - s * s) / draws)),
  );
  return { draws, seed, mean: avg, covariance, covarianceStandardError, warnings: model.warnings };
}
