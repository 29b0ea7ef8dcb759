/**
 * Channel assignment once every target has its probe. Then I(t→u) depends only on u's channel, so the objective
 * is max over u of g_u(c_u), with g_u(c) the worst interference into u if it is read in channel c. With only
 * "distinct channels" as a side condition this is a bottleneck assignment problem, solved exactly by thresholding
 * plus bipartite matching (Kuhn's augmenting paths: Kuhn, Naval Res. Logist. Q. 1955, 2, 83; bottleneck form:
 * Gross, RAND P-1630, 1959, from memory). Passband conflicts and the signal floor are side conditions matching
 * cannot express; a small depth-first search handles them, starting from the matching value as its bound.
 */

/** cost[r · cols + c]: the value of giving column (channel) c to row (target) r; Infinity where not allowed. */
export interface CostTable {
  cost: Float64Array;
  rows: number;
  cols: number;
}

/** A channel per target and the largest cost among them. */
export interface ChannelChoice {
  value: number;
  columns: Int32Array;
}

function augment(t: CostTable, r: number, tau: number, rowOfCol: Int32Array, seen: Uint8Array): boolean {
  for (let c = 0; c < t.cols; c++) {
    if (seen[c] || !(t.cost[r * t.cols + c] <= tau)) continue;
    seen[c] = 1;
    if (rowOfCol[c] < 0 || augment(t, rowOfCol[c], tau, rowOfCol, seen)) {
      rowOfCol[c] = r;
      return true;
    }
  }
  return false;
}

function matchUnder(t: CostTable, tau: number, rowOfCol: Int32Array, seen: Uint8Array): boolean {
  rowOfCol.fill(-1);
  for (let r = 0; r < t.rows; r++) {
    seen.fill(0);
    if (!augment(t, r, tau, rowOfCol, seen)) return false;
  }
  return true;
}

/**
 * Least possible largest cost when every row takes a distinct column, considering only costs below `limit`;
 * null when no such assignment exists.
 */
export function bottleneckAssignment(t: CostTable, limit = Infinity): ChannelChoice | null {
  const rowOfCol = new Int32Array(t.cols);
  const seen = new Uint8Array(t.cols);
  // Every row needs one of its entries, so the largest row minimum is a floor; it is often the answer.
  let floor = 0;
  for (let r = 0; r < t.rows; r++) {
    let least = Infinity;
    for (let c = 0; c < t.cols; c++) least = Math.min(least, t.cost[r * t.cols + c]);
    if (!(least < limit)) return null;
    floor = Math.max(floor, least);
  }
  let tau = floor;
  if (!matchUnder(t, tau, rowOfCol, seen)) {
    const levels = Array.from(new Set(Array.from(t.cost).filter((x) => x > floor && x < limit))).sort((a, b) => a - b);
    let lo = 0;
    let hi = levels.length - 1;
    if (hi < 0 || !matchUnder(t, levels[hi], rowOfCol, seen)) return null;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if (matchUnder(t, levels[mid], rowOfCol, seen)) hi = mid;
      else lo = mid + 1;
    }
    tau = levels[lo];
    matchUnder(t, tau, rowOfCol, seen);
  }
  const columns = new Int32Array(t.rows).fill(-1);
  for (let c = 0; c < t.cols; c++) if (rowOfCol[c] >= 0) columns[rowOfCol[c]] = c;
  return { value: tau, columns };
}

/** Side conditions of the constrained form: own signal per (row, column), the floor, conflicting column pairs. */
export interface ChannelSideConditions {
  signal: Float64Array;
  minSignalFraction: number;
  conflict: Uint8Array | null;
}

/** A constrained assignment and whether its search finished (false: it hit `maxVisits`, best found only). */
export interface ConstrainedChoice {
  choice: ChannelChoice | null;
  complete: boolean;
  visits: number;
}

/**
 * Exact channel assignment under passband conflicts and the signal floor, by depth-first search (rows with the
 * fewest usable columns first, columns cheapest first) with forward checking: after each choice every row still to
 * place must keep a usable column. `floorValue` is a known lower bound (the matching value); the search stops when
 * it reaches it, or after `maxVisits` choices.
 */
export function constrainedAssignment(
  t: CostTable,
  side: ChannelSideConditions,
  limit: number,
  floorValue: number,
  maxVisits = 100_000,
): ConstrainedChoice {
  const rows = Array.from({ length: t.rows }, (_, r) => r);
  const lists = rows.map((r) =>
    Array.from({ length: t.cols }, (_, c) => c)
      .filter((c) => t.cost[r * t.cols + c] < limit)
      .sort((a, b) => t.cost[r * t.cols + a] - t.cost[r * t.cols + b]),
  );
  rows.sort((a, b) => lists[a].length - lists[b].length);
  let best: ChannelChoice | null = null;
  let bound = limit;
  let visits = 0;
  const columns = new Int32Array(t.rows).fill(-1);
  const used = new Uint8Array(t.cols);
  const usable = (r: number, c: number, worstSoFar: number, minS: number, maxS: number): boolean => {
    if (used[c] || Math.max(worstSoFar, t.cost[r * t.cols + c]) >= bound) return false;
    for (let k = 0; k < t.rows; k++)
      if (columns[k] >= 0 && side.conflict && side.conflict[columns[k] * t.cols + c] === 1) return false;
    const s = side.signal[r * t.cols + c];
    return Math.min(minS, s) >= side.minSignalFraction * Math.max(maxS, s);
  };
  const visit = (k: number, worst: number, minS: number, maxS: number): boolean => {
    if (k === rows.length) {
      best = { value: worst, columns: Int32Array.from(columns) };
      bound = worst;
      return worst <= floorValue; // cannot do better than the floor: stop
    }
    const r = rows[k];
    for (const c of lists[r]) {
      if (visits >= maxVisits) return true;
      if (Math.max(worst, t.cost[r * t.cols + c]) >= bound) break;
      if (!usable(r, c, worst, minS, maxS)) continue;
      visits++;
      const s = side.signal[r * t.cols + c];
      const lo = Math.min(minS, s);
      const hi = Math.max(maxS, s);
      const cost = Math.max(worst, t.cost[r * t.cols + c]);
      used[c] = 1;
      columns[r] = c;
      // Forward check: every later row keeps at least one usable column.
      let alive = true;
      for (let j = k + 1; j < rows.length && alive; j++)
        alive = lists[rows[j]].some((d) => usable(rows[j], d, cost, lo, hi));
      const stop = alive && visit(k + 1, cost, lo, hi);
      used[c] = 0;
      columns[r] = -1;
      if (stop) return true;
    }
    return false;
  };
  visit(0, 0, Infinity, 0);
  return { choice: best, complete: visits < maxVisits, visits };
}
