/**
 * A quick first design for the branch and bound to beat: greedy placement (rarest target first, each taking the
 * candidate that raises the worst interference least), then single-target moves while they lower the objective.
 * A tighter first incumbent lets the exact search prune more; it is never the final word.
 */
import { pairCost, type FlatProblem } from './problem';

/** A complete assignment in flat form (value index per target) and its worst interference. */
export interface FlatDesign {
  values: Int32Array;
  worst: number;
}

/** Worst pair cost of a complete assignment, or Infinity when it breaks a constraint (including the signal floor). */
export function flatObjective(f: FlatProblem, values: Int32Array): number {
  let worst = 0;
  let minSignal = Infinity;
  let maxSignal = 0;
  for (let t = 0; t < f.targets; t++) {
    const s = f.own[t * f.values + values[t]];
    if (!(s > 0)) return Infinity;
    if (s < minSignal) minSignal = s;
    if (s > maxSignal) maxSignal = s;
    for (let u = t + 1; u < f.targets; u++) {
      const cost = pairCost(f, t, values[t], u, values[u]);
      if (cost > worst) worst = cost;
    }
  }
  return minSignal >= f.minSignalFraction * maxSignal ? worst : Infinity;
}

/** Greedy placement plus local moves; null when the greedy finds no design that meets every constraint. */
export function greedyDesign(f: FlatProblem): FlatDesign | null {
  const order = Array.from({ length: f.targets }, (_, t) => t).sort((x, y) => f.abundance[x] - f.abundance[y] || x - y);
  const values = new Int32Array(f.targets).fill(-1);
  const placed: number[] = [];
  let minSignal = Infinity;
  let maxSignal = 0;
  for (const t of order) {
    let best = -1;
    let bestCost = Infinity;
    for (let v = 0; v < f.values; v++) {
      const s = f.own[t * f.values + v];
      if (!(s > 0) || Math.min(minSignal, s) < f.minSignalFraction * Math.max(maxSignal, s)) continue;
      let cost = 0;
      for (const u of placed) cost = Math.max(cost, pairCost(f, t, v, u, values[u]));
      if (cost < bestCost || (cost === bestCost && best >= 0 && f.own[t * f.values + v] > f.own[t * f.values + best])) {
        best = v;
        bestCost = cost;
      }
    }
    if (best < 0 || bestCost === Infinity) return null;
    values[t] = best;
    placed.push(t);
    minSignal = Math.min(minSignal, f.own[t * f.values + best]);
    maxSignal = Math.max(maxSignal, f.own[t * f.values + best]);
  }
  let worst = flatObjective(f, values);
  // Single-target moves: try every other candidate for each target; keep a move when it lowers the objective.
  // Each sweep costs targets × values objective evaluations: cap the total near 200,000.
  const maxSweeps = Math.max(1, Math.min(20, Math.floor(200_000 / (f.targets * f.values))));
  for (let improved = true, sweeps = 0; improved && sweeps < maxSweeps; sweeps++) {
    improved = false;
    for (let t = 0; t < f.targets; t++) {
      for (let v = 0; v < f.values; v++) {
        const previous = values[t];
        if (v === previous) continue;
        values[t] = v;
        const score = flatObjective(f, values);
        if (score < worst) {
          worst = score;
          improved = true;
        } else values[t] = previous;
      }
    }
  }
  return worst === Infinity ? null : { values, worst };
}
