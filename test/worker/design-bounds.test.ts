// Bounded work per request on the real Workers runtime (workerd via wrangler, real local KV): a design too large for
// one request is refused before any work, an accepted one answers within the API's 2 s while /api/v1/health keeps
// answering, and evaluate's lot-shift check can be left out. Bounds, not benchmarks: speed is measured in the bench.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { LIMITS } from '../../spectra/index';
import { examplePanel } from './helpers/panels';
import { errorOf, freshPersistDir, postJson, startWorker, type RunningWorker } from './helpers/worker';

let worker: RunningWorker;
beforeAll(async () => {
  worker = await startWorker(freshPersistDir());
  // One small design first, so that the isolate's first compilation is not inside a timed request.
  await postJson(worker, '/api/v1/panels/design', freeRequest(2, {}));
});
afterAll(async () => {
  await worker?.dispose();
});

const WORDS = ['high', 'low', 'medium'] as const;

function freeRequest(targets: number, options: Record<string, unknown>) {
  return {
    targets: Array.from({ length: targets }, (_, i) => ({ name: `marker ${i + 1}`, abundance: WORDS[i % 3] })),
    excitation: [{ wavelengthNm: 405 }],
    options,
  };
}

/** 16 targets from 16 CdSe/CdTe dots and 64 bandpasses, asking for the largest node budget the schema takes. */
function largestCatalogRequest() {
  const probes = Array.from({ length: 16 }, (_, i) =>
    i < 8
      ? { id: `dot${i + 1}`, material: 'cdse', emissionPeakNm: 480 + i * 20 }
      : { id: `dot${i + 1}`, material: 'cdte', emissionPeakNm: 640 + (i - 8) * 12 },
  );
  const channels = Array.from({ length: 64 }, (_, i) => ({
    id: `bp${i + 1}`,
    filters: [{ type: 'bandpass', centerNm: 470 + i * 4, widthNm: 20 }],
  }));
  return {
    ...freeRequest(16, { nodeBudget: LIMITS.nodeBudget }),
    candidates: { probes, channels },
  };
}

/**
 * The heaviest accepted design found by a sweep of targets (4–16) and grid steps (2–10 nm) at the largest node budget:
 * it runs to the API's time limit, with the longest stretch of work between pauses among them.
 */
function heaviestAccepted() {
  return freeRequest(12, { peakStepNm: 5, bandStepNm: 5, nodeBudget: LIMITS.nodeBudget });
}

async function timed(request: Promise<Response>): Promise<{ res: Response; ms: number }> {
  const t0 = performance.now();
  const res = await request;
  await res.clone().arrayBuffer();
  return { res, ms: performance.now() - t0 };
}

const design = (body: unknown) => postJson(worker, '/api/v1/panels/design', body);

describe('bounded design requests', () => {
  it('6 free targets, 1 nm grid, nodeBudget 5,000,000: 400 request_too_large in < 2 s saying how to fit', async () => {
    const pinning = freeRequest(6, { peakStepNm: 1, bandStepNm: 1, nodeBudget: 5_000_000, minSignalFraction: 0 });
    const { res, ms } = await timed(design(pinning));
    expect(res.status).toBe(400);
    const error = await errorOf(res);
    expect(error?.code).toBe('request_too_large');
    expect(error?.message).toMatch(/MiB/);
    expect(error?.message).toMatch(/5 nm or more/);
    expect(error?.message).toMatch(/in the page/);
    expect(ms).toBeLessThan(2000);
  });

  it('16 free targets on a 1 nm grid at nodeBudget 1: 400 request_too_large in < 2 s', async () => {
    const { res, ms } = await timed(design(freeRequest(16, { peakStepNm: 1, bandStepNm: 1, nodeBudget: 1 })));
    expect(res.status).toBe(400);
    expect((await errorOf(res))?.code).toBe('request_too_large');
    expect(ms).toBeLessThan(2000);
  });

  it('16 targets of 16 × 64 candidates, largest node budget: 200 in < 2 s, saying the work was bounded', async () => {
    const { res, ms } = await timed(design(largestCatalogRequest()));
    expect(res.status).toBe(200);
    const body = (await res.json()) as { warnings: string[]; stats: { nodesVisited: number } | null };
    expect(body.warnings.join(' ')).toMatch(/bounds each design's work/);
    expect(ms).toBeLessThan(2000);
  });

  it('12 free targets, 5 nm grid, largest node budget: 200 in < 2 s, saying the work was bounded', async () => {
    const { res, ms } = await timed(design(heaviestAccepted()));
    expect(res.status).toBe(200);
    expect(((await res.json()) as { warnings: string[] }).warnings.join(' ')).toMatch(/bounds each design's work/);
    expect(ms).toBeLessThan(2000);
  });

  it('while 12 free targets on a 5 nm grid are designed, GET /api/v1/health answers 200 in < 1 s', async () => {
    const running = timed(design(heaviestAccepted()));
    // Let the design start before asking.
    await new Promise((resolve) => setTimeout(resolve, 150));
    const health = await timed(worker.call('/api/v1/health'));
    const done = await running;
    expect(health.res.status).toBe(200);
    expect(health.ms).toBeLessThan(1000);
    expect(done.res.status).toBe(200);
    // The health answer came while the design was still running.
    expect(health.ms + 150).toBeLessThan(done.ms);
  });
});

describe('POST /api/v1/panels/evaluate with sensitivity', () => {
  const evaluate = (body: unknown) => postJson(worker, '/api/v1/panels/evaluate', body);

  it('sensitivity false answers lotShiftSensitivity null; omitted, the check is made as before', async () => {
    const off = (await (await evaluate({ ...examplePanel(), sensitivity: false })).json()) as Record<string, unknown>;
    const on = (await (await evaluate(examplePanel())).json()) as Record<string, unknown>;
    expect(off.lotShiftSensitivity).toBeNull();
    expect(on.lotShiftSensitivity).not.toBeNull();
    expect(off.collected).toEqual(on.collected);
  });

  it('sensitivity true answers the lot-shift check', async () => {
    const res = await evaluate({ ...examplePanel(), sensitivity: true });
    expect(res.status).toBe(200);
    expect(((await res.json()) as Record<string, unknown>).lotShiftSensitivity).not.toBeNull();
  });

  it('sensitivity "no" is refused 400 invalid_input naming the field', async () => {
    const error = await errorOf(await evaluate({ ...examplePanel(), sensitivity: 'no' }));
    expect(error).toMatchObject({ code: 'invalid_input', path: ['sensitivity'] });
  });
});
