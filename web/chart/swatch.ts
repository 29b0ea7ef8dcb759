/**
 * The small drawing of one legend line (28 × 10 px): a curve's soft fill under its dashed outline, a channel's
 * window, or a filled patch, as the plot draws the layer. The on-page legend and the exported chart both draw it.
 */
import { svg } from 'lit';
import { BACKGROUND_LOOK, CHANNEL_LOOK, CURVE_LOOK, type LegendEntry } from './looks';

/** Width and height of a swatch, px. */
export const SWATCH_PX = { width: 28, height: 10 } as const;

/** A legend entry's swatch, in a 28 × 10 box. */
export function legendSwatch(e: LegendEntry) {
  if (e.mark === 'band')
    return svg`<rect x="1" y="1" width="26" height="8" rx="3" fill=${CHANNEL_LOOK.fill}
      fill-opacity=${CHANNEL_LOOK.fillOpacity * 2} stroke=${CHANNEL_LOOK.stroke}></rect>`;
  if (e.mark === 'background')
    return svg`<rect width="28" height="10" fill=${BACKGROUND_LOOK.fill} fill-opacity="0.4"></rect>`;
  const fill =
    e.mark === 'curve' ? svg`<rect y="4" width="28" height="6" fill=${e.stroke} fill-opacity="0.18"></rect>` : '';
  return svg`${fill}<line x1="0" x2="28" y1="4" y2="4" stroke=${e.stroke} stroke-width=${CURVE_LOOK.width + 0.5}
    stroke-dasharray=${e.dash}></line>`;
}
