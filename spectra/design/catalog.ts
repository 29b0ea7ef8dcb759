/**
 * Exact catalog design by branch and bound over probe choices. Once every target has its probe, I(t→u) depends only
 * on u's channel, so channels are settled exactly by a bottleneck assignment (channels.ts) rather than branched on.
 * Targets are branched rarest first (interference into a rare target is divided by its small abundance, so its
 * choices are the tightest). Every quantity in the bound only grows as probes are added, so a node is pruned when
 * the bound reaches the best complete design found so far (the incumbent). The bound at a node is a bottleneck
 * assignment of all targets to channels: an assigned target u in channel c costs the worst interference into it
 * from the probes placed so far; an unassigned one costs the least, over the probes still free, of the worst
 * interference the placed probes would put into it there. Targets of equal abundance are interchangeable, so only
 * increasing probe indices are searched among them. The search runs in chunks of nodes (progress, stop, budget).
 */
import { flattenProblem, fullEnumerationSize, type CatalogProblem, type FlatProblem } from './problem';
import { flatObjective, greedyDesign } from './greedy';
import { constrainedAssignment, type ChannelChoice } from './channels';
import { worstInterference, type DesignAssignment, type DesignObjective } from './objective';
import { childKey, extendFrame, type Frame } from './frame';

/** Figures of one search. `bound` is a proven lower bound on the optimum (equal to it when exact). */
export interface CatalogSearchStats {
  nodesVisited: number;
  fullEnumeration: number;
  bound: number | null;
  greedyWorst: number | null;
}

/** Outcome: the best design found (null when none meets the constraints), and whether it is proven optimal. */
export interface CatalogResult {
  design: DesignAssignment | null;
  objective: DesignObjective | null;
  exact: boolean;
  stats: CatalogSearchStats;
}

/** A resumable branch-and-bound search over one catalog problem. */
export class CatalogSearch {
  readonly flat: FlatProblem;
  nodesVisited = 0;
  done = false;
  incumbentWorst = Infinity;
  private incumbent: DesignAssignment | null = null;
  private readonly greedyWorst: number | null;
  private readonly problem: CatalogProblem;
  private readonly frames: Frame[] = [];
  private readonly childProbe: Int32Array[] = [];
  private readonly childBound: Float64Array[] = [];
  private readonly childCount: Int32Array;
  private readonly childIdx: Int32Array;
  private readonly sideConditions: boolean;
  /** Each probe's largest collected light over the channels (for ordering ties). */
  private readonly brightness: Float64Array;
  private depth = 0;
  /** True once a leaf's channel search hit its cap: the search can then no longer prove optimality. */
  private truncated = false;
  private truncatedBound = Infinity;

  constructor(problem: CatalogProblem, initial?: DesignAssignment) {
    this.problem = problem;
    const f = (this.flat = flattenProblem(problem));
    const n = f.targets;
    const order = Int32Array.from({ length: n }, (_, t) => t).sort((x, y) => f.abundance[x] - f.abundance[y] || x - y);
    for (let d = 0; d <= n; d++) {
      this.frames.push({
        order,
        probeOf: new Int32Array(n).fill(-1),
        probeUsed: new Uint8Array(f.probes),
        g: new Float64Array(n * f.channels),
        m: new Float64Array(n * f.probes * f.channels),
        rows: new Float64Array(n * f.channels),
        bound: 0,
        channels: null,
      });
      this.childProbe.push(new Int32Array(f.probes));
      this.childBound.push(new Float64Array(f.probes));
    }
    this.childCount = new Int32Array(n + 1);
    this.childIdx = new Int32Array(n + 1);
    this.sideConditions = f.minSignalFraction > 0 || f.conflict !== null;
    this.brightness = new Float64Array(f.probes);
    for (let c = 0; c < f.channels; c++)
      for (let q = 0; q < f.probes; q++)
        this.brightness[q] = Math.max(this.brightness[q], f.ownLight[c * f.probes + q]);
    const greedy = greedyDesign(f);
    this.greedyWorst = greedy ? greedy.worst : null;
    if (greedy) this.offer(this.toDesign(greedy.values));
    if (initial) this.offer(initial);
    const root = this.frames[0];
    for (let u = 0; u < n; u++) {
      for (let q = 0; q < f.probes; q++) {
        for (let c = 0; c < f.channels; c++)
          root.m[(u * f.probes + q) * f.channels + c] = f.ownLight[c * f.probes + q] > 0 ? 0 : Infinity;
      }
    }
    this.prepareChildren(0);
  }

  /** Proposes a complete design (e.g. from an earlier stage) as the incumbent if it is better and allowed. */
  offer(design: DesignAssignment): void {
    const values = Int32Array.from(design.probe, (p, t) => p * this.flat.channels + design.channel[t]);
    const worst = flatObjective(this.flat, values);
    if (worst < this.incumbentWorst) {
      this.incumbentWorst = worst;
      this.incumbent = { probe: [...design.probe], channel: [...design.channel] };
    }
  }

  /** Runs up to `maxNodes` more nodes; returns true when the search space is exhausted (the incumbent is optimal). */
  advance(maxNodes: number): boolean {
    const stopAt = this.nodesVisited + maxNodes;
    const n = this.flat.targets;
    while (!this.done && this.nodesVisited < stopAt) {
      const d = this.depth;
      if (this.childIdx[d] >= this.childCount[d]) {
        if (d === 0) this.done = true;
        else this.depth = d - 1;
        continue;
      }
      const i = this.childIdx[d]++;
      if (this.childBound[d][i] >= this.incumbentWorst) {
        this.childIdx[d] = this.childCount[d]; // children are sorted by bound: the rest cannot do better
        continue;
      }
      this.nodesVisited++;
      const child = this.frames[d + 1];
      if (!extendFrame(this.flat, this.frames[d], child, d, this.childProbe[d][i], this.incumbentWorst)) continue;
      if (d + 1 === n) this.settleLeaf(child);
      else {
        this.prepareChildren(d + 1);
        this.depth = d + 1;
      }
    }
    return this.done;
  }

  /** A proven lower bound on the optimum: the incumbent once done, else the least bound left unexplored. */
  lowerBound(): number {
    let bound = Math.min(this.incumbentWorst, this.truncatedBound);
    if (this.done) return bound;
    for (let d = 0; d <= this.depth; d++) {
      if (this.childIdx[d] < this.childCount[d]) bound = Math.min(bound, this.childBound[d][this.childIdx[d]]);
    }
    return bound;
  }

  /** The outcome so far. */
  result(): CatalogResult {
    const design = this.incumbent;
    const bound = this.lowerBound();
    return {
      design,
      objective: design ? worstInterference(this.problem.collected, this.problem.abundance, design) : null,
      exact: this.done && !this.truncated,
      stats: {
        nodesVisited: this.nodesVisited,
        fullEnumeration: fullEnumerationSize(this.flat.targets, this.flat.probes, this.flat.channels),
        bound: Number.isFinite(bound) ? bound : null,
        greedyWorst: this.greedyWorst,
      },
    };
  }

  private toDesign(values: Int32Array): DesignAssignment {
    return {
      probe: Array.from(values, (v) => this.flat.probeOf[v]),
      channel: Array.from(values, (v) => this.flat.channelOf[v]),
    };
  }

  /** Every probe placed: the frame's rows are exact channel costs; settle channels and maybe take the incumbent. */
  private settleLeaf(frame: Frame): void {
    const f = this.flat;
    let choice: ChannelChoice | null = frame.channels;
    if (this.sideConditions && choice) {
      const signal = new Float64Array(f.targets * f.channels);
      for (let u = 0; u < f.targets; u++) {
        for (let c = 0; c < f.channels; c++)
          signal[u * f.channels + c] = f.abundance[u] * f.ownLight[c * f.probes + frame.probeOf[u]];
      }
      const table = { cost: frame.rows, rows: f.targets, cols: f.channels };
      const side = { signal, minSignalFraction: f.minSignalFraction, conflict: f.conflict };
      const settled = constrainedAssignment(table, side, this.incumbentWorst, choice.value);
      // The channel search's own steps count against the node budget; a capped one leaves the answer unproven.
      this.nodesVisited += settled.visits;
      if (!settled.complete) {
        this.truncated = true;
        this.truncatedBound = Math.min(this.truncatedBound, choice.value); // the matching value still bounds that leaf
      }
      choice = settled.choice;
    }
    if (!choice || !(choice.value < this.incumbentWorst)) return;
    this.incumbentWorst = choice.value;
    this.incumbent = { probe: Array.from(frame.probeOf), channel: Array.from(choice.columns) };
  }

  /** Lists the free probes for the next target in the order, cheapest bound first, dropping those at the incumbent. */
  private prepareChildren(d: number): void {
    const f = this.flat;
    const frame = this.frames[d];
    const t = frame.order[d];
    const previous =
      d > 0 && f.abundance[frame.order[d - 1]] === f.abundance[t] ? frame.probeOf[frame.order[d - 1]] : -1;
    const keys: [number, number][] = [];
    for (let q = previous + 1; q < f.probes; q++) {
      if (frame.probeUsed[q]) continue;
      const key = Math.max(frame.bound, childKey(f, frame, d, q));
      if (key < this.incumbentWorst) keys.push([key, q]);
    }
    // Ties (common near the root, where every bound is 0) go to the probe with the most light in its best channel:
    // rare targets, branched first, then try bright probes first, as the objective favours.
    keys.sort((a, b) => a[0] - b[0] || this.brightness[b[1]] - this.brightness[a[1]]);
    keys.forEach(([key, q], i) => {
      this.childBound[d][i] = key;
      this.childProbe[d][i] = q;
    });
    this.childCount[d] = keys.length;
    this.childIdx[d] = 0;
  }
}
