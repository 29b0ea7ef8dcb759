/**
 * How each probe's curve is told apart: a (colour, dash pattern) pair from the chart's own palette, handed out in
 * order of emission peak so that curves next to each other on the wavelength axis differ in both. The colour is a
 * label, not the colour of the light: near-infrared probes get palette colours too, and the legend marks them NIR.
 */

/**
 * The probe palette (our own choice): eight colours ordered so that each differs strongly from the next, the last
 * from the first included (every successive pair ≥ 30 CIEDE2000, see test/web/curve-looks.test.ts), each with at
 * least 4.5:1 contrast on white so it can also colour a label's text.
 */
export const PROBE_PALETTE = [
  '#1b6ca8',
  '#b85f00',
  '#2e7d32',
  '#c2185b',
  '#00838f',
  '#8e5bd6',
  '#7a6000',
  '#d23c38',
] as const;

/**
 * Dash patterns, SVG stroke-dasharray (our own choice): solid first, then patterns that stay distinct at 2 px.
 * Five patterns against eight colours (coprime lengths) give 40 distinct pairs before any repeats, more than the
 * panel's probe limit.
 */
export const PROBE_DASHES = ['none', '8 3', '2 2.5', '10 3 2 3', '5 2 1 2 1 2'] as const;

/** One curve's stroke colour and dash pattern. */
export interface CurveLook {
  stroke: string;
  dash: string;
}

/** Input positions sorted by peak wavelength (ties keep input order); a non-finite peak sorts last. */
export function peakOrder(peaksNm: readonly number[]): number[] {
  const key = (i: number) => (Number.isFinite(peaksNm[i]) ? peaksNm[i] : Infinity);
  return peaksNm.map((_, i) => i).sort((a, b) => key(a) - key(b) || a - b);
}

/** The look of the curve at rank `rank` in peak order. */
export function lookAtRank(rank: number): CurveLook {
  return { stroke: PROBE_PALETTE[rank % PROBE_PALETTE.length], dash: PROBE_DASHES[rank % PROBE_DASHES.length] };
}

/** Each curve's look, in input order, assigned by rank of its peak wavelength. */
export function curveLooks(peaksNm: readonly number[]): CurveLook[] {
  const looks = new Array<CurveLook>(peaksNm.length);
  peakOrder(peaksNm).forEach((index, rank) => (looks[index] = lookAtRank(rank)));
  return looks;
}
