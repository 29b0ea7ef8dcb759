// Bad bodies at every POST route of the contract (resolve, evaluate, share, design, controls) on the real Workers
// runtime with real local KV: malformed JSON, an empty body, a non-object body, a wrong content type, an oversized
// body, a missing required field, a wrong type and a non-finite number literal each get a 4xx in the contract's error
// shape naming the field, never a 5xx.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { exampleControls, examplePanel } from './helpers/panels';
import { errorOf, freshPersistDir, postJson, startWorker, type RunningWorker } from './helpers/worker';

let worker: RunningWorker;
beforeAll(async () => {
  worker = await startWorker(freshPersistDir());
});
afterAll(async () => {
  await worker?.dispose();
});

const designRequest = () => ({
  targets: [{ name: 'A', abundance: 1 }],
  excitation: [{ wavelengthNm: 405 }],
  options: { nodeBudget: 50 },
});

/** Each POST route with a valid body and one required top-level field (missing it must be a 400 naming it). */
const ROUTES: [string, () => Record<string, unknown>, string][] = [
  ['/api/v1/dots/resolve', () => ({ material: 'cdse', emissionPeakNm: 605 }), 'material'],
  ['/api/v1/panels/evaluate', examplePanel, 'probes'],
  ['/api/v1/panels', examplePanel, 'channels'],
  ['/api/v1/panels/design', designRequest, 'targets'],
  ['/api/v1/controls/spillover', exampleControls, 'controls'],
];

async function expectError(res: Response, status: number, code: string, path?: (string | number)[]): Promise<void> {
  expect(res.status).toBe(status);
  expect(res.headers.get('content-type')).toMatch(/^application\/json/);
  const error = await errorOf(res);
  expect(error?.code).toBe(code);
  expect(error?.message.length).toBeGreaterThan(10);
  if (path) expect(error?.path).toEqual(path);
}

describe.each(ROUTES)('POST %s', (route, valid, required) => {
  it(`POST ${route} with a valid body answers 2xx (the baseline the bad bodies below depart from)`, async () => {
    const res = await postJson(worker, route, valid());
    expect(res.status, await res.clone().text()).toBeLessThan(300);
  });

  it(`POST ${route} with malformed JSON answers 400 invalid_json`, async () => {
    await expectError(await postJson(worker, route, '{"a": [1, 2', true), 400, 'invalid_json', []);
  });

  it(`POST ${route} with an empty body answers 400 invalid_json`, async () => {
    await expectError(await postJson(worker, route, '', true), 400, 'invalid_json', []);
  });

  it(`POST ${route} with a JSON array instead of an object answers 400 naming the body`, async () => {
    await expectError(await postJson(worker, route, [valid()]), 400, 'invalid_input', []);
  });

  it(`POST ${route} sent as text/plain answers 415 in the contract shape`, async () => {
    const res = await worker.call(route, {
      method: 'POST',
      headers: { 'content-type': 'text/plain' },
      body: JSON.stringify(valid()),
    });
    await expectError(res, 415, 'unsupported_media_type');
  });

  it(`POST ${route} with a body over 256 KiB answers 413 in the contract shape`, async () => {
    await expectError(
      await postJson(worker, route, { ...valid(), padding: 'x'.repeat(300 * 1024) }),
      413,
      'payload_too_large',
    );
  });

  it(`POST ${route} without ${required} answers 400 naming ${required}`, async () => {
    const body = valid();
    delete body[required];
    const res = await postJson(worker, route, body);
    expect(res.status).toBe(400);
    expect((await errorOf(res))?.path).toEqual([required]);
  });

  it(`POST ${route} with ${required} of the wrong type answers 400 naming ${required}`, async () => {
    const res = await postJson(worker, route, { ...valid(), [required]: 42 });
    expect(res.status).toBe(400);
    expect((await errorOf(res))?.path).toEqual([required]);
  });

  it(`POST ${route} with a number literal too large for a double answers 400, never a 5xx`, async () => {
    // 1e999 parses to Infinity in JSON.parse: the validator must call it not finite, naming where it sits.
    const text = JSON.stringify(valid()).replace(/405|605/, '1e999');
    const res = await postJson(worker, route, text, true);
    expect(res.status).toBe(400);
    const error = await errorOf(res);
    expect(error?.message).toMatch(/finite/);
    expect(error?.path.length).toBeGreaterThan(0);
  });
});
