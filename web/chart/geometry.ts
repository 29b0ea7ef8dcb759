/**
 * Scales and path strings of the spectra chart (d3-scale, d3-shape), built once per change of data, scale or size.
 * On the log scale a value below the floor (a fraction of the axis top) is drawn at the floor, so spillover tails
 * decades below a peak stay readable without the curve running off the plot.
 */
import { scaleLinear, scaleLog, type ScaleContinuousNumeric } from 'd3-scale';
import { area, line } from 'd3-shape';
import type { SampledSpectrum } from '../../spectra/index';

/** Plot margins in px: room for the axes' tick labels and titles. */
export const MARGIN = { top: 14, right: 46, bottom: 40, left: 52 };

/**
 * Bottom of the log axes as a fraction of their top: four decades, i.e. a passband blocking to OD 4, which covers the
 * spillover fractions the crosstalk tables print (from 0.1 %) with a decade to spare (our convention).
 */
export const LOG_FLOOR_FRACTION = 1e-4;

/** A numeric scale from value to px: linear or log. */
export type ValueScale = ScaleContinuousNumeric<number, number>;

/** Everything the chart's template needs, in px. */
export interface ChartGeometry {
  x: ScaleContinuousNumeric<number, number>;
  yEmission: ValueScale;
  yTransmission: ValueScale;
  curvePaths: string[];
  /** The same curves closed down to the axis, for their soft fill. */
  curveAreas: string[];
  /** Each channel's transmission as a line (an outline, not a shaded box) on the transmission axis. */
  passbandPaths: string[];
  /** Lines (not areas) on the transmission axis: the shared light path's parts. */
  sharedPaths: string[];
  backgroundPath: string;
}

/** What the chart draws, before scaling. */
export interface ChartLayers {
  curves: readonly SampledSpectrum[];
  passbands: readonly SampledSpectrum[];
  shared: readonly SampledSpectrum[];
  background?: SampledSpectrum;
}

/** Points of a grid curve inside [loNm, hiNm], every `stride`-th sample (enough for a few px per point). */
function pointsOf(c: SampledSpectrum, loNm: number, hiNm: number, stride: number): [number, number][] {
  const out: [number, number][] = [];
  for (let i = 0; i < c.values.length; i += stride) {
    const nm = c.startNm + i * c.stepNm;
    if (nm >= loNm && nm <= hiNm) out.push([nm, c.values[i]]);
  }
  return out;
}

/**
 * A value axis from 0 (linear) or from LOG_FLOOR_FRACTION × top (log) up to `top`, onto [bottomPx, topPx], with
 * values below the log floor clamped to it.
 */
export function valueScale(top: number, log: boolean, bottomPx: number, topPx: number): ValueScale {
  if (!log) return scaleLinear().domain([0, top]).range([bottomPx, topPx]);
  return scaleLog()
    .domain([top * LOG_FLOOR_FRACTION, top])
    .range([bottomPx, topPx])
    .clamp(true);
}

/** Path kinds a spectrum can be drawn as. */
type PathKind = 'line' | 'area' | 'transmission';

/**
 * The last path of each spectrum object and kind, with the scales it was drawn for: the page hands the chart the same
 * object for a curve or passband whose values did not change, so an edit of one probe redraws one curve, not all.
 */
const drawn = new WeakMap<SampledSpectrum, Partial<Record<PathKind, { scales: string; path: string }>>>();

function pathOf(c: SampledSpectrum, kind: PathKind, scales: string, build: () => string): string {
  const paths = drawn.get(c) ?? {};
  const hit = paths[kind];
  if (hit?.scales === scales) return hit.path;
  const path = build();
  paths[kind] = { scales, path };
  drawn.set(c, paths);
  return path;
}

/** Builds scales and paths for a plot of `widthPx` × `heightPx` over `domainNm`, on linear or log value axes. */
export function chartGeometry(
  layers: ChartLayers,
  domainNm: [number, number],
  widthPx: number,
  heightPx: number,
  log = false,
): ChartGeometry {
  const x = scaleLinear()
    .domain(domainNm)
    .range([MARGIN.left, Math.max(MARGIN.left + 10, widthPx - MARGIN.right)]);
  let maxValue = 0;
  for (const c of [...layers.curves, ...(layers.background ? [layers.background] : [])]) {
    for (let i = 0; i < c.values.length; i++) if (c.values[i] > maxValue) maxValue = c.values[i];
  }
  const bottomPx = heightPx - MARGIN.bottom;
  // The linear axis leaves 5 % headroom over the tallest curve; the log axis ends at it.
  const top = maxValue > 0 ? maxValue * (log ? 1 : 1.05) : 1;
  const yEmission = valueScale(top, log, bottomPx, MARGIN.top);
  const yTransmission = valueScale(1, log, bottomPx, MARGIN.top);
  // Sample a 1 nm grid at most once per px: keeps paths short on a phone.
  const stride = (c: SampledSpectrum) => Math.max(1, Math.floor((domainNm[1] - domainNm[0]) / c.stepNm / widthPx));
  const along = (c: SampledSpectrum) => pointsOf(c, domainNm[0], domainNm[1], stride(c));
  // On the log scale the clamp puts 0 (and any value below the floor) on the bottom of the plot.
  const curveLine = line<[number, number]>()
    .x((d) => x(d[0]))
    .y((d) => yEmission(d[1]));
  const transmissionLine = line<[number, number]>()
    .x((d) => x(d[0]))
    .y((d) => yTransmission(d[1]));
  const curveArea = area<[number, number]>()
    .x((d) => x(d[0]))
    .y0(bottomPx)
    .y1((d) => yEmission(d[1]));
  const onAxes = `${domainNm.join()}|${widthPx}|${heightPx}|${log}`;
  const emission = (c: SampledSpectrum, kind: 'line' | 'area') =>
    pathOf(c, kind, `${onAxes}|${top}`, () => (kind === 'line' ? curveLine : curveArea)(along(c)) ?? '');
  const transmission = (c: SampledSpectrum) =>
    pathOf(c, 'transmission', onAxes, () => transmissionLine(along(c)) ?? '');
  return {
    x,
    yEmission,
    yTransmission,
    curvePaths: layers.curves.map((c) => emission(c, 'line')),
    curveAreas: layers.curves.map((c) => emission(c, 'area')),
    passbandPaths: layers.passbands.map(transmission),
    sharedPaths: layers.shared.map(transmission),
    backgroundPath: layers.background ? emission(layers.background, 'area') : '',
  };
}
