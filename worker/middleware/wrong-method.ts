import type { Context, Hono } from 'hono';
import { methodNotAllowed } from 'hono/method-not-allowed';
import type { AppEnv } from '../env';
import { errorResponse } from '../errors';

/**
 * hono's method-not-allowed middleware with the contract's error shape: a known path asked with another method is a
 * 405 naming the allowed ones, in the body and in the Allow header (HEAD rides along with GET; OPTIONS is answered
 * by the CORS middleware, so it is listed too).
 */
export function wrongMethod(app: Hono<AppEnv>) {
  return methodNotAllowed({
    app,
    onMethodNotAllowed: (c: Context, methods: string[]) => {
      const named = methods.filter((m) => m !== 'HEAD');
      return errorResponse(
        405,
        'method_not_allowed',
        `${c.req.method} is not allowed here; use ${named.join(' or ')}`,
        [],
        {
          Allow: [...methods, 'OPTIONS'].join(', '),
        },
      );
    },
  });
}
