import { canonicalJson, isShareId, shareIdOf } from './share-id';

const KEY_PREFIX = 'panel:';

/** What storing a panel did: `created` is false when the same panel was already stored (nothing was written). */
export interface StoredPanel {
  id: string;
  created: boolean;
}

/**
 * Stores a validated panel under the id of its canonical text. Stored panels are immutable: the key is read first
 * and an existing value is never overwritten (the same text always maps to the same key anyway). `beforeWrite` runs
 * only when a new value is about to be written (the per-client budget of new links); it may throw to refuse.
 */
export async function savePanel(
  kv: KVNamespace,
  panel: unknown,
  beforeWrite?: () => Promise<void>,
): Promise<StoredPanel> {
  const canonical = canonicalJson(panel);
  const id = await shareIdOf(canonical);
  const existing = await kv.get(KEY_PREFIX + id);
  if (existing !== null) return { id, created: false };
  await beforeWrite?.();
  await kv.put(KEY_PREFIX + id, canonical);
  return { id, created: true };
}

/** The stored canonical JSON text of a panel, or null when the id is malformed (KV is then not read) or unknown. */
export async function loadPanelText(kv: KVNamespace, id: string): Promise<string | null> {
  if (!isShareId(id)) return null;
  return kv.get(KEY_PREFIX + id);
}
