import { zValidator } from '@hono/zod-validator';
import type { z } from 'zod';
import { errorResponse } from './errors';
import { issueToError } from './schemas/issues';

/**
 * The JSON body validator of every POST route: zod's first issue becomes the contract's 400, with up to ten more
 * issues listed under `error.issues` so a client can fix several fields at once.
 */
export function validJson<S extends z.ZodType>(schema: S) {
  return zValidator('json', schema, (result) => {
    if (result.success) return;
    const all = result.error.issues.map(issueToError);
    const first = all[0];
    const res = errorResponse(400, first.code, first.message, first.path);
    return new Response(JSON.stringify({ error: { ...first, issues: all.slice(0, 11) } }), res);
  });
}
