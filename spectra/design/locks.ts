/**
 * Targets locked to probes and channels the user owns: their ids turned into indices of the candidates a search
 * works on, with a refusal naming the field when an id is unknown or two targets claim one item, and the
 * no_usable_panel answer when a locked item was left out by a practice check (the user owns it, but the check is
 * what makes the panel usable).
 */
import { SpectraError } from '../core/errors';
import type { IndexLock } from './snr-search';
import { NoDesignFound } from './practice';
import type { DesignTarget } from './request';

/** Where a locked item may be: the ids kept for the search, and those a check left out with the check's words. */
export interface LockPool {
  kept: readonly string[];
  leftOut: ReadonlyMap<string, string>;
}

/** Each target's lock as indices into the kept probes and channels (undefined: free). */
export function lockIndices(
  targets: readonly DesignTarget[],
  probes: LockPool,
  channels: LockPool,
): (IndexLock | undefined)[] {
  const claimed = new Map<string, number>();
  return targets.map((t, i) => {
    if (!t.lock) return undefined;
    const lock: IndexLock = {};
    for (const [field, pool] of [
      ['probe', probes],
      ['channel', channels],
    ] as const) {
      const id = t.lock[field];
      if (id === undefined) continue;
      const path = ['targets', i, 'lock', field];
      const other = claimed.get(`${field} ${id}`);
      if (other !== undefined) {
        throw new SpectraError(
          'invalid_input',
          `targets '${targets[other].name}' and '${t.name}' are both locked to ${field} '${id}': each ${field} ` +
            'serves one target',
          path,
        );
      }
      claimed.set(`${field} ${id}`, i);
      const why = pool.leftOut.get(id);
      if (why !== undefined) {
        throw new NoDesignFound(`target '${t.name}' is locked to ${field} '${id}', which ${why}`, path, true);
      }
      const index = pool.kept.indexOf(id);
      if (index < 0) {
        throw new SpectraError(
          'invalid_input',
          `target '${t.name}' is locked to ${field} '${id}', which is not among the candidates or owned items`,
          path,
        );
      }
      lock[field] = index;
    }
    return lock;
  });
}
