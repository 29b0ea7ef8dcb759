import type { Handler } from 'hono';
import { ApiError } from '../errors';

/**
 * Handler factory for `app.all(path, ...)` after a path's real routes: any other method is a 405 naming the
 * allowed ones in the Allow header (HEAD rides along with GET, OPTIONS is answered by the CORS middleware).
 */
export function methodNotAllowed(...allowed: ('GET' | 'POST')[]): Handler {
  const allow = [...allowed, ...(allowed.includes('GET') ? ['HEAD'] : []), 'OPTIONS'].join(', ');
  return function rejectMethod(c) {
    throw new ApiError(
      405,
      'method_not_allowed',
      `${c.req.method} is not allowed here; use ${allowed.join(' or ')}`,
      [],
      {
        Allow: allow,
      },
    );
  };
}
