// The API's three descriptions cannot drift apart: the routes the app really mounts (read from the Hono app itself),
// the OpenAPI document it serves, and the reference in docs/api.md list the same method and path for every route.
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import app from '../../worker/index';
import { openApiDocument } from '../../worker/openapi';

/** "GET /api/v1/panels/{id}" for a Hono route "/api/v1/panels/:id{[A-Za-z0-9_-]{24}}" (the pattern dropped). */
function routeName(method: string, path: string): string {
  return `${method} ${path.replace(/:(\w+)(\{(?:[^{}]|\{[^{}]*\})*\})?/g, '{$1}')}`;
}

const mounted = [
  ...new Set(app.routes.filter((r) => r.method !== 'ALL').map((r) => routeName(r.method, r.path))),
].sort();
const apiRoutes = mounted.filter((r) => r.includes(' /api/'));

describe('the API reference', () => {
  it('the app mounts the routes this test expects to compare (a guard against an empty route list)', () => {
    expect(mounted).toContain('POST /api/v1/panels/evaluate');
    expect(mounted.length).toBeGreaterThanOrEqual(9);
  });

  it('openapi.json lists exactly the /api/ routes the app mounts, with their methods', () => {
    const paths = openApiDocument().paths as Record<string, Record<string, unknown>>;
    const documented = Object.entries(paths)
      .flatMap(([path, item]) => Object.keys(item).map((method) => `${method.toUpperCase()} ${path}`))
      .sort();
    expect(documented).toEqual(apiRoutes);
  });

  it('docs/api.md has a "### METHOD /path" section for exactly the routes the app mounts', () => {
    const text = readFileSync(new URL('../../docs/api.md', import.meta.url), 'utf8');
    const headings = [...text.matchAll(/^### (GET|POST|PUT|DELETE|PATCH) (\/\S*)\s*$/gm)]
      .map((m) => `${m[1]} ${m[2]}`)
      .sort();
    expect(headings).toEqual(mounted);
  });
});
