/**
 * Stock bandpass sizes: the centre/width pairs fluorescence filters are commonly kept in stock at, as a rule rather
 * than a catalogue. Centres step by 5 nm across the visible and near infrared, and passband widths come in a short
 * series (10, 20, 25, 30, 40, 50, 60, 75, 100 nm). Common practice, M (from memory, unverified); no maker and no part
 * number. A size off the rule is a custom size: orderable, but usually made to order.
 */
export const STOCK_BANDPASS_RULE = Object.freeze({
  centerStepNm: 5,
  centerRangeNm: [380, 850] as const,
  widthsNm: [10, 20, 25, 30, 40, 50, 60, 75, 100] as const,
});

/** One stock bandpass size. */
export interface StockBandpass {
  centerNm: number;
  widthNm: number;
}

/** Every stock bandpass size, by centre then width. */
export function listStockBandpasses(): StockBandpass[] {
  const { centerStepNm, centerRangeNm, widthsNm } = STOCK_BANDPASS_RULE;
  const out: StockBandpass[] = [];
  for (let c = centerRangeNm[0]; c <= centerRangeNm[1]; c += centerStepNm)
    for (const w of widthsNm) out.push({ centerNm: c, widthNm: w });
  return out;
}

/** True when centre and width are a stock size (to 0.01 nm). */
export function isStockBandpass(centerNm: number, widthNm: number): boolean {
  const near = nearestStockBandpass(centerNm, widthNm);
  return Math.abs(near.centerNm - centerNm) < 0.01 && Math.abs(near.widthNm - widthNm) < 0.01;
}

/** The stock size nearest a centre and width: the centre rounded to the step, the width the nearest in the series. */
export function nearestStockBandpass(centerNm: number, widthNm: number): StockBandpass {
  const { centerStepNm, centerRangeNm, widthsNm } = STOCK_BANDPASS_RULE;
  const c = Math.min(centerRangeNm[1], Math.max(centerRangeNm[0], Math.round(centerNm / centerStepNm) * centerStepNm));
  let w: number = widthsNm[0];
  for (const x of widthsNm) if (Math.abs(x - widthNm) < Math.abs(w - widthNm)) w = x;
  return { centerNm: c, widthNm: w };
}
