import { describe, expect, it } from 'vitest';
import { isStockBandpass, listStockBandpasses, nearestStockBandpass } from '../../spectra/index';

describe('stock bandpass sizes (common practice: centres every 5 nm, widths in a short series)', () => {
  it('605/20, 525/50 and 700/75 are stock sizes; 589/34 and 712.5/25 are custom', () => {
    expect([isStockBandpass(605, 20), isStockBandpass(525, 50), isStockBandpass(700, 75)]).toEqual([true, true, true]);
    expect([isStockBandpass(589, 34), isStockBandpass(712.5, 25)]).toEqual([false, false]);
  });

  it('the nearest stock size of 589/34 is 590/30 and of 712.5/25 is 715/25 (centre to 5 nm, half up)', () => {
    expect(nearestStockBandpass(589, 34)).toEqual({ centerNm: 590, widthNm: 30 });
    expect(nearestStockBandpass(712.5, 25)).toEqual({ centerNm: 715, widthNm: 25 });
  });

  it('the list holds every centre from 380 to 850 nm in 5 nm steps with each of the 9 widths, no duplicates', () => {
    const list = listStockBandpasses();
    expect(list).toHaveLength(((850 - 380) / 5 + 1) * 9);
    expect(new Set(list.map((b) => `${b.centerNm}/${b.widthNm}`)).size).toBe(list.length);
    expect(list.every((b) => isStockBandpass(b.centerNm, b.widthNm))).toBe(true);
  });
});
