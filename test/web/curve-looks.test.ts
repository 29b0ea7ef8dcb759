// The curves' (colour, dash) assignment and the greedy placement of their peak labels, as plain functions.
import { describe, expect, it } from 'vitest';
import { differenceCiede2000 } from 'culori';
import { curveLooks, PROBE_DASHES, PROBE_PALETTE } from '../../web/chart/curve-looks';
import { overlaps, placePeakLabels, type LabelRequest } from '../../web/chart/peak-labels';
import { LIMITS } from '../../worker/schemas';
import { isNearInfrared } from '../../web/chart/nir';

/**
 * CIEDE2000 colour difference (Sharma, Wu & Dalal, "The CIEDE2000 color-difference formula: implementation notes,
 * supplementary test data, and mathematical observations", Color Res. Appl. 30(1), 2005), as culori computes it.
 */
const deltaE2000 = differenceCiede2000();

/**
 * Smallest difference we accept between curves next to each other by peak: 30 ΔE00, far above the ~1–2 of a
 * just-noticeable difference, so the two read as different colours at a glance even on a dim screen (our convention).
 */
const MIN_NEIGHBOUR_DELTA_E = 30;

/** Sixteen peaks 20 nm apart, given out of order. */
const PEAKS_NM = [700, 520, 640, 460, 780, 560, 600, 480, 740, 660, 500, 580, 620, 720, 540, 680];

/** The looks of PEAKS_NM listed from the bluest peak to the reddest. */
function looksByPeak() {
  const looks = curveLooks(PEAKS_NM);
  return PEAKS_NM.map((nm, i) => ({ nm, ...looks[i] })).sort((a, b) => a.nm - b.nm);
}

describe('curveLooks', () => {
  it('neighbours by peak never share a dash pattern', () => {
    const sorted = looksByPeak();
    for (let i = 1; i < sorted.length; i++) expect(sorted[i].dash).not.toBe(sorted[i - 1].dash);
  });

  it(`neighbours by peak differ in colour by more than ${MIN_NEIGHBOUR_DELTA_E} CIEDE2000`, () => {
    const sorted = looksByPeak();
    for (let i = 1; i < sorted.length; i++) {
      expect(deltaE2000(sorted[i].stroke, sorted[i - 1].stroke)).toBeGreaterThan(MIN_NEIGHBOUR_DELTA_E);
    }
  });

  it('gives every probe of a full panel its own (colour, dash) pair', () => {
    const peaks = Array.from({ length: LIMITS.probes }, (_, i) => 450 + 15 * i);
    const pairs = new Set(curveLooks(peaks).map((l) => `${l.stroke}|${l.dash}`));
    expect(pairs.size).toBe(LIMITS.probes);
  });

  it('the bluest curve gets the first colour and a solid line whatever the input order', () => {
    const looks = curveLooks([650, 480, 560]);
    expect(looks[1]).toEqual({ stroke: PROBE_PALETTE[0], dash: 'none' });
    expect(looks[2]).toEqual({ stroke: PROBE_PALETTE[1], dash: PROBE_DASHES[1] });
    expect(looks[0]).toEqual({ stroke: PROBE_PALETTE[2], dash: PROBE_DASHES[2] });
  });
});

describe('placePeakLabels', () => {
  const area = { left: 50, right: 750, top: 10, bottom: 260, lineHeightPx: 12 };
  const request = (id: string, x: number, y: number): LabelRequest => ({
    id,
    text: id,
    peakXPx: x,
    peakYPx: y,
    widthPx: 60,
  });

  it('puts a lone label centred over its peak, 4 px above it', () => {
    const [placed] = placePeakLabels([request('a', 300, 100)], area);
    expect(placed.xPx).toBe(300);
    expect(placed.yPx).toBe(96);
  });

  it('moves a label off one already placed at the same spot, so no two boxes overlap', () => {
    const requests = [request('a', 300, 100), request('b', 310, 101), request('c', 320, 102), request('d', 700, 40)];
    const placed = placePeakLabels(requests, area);
    expect(placed.map((p) => p.id).sort()).toEqual(['a', 'b', 'c', 'd']);
    for (let i = 0; i < placed.length; i++) {
      for (let j = i + 1; j < placed.length; j++) expect(overlaps(placed[i].box, placed[j].box)).toBe(false);
    }
  });

  it('keeps every placed box inside the plot, the one near the right edge pulled left', () => {
    const placed = placePeakLabels([request('edge', 745, 30)], area);
    expect(placed[0].box.right).toBeLessThanOrEqual(area.right);
    expect(placed[0].box.top).toBeGreaterThanOrEqual(area.top);
  });

  it('leaves a label off when every slot near its peak is taken', () => {
    const crowd = Array.from({ length: 30 }, (_, i) => request(`p${i}`, 300, 130));
    const placed = placePeakLabels(crowd, area);
    expect(placed.length).toBeLessThan(crowd.length);
    expect(placed.length).toBeGreaterThan(1);
  });
});

describe('isNearInfrared', () => {
  it('marks peaks from 700 nm on, and not 699 nm', () => {
    expect(isNearInfrared(700)).toBe(true);
    expect(isNearInfrared(760)).toBe(true);
    expect(isNearInfrared(699)).toBe(false);
  });
});
