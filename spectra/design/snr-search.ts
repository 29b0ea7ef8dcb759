/**
 * Exact design search on the signal-to-noise objective (snr.ts): maximise the worst target's S/N after unmixing,
 * subject to every pair's interference at most a ceiling, the signal floor, channel conflicts and each target's
 * lock, ties broken by the smaller total spreading.
 *
 * Depth-first branch and bound over targets (locked first, then rarest first), each taking one (probe, channel)
 * value. After each placement every later target's list of values is filtered against it (forward checking: a
 * distinct probe and channel, no conflict, both interferences within the ceiling, the floor), so a dead end is seen
 * at once. A node is pruned when an upper bound on the worst S/N of any completion falls below the best design
 * found. The bound is the Cramér–Rao bound of the tool's own Gaussian noise model: for target u taking probe p in
 * channel c,
 *   S/N_u² = a_u² / Var(â_u) ≤ Σ_{channels i of the design} x_i² / v_i,
 * x_i the photons of u in channel i, because the least-squares estimate of a square system attains the bound with
 * every other probe unknown, knowing them can only lower it, and v_i is at least F·(x_i + the light of the probes
 * already placed + the sample in u's own channel) + r². The n − 1 other channels of the design are bounded by the
 * n − 1 most informative candidates that can join it, each holding another target's own signal: at least the floor's
 * share, and at least u's light there over the interference ceiling. With a
 * shared photon scale, k ≤ P / max(u's own light, the brightest placed),
 * and the bound's terms only grow with k. Targets of equal abundance without locks are interchangeable (when the
 * noise settings are one number each), so only increasing values are searched among them.
 */
import { flattenProblem, type CatalogProblem, type FlatProblem } from './problem';
import { betterScore, scoreDesign, type SnrProblem, type SnrScore, type SnrSettings } from './snr';
import type { DesignAssignment } from './objective';

/** A target's lock as candidate indices (-1 or absent: free). */
export interface IndexLock {
  probe?: number;
  channel?: number;
}

/** A catalog problem with the S/N objective. */
export interface SnrSearchProblem extends CatalogProblem {
  /** The sample's light in each candidate channel (leak, water Raman), collected units. */
  sample: readonly number[];
  settings: SnrSettings;
  /** Largest interference I(t→u) allowed for any pair. */
  ceiling: number;
  /** Per target (may be shorter or absent): the probe and/or channel it must take. */
  locks?: readonly (IndexLock | undefined)[];
}

/** Figures of a search on the S/N objective. */
export interface SnrSearchStats {
  nodesVisited: number;
  /** Proven upper bound on the best worst S/N (equal to the answer's when exact; null when none is proven). */
  bound: number | null;
  /** (bound − found) / bound: how far from proven the answer may be (0 when exact; null without an answer). */
  gap: number | null;
}

/** Outcome: the best design found (null: none meets the constraints) and whether it is proven optimal. */
export interface SnrSearchResult {
  design: DesignAssignment | null;
  score: SnrScore | null;
  exact: boolean;
  stats: SnrSearchStats;
}

/** A resumable branch-and-bound search on the S/N objective. */
export class SnrSearch {
  readonly flat: FlatProblem;
  nodesVisited = 0;
  done = false;
  private readonly snr: SnrProblem;
  private readonly ceiling: number;
  private readonly order: Int32Array;
  /** Position in `order` of the previous interchangeable target, or -1. */
  private readonly previousTwin: Int32Array;
  private readonly maxDomain: number;
  /** dom[d]: each target's values at depth d (target u's at u · maxDomain), domCount[d][u] of them. */
  private readonly dom: Int32Array[] = [];
  private readonly domCount: Int32Array[] = [];
  private readonly spill: Float64Array[] = [];
  private readonly maxOwn: Float64Array;
  private readonly minOwn: Float64Array;
  private readonly children: Int32Array[] = [];
  private readonly childCount: Int32Array;
  private readonly childIdx: Int32Array;
  private readonly nodeBound: Float64Array;
  /** Information of the n − 1 best other channels of each (target, value), at scale restScale. */
  private readonly restInfo: Map<number, number>[] = [];
  private readonly values: Int32Array;
  /** A partition of the channels into groups that pairwise conflict (first fit); cliqueCount groups. */
  private readonly cliqueOf: Int32Array;
  private readonly cliqueCount: number;
  private depth = 0;
  private incumbent: Int32Array | null = null;
  private best: SnrScore | null = null;

  constructor(problem: SnrSearchProblem, initial: readonly DesignAssignment[] = []) {
    const f = (this.flat = flattenProblem(problem));
    const n = f.targets;
    this.ceiling = problem.ceiling;
    this.snr = {
      probes: f.probes,
      channels: f.channels,
      light: f.light,
      sample: problem.sample,
      abundance: f.abundance,
      settings: problem.settings,
    };
    const locks = Array.from({ length: n }, (_, t) => problem.locks?.[t]);
    const locked = (t: number) => (locks[t]?.probe ?? -1) >= 0 || (locks[t]?.channel ?? -1) >= 0;
    this.order = Int32Array.from({ length: n }, (_, t) => t).sort(
      (x, y) => Number(locked(y)) - Number(locked(x)) || f.abundance[x] - f.abundance[y] || x - y,
    );
    const symmetric =
      typeof problem.settings.photons === 'number' && typeof problem.settings.backgroundPhotons === 'number';
    this.previousTwin = this.order.map((t, d) => {
      const prev = d > 0 ? this.order[d - 1] : -1;
      return symmetric && prev >= 0 && !locked(t) && !locked(prev) && f.abundance[prev] === f.abundance[t] ? d - 1 : -1;
    });
    // Each target's values: pairs it may be read in, within its lock.
    const initialDomains = Array.from({ length: n }, (_, t) => {
      const lock = locks[t];
      const list: number[] = [];
      for (let v = 0; v < f.values; v++) {
        if (!(f.own[t * f.values + v] > 0)) continue;
        if ((lock?.probe ?? -1) >= 0 && f.probeOf[v] !== lock!.probe) continue;
        if ((lock?.channel ?? -1) >= 0 && f.channelOf[v] !== lock!.channel) continue;
        list.push(v);
      }
      return list;
    });
    this.maxDomain = Math.max(1, ...initialDomains.map((l) => l.length));
    for (let d = 0; d <= n; d++) {
      this.dom.push(new Int32Array(n * this.maxDomain));
      this.domCount.push(new Int32Array(n));
      this.spill.push(new Float64Array(f.channels));
      this.children.push(new Int32Array(this.maxDomain));
    }
    initialDomains.forEach((list, t) => {
      this.dom[0].set(list, t * this.maxDomain);
      this.domCount[0][t] = list.length;
    });
    this.maxOwn = new Float64Array(n + 1);
    this.minOwn = new Float64Array(n + 1).fill(Infinity);
    this.childCount = new Int32Array(n + 1);
    this.childIdx = new Int32Array(n + 1);
    this.nodeBound = new Float64Array(n + 1);
    this.values = new Int32Array(n).fill(-1);
    ({ group: this.cliqueOf, count: this.cliqueCount } = cliquePartition(f));
    initialDomains.forEach((list, t) => this.restInfo.push(new Map(list.map((v) => [v, this.restOf(t, v)]))));
    for (const design of initial) this.offer(design);
    this.nodeBound[0] = this.boundAt(0);
    if (initialDomains.some((l) => l.length === 0)) this.done = true;
    else this.prepareChildren(0);
  }

  /** Offers a complete design (e.g. from an earlier search) as the incumbent when it keeps every rule and is better. */
  offer(design: DesignAssignment): void {
    const f = this.flat;
    const v = Int32Array.from(design.probe, (p, t) => p * f.channels + design.channel[t]);
    const n = f.targets;
    for (let t = 0; t < n; t++) {
      if (!this.inList(t, v[t])) return;
      for (let u = t + 1; u < n; u++) if (!this.compatible(t, v[t], u, v[u])) return;
    }
    const own = Array.from(v, (x, t) => f.own[t * f.values + x]);
    if (Math.min(...own) < f.minSignalFraction * Math.max(...own)) return;
    this.consider(v);
  }

  /** Runs up to `maxNodes` more nodes; returns true when the search space is exhausted (the incumbent is optimal). */
  advance(maxNodes: number): boolean {
    const stopAt = this.nodesVisited + maxNodes;
    const f = this.flat;
    const n = f.targets;
    while (!this.done && this.nodesVisited < stopAt) {
      const d = this.depth;
      if (this.childIdx[d] >= this.childCount[d] || this.cannotBeat(this.nodeBound[d])) {
        this.childIdx[d] = this.childCount[d];
        if (d === 0) this.done = true;
        else {
          this.depth = d - 1;
          this.values[this.order[d - 1]] = -1;
        }
        continue;
      }
      const v = this.children[d][this.childIdx[d]++];
      this.nodesVisited++;
      const t = this.order[d];
      if (!this.place(d, t, v)) continue;
      this.values[t] = v;
      if (d + 1 === n) {
        this.consider(this.values);
        this.values[t] = -1;
        continue;
      }
      this.nodeBound[d + 1] = this.boundAt(d + 1);
      if (this.cannotBeat(this.nodeBound[d + 1])) {
        this.values[t] = -1;
        continue;
      }
      this.prepareChildren(d + 1);
      this.depth = d + 1;
    }
    return this.done;
  }

  /** A proven upper bound on the best worst S/N: the incumbent's once done, else the best open node's. */
  upperBound(): number {
    let bound = this.best ? this.best.worst : 0;
    if (this.done) return bound;
    for (let d = 0; d <= this.depth; d++) {
      if (this.childIdx[d] < this.childCount[d]) bound = Math.max(bound, this.nodeBound[d]);
    }
    return bound;
  }

  /** The outcome so far. */
  result(): SnrSearchResult {
    const f = this.flat;
    const v = this.incumbent;
    const bound = this.upperBound();
    const found = this.best ? this.best.worst : null;
    return {
      design: v ? { probe: Array.from(v, (x) => f.probeOf[x]), channel: Array.from(v, (x) => f.channelOf[x]) } : null,
      score: this.best,
      exact: this.done,
      stats: {
        nodesVisited: this.nodesVisited,
        bound: Number.isFinite(bound) && (found !== null || this.done) ? bound : null,
        gap: found === null ? null : this.done || bound <= 0 ? 0 : Math.max(0, (bound - found) / bound),
      },
    };
  }

  /**
   * Local improvement of the best design found: moves one target to another of its values, or swaps two targets'
   * values, while that keeps every rule and raises the score, until no move helps or `maxEvaluations` designs were
   * scored. Used when the search stops unproven; the result stays unproven. Returns the designs scored.
   */
  polish(maxEvaluations: number): number {
    const steps = this.polishSteps(maxEvaluations, Infinity);
    for (;;) {
      const next = steps.next();
      if (next.done) return next.value;
    }
  }

  /**
   * polish as steps: yields after every `checksPerStep` designs checked against the rules (each check costs up to
   * n² pair tests, and a target's list of values can be long), so that a caller can pause or stop between them.
   */
  *polishSteps(maxEvaluations: number, checksPerStep: number): Generator<void, number> {
    const f = this.flat;
    const n = f.targets;
    if (!this.incumbent) return 0;
    let evaluations = 0;
    let checks = 0;
    const current = Int32Array.from(this.incumbent);
    const keeps = (v: Int32Array) => {
      const own = Array.from(v, (x, t) => f.own[t * f.values + x]);
      if (Math.min(...own) < f.minSignalFraction * Math.max(...own)) return false;
      for (let t = 0; t < n; t++) {
        if (!this.inList(t, v[t])) return false;
        for (let u = t + 1; u < n; u++) if (!this.compatible(t, v[t], u, v[u])) return false;
      }
      return true;
    };
    const tryDesign = (v: Int32Array) => {
      checks++;
      if (!keeps(v)) return false;
      evaluations++;
      const before = this.best;
      this.consider(v);
      if (this.best === before) return false;
      current.set(v);
      return true;
    };
    for (let improved = true; improved && evaluations < maxEvaluations;) {
      improved = false;
      for (let t = 0; t < n && evaluations < maxEvaluations; t++) {
        for (let i = 0; i < this.domCount[0][t] && evaluations < maxEvaluations; i++) {
          const next = Int32Array.from(current);
          next[t] = this.dom[0][t * this.maxDomain + i];
          if (next[t] !== current[t] && tryDesign(next)) improved = true;
          if (checks >= checksPerStep) {
            checks = 0;
            yield;
          }
        }
        for (let u = t + 1; u < n && evaluations < maxEvaluations; u++) {
          const next = Int32Array.from(current);
          [next[t], next[u]] = [current[u], current[t]];
          if (tryDesign(next)) improved = true;
        }
      }
    }
    return evaluations;
  }

  /**
   * Repairs a design that breaks the interference ceiling or the signal floor (e.g. the min–max stage's best when it
   * stays above the ceiling): single moves to other values of a target's list and swaps of two targets' values, kept
   * while they lower the total
   * excess (Σ over pairs of how far I(t→u) exceeds the ceiling, plus how far the dimmest own signal falls short of
   * the floor, as fractions), until none is left, when the design is considered as an incumbent. Returns true then.
   */
  repair(design: DesignAssignment, maxEvaluations: number): boolean {
    const f = this.flat;
    const n = f.targets;
    const v = Int32Array.from(design.probe, (p, t) => p * f.channels + design.channel[t]);
    if (!v.every((x, t) => this.inList(t, x))) return false;
    const excess = (w: Int32Array) => {
      let sum = 0;
      let top = 0;
      let low = Infinity;
      for (let t = 0; t < n; t++) {
        const own = f.own[t * f.values + w[t]];
        top = Math.max(top, own);
        low = Math.min(low, own);
        for (let u = 0; u < n; u++) {
          if (u === t) continue;
          const pt = f.probeOf[w[t]];
          const cu = f.channelOf[w[u]];
          if (pt === f.probeOf[w[u]] || cu === f.channelOf[w[t]]) return Infinity;
          if (f.conflict !== null && f.conflict[f.channelOf[w[t]] * f.channels + cu] === 1) return Infinity;
          const i = (f.abundance[t] * f.light[cu * f.probes + pt]) / f.own[u * f.values + w[u]];
          if (i > this.ceiling) sum += i - this.ceiling;
        }
      }
      return sum + Math.max(0, f.minSignalFraction - low / top);
    };
    let current = excess(v);
    let evaluations = 0;
    while (current > 0 && evaluations < maxEvaluations) {
      let improved = false;
      for (let t = 0; t < n && current > 0 && evaluations < maxEvaluations; t++) {
        const keep = v[t];
        let best = keep;
        for (let i = 0; i < this.domCount[0][t] && evaluations < maxEvaluations; i++) {
          v[t] = this.dom[0][t * this.maxDomain + i];
          evaluations++;
          const e = excess(v);
          if (e < current) {
            current = e;
            best = v[t];
          }
        }
        v[t] = best;
        if (best !== keep) improved = true;
        // Swaps: target t takes another target's value and gives it its own (abundances trade places).
        for (let u = t + 1; u < n && current > 0 && evaluations < maxEvaluations; u++) {
          if (!this.inList(t, v[u]) || !this.inList(u, v[t])) continue;
          [v[t], v[u]] = [v[u], v[t]];
          evaluations++;
          const e = excess(v);
          if (e < current) {
            current = e;
            improved = true;
          } else [v[t], v[u]] = [v[u], v[t]];
        }
      }
      if (!improved) break;
    }
    if (current > 0) return false;
    this.offer({ probe: Array.from(v, (x) => f.probeOf[x]), channel: Array.from(v, (x) => f.channelOf[x]) });
    return this.best !== null;
  }

  /** The worst S/N of the best design so far (null: none yet). */
  get incumbentWorst(): number | null {
    return this.best ? this.best.worst : null;
  }

  /** True when value x is in target t's list at the root (its pairs and its lock). */
  private inList(t: number, x: number): boolean {
    return this.dom[0].subarray(t * this.maxDomain, t * this.maxDomain + this.domCount[0][t]).includes(x);
  }

  private cannotBeat(bound: number): boolean {
    return this.best !== null && bound < this.best.worst * (1 - 1e-9);
  }

  private consider(values: Int32Array): void {
    const f = this.flat;
    const score = scoreDesign(
      this.snr,
      Array.from(values, (v) => f.probeOf[v]),
      Array.from(values, (v) => f.channelOf[v]),
    );
    if (score.worst > 0 && betterScore(score, this.best)) {
      this.best = score;
      this.incumbent = Int32Array.from(values);
    }
  }

  /** True when target t on value v and target u on value w can share a design. */
  private compatible(t: number, v: number, u: number, w: number): boolean {
    const f = this.flat;
    const pv = f.probeOf[v];
    const pw = f.probeOf[w];
    const cv = f.channelOf[v];
    const cw = f.channelOf[w];
    if (pv === pw || cv === cw || (f.conflict !== null && f.conflict[cv * f.channels + cw] === 1)) return false;
    const tIntoU = (f.abundance[t] * f.light[cw * f.probes + pv]) / f.own[u * f.values + w];
    const uIntoT = (f.abundance[u] * f.light[cv * f.probes + pw]) / f.own[t * f.values + v];
    return tIntoU <= this.ceiling && uIntoT <= this.ceiling;
  }

  /** Places target t (position d) on v: fills depth d + 1's lists and light; false on a dead end. */
  private place(d: number, t: number, v: number): boolean {
    const f = this.flat;
    const n = f.targets;
    const own = f.own[t * f.values + v];
    const maxOwn = Math.max(this.maxOwn[d], own);
    const minOwn = Math.min(this.minOwn[d], own);
    if (minOwn < f.minSignalFraction * maxOwn) return false;
    const D = this.maxDomain;
    const from = this.dom[d];
    const to = this.dom[d + 1];
    for (let k = d + 1; k < n; k++) {
      const u = this.order[k];
      let count = 0;
      for (let i = 0; i < this.domCount[d][u]; i++) {
        const w = from[u * D + i];
        const s = f.own[u * f.values + w];
        if (s < f.minSignalFraction * maxOwn || minOwn < f.minSignalFraction * s) continue;
        if (this.compatible(t, v, u, w)) to[u * D + count++] = w;
      }
      if (count === 0) return false;
      this.domCount[d + 1][u] = count;
    }
    const spill = this.spill[d + 1];
    spill.set(this.spill[d]);
    const p = f.probeOf[v];
    for (let c = 0; c < f.channels; c++) spill[c] += f.abundance[t] * f.light[c * f.probes + p];
    this.maxOwn[d + 1] = maxOwn;
    this.minOwn[d + 1] = minOwn;
    return true;
  }

  /** Upper bound on the worst S/N of any completion of the node at depth d. */
  private boundAt(d: number): number {
    const f = this.flat;
    let bound = Infinity;
    for (let k = 0; k < f.targets; k++) {
      const u = this.order[k];
      let best = 0;
      if (k < d) best = this.targetBound(d, u, this.values[u], true);
      else {
        for (let i = 0; i < this.domCount[d][u]; i++)
          best = Math.max(best, this.targetBound(d, u, this.dom[d][u * this.maxDomain + i], false));
      }
      bound = Math.min(bound, best);
    }
    return bound;
  }

  /** Photons per unit collected light of target u on value v at depth d: an upper bound with a shared scale. */
  private scaleOf(d: number, u: number, v: number): number {
    const f = this.flat;
    const { photons } = this.snr.settings;
    const ownLight = f.light[f.channelOf[v] * f.probes + f.probeOf[v]];
    if (typeof photons !== 'number') return photons[u] / ownLight;
    return photons / Math.max(f.own[u * f.values + v], this.maxOwn[d]);
  }

  /** The largest scale target u on value v can ever have (its own light the brightest). */
  private topScale(u: number, v: number): number {
    const f = this.flat;
    const { photons } = this.snr.settings;
    const ownLight = f.light[f.channelOf[v] * f.probes + f.probeOf[v]];
    return typeof photons === 'number' ? photons / f.own[u * f.values + v] : photons[u] / ownLight;
  }

  /**
   * Information about target u on value v from the n − 1 most informative other channels a design can hold with it,
   * at topScale: channels that conflict with v's are left out, and of a group of channels that all conflict with each
   * other (cliqueOf) a design holds at most one, so each group counts with its best.
   */
  private restOf(u: number, v: number): number {
    const f = this.flat;
    const { excessNoiseFactor: F, readNoiseElectrons: r } = this.snr.settings;
    const k = this.topScale(u, v);
    const p = f.probeOf[v];
    const own = f.channelOf[v];
    // Every other channel of a design is some other target's own: it holds that target's photons, at least the signal
    // floor's share of the brightest (a shared scale), or that target's stated photons (one number per target).
    const { photons } = this.snr.settings;
    const held =
      typeof photons === 'number'
        ? f.minSignalFraction * photons
        : Math.min(...Array.from(f.abundance, (a, t) => (t === u ? Infinity : a * photons[t])));
    const info = new Float64Array(this.cliqueCount);
    for (let c = 0; c < f.channels; c++) {
      if (c === own || (f.conflict !== null && f.conflict[own * f.channels + c] === 1)) continue;
      const x = k * f.abundance[u] * f.light[c * f.probes + p];
      const g = this.cliqueOf[c];
      // That target's own photons there are also at least x / ceiling (u's light there is within the ceiling).
      if (x > 0) info[g] = Math.max(info[g], (x * x) / (F * (x + Math.max(held, x / this.ceiling)) + r * r));
    }
    info.sort((a, b) => b - a);
    let sum = 0;
    for (let i = 0; i < Math.min(f.targets - 1, info.length); i++) sum += info[i];
    return sum;
  }

  /** The Cramér–Rao bound on target u's S/N on value v at depth d (see the file's comment); without the other
   * channels' share when `ownOnly` (the order in which values are tried). */
  private targetBound(d: number, u: number, v: number, placed: boolean, ownOnly = false): number {
    const f = this.flat;
    const { excessNoiseFactor: F, readNoiseElectrons: r, backgroundPhotons } = this.snr.settings;
    const c = f.channelOf[v];
    const k = this.scaleOf(d, u, v);
    const x = k * f.own[u * f.values + v];
    const others = k * Math.max(0, this.spill[d][c] - (placed ? f.own[u * f.values + v] : 0));
    const b = typeof backgroundPhotons === 'number' ? backgroundPhotons : backgroundPhotons[u];
    const variance = F * (x + others + b + k * this.snr.sample[c]) + r * r;
    const rest = ownOnly ? 0 : (this.restInfo[u].get(v) ?? 0) * (k / this.topScale(u, v));
    return Math.sqrt((x * x) / variance + rest);
  }

  /**
   * Lists target order[d]'s values at depth d (after the interchangeability rule), the most promising first: the
   * highest S/N its own channel alone could give, with the light already placed there.
   */
  private prepareChildren(d: number): void {
    const t = this.order[d];
    const twin = this.previousTwin[d];
    const after = twin >= 0 ? this.values[this.order[twin]] : -1;
    const keyed: [number, number][] = [];
    for (let i = 0; i < this.domCount[d][t]; i++) {
      const v = this.dom[d][t * this.maxDomain + i];
      if (v > after) keyed.push([this.targetBound(d, t, v, false, true), v]);
    }
    keyed.sort((a, b) => b[0] - a[0] || a[1] - b[1]);
    keyed.forEach(([, v], i) => (this.children[d][i] = v));
    this.childCount[d] = keyed.length;
    this.childIdx[d] = 0;
  }
}

/** Groups channels so that every two channels of a group conflict (first fit in index order). */
function cliquePartition(f: FlatProblem): { group: Int32Array; count: number } {
  const group = new Int32Array(f.channels);
  const members: number[][] = [];
  for (let c = 0; c < f.channels; c++) {
    const conflict = f.conflict;
    const fits = conflict ? members.findIndex((m) => m.every((d) => conflict[c * f.channels + d] === 1)) : -1;
    if (fits >= 0) {
      members[fits].push(c);
      group[c] = fits;
    } else {
      group[c] = members.length;
      members.push([c]);
    }
  }
  return { group, count: members.length };
}
