/**
 * The small drawing of one legend line (28 × 10 px): a line, a shaded band or a filled patch, as the plot draws the
 * layer. The on-page legend and the exported chart both draw it.
 */
import { svg } from 'lit';
import { BACKGROUND_LOOK, BAND_LOOK, type LegendEntry } from './looks';

/** Width and height of a swatch, px. */
export const SWATCH_PX = { width: 28, height: 10 } as const;

/** A legend entry's swatch, in a 28 × 10 box. */
export function legendSwatch(e: LegendEntry) {
  if (e.mark === 'band')
    return svg`<rect x="1" y="1" width="26" height="8" fill=${BAND_LOOK.fill} fill-opacity="0.4"
      stroke=${BAND_LOOK.stroke} stroke-dasharray=${BAND_LOOK.dash}></rect>`;
  if (e.mark === 'background')
    return svg`<rect width="28" height="10" fill=${BACKGROUND_LOOK.fill} fill-opacity="0.4"></rect>`;
  return svg`<line x1="0" x2="28" y1="5" y2="5" stroke=${e.stroke} stroke-width="3" stroke-dasharray=${e.dash}></line>`;
}
