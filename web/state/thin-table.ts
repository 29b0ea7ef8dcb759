/**
 * Thins an imported [nm, value] table longer than a panel may hold: at most MAX_TABLE_POINTS evenly spaced points over
 * the same range (values from the spectral library's resampleTable), rounded. Links and saved panels are never thinned.
 */
import { LIMITS, resampleTable, type SpectrumPoints } from '../../spectra/index';

/** Most points a measured table in a panel holds (the API's limit). */
export const MAX_TABLE_POINTS = LIMITS.tablePoints;

/** The table itself when it is short enough; otherwise `maxPoints` evenly spaced points, rounded. */
export function thinTable(points: SpectrumPoints, maxPoints: number = MAX_TABLE_POINTS): SpectrumPoints {
  if (points.length <= maxPoints) return points;
  const first = points[0][0];
  const span = points[points.length - 1][0] - first;
  // Each wavelength is written from the spacing itself (first + k × span / (maxPoints − 1)): resampleTable ends
  // exactly on the last wavelength, which can round 0.01 nm apart when that wavelength ends in a 5 at its third
  // decimal. 0.01 nm and 5 significant digits are below any measurement's precision.
  return resampleTable(points, maxPoints).map(([, v], k) => [
    Math.round((first + (span * k) / (maxPoints - 1)) * 100) / 100,
    Number(v.toPrecision(5)),
  ]);
}
