/**
 * Scales and path strings of the spectra chart (d3-scale, d3-shape), built once per change of data or size.
 */
import { scaleLinear, type ScaleLinear } from 'd3-scale';
import { area, line } from 'd3-shape';
import type { SampledSpectrum } from '../../spectra/index';
import type { ChartCurve, ChartPassband } from './types';

/** Plot margins in px: room for the axes' tick labels and titles. */
export const MARGIN = { top: 14, right: 46, bottom: 40, left: 52 };

/** Everything the chart's template needs, in px. */
export interface ChartGeometry {
  x: ScaleLinear<number, number>;
  yEmission: ScaleLinear<number, number>;
  yTransmission: ScaleLinear<number, number>;
  curvePaths: string[];
  passbandPaths: string[];
  backgroundPath: string;
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

/** Builds scales and paths for a plot of `widthPx` × `heightPx` over `domainNm`. */
export function chartGeometry(
  curves: readonly ChartCurve[],
  passbands: readonly ChartPassband[],
  background: SampledSpectrum | undefined,
  domainNm: [number, number],
  widthPx: number,
  heightPx: number,
): ChartGeometry {
  const x = scaleLinear()
    .domain(domainNm)
    .range([MARGIN.left, Math.max(MARGIN.left + 10, widthPx - MARGIN.right)]);
  let maxValue = 0;
  for (const c of [...curves.map((c) => c.spectrum), ...(background ? [background] : [])]) {
    for (let i = 0; i < c.values.length; i++) if (c.values[i] > maxValue) maxValue = c.values[i];
  }
  const yEmission = scaleLinear()
    .domain([0, maxValue > 0 ? maxValue * 1.05 : 1])
    .range([heightPx - MARGIN.bottom, MARGIN.top]);
  const yTransmission = scaleLinear()
    .domain([0, 1])
    .range([heightPx - MARGIN.bottom, MARGIN.top]);
  // Sample a 1 nm grid at most once per px: keeps paths short on a phone.
  const stride = (c: SampledSpectrum) => Math.max(1, Math.floor((domainNm[1] - domainNm[0]) / c.stepNm / widthPx));
  const curveLine = line<[number, number]>()
    .x((d) => x(d[0]))
    .y((d) => yEmission(d[1]));
  const bandArea = area<[number, number]>()
    .x((d) => x(d[0]))
    .y0(yTransmission(0))
    .y1((d) => yTransmission(d[1]));
  const bgArea = area<[number, number]>()
    .x((d) => x(d[0]))
    .y0(yEmission(0))
    .y1((d) => yEmission(d[1]));
  return {
    x,
    yEmission,
    yTransmission,
    curvePaths: curves.map((c) => curveLine(pointsOf(c.spectrum, domainNm[0], domainNm[1], stride(c.spectrum))) ?? ''),
    passbandPaths: passbands.map(
      (p) => bandArea(pointsOf(p.transmission, domainNm[0], domainNm[1], stride(p.transmission))) ?? '',
    ),
    backgroundPath: background
      ? (bgArea(pointsOf(background, domainNm[0], domainNm[1], stride(background))) ?? '')
      : '',
  };
}
