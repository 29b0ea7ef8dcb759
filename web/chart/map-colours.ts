/**
 * The colour scale of the abundance and residual maps: cividis (Nuñez, Anderton & Renslow, "Optimizing colormaps with
 * consideration for color vision deficiency to enable accurate interpretation of scientific data", PLoS ONE 2018,
 * 13(7): e0199239), whose lightness rises monotonically from dark blue to yellow, so a map reads the same printed in
 * grey. Here it is six stops of the published map, linear in sRGB between them: the stop values are approximate
 * (8-bit, as remembered, not checked against the authors' table); the tests check that CIELAB lightness rises along
 * the whole ramp.
 */

/** Six sRGB stops at 0, 0.2, …, 1 (approximate, see above). */
export const CIVIDIS_STOPS: readonly (readonly [number, number, number])[] = [
  [0, 34, 78],
  [53, 69, 108],
  [102, 105, 112],
  [148, 142, 119],
  [200, 184, 102],
  [254, 232, 56],
];

/** The ramp's colour at t in [0, 1] (clamped) as [r, g, b] 0–255. */
export function rampColour(t: number): [number, number, number] {
  const x = Math.min(1, Math.max(0, Number.isFinite(t) ? t : 0)) * (CIVIDIS_STOPS.length - 1);
  const i = Math.min(CIVIDIS_STOPS.length - 2, Math.floor(x));
  const f = x - i;
  const [a, b] = [CIVIDIS_STOPS[i], CIVIDIS_STOPS[i + 1]];
  return [0, 1, 2].map((k) => Math.round(a[k] + (b[k] - a[k]) * f)) as [number, number, number];
}

/** The smallest and largest finite values of a plane (0 and 0 when it has none). */
export function planeRange(plane: ArrayLike<number>): { min: number; max: number } {
  let min = Infinity;
  let max = -Infinity;
  for (let k = 0; k < plane.length; k++) {
    const v = plane[k];
    if (v < min) min = v;
    if (v > max) max = v;
  }
  return Number.isFinite(min) ? { min, max } : { min: 0, max: 0 };
}

/**
 * RGBA pixels of a plane on the ramp from `min` (darkest) to `max` (lightest); a value that is not finite is drawn
 * mid grey with no ramp colour, so a missing pixel does not read as a value.
 */
export function mapPixels(plane: ArrayLike<number>, min: number, max: number): Uint8ClampedArray<ArrayBuffer> {
  const rgba = new Uint8ClampedArray(plane.length * 4);
  const span = max > min ? max - min : 1;
  const lut = Array.from({ length: 256 }, (_, k) => rampColour(k / 255));
  for (let k = 0; k < plane.length; k++) {
    const v = plane[k];
    const [r, g, b] = Number.isFinite(v) ? (lut[Math.round(((v - min) / span) * 255)] ?? lut[0]) : [128, 128, 128];
    rgba.set([r, g, b, 255], 4 * k);
  }
  return rgba;
}
