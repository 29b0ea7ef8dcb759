import type { Context } from 'hono';
import type { AppEnv } from './env';
import { ApiError } from './schemas/index';

/** Seconds a client waits after its budget of new share links is spent (the binding's window, wrangler.toml). */
export const SHARE_BUDGET_PERIOD_S = 60;

// Loopback addresses: only seen in local runs (wrangler dev fills CF-Connecting-IP with the socket's address); on
// Workers the header is the visitor's public address, set by the platform and never loopback.
const LOOPBACK = /^(127\.|::1$|::ffff:127\.)/;

/**
 * The rate-limit key of a request's client: its CF-Connecting-IP, with an IPv6 address cut to its /64 prefix (one
 * subscriber usually holds a whole /64, so per-address keys would be free to rotate). Null for loopback clients,
 * which are not limited. A request without the header (another worker calling through a service binding) shares one
 * key, 'no-client-ip'.
 */
export function shareBudgetKey(clientIp: string | undefined): string | null {
  const ip = (clientIp ?? '').trim().toLowerCase();
  if (ip === '') return 'no-client-ip';
  if (LOOPBACK.test(ip)) return null;
  if (!ip.includes(':')) return ip;
  const groups = ip.split('::')[0].split(':');
  return `${groups.slice(0, 4).join(':')}::/64`;
}

/**
 * Spends one unit of the client's budget of new share links, or throws 429 `rate_limited` (with Retry-After) when it
 * is spent. Called only when a POST /api/v1/panels would write a new panel: re-sharing a stored panel and every read
 * stay free. Uses the platform's rate-limiting binding SHARE_WRITES (a per-location counter, so a client spread over
 * several locations gets a budget in each); without the binding nothing is limited.
 */
export async function spendShareBudget(c: Context<AppEnv>): Promise<void> {
  const limiter = c.env.SHARE_WRITES;
  const key = shareBudgetKey(c.req.header('cf-connecting-ip'));
  if (limiter === undefined || key === null) return;
  const { success } = await limiter.limit({ key: `share:${key}` });
  if (success) return;
  throw new ApiError(
    429,
    'rate_limited',
    `too many new share links from this address; try again in ${SHARE_BUDGET_PERIOD_S} seconds (reading links is not ` +
      `limited)`,
    [],
    { 'Retry-After': String(SHARE_BUDGET_PERIOD_S) },
  );
}
