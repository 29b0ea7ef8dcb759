/**
 * One node of the catalog branch and bound (catalog.ts): the probes placed so far and the interference tables that
 * bound every completion. All tables only grow as probes are added, which is what makes the bound valid.
 */
import { bottleneckAssignment, type ChannelChoice } from './channels';
import type { FlatProblem } from './problem';

/** Search state after the first d targets of `order` have their probes. */
export interface Frame {
  /** Targets in branching order (shared by all frames). */
  order: Int32Array;
  /** Probe of each target placed so far (-1: not yet). */
  probeOf: Int32Array;
  probeUsed: Uint8Array;
  /** g[u·K + c]: worst interference into placed target u if read in channel c, from the probes placed so far. */
  g: Float64Array;
  /** m[(u·P + q)·K + c]: for an unplaced target u, the same if it took probe q and channel c. */
  m: Float64Array;
  /** The cost table of the bound: g rows for placed targets, the least m over free probes for the others. */
  rows: Float64Array;
  /** Bottleneck assignment value of `rows`: a lower bound on every completion of this node. */
  bound: number;
  /**
   * The assignment that achieves `bound` (exact channels once every probe is placed and there are no side conditions).
   */
  channels: ChannelChoice | null;
}

/**
 * Fills `child` with the state after target order[d] of `parent` takes probe q. Returns false when no completion
 * can get below `limit` (the node is pruned).
 */
export function extendFrame(f: FlatProblem, parent: Frame, child: Frame, d: number, q: number, limit: number): boolean {
  const { order } = parent;
  const K = f.channels;
  const P = f.probes;
  const n = f.targets;
  const t = order[d];
  const at = f.abundance[t];
  child.probeOf.set(parent.probeOf);
  child.probeOf[t] = q;
  child.probeUsed.set(parent.probeUsed);
  child.probeUsed[q] = 1;
  for (let k = 0; k < d; k++) {
    const u = order[k];
    const pu = parent.probeOf[u];
    const au = f.abundance[u];
    for (let c = 0; c < K; c++) {
      let x = parent.g[u * K + c];
      const own = au * f.ownLight[c * P + pu];
      if (own > 0) {
        const y = (at * f.light[c * P + q]) / own;
        if (y > x) x = y;
      }
      child.g[u * K + c] = x;
      child.rows[u * K + c] = x;
    }
  }
  for (let c = 0; c < K; c++) {
    const x = parent.m[(t * P + q) * K + c];
    child.g[t * K + c] = x;
    child.rows[t * K + c] = x;
  }
  for (let k = d + 1; k < n; k++) {
    const u = order[k];
    const au = f.abundance[u];
    child.rows.fill(Infinity, u * K, u * K + K);
    for (let p = 0; p < P; p++) {
      if (child.probeUsed[p]) continue;
      const base = (u * P + p) * K;
      for (let c = 0; c < K; c++) {
        const own = au * f.ownLight[c * P + p];
        let x = parent.m[base + c];
        if (!(own > 0)) x = Infinity;
        else {
          const y = (at * f.light[c * P + q]) / own;
          if (y > x) x = y;
        }
        child.m[base + c] = x;
        if (x < child.rows[u * K + c]) child.rows[u * K + c] = x;
      }
    }
  }
  const choice = bottleneckAssignment({ cost: child.rows, rows: n, cols: K }, limit);
  if (!choice) return false;
  child.bound = choice.value;
  child.channels = choice;
  return true;
}

/**
 * A cheap lower bound for the child where target order[d] takes probe q: the interference the placed probes put
 * into it in its best channel, and for each placed target the interference q adds in that target's best channel.
 */
export function childKey(f: FlatProblem, frame: Frame, d: number, q: number): number {
  const K = f.channels;
  const P = f.probes;
  const t = frame.order[d];
  const at = f.abundance[t];
  let key = Infinity;
  const base = (t * P + q) * K;
  for (let c = 0; c < K; c++) if (frame.m[base + c] < key) key = frame.m[base + c];
  for (let k = 0; k < d; k++) {
    const u = frame.order[k];
    const pu = frame.probeOf[u];
    const au = f.abundance[u];
    let least = Infinity;
    for (let c = 0; c < K; c++) {
      const own = au * f.ownLight[c * P + pu];
      if (!(own > 0)) continue;
      const y = (at * f.light[c * P + q]) / own;
      const x = frame.g[u * K + c] > y ? frame.g[u * K + c] : y;
      if (x < least) least = x;
    }
    if (least > key) key = least;
  }
  return key;
}
