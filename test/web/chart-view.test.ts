// The spectra chart's pure view functions: the range that follows the panel and the log value axis.
import { describe, expect, it } from 'vitest';
import { autoRangeNm } from '../../web/chart/auto-range';
import { chartGeometry } from '../../web/chart/geometry';
import type { ChartPassband } from '../../web/chart/types';

/** A Gaussian of peak 1 on a 1 nm grid over 300–1000 nm (test data only). */
function gaussian(peakNm: number, fwhmNm: number) {
  const s = fwhmNm / (2 * Math.sqrt(2 * Math.LN2));
  return {
    startNm: 300,
    stepNm: 1,
    values: Array.from({ length: 701 }, (_, i) => Math.exp(-0.5 * ((300 + i - peakNm) / s) ** 2)),
  };
}

const band = (loNm: number, hiNm: number, withHandles = true): ChartPassband => ({
  id: `b${loNm}`,
  label: `band ${loNm}`,
  transmission: {
    startNm: 300,
    stepNm: 1,
    values: Array.from({ length: 701 }, (_, i) => (300 + i >= loNm && 300 + i <= hiNm ? 0.9 : 0)),
  },
  handles: withHandles
    ? [
        { channelIndex: 0, filterIndex: 0, edge: 'low', wavelengthNm: loNm },
        { channelIndex: 0, filterIndex: 0, edge: 'high', wavelengthNm: hiNm },
      ]
    : [],
});

describe('autoRangeNm: the range that follows the panel', () => {
  it('autoRangeNm(525 and 800 nm probes, 405 nm line) is 390–870 nm: the 800 nm tail reaches 1 % at 851 nm', () => {
    // The 800 nm probe (FWHM 40 nm, σ = 16.99 nm) falls to 1 % of its peak at 800 + σ·√(2 ln 100) = 851.6 nm: the last
    // whole nm at or above 1 % is 851; + 10 nm padding = 861, rounded up to 870. The line at 405 − 10 = 395 → 390.
    const curves = [{ spectrum: gaussian(525, 30) }, { spectrum: gaussian(800, 40) }];
    expect(autoRangeNm(curves, [], [405])).toEqual([390, 870]);
  });

  it('autoRangeNm(520 and 630 nm probes, 488 nm line, 605/20 band) is 470–680 nm, inside 380–800', () => {
    // 1 % tails of FWHM-30 Gaussians: 520 − 38.7 = 481.3 (first whole nm 482) and 630 + 38.7 = 668.7 (last 668); the
    // line at 488 and the band edges at 595 and 615 lie inside. 482 − 10 → 470; 668 + 10 → 680.
    const curves = [{ spectrum: gaussian(520, 30) }, { spectrum: gaussian(630, 30) }];
    expect(autoRangeNm(curves, [band(595, 615)], [488])).toEqual([470, 680]);
  });

  it('autoRangeNm(a 950 nm probe and a 340 nm line) is clamped to 350–900 nm', () => {
    expect(autoRangeNm([{ spectrum: gaussian(950, 40) }], [], [340])).toEqual([350, 900]);
  });

  it('autoRangeNm(nothing) is 380–800 nm, and a lone 355 nm line widens to 100 nm without leaving 350–900', () => {
    expect(autoRangeNm([], [], [])).toEqual([380, 800]);
    // 355 ± 10 → 340–370, grown by 35 nm a side to 300–410, slid up to start at the 350 nm limit.
    expect(autoRangeNm([], [], [355])).toEqual([350, 460]);
  });

  it('autoRangeNm(a measured band without handles, 700–760 nm at 0.9) uses its half-maximum ends', () => {
    expect(autoRangeNm([], [band(700, 760, false)], [650])).toEqual([640, 770]);
  });
});

describe('chartGeometry: the log value axis', () => {
  const plot = { heightPx: 300, bottomPx: 300 - 40, topPx: 14 };
  const geometry = (log: boolean) =>
    chartGeometry({ curves: [gaussian(600, 40)], passbands: [], shared: [] }, [400, 800], 800, plot.heightPx, log);

  it('on the log axis (1e-4 to 1 × the tallest curve) a value 1e-3 of the peak lands a quarter of the way up', () => {
    const g = geometry(true);
    // log10(1e-3 / 1e-4) / log10(1 / 1e-4) = 1/4 of the plot height above its bottom.
    const expected = plot.bottomPx - ((Math.log10(1e-3) - Math.log10(1e-4)) / 4) * (plot.bottomPx - plot.topPx);
    expect(g.yEmission(1e-3)).toBeCloseTo(expected, 6);
    expect(g.yEmission(1)).toBeCloseTo(plot.topPx, 6);
    // A transmission of 1 % is half way up its four decades.
    expect(g.yTransmission(0.01)).toBeCloseTo((plot.bottomPx + plot.topPx) / 2, 6);
  });

  it('on the log axis values below 1e-4 of the peak, and 0, are drawn at the floor (the bottom of the plot)', () => {
    const g = geometry(true);
    expect(g.yEmission(1e-7)).toBeCloseTo(plot.bottomPx, 6);
    expect(g.yEmission(0)).toBeCloseTo(plot.bottomPx, 6);
    expect(g.curvePaths[0]).not.toMatch(/NaN|Infinity/);
  });

  it('on the linear axis (0 to 1.05 × the peak) 1e-3 of the peak sits 1e-3/1.05 of the plot height up', () => {
    const g = geometry(false);
    expect(plot.bottomPx - g.yEmission(1e-3)).toBeCloseTo((1e-3 / 1.05) * (plot.bottomPx - plot.topPx), 6);
  });
});
