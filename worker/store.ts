import { canonicalJson, isShareId, shareIdOf } from './share-id';

/** What the store keeps behind share links: panels (/p/<id>) and instrument profiles (/i/<id>). */
export type SharedKind = 'panel' | 'instrument';

const KEY_PREFIX: Record<SharedKind, string> = { panel: 'panel:', instrument: 'instrument:' };

/** What storing did: `created` is false when the same value was already stored (nothing was written). */
export interface StoredValue {
  id: string;
  created: boolean;
}

/**
 * Stores a validated value under the id of its canonical text. Stored values are immutable: the key is read first
 * and an existing value is never overwritten (the same text always maps to the same key anyway). `beforeWrite` runs
 * only when a new value is about to be written (the per-client budget of new links); it may throw to refuse.
 */
export async function saveShared(
  kv: KVNamespace,
  kind: SharedKind,
  value: unknown,
  beforeWrite?: () => Promise<void>,
): Promise<StoredValue> {
  const canonical = canonicalJson(value);
  const id = await shareIdOf(canonical);
  const existing = await kv.get(KEY_PREFIX[kind] + id);
  if (existing !== null) return { id, created: false };
  await beforeWrite?.();
  await kv.put(KEY_PREFIX[kind] + id, canonical);
  return { id, created: true };
}

/** The stored canonical JSON text under an id, or null when the id is malformed (KV is then not read) or unknown. */
export async function loadSharedText(kv: KVNamespace, kind: SharedKind, id: string): Promise<string | null> {
  if (!isShareId(id)) return null;
  return kv.get(KEY_PREFIX[kind] + id);
}
