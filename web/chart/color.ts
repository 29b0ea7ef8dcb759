/**
 * Display colour of a wavelength: CIE 1931 2° colour-matching functions (analytic multi-lobe fit) → XYZ → sRGB.
 * Monochromatic light lies outside the sRGB gamut, so the colour is desaturated towards white just enough to fit and
 * then scaled so its brightest channel is 1: a hue for telling curves apart, not a colorimetric rendering.
 */

/** Piecewise Gaussian with different widths below and above the mean (Wyman, Sloan, Shirley, JCGT 2013, eq. 2). */
function lobe(wavelengthNm: number, meanNm: number, sigmaBelowNm: number, sigmaAboveNm: number): number {
  const t = (wavelengthNm - meanNm) / (wavelengthNm < meanNm ? sigmaBelowNm : sigmaAboveNm);
  return Math.exp(-0.5 * t * t);
}

/**
 * CIE 1931 2° colour-matching functions x̄, ȳ, z̄ at one wavelength, from the multi-lobe fit of
 * Wyman, Sloan, Shirley, "Simple Analytic Approximations to the CIE XYZ Color Matching Functions", JCGT 2(2), 2013
 * (coefficients of its 1931 multi-lobe fit, eq. 2; typed in from memory and checked in the tests against the CIE
 * table).
 */
export function cie1931Cmf(wavelengthNm: number): [number, number, number] {
  const l = wavelengthNm;
  const x =
    1.056 * lobe(l, 599.8, 37.9, 31.0) + 0.362 * lobe(l, 442.0, 16.0, 26.7) - 0.065 * lobe(l, 501.1, 20.4, 26.2);
  const y = 0.821 * lobe(l, 568.8, 46.9, 40.5) + 0.286 * lobe(l, 530.9, 16.3, 31.1);
  const z = 1.217 * lobe(l, 437.0, 11.8, 36.0) + 0.681 * lobe(l, 459.0, 26.0, 13.8);
  return [x, y, z];
}

/** XYZ (D65 white) to linear sRGB, the matrix of IEC 61966-2-1:1999 (sRGB), clause 5.2. */
export function xyzToLinearSrgb([x, y, z]: readonly [number, number, number]): [number, number, number] {
  return [
    3.2406 * x - 1.5372 * y - 0.4986 * z,
    -0.9689 * x + 1.8758 * y + 0.0415 * z,
    0.0557 * x - 0.204 * y + 1.057 * z,
  ];
}

/** sRGB transfer function (IEC 61966-2-1:1999): linear 0–1 to encoded 0–1. */
export function srgbEncode(linear: number): number {
  const c = Math.min(1, Math.max(0, linear));
  return c <= 0.0031308 ? 12.92 * c : 1.055 * Math.pow(c, 1 / 2.4) - 0.055;
}

/** Beyond this the eye barely sees the light (ȳ < 0.005 past ~690 nm): curves there get the near-infrared style. */
export const NIR_START_NM = 700;

/** True when a curve peaking at `peakNm` is drawn in the near-infrared style (dashed dark grey). */
export function isNearInfrared(peakNm: number): boolean {
  return peakNm >= NIR_START_NM;
}

/** Encoded sRGB 0–1 triplet for a wavelength, normalised for display (brightest channel 1). */
export function wavelengthToDisplayRgb(wavelengthNm: number): [number, number, number] {
  const lin = xyzToLinearSrgb(cie1931Cmf(wavelengthNm));
  // Add white until no channel is negative: the nearest in-gamut colour of the same hue, roughly.
  const lift = Math.max(0, -Math.min(...lin));
  const lifted = lin.map((c) => c + lift);
  const max = Math.max(...lifted);
  if (!(max > 0)) return [0, 0, 0];
  return lifted.map((c) => srgbEncode(c / max)) as [number, number, number];
}

/** Near-infrared curves: one dark grey, told apart by the dash pattern and the legend note. */
export const NIR_COLOR = '#4a4a4a';

/** CSS hex colour for a curve peaking at `peakNm` (the near-infrared grey beyond NIR_START_NM). */
export function wavelengthToCss(peakNm: number): string {
  if (!Number.isFinite(peakNm)) return NIR_COLOR;
  if (isNearInfrared(peakNm)) return NIR_COLOR;
  const hex = (v: number) =>
    Math.round(v * 255)
      .toString(16)
      .padStart(2, '0');
  const [r, g, b] = wavelengthToDisplayRgb(peakNm);
  return `#${hex(r)}${hex(g)}${hex(b)}`;
}
