/**
 * The overlap sums of the collected matrix, Σλ em(λ) T(λ), for every emission against every channel transmission.
 * A transmission is constant beyond its edges (a filter blocks at its floor, or stays open), so each sum splits into
 * the constant run below the edges, the part between and the constant run above: before × (the emission's sum below)
 * + Σ em·T between + after × (the emission's sum above). The emission's sums are running sums taken from its blue end
 * and from its red end, so a tiny tail is never the difference of two large sums (it matters against a 10^-12
 * blocking floor). Only the part between the edges is summed point by point. `overlapsReference` is the plain double
 * loop; test/spectra/kernels.test.ts holds the two together to 1e-12.
 */

/** An emission held from grid index `from` on (0 elsewhere). */
export interface HeldEmission {
  values: number[];
  from: number;
}

/** A grid-long transmission with the index range [first, end) outside which it is constant. */
interface Runs {
  t: number[];
  first: number;
  end: number;
}

/** The constant runs at both ends of a transmission (exact equality, so the split changes no value). */
function runsOf(t: number[]): Runs {
  let first = 0;
  while (first < t.length && t[first] === t[0]) first++;
  let end = t.length;
  while (end > first && t[end - 1] === t[t.length - 1]) end--;
  return { t, first, end };
}

/** overlap[c][e] = Σ_k emissions[e].values[k] · transmissions[c][from + k], by constant runs and running sums. */
export function overlaps(emissions: HeldEmission[], transmissions: number[][]): number[][] {
  const runs = transmissions.map(runsOf);
  const out = transmissions.map(() => new Array<number>(emissions.length));
  emissions.forEach(({ values, from }, e) => {
    const n = values.length;
    // below[k] = Σ values[0..k) from the blue end; above[k] = Σ values[k..n) from the red end.
    const below = new Array<number>(n + 1);
    const above = new Array<number>(n + 1);
    below[0] = 0;
    above[n] = 0;
    for (let k = 0; k < n; k++) below[k + 1] = below[k] + values[k];
    for (let k = n - 1; k >= 0; k--) above[k] = above[k + 1] + values[k];
    runs.forEach(({ t, first, end }, c) => {
      const a = Math.min(n, Math.max(0, first - from));
      const b = Math.min(n, Math.max(a, end - from));
      let between = 0;
      for (let k = a; k < b; k++) between += values[k] * t[from + k];
      const before = a > 0 ? t[0] * below[a] : 0;
      const after = b < n ? t[t.length - 1] * above[b] : 0;
      out[c][e] = before + between + after;
    });
  });
  return out;
}

/** The plain double loop: Σ_k values[k] · t[from + k] for every pair. */
export function overlapsReference(emissions: HeldEmission[], transmissions: number[][]): number[][] {
  return transmissions.map((t) =>
    emissions.map(({ values, from }) => values.reduce((sum, v, k) => sum + v * t[from + k], 0)),
  );
}
