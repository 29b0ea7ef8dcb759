/**
 * The inner solve of active-set NNLS on cross-products: z = argmin ‖M_P z − y‖ over the passive columns P, from
 * G_PP z = b_P with G = MᵀM and b = Mᵀy, by Cholesky (Bro & De Jong, J. Chemometrics 1997, 11, 393: the
 * cross-products are formed once, and each passive set's system is a small submatrix of them). Scratch is preallocated.
 */

/** Solves G_PP z_P = b_P for the passive set; z is zero elsewhere. */
export interface PassiveSolver {
  /** Returns false when G_PP is not positive definite (cannot happen for a full-rank M, kept as a guard). */
  solve(b: Float64Array, passive: Uint8Array, z: Float64Array): boolean;
}

/** A solver on the Gram matrix G (probes × probes) for any passive set, allocating its scratch once. */
export function passiveSolver(gram: Float64Array, probes: number): PassiveSolver {
  const index = new Int32Array(probes);
  const lower = new Float64Array(probes * probes);
  const w = new Float64Array(probes);
  return {
    solve(b, passive, z) {
      let n = 0;
      for (let j = 0; j < probes; j++) {
        z[j] = 0;
        if (passive[j]) index[n++] = j;
      }
      // Cholesky G_PP = L Lᵀ, row by row (Golub & Van Loan, Matrix Computations, 4th ed. 2013, §4.2; from memory).
      for (let i = 0; i < n; i++) {
        const gi = index[i] * probes;
        for (let j = 0; j <= i; j++) {
          let sum = gram[gi + index[j]];
          for (let k = 0; k < j; k++) sum -= lower[i * probes + k] * lower[j * probes + k];
          if (i === j) {
            if (!(sum > 0)) return false;
            lower[i * probes + i] = Math.sqrt(sum);
          } else {
            lower[i * probes + j] = sum / lower[j * probes + j];
          }
        }
      }
      // L w = b_P, then Lᵀ z_P = w.
      for (let i = 0; i < n; i++) {
        let sum = b[index[i]];
        for (let k = 0; k < i; k++) sum -= lower[i * probes + k] * w[k];
        w[i] = sum / lower[i * probes + i];
      }
      for (let i = n - 1; i >= 0; i--) {
        let sum = w[i];
        for (let k = i + 1; k < n; k++) sum -= lower[k * probes + i] * z[index[k]];
        z[index[i]] = sum / lower[i * probes + i];
      }
      return true;
    },
  };
}
