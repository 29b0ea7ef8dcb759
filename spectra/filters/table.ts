/**
 * A filter given as a measured table [[nm, transmission 0–1], ...] (at most 1,000 points, ascending), linearly
 * interpolated onto the grid. Beyond the table's ends the end values are held: a measured curve usually stops where
 * the filter is already blocking or fully open, and holding is the least surprising guess.
 */
import type { WavelengthGrid } from '../grid';
import { SpectraError } from '../errors';
import type { ConstantEnds } from '../linalg/runs';

/** A measured filter as the panel carries it. */
export interface TableFilterSpec {
  type: 'table';
  points: [number, number][];
}

/** Most points a table filter may carry (api-v1). */
export const MAX_TABLE_POINTS = 1000;

/** Checks a [[nm, value], ...] table: 2–maxPoints rows, finite, nm > 0 strictly ascending, value in [min, max]. */
export function checkTable(
  points: unknown,
  path: (string | number)[],
  range: [number, number],
  maxPoints = MAX_TABLE_POINTS,
): [number, number][] {
  if (!Array.isArray(points) || points.length < 2) {
    throw new SpectraError('invalid_table', 'a table needs at least 2 points [nm, value]', path);
  }
  if (points.length > maxPoints) {
    throw new SpectraError('invalid_table', `a table may have at most ${maxPoints} points, got ${points.length}`, path);
  }
  let previousNm = 0;
  points.forEach((row: unknown, i) => {
    if (!Array.isArray(row) || row.length !== 2 || !row.every((v) => typeof v === 'number' && Number.isFinite(v))) {
      throw new SpectraError('invalid_table', `point ${i} must be [nm, value] with two finite numbers`, [...path, i]);
    }
    const [nm, value] = row as [number, number];
    if (nm <= previousNm) {
      throw new SpectraError(
        'invalid_table',
        `point ${i}: wavelengths must be above 0 and strictly ascending (${nm} nm after ${previousNm} nm)`,
        [...path, i, 0],
      );
    }
    if (value < range[0] || value > range[1]) {
      throw new SpectraError('invalid_table', `point ${i}: value ${value} is outside ${range[0]}–${range[1]}`, [
        ...path,
        i,
        1,
      ]);
    }
    previousNm = nm;
  });
  return points as [number, number][];
}

/** Transmission (0–1) of a measured filter on a grid, end values held beyond the table. */
export function tableTransmission(
  filter: TableFilterSpec,
  grid: WavelengthGrid,
  path: (string | number)[] = [],
  ends?: ConstantEnds,
  out: Float64Array = new Float64Array(grid.count),
): Float64Array {
  const points = checkTable(filter.points, [...path, 'points'], [0, 1]);
  if (ends) {
    // The end values are held beyond the table: constant below its first and above its last wavelength.
    ends.first = Math.min(grid.count, Math.max(0, Math.floor((points[0][0] - grid.startNm) / grid.stepNm)));
    ends.end = Math.max(
      ends.first,
      Math.min(grid.count, Math.ceil((points[points.length - 1][0] - grid.startNm) / grid.stepNm) + 1),
    );
  }
  const n = points.length;
  let j = 0;
  for (let i = 0; i < grid.count; i++) {
    const nm = grid.startNm + i * grid.stepNm;
    if (nm <= points[0][0]) out[i] = points[0][1];
    else if (nm >= points[n - 1][0]) out[i] = points[n - 1][1];
    else {
      while (points[j + 1][0] < nm) j++;
      const [x0, y0] = points[j];
      const [x1, y1] = points[j + 1];
      out[i] = y0 + ((y1 - y0) * (nm - x0)) / (x1 - x0);
    }
  }
  return out;
}
