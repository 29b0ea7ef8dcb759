// Health, OpenAPI, detectors, method and route errors, content type and body-size limits (real workerd).
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { examplePanel } from './helpers/panels';
import { errorOf, freshPersistDir, postJson, ROOT, startWorker, type RunningWorker } from './helpers/worker';

const LIMIT_BYTES = 256 * 1024; // the contract's 256 KiB (docs/api.md, "Errors")
let worker: RunningWorker;

beforeAll(async () => {
  worker = await startWorker(freshPersistDir());
});
afterAll(async () => {
  await worker?.dispose();
});

describe('health and description', () => {
  it('GET /api/v1/health answers ok with the version in package.json', async () => {
    const pkg = JSON.parse(readFileSync(join(ROOT, 'package.json'), 'utf8')) as { version: string };
    const res = await worker.call('/api/v1/health');
    expect(res.status).toBe(200);
    expect(await res.json()).toEqual({ ok: true, version: pkg.version });
  });

  it('GET /api/v1/openapi.json describes every route of the contract', async () => {
    const doc = (await (await worker.call('/api/v1/openapi.json')).json()) as {
      openapi: string;
      paths: Record<string, object>;
    };
    expect(doc.openapi).toMatch(/^3\.1/);
    for (const path of [
      '/api/v1/health',
      '/api/v1/openapi.json',
      '/api/v1/materials',
      '/api/v1/detectors',
      '/api/v1/backgrounds',
      '/api/v1/dyes',
      '/api/v1/filters/stock',
      '/api/v1/dots/resolve',
      '/api/v1/panels/evaluate',
      '/api/v1/panels',
      '/api/v1/panels/{id}',
    ]) {
      expect(Object.keys(doc.paths), path).toContain(path);
    }
  });

  it('GET /api/v1/openapi.json gives the panel schema its limits and strictness', async () => {
    const doc = (await (await worker.call('/api/v1/openapi.json')).json()) as {
      components: { schemas: Record<string, any> };
    };
    const panel = doc.components.schemas.Panel;
    expect(panel.additionalProperties).toBe(false);
    expect(panel.required).toEqual(expect.arrayContaining(['excitation', 'probes', 'channels']));
    // docs/api.md: only type, the wavelength fields and the ids are required; version defaults to 1.
    expect(panel.required).not.toContain('version');
    expect(panel.properties.probes.maxItems).toBe(16);
    expect(panel.properties.channels.maxItems).toBe(64);
  });

  it('GET /api/v1/detectors lists detector classes with id, name and notes', async () => {
    const body = (await (await worker.call('/api/v1/detectors')).json()) as {
      detectors: { id: string; name: string; notes: string }[];
    };
    expect(body.detectors.length).toBeGreaterThan(0);
    for (const d of body.detectors) expect(Object.keys(d).sort()).toEqual(['id', 'name', 'notes']);
  });
});

describe('routes and methods', () => {
  it('GET of an unknown /api/ route is a JSON 404 in the contract shape', async () => {
    const res = await worker.call('/api/v1/nothing-here');
    expect(res.status).toBe(404);
    expect(res.headers.get('content-type')).toMatch(/^application\/json/);
    expect((await errorOf(res))?.code).toBe('not_found');
  });

  it.each([
    ['POST', '/api/v1/health', 'GET'],
    ['PUT', '/api/v1/detectors', 'GET'],
    ['POST', '/api/v1/backgrounds', 'GET'],
    ['GET', '/api/v1/panels', 'POST'],
    ['GET', '/api/v1/panels/evaluate', 'POST'],
    ['DELETE', '/api/v1/dots/resolve', 'POST'],
  ])('%s %s is a 405 whose Allow header names %s', async (method, path, allowed) => {
    const res = await worker.call(path, { method });
    expect(res.status).toBe(405);
    expect(res.headers.get('allow')).toContain(allowed);
    expect((await errorOf(res))?.code).toBe('method_not_allowed');
  });
});

describe('content type and size', () => {
  it('POST /api/v1/panels with a form content type is a 415 in the contract shape', async () => {
    const res = await worker.call('/api/v1/panels', {
      method: 'POST',
      headers: { 'content-type': 'text/plain' },
      body: JSON.stringify(examplePanel()),
    });
    expect(res.status).toBe(415);
    expect((await errorOf(res))?.code).toBe('unsupported_media_type');
  });

  it('POST /api/v1/panels with a charset parameter is accepted', async () => {
    const res = await worker.call('/api/v1/panels', {
      method: 'POST',
      headers: { 'content-type': 'application/json; charset=utf-8' },
      body: JSON.stringify(examplePanel()),
    });
    expect(res.status).toBe(201);
  });

  it('POST /api/v1/panels with a panel padded to exactly the limit is accepted', async () => {
    const text = JSON.stringify(examplePanel());
    const res = await postJson(worker, '/api/v1/panels', text + ' '.repeat(LIMIT_BYTES - text.length), true);
    expect(res.status).toBe(201);
  });

  it('POST /api/v1/panels with one byte over the limit (Content-Length known) is a 413', async () => {
    const text = JSON.stringify(examplePanel());
    const res = await postJson(worker, '/api/v1/panels', text + ' '.repeat(LIMIT_BYTES + 1 - text.length), true);
    expect(res.status).toBe(413);
    expect((await errorOf(res))?.code).toBe('payload_too_large');
  });

  it('POST /api/v1/panels/evaluate with a chunked body over the limit and no Content-Length is a 413', async () => {
    const chunk = new TextEncoder().encode(' '.repeat(64 * 1024));
    let sent = 0;
    const body = new ReadableStream<Uint8Array>({
      pull(controller) {
        if (sent++ < 6)
          controller.enqueue(chunk); // 384 KiB in all
        else controller.close();
      },
    });
    const res = await worker.call('/api/v1/panels/evaluate', {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body,
      duplex: 'half',
    } as RequestInit);
    expect(res.status).toBe(413);
    expect((await errorOf(res))?.code).toBe('payload_too_large');
    // The connection stays usable: the next request is answered normally.
    expect((await worker.call('/api/v1/health')).status).toBe(200);
    expect((await postJson(worker, '/api/v1/panels', examplePanel())).status).toBeLessThan(300);
  });
});
