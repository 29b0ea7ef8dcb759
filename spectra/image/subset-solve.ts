/**
 * The passive-set solve by table: with few probes every passive set's (G_PP)⁻¹ is computed once, so each solve of
 * the active-set loop is one small matrix-vector product instead of a Cholesky factorisation. The idea of reusing the
 * factorisation of a passive set across solves is that of fast combinatorial NNLS (Van Benthem & Keenan,
 * J. Chemometrics 2004, 18, 441); here the sets are few enough to tabulate them all.
 */
import { passiveSolver, type PassiveSolver } from './passive-solve';

/**
 * Most probes tabulated: 2¹⁰ sets of at most 10 × 10 entries, under 1 MiB of Float64 (our choice; the table is built
 * once per unmixer, in well under a millisecond per hundred sets).
 */
export const SUBSET_TABLE_PROBES = 10;

/** A table solver on the Gram matrix G, or null past SUBSET_TABLE_PROBES (the caller factorises per solve). */
export function subsetSolver(gram: Float64Array, probes: number): PassiveSolver | null {
  if (probes > SUBSET_TABLE_PROBES) return null;
  const sets = 1 << probes;
  const offsets = new Int32Array(sets).fill(-1);
  let size = 0;
  for (let mask = 1; mask < sets; mask++) {
    const n = popcount(mask);
    size += n * n;
  }
  const inverses = new Float64Array(size);
  // Column j of (G_PP)⁻¹ solves G_PP x = e_j, by the Cholesky solver itself.
  const cholesky = passiveSolver(gram, probes);
  const passive = new Uint8Array(probes);
  const unit = new Float64Array(probes);
  const column = new Float64Array(probes);
  const members = new Int32Array(probes);
  let offset = 0;
  for (let mask = 1; mask < sets; mask++) {
    const n = setMembers(mask, probes, passive, members);
    let ok = true;
    for (let j = 0; j < n && ok; j++) {
      unit.fill(0);
      unit[members[j]] = 1;
      ok = cholesky.solve(unit, passive, column);
      for (let i = 0; i < n; i++) inverses[offset + i * n + j] = column[members[i]];
    }
    if (ok) offsets[mask] = offset;
    offset += n * n;
  }
  return {
    solve(b, passiveSet, z) {
      let mask = 0;
      for (let j = 0; j < probes; j++) {
        z[j] = 0;
        if (passiveSet[j]) mask |= 1 << j;
      }
      const start = offsets[mask];
      if (start < 0) return mask === 0;
      const n = setMembers(mask, probes, passive, members);
      for (let i = 0; i < n; i++) {
        let sum = 0;
        const row = start + i * n;
        for (let j = 0; j < n; j++) sum += inverses[row + j] * b[members[j]];
        z[members[i]] = sum;
      }
      return true;
    },
  };
}

/** Writes the set `mask` as flags and as its member list; returns its size. */
function setMembers(mask: number, probes: number, flags: Uint8Array, members: Int32Array): number {
  let n = 0;
  for (let j = 0; j < probes; j++) {
    flags[j] = (mask >> j) & 1;
    if (flags[j]) members[n++] = j;
  }
  return n;
}

function popcount(mask: number): number {
  let n = 0;
  for (let m = mask; m !== 0; m &= m - 1) n++;
  return n;
}
