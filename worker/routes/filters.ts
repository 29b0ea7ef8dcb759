import { Hono } from 'hono';
import { STOCK_BANDPASS_RULE, listStockBandpasses } from '../../spectra/index';
import type { AppEnv } from '../env';

/** What the stock list is, said once for the API and the page. */
export const STOCK_NOTE =
  'Stock bandpass sizes as commonly kept (common practice, approximate: centres every 5 nm, widths in a short ' +
  'series); no maker or part number. Other sizes are custom: orderable, usually made to order.';

/** GET /api/v1/filters/stock: the stock bandpass sizes (centre/width pairs) and the rule they follow. */
export const filters = new Hono<AppEnv>().get('/stock', (c) =>
  c.json({
    rule: {
      centerStepNm: STOCK_BANDPASS_RULE.centerStepNm,
      centerRangeNm: [...STOCK_BANDPASS_RULE.centerRangeNm],
      widthsNm: [...STOCK_BANDPASS_RULE.widthsNm],
    },
    bandpasses: listStockBandpasses(),
    note: STOCK_NOTE,
  }),
);
