/**
 * Thins a measured [nm, value] table to at most `maxPoints` by linear interpolation at evenly spaced wavelengths
 * over the same range, so large imported spectra stay small in links and stored panels.
 */
export const MAX_LINK_POINTS = 200;

/** Returns the table unchanged when it is already short enough; otherwise `maxPoints` evenly spaced samples. */
export function resamplePoints(points: [number, number][], maxPoints = MAX_LINK_POINTS): [number, number][] {
  if (points.length <= maxPoints) return points;
  const startNm = points[0][0];
  const endNm = points[points.length - 1][0];
  const out: [number, number][] = [];
  let j = 0;
  for (let i = 0; i < maxPoints; i++) {
    const nm = startNm + ((endNm - startNm) * i) / (maxPoints - 1);
    while (j < points.length - 2 && points[j + 1][0] < nm) j++;
    const [x0, y0] = points[j];
    const [x1, y1] = points[j + 1];
    const f = x1 === x0 ? 0 : Math.min(1, Math.max(0, (nm - x0) / (x1 - x0)));
    // Rounded so the link text stays short: 0.01 nm and 5 significant digits are below any measurement's precision.
    out.push([Math.round(nm * 100) / 100, Number((y0 + (y1 - y0) * f).toPrecision(5))]);
  }
  return out;
}
