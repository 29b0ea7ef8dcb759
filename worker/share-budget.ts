import type { Context } from 'hono';
import type { AppEnv } from './env';
import { clientKey } from './client-key';
import { ApiError } from './schemas/index';

/** Seconds a client waits after its budget of share links is spent (the binding's window, wrangler.toml). */
export const SHARE_BUDGET_PERIOD_S = 60;

/**
 * Spends one unit of the client's budget of share links, or throws 429 `rate_limited` (with Retry-After) when it is
 * spent. Called on every POST /api/v1/panels and POST /api/v1/instruments that passed validation, whether or not the
 * value is already stored (worker/store.ts says why); evaluating and every read stay free. Uses the platform's
 * rate-limiting binding SHARE_WRITES (a per-location counter, so a client spread over several locations gets a budget
 * in each); without the binding nothing is limited.
 */
export async function spendShareBudget(c: Context<AppEnv>): Promise<void> {
  const limiter = c.env.SHARE_WRITES;
  // The client's key (worker/client-key.ts): an IPv4 address or an IPv6 /64 whatever its spelling; null for loopback
  // (wrangler dev fills CF-Connecting-IP with the socket's address; on Workers the platform sets the visitor's).
  const key = clientKey(c.req.header('cf-connecting-ip'));
  if (limiter === undefined || key === null) return;
  const { success } = await limiter.limit({ key: `share:${key}` });
  if (success) return;
  throw new ApiError(
    429,
    'rate_limited',
    `too many share links from this address; try again in ${SHARE_BUDGET_PERIOD_S} seconds (reading links is not ` +
      `limited)`,
    [],
    { 'Retry-After': String(SHARE_BUDGET_PERIOD_S) },
  );
}
