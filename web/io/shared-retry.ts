/**
 * Opening a shared panel just after it was stored: the store spreads a new panel to every location within about a
 * minute, so a link opened sooner can meet "not found". The page tries again with growing waits for about a minute,
 * saying so, and only then says the panel is not there.
 */
import { ApiError } from '../../worker/schemas';
import { loadSharedPanel } from './api';

/**
 * Waits before each new try after a "not found", ms: 1, 2, 4, 8, 15, 15 and 15 s, 60 s in all. Source: Cloudflare's
 * Workers KV documentation (a write may take 60 seconds or more to be seen in other locations).
 */
export const SHARE_RETRY_DELAYS_MS = Object.freeze([1000, 2000, 4000, 8000, 15000, 15000, 15000]);

/** What the page says while it waits for a shared panel. */
export const SHARED_NOT_YET = 'This shared panel is not available yet; trying again…';

/** Why a shared panel still not there after every try could not be opened (the page puts its own words first). */
export const SHARED_NOT_FOUND =
  'it is still not available after a minute of trying. If it was shared just now, reload the page in a few ' +
  'minutes; otherwise ask its sender for the link again.';

/** How a load is retried (tests pass a sleep that does not wait). */
export interface RetryOptions {
  /** Called before each wait, with the number of the try that failed. */
  onWait?: (failedTries: number) => void;
  sleep?: (ms: number) => Promise<void>;
  delaysMs?: readonly number[];
}

const wait = (ms: number) => new Promise<void>((resolve) => setTimeout(resolve, ms));

/**
 * Loads a shared panel by id, trying again after each 404 for as long as `delaysMs` lasts. Any other failure is
 * thrown at once; the last 404 is thrown as an ApiError with SHARED_NOT_FOUND.
 */
export async function loadSharedPanelPatiently(id: string, options: RetryOptions = {}): Promise<unknown> {
  const { onWait, sleep = wait, delaysMs = SHARE_RETRY_DELAYS_MS } = options;
  for (let tries = 1; ; tries++) {
    try {
      return await loadSharedPanel(id);
    } catch (e) {
      if (!(e instanceof ApiError) || e.status !== 404) throw e;
      if (tries > delaysMs.length) throw new ApiError(404, e.code, SHARED_NOT_FOUND, e.path);
      onWait?.(tries);
      await sleep(delaysMs[tries - 1]);
    }
  }
}
