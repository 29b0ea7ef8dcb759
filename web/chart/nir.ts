/**
 * Where the chart's near-infrared stretch begins: past it the eye barely sees the light (the CIE 1931 photopic curve
 * ȳ is below 0.005 beyond about 690 nm, CIE 015:2018 table, value from memory, unverified), so the axis is tinted
 * there and the legend marks such curves NIR.
 */

/** Start of the near-infrared stretch, nm (our convention, rounded from the photopic cut-off above). */
export const NIR_START_NM = 700;

/** True when a curve peaking at `peakNm` is marked near-infrared. */
export function isNearInfrared(peakNm: number): boolean {
  return peakNm >= NIR_START_NM;
}
