// The detection strip's windows and lanes, and the two-way curve-height choice, as the chart and page use them.
import { afterEach, describe, expect, it } from 'vitest';
import { detectionWindows, halfMaximumSpanNm, laneCount, MAX_LANES } from '../../web/chart/detection-strip';
import type { ChartPassband } from '../../web/chart/types';
import '../../web/elements/height-toggle';

/** A channel with a bandpass's two editable edges at loNm and hiNm (its transmission is not read). */
function bandpass(id: string, loNm: number, hiNm: number): ChartPassband {
  return {
    id,
    label: id,
    transmission: { startNm: 300, stepNm: 1, values: [] },
    handles: [
      { channelIndex: 0, filterIndex: 0, edge: 'low', wavelengthNm: loNm },
      { channelIndex: 0, filterIndex: 0, edge: 'high', wavelengthNm: hiNm },
    ],
  };
}

afterEach(() => document.body.replaceChildren());

describe('detectionWindows', () => {
  it('spans each window from its lower to its upper edge and keeps windows 10 nm apart in one lane', () => {
    const windows = detectionWindows([bandpass('a', 500, 520), bandpass('b', 530, 550)], 5);
    expect(windows.map((w) => [w.id, w.loNm, w.hiNm, w.lane])).toEqual([
      ['a', 500, 520, 0],
      ['b', 530, 550, 0],
    ]);
  });

  it('puts overlapping windows, and windows closer than the gap, in different lanes', () => {
    const windows = detectionWindows([bandpass('a', 500, 540), bandpass('b', 520, 560), bandpass('c', 543, 580)], 5);
    const lane = Object.fromEntries(windows.map((w) => [w.id, w.lane]));
    expect(lane.a).not.toBe(lane.b);
    expect(lane.c).not.toBe(lane.a); // 3 nm after a ends: closer than the 5 nm gap
    expect(lane.c).not.toBe(lane.b); // overlaps b
  });

  it(`never uses more than ${MAX_LANES} lanes, however many windows overlap`, () => {
    const windows = detectionWindows(
      Array.from({ length: 8 }, (_, i) => bandpass(`c${i}`, 500 + i, 600 + i)),
      5,
    );
    expect(laneCount(windows)).toBe(MAX_LANES);
  });

  it('spans a measured channel (no edges) where it passes at least half its best transmission', () => {
    const values = Array.from({ length: 400 }, (_, i) => (i >= 200 && i <= 240 ? 0.8 : i >= 195 && i <= 245 ? 0.3 : 0));
    expect(halfMaximumSpanNm({ startNm: 300, stepNm: 1, values })).toEqual([500, 540]);
    expect(halfMaximumSpanNm({ startNm: 300, stepNm: 1, values: values.map(() => 0) })).toBeNull();
  });
});

describe('<qdp-height-toggle>', () => {
  it('marks "expected signal" chosen and fires heights-change {byBrightness: false} on "shape only"', async () => {
    const el = document.createElement('qdp-height-toggle');
    document.body.appendChild(el);
    await el.updateComplete;
    const seen: boolean[] = [];
    el.addEventListener('heights-change', (e) =>
      seen.push((e as CustomEvent<{ byBrightness: boolean }>).detail.byBrightness),
    );
    const [signal, shape] = [...el.shadowRoot!.querySelectorAll('label')];
    expect(signal.textContent).toContain('expected signal');
    expect(signal.querySelector('input')!.checked).toBe(true);
    shape.querySelector('input')!.click();
    expect(seen).toEqual([false]);
  });
});
