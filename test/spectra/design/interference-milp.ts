/**
 * The catalog design's min–max interference problem as a mixed-integer linear program, solved by HiGHS (the `highs`
 * npm package: the HiGHS solver of Huangfu & Hall, Math. Prog. Comp. 2018, 10, 119, compiled to WebAssembly). Written
 * here from the objective's definition (spectra/design/objective.ts header), independently of the branch and bound.
 *
 * Values: target t takes a (probe, channel) pair v, binary x_tv; pairs where the channel collects none of the probe's
 * light are left out (a target read there has no own signal). With I(t→u) = a_t·C[c_w][p_v] / (a_u·C[c_w][p_w]) when
 * t takes v and u takes w:
 *   minimise z
 *   Σ_v x_tv = 1 for each target t;  Σ_{t, v: probe v = p} x_tv ≤ 1 for each probe p; the same for each channel;
 *   z ≥ I(t→u)·(x_tv + x_uw − 1) for every two targets t ≠ u and values v, w (a linearisation of z ≥ max I: the
 *   right side is I when both values are taken and at most 0 otherwise, and z ≥ 0 holds anyway).
 * Only the larger of I(t→u) and I(u→t) is written for each unordered pair of (target, value), and none for values
 * that share a probe or a channel (the ≤ 1 rows already keep them apart).
 */
import loadHighs from 'highs';

type Highs = Awaited<ReturnType<typeof loadHighs>>;

/** One instance: collected[c][p] (channels × probes) at abundance 1, and the targets' abundances. */
export interface MilpInstance {
  collected: number[][];
  abundance: number[];
}

/** The MILP's answer: HiGHS's status, its objective value, and the assignment it chose (null when none). */
export interface MilpAnswer {
  status: string;
  objectiveValue: number;
  design: { probe: number[]; channel: number[] } | null;
}

/** A coefficient as LP text: the shortest decimal that reads back as the same double (ECMAScript Number#toString). */
const num = (x: number) => String(x);

/** Builds the model in CPLEX LP format. */
export function interferenceMilp({ collected, abundance }: MilpInstance): string {
  const channels = collected.length;
  const probes = collected[0].length;
  const n = abundance.length;
  const values: { t: number; p: number; c: number; name: string }[] = [];
  for (let t = 0; t < n; t++)
    for (let p = 0; p < probes; p++)
      for (let c = 0; c < channels; c++) if (collected[c][p] > 0) values.push({ t, p, c, name: `x_${t}_${p}_${c}` });
  const rows: string[] = [];
  const sum = (list: typeof values) => list.map((v) => v.name).join(' + ');
  for (let t = 0; t < n; t++) rows.push(`one_${t}: ${sum(values.filter((v) => v.t === t))} = 1`);
  for (let p = 0; p < probes; p++) {
    const list = values.filter((v) => v.p === p);
    if (list.length) rows.push(`probe_${p}: ${sum(list)} <= 1`);
  }
  for (let c = 0; c < channels; c++) {
    const list = values.filter((v) => v.c === c);
    if (list.length) rows.push(`channel_${c}: ${sum(list)} <= 1`);
  }
  let k = 0;
  for (const v of values) {
    for (const w of values) {
      if (w.t <= v.t || w.p === v.p || w.c === v.c) continue;
      // v into w's channel (target v.t into w.t), and w into v's channel.
      const into = (abundance[v.t] * collected[w.c][v.p]) / (abundance[w.t] * collected[w.c][w.p]);
      const back = (abundance[w.t] * collected[v.c][w.p]) / (abundance[v.t] * collected[v.c][v.p]);
      const i = Math.max(into, back);
      if (i > 0) rows.push(`pair_${k++}: z - ${num(i)} ${v.name} - ${num(i)} ${w.name} >= -${num(i)}`);
    }
  }
  return [
    'Minimize',
    ' obj: z',
    'Subject To',
    ...rows.map((r) => ` ${r}`),
    'Bounds',
    ' z >= 0',
    'Binaries',
    ...values.map((v) => ` ${v.name}`),
    'End',
  ].join('\n');
}

/**
 * Solves the instance to a proven optimum: relative and absolute gaps 0 (HiGHS's defaults, 1e-4 and 1e-6, would let
 * it stop short of the optimum) and a tight integrality tolerance, so that z ≥ I·(x + x − 1) cannot be met by values a
 * hair below 1.
 */
export function solveInterferenceMilp(highs: Highs, instance: MilpInstance): MilpAnswer {
  const n = instance.abundance.length;
  const solution = highs.solve(interferenceMilp(instance), {
    output_flag: false,
    mip_rel_gap: 0,
    mip_abs_gap: 0,
    mip_feasibility_tolerance: 1e-9,
  });
  if (solution.Status !== 'Optimal') return { status: solution.Status, objectiveValue: NaN, design: null };
  const design = { probe: new Array<number>(n).fill(-1), channel: new Array<number>(n).fill(-1) };
  for (const [name, column] of Object.entries(solution.Columns)) {
    const m = /^x_(\d+)_(\d+)_(\d+)$/.exec(name);
    if (!m || !('Primal' in column) || column.Primal < 0.5) continue;
    design.probe[Number(m[1])] = Number(m[2]);
    design.channel[Number(m[1])] = Number(m[3]);
  }
  return { status: solution.Status, objectiveValue: solution.ObjectiveValue, design };
}

/** max over ordered pairs t ≠ u of I(t→u) for a complete assignment (the objective's definition, written here). */
export function assignmentWorst(instance: MilpInstance, design: { probe: number[]; channel: number[] }): number {
  const { collected, abundance } = instance;
  let worst = 0;
  for (let u = 0; u < abundance.length; u++) {
    const own = abundance[u] * collected[design.channel[u]][design.probe[u]];
    for (let t = 0; t < abundance.length; t++) {
      if (t !== u) worst = Math.max(worst, (abundance[t] * collected[design.channel[u]][design.probe[t]]) / own);
    }
  }
  return worst;
}

export { loadHighs };
