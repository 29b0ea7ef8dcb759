/**
 * Thins a measured [nm, value] table for links and stored panels: at most MAX_LINK_POINTS evenly spaced points over
 * the same range (values from the spectral library's resampleTable), rounded so the link text stays short.
 */
import { resampleTable, type SpectrumPoints } from '../../spectra/index';

/** Most points a table keeps in a link: our choice, enough for a smooth 300–1000 nm curve, short in a URL. */
export const MAX_LINK_POINTS = 200;

/** The table itself when it is short enough; otherwise `maxPoints` evenly spaced points, rounded. */
export function thinTable(points: SpectrumPoints, maxPoints = MAX_LINK_POINTS): SpectrumPoints {
  if (points.length <= maxPoints) return points;
  const first = points[0][0];
  const span = points[points.length - 1][0] - first;
  // Each wavelength is written from the spacing itself (first + k × span / (maxPoints − 1)), as links always wrote
  // it, so a panel keeps its link text: resampleTable ends exactly on the last wavelength, which can round 0.01 nm
  // apart when that wavelength ends in a 5 at its third decimal. 0.01 nm and 5 significant digits are below any
  // measurement's precision.
  return resampleTable(points, maxPoints).map(([, v], k) => [
    Math.round((first + (span * k) / (maxPoints - 1)) * 100) / 100,
    Number(v.toPrecision(5)),
  ]);
}
