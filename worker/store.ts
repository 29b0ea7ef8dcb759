import { canonicalJson, isShareId, shareIdOf } from './share-id';

/** What the store keeps behind share links: panels (/p/<id>) and instrument profiles (/i/<id>). */
export type SharedKind = 'panel' | 'instrument';

const KEY_PREFIX: Record<SharedKind, string> = { panel: 'panel:', instrument: 'instrument:' };

/**
 * Stores a validated value under the keyed id of its canonical text (worker/share-id.ts) and returns the id. Stored
 * values are immutable: the key is read first and an existing value is never overwritten (the same text always maps
 * to the same key anyway). The caller spends the client's budget of share links before, on every share, whether or not
 * the value is already stored: a budget spent only on new values would tell a client whether someone else had stored
 * the same value.
 */
export async function saveShared(kv: KVNamespace, kind: SharedKind, value: unknown, keyText: string): Promise<string> {
  const canonical = canonicalJson(value);
  const id = await shareIdOf(canonical, keyText);
  const existing = await kv.get(KEY_PREFIX[kind] + id);
  if (existing === null) await kv.put(KEY_PREFIX[kind] + id, canonical);
  return id;
}

/**
 * The stored canonical JSON text under an id, or null when the id is malformed (KV is then not read) or unknown. Ids
 * of both schemes (keyed, and the plain SHA-256 of links issued before) are keys of the same form in the same store.
 */
export async function loadSharedText(kv: KVNamespace, kind: SharedKind, id: string): Promise<string | null> {
  if (!isShareId(id)) return null;
  return kv.get(KEY_PREFIX[kind] + id);
}
