/**
 * Non-negative least squares for one pixel, min ‖M a − y‖₂ subject to a ≥ 0, by the active-set algorithm of Lawson &
 * Hanson (Solving Least Squares Problems, Prentice-Hall 1974, ch. 23, algorithm NNLS) on the cross-products G = MᵀM
 * and b = Mᵀy (Bro & De Jong, J. Chemometrics 1997, 11, 393). The start is warm and stays exact: a least-squares
 * solution that is all positive already is the NNLS solution (every gradient component is zero); otherwise the passive
 * set starts as the least-squares solution's positive components (as in Van Benthem & Keenan, J. Chemometrics 2004,
 * 18, 441), pruned of those whose subproblem solution is not positive until it is all positive, a feasible state from
 * which the algorithm's iterations reach the unique optimum (M has full column rank).
 */
import { EPSILON } from '../signal/linalg/matrix';
import { projectPixel } from './least-squares';
import { passiveSolver } from './passive-solve';
import { subsetSolver } from './subset-solve';
import type { PreparedReference } from './reference';

/** Solves one pixel: y (channels) in, a (probes) out. Reuses its scratch between calls. */
export type PixelNnls = (y: Float64Array, a: Float64Array) => void;

/** A per-pixel NNLS solver over a prepared reference, with all scratch allocated here once. */
export function pixelNnls(ref: PreparedReference): PixelNnls {
  const { channels, probes, matrix, gram } = ref;
  const solver = subsetSolver(gram, probes) ?? passiveSolver(gram, probes);
  const b = new Float64Array(probes);
  const z = new Float64Array(probes);
  const passive = new Uint8Array(probes);
  const blocked = new Uint8Array(probes);
  // Lawson & Hanson bound the loop by 3n iterations in practice (1974, ch. 23); 30n guards against cycling.
  const maxIterations = 30 * probes;
  // Gradient tolerance scaled like scipy's and Lawson & Hanson's: 10 · ε · max(m, n) · ‖M‖ · ‖y‖ (our choice of norm).
  const tolScale = 10 * EPSILON * Math.max(channels, probes) * ref.normFrobenius;

  const allPassivePositive = (values: Float64Array) => {
    for (let j = 0; j < probes; j++) if (passive[j] && !(values[j] > 0)) return false;
    return true;
  };

  /** Passive set = the positive components of the least-squares a, pruned until its solution is all positive. */
  const warmStart = (a: Float64Array): boolean => {
    let any = false;
    for (let j = 0; j < probes; j++) {
      passive[j] = a[j] > 0 ? 1 : 0;
      any ||= a[j] > 0;
    }
    while (any && solver.solve(b, passive, z)) {
      if (allPassivePositive(z)) {
        a.set(z);
        return true;
      }
      any = false;
      for (let j = 0; j < probes; j++) {
        if (passive[j] && !(z[j] > 0)) passive[j] = 0;
        any ||= passive[j] === 1;
      }
    }
    return false;
  };

  return (y, a) => {
    projectPixel(ref, y, a);
    let positive = true;
    for (let j = 0; j < probes && positive; j++) positive = a[j] > 0;
    if (positive) return;
    let norm = 0;
    for (let c = 0; c < channels; c++) norm += y[c] * y[c];
    const tol = tolScale * Math.sqrt(norm);
    for (let j = 0; j < probes; j++) {
      let sum = 0;
      for (let c = 0; c < channels; c++) sum += matrix[c * probes + j] * y[c];
      b[j] = sum;
    }
    blocked.fill(0);
    if (!warmStart(a)) {
      a.fill(0);
      passive.fill(0);
    }
    let iterations = 0;
    for (;;) {
      // Gradient w = b − G a; the most positive free component enters the passive set.
      let t = -1;
      let best = tol;
      for (let j = 0; j < probes; j++) {
        if (passive[j] || blocked[j]) continue;
        let w = b[j];
        for (let k = 0; k < probes; k++) w -= gram[j * probes + k] * a[k];
        if (w > best) {
          best = w;
          t = j;
        }
      }
      if (t < 0) break;
      passive[t] = 1;
      let first = true;
      for (;;) {
        // Past the iteration bound, or on a singular subsystem (impossible for a full-rank M), a stays feasible.
        if (++iterations > maxIterations || !solver.solve(b, passive, z)) {
          t = -2;
          break;
        }
        // Rounding can give the entering variable z_t ≤ 0 although its gradient is positive; it cannot improve
        // the fit, so it is set aside for this pixel rather than cycling (Lawson & Hanson 1974, ch. 23, step 6).
        if (first && !(z[t] > 0)) {
          passive[t] = 0;
          blocked[t] = 1;
          break;
        }
        first = false;
        if (allPassivePositive(z)) {
          a.set(z);
          break;
        }
        // Step from a towards z as far as feasibility allows; the variables that reach zero leave the passive set.
        let alpha = Infinity;
        let leaving = -1;
        for (let j = 0; j < probes; j++) {
          if (!passive[j] || z[j] > 0) continue;
          const step = a[j] / (a[j] - z[j]);
          if (step < alpha) {
            alpha = step;
            leaving = j;
          }
        }
        for (let j = 0; j < probes; j++) {
          if (!passive[j]) continue;
          a[j] += alpha * (z[j] - a[j]);
          if (j === leaving || a[j] <= 0) {
            a[j] = 0;
            passive[j] = 0;
          }
        }
      }
      if (t === -2) break;
    }
  };
}
