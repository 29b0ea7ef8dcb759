/**
 * An axis's ticks as plain data (value, position in px, label) for the chart to draw with Lit's `svg`: the scale's
 * own tick values and number format (d3-scale), so a log axis labels its decades and leaves the steps between blank.
 */
import type { ScaleContinuousNumeric } from 'd3-scale';

/** One tick: its value, where it sits (px) and its label ('' for an unlabelled log step). */
export interface AxisTick {
  value: number;
  px: number;
  label: string;
}

/** About `count` ticks of `scale`, labelled with the d3-format `specifier` (the scale's default when omitted). */
export function axisTicks(
  scale: ScaleContinuousNumeric<number, number>,
  count: number,
  specifier?: string,
): AxisTick[] {
  const format = scale.tickFormat(count, specifier);
  return scale.ticks(count).map((value) => ({ value, px: scale(value), label: format(value) }));
}
