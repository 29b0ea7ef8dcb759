// The stock bandpass list through the HTTP API on the real runtime.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { listStockBandpasses } from '../../spectra/index';
import { StockFilterList } from '../../worker/schemas/index';
import { freshPersistDir, startWorker, type RunningWorker } from './helpers/worker';

let worker: RunningWorker;

beforeAll(async () => {
  worker = await startWorker(freshPersistDir());
});
afterAll(async () => {
  await worker?.dispose();
});

describe('GET /api/v1/filters/stock', () => {
  it('answers the library’s stock list in its schema, with a note naming no maker', async () => {
    const res = await worker.call('/api/v1/filters/stock');
    expect(res.status).toBe(200);
    const body = StockFilterList.parse(await res.json());
    expect(body.bandpasses).toEqual(listStockBandpasses());
    expect(body.note).toMatch(/common practice/);
  });
});
