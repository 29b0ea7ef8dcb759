// Security headers and CORS on every kind of response: static front end, API, errors, the share page route.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { examplePanel } from './helpers/panels';
import { freshPersistDir, postJson, startWorker, type RunningWorker } from './helpers/worker';

let worker: RunningWorker;
let sharedPage: string;

beforeAll(async () => {
  worker = await startWorker(freshPersistDir());
  sharedPage = ((await (await postJson(worker, '/api/v1/panels', examplePanel())).json()) as { url: string }).url;
});
afterAll(async () => {
  await worker?.dispose();
});

/** The CSP as a map from directive to its sources. */
function directives(csp: string | null): Map<string, string> {
  const out = new Map<string, string>();
  for (const part of (csp ?? '').split(';')) {
    const [name, ...sources] = part.trim().split(/\s+/);
    if (name) out.set(name, sources.join(' '));
  }
  return out;
}

function expectSecurityHeaders(res: Response, what: string): void {
  const csp = directives(res.headers.get('content-security-policy'));
  expect(csp.get('default-src'), what).toBe("'self'");
  expect(csp.get('script-src'), what).toBe("'self'"); // no inline script, no eval
  expect(csp.get('style-src'), what).not.toContain('unsafe');
  expect(csp.get('object-src'), what).toBe("'none'");
  expect(csp.get('base-uri'), what).toBe("'none'");
  expect(csp.get('frame-ancestors'), what).toBe("'none'");
  expect(csp.get('connect-src'), what).toBe("'self'");
  expect(res.headers.get('x-content-type-options'), what).toBe('nosniff');
  expect(res.headers.get('referrer-policy'), what).toBe('no-referrer');
  expect(res.headers.get('cross-origin-opener-policy'), what).toBe('same-origin');
}

describe('security headers', () => {
  it('GET / (the front end from the asset layer) carries the security headers', async () => {
    const res = await worker.call('/');
    expect(res.status).toBe(200);
    expectSecurityHeaders(res, '/');
  });

  it('GET of a built script file carries the security headers', async () => {
    const html = await (await worker.call('/')).text();
    const script = /src="(\/assets\/[^"]+\.js)"/.exec(html)?.[1];
    expect(script).toBeDefined();
    const res = await worker.call(script!);
    expect(res.status).toBe(200);
    expectSecurityHeaders(res, script!);
  });

  it('GET /api/v1/health carries the security headers', async () => {
    expectSecurityHeaders(await worker.call('/api/v1/health'), 'health');
  });

  it('an API error response carries the security headers', async () => {
    const res = await worker.call('/api/v1/no-such-route');
    expect(res.status).toBe(404);
    expectSecurityHeaders(res, '404');
  });

  it('GET /p/:id of a stored panel and of an unknown id carry the security headers', async () => {
    expectSecurityHeaders(await worker.call(sharedPage), sharedPage);
    expectSecurityHeaders(await worker.call('/p/AAAAAAAAAAAAAAAAAAAAAAAA'), 'unknown page');
  });

  it('the static front end and the API send the same security headers', async () => {
    const names = [
      'content-security-policy',
      'x-content-type-options',
      'referrer-policy',
      'cross-origin-opener-policy',
      'x-frame-options',
      'permissions-policy',
    ];
    const page = await worker.call('/');
    const api = await worker.call('/api/v1/health');
    for (const name of names) expect(page.headers.get(name), name).toBe(api.headers.get(name));
  });
});

describe('CORS', () => {
  it('GET /api/v1/health allows any origin without credentials', async () => {
    const res = await worker.call('/api/v1/health', { headers: { Origin: 'https://notebook.example' } });
    expect(res.headers.get('access-control-allow-origin')).toBe('*');
    expect(res.headers.get('access-control-allow-credentials')).toBeNull();
  });

  it('OPTIONS /api/v1/panels/evaluate answers the preflight for a JSON POST', async () => {
    const res = await worker.call('/api/v1/panels/evaluate', {
      method: 'OPTIONS',
      headers: {
        Origin: 'https://notebook.example',
        'Access-Control-Request-Method': 'POST',
        'Access-Control-Request-Headers': 'content-type',
      },
    });
    expect(res.status).toBe(204);
    expect(res.headers.get('access-control-allow-methods')).toContain('POST');
    expect(res.headers.get('access-control-allow-headers')?.toLowerCase()).toContain('content-type');
  });

  it('GET / (not the API) sends no CORS header', async () => {
    const res = await worker.call('/', { headers: { Origin: 'https://elsewhere.example' } });
    expect(res.headers.get('access-control-allow-origin')).toBeNull();
  });
});
