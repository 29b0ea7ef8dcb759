/**
 * Where each curve's name goes on the plot: just above its peak, or, when that spot is taken by an earlier label, the
 * nearest free slot one line higher or lower (a greedy placement, tallest peak first). A label that finds no free
 * slot inside the plot is left off; the legend still names the curve.
 */

/** A label to place: the peak it names (px) and its text's size. */
export interface LabelRequest {
  id: string;
  text: string;
  peakXPx: number;
  peakYPx: number;
  widthPx: number;
}

/** A placed label: the centre of its text's baseline and its box. */
export interface PlacedLabel extends LabelRequest {
  xPx: number;
  yPx: number;
  box: Box;
}

/** An axis-aligned box, px. */
export interface Box {
  left: number;
  top: number;
  right: number;
  bottom: number;
}

/** The plot's edges and the label line's height, px. */
export interface LabelArea extends Box {
  lineHeightPx: number;
}

/** Slots tried above and below the first before a label is left off (our convention). */
const MAX_SHIFT_LINES = 6;

/** Gap between a peak and the baseline of the label above it, px (our convention). */
const PEAK_GAP_PX = 4;

/** Width of a label's text at `fontPx`, estimated from its length (0.6 em a character; no font metrics needed). */
export function estimateTextWidthPx(text: string, fontPx: number): number {
  return text.length * fontPx * 0.6;
}

/** True when two boxes share any area. */
export function overlaps(a: Box, b: Box): boolean {
  return a.left < b.right && b.left < a.right && a.top < b.bottom && b.top < a.bottom;
}

function boxAt(req: LabelRequest, yPx: number, area: LabelArea): Box {
  const half = req.widthPx / 2;
  const x = Math.min(area.right - half, Math.max(area.left + half, req.peakXPx));
  return { left: x - half, right: x + half, top: yPx - area.lineHeightPx, bottom: yPx };
}

/** Baselines to try for one label: above the peak first, then one line higher, lower, higher… */
function candidateBaselines(req: LabelRequest, area: LabelArea): number[] {
  const first = Math.max(area.top + area.lineHeightPx, req.peakYPx - PEAK_GAP_PX);
  const out = [first];
  for (let k = 1; k <= MAX_SHIFT_LINES; k++) out.push(first - k * area.lineHeightPx, first + k * area.lineHeightPx);
  return out.filter((y) => y - area.lineHeightPx >= area.top && y <= area.bottom);
}

/** Places the labels greedily, tallest peak (smallest y) first; returns the placed ones. */
export function placePeakLabels(requests: readonly LabelRequest[], area: LabelArea): PlacedLabel[] {
  const placed: PlacedLabel[] = [];
  const byHeight = [...requests].sort((a, b) => a.peakYPx - b.peakYPx);
  for (const req of byHeight) {
    for (const y of candidateBaselines(req, area)) {
      const box = boxAt(req, y, area);
      if (placed.some((p) => overlaps(p.box, box))) continue;
      placed.push({ ...req, xPx: (box.left + box.right) / 2, yPx: y, box });
      break;
    }
  }
  return placed;
}
