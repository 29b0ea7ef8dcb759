/**
 * "My panels": every panel the user edits, kept whole in this browser's IndexedDB (through idb-keyval), one entry per
 * working panel, newest first, at most SAVED_PANEL_LIMIT. Storage that is off or full never breaks the page: a failed
 * read gives no entries and a failed write is reported once through the autosaver's callback, and the page keeps its
 * address and localStorage copy of the last state as before.
 */
import { createStore, del, entries, get, set, setMany, delMany, type UseStore } from 'idb-keyval';
import type { PanelSpec } from '../../spectra/index';
import type { PanelExclusion } from './exclusions';

/** Most panels kept; saving one more drops the oldest. */
export const SAVED_PANEL_LIMIT = 50;

/** Wait after the last edit before a panel is written (ms); leaving the page writes at once. */
export const AUTOSAVE_DELAY_MS = 500;

/** The name of a panel without a title. */
export const UNTITLED = 'Untitled panel';

/** What the page says, once, when it cannot keep panels in this browser. */
export const STORAGE_OFF_NOTICE =
  'This browser does not let the page keep your panels (storage is off or full); the address still holds the panel.';

/** One kept panel. */
export interface SavedPanel {
  /** Random id of the working panel (stays the same while it is edited). */
  id: string;
  /** The panel's title, or UNTITLED. */
  name: string;
  /** When it was last written (ISO 8601). */
  savedAt: string;
  /** The panel exactly as edited (measured tables in full). */
  panel: PanelSpec;
  /** Material classes excluded in the view. */
  exclude: PanelExclusion[];
  /** The instrument profile the panel is on, if any. */
  instrument?: string;
}

/** The name a panel is listed under: its title, or UNTITLED when it has none. */
export function savedName(panel: PanelSpec): string {
  return panel.title?.trim() || UNTITLED;
}

/** A new id for a working panel. */
export function newSavedId(): string {
  return crypto.randomUUID();
}

/** The entry for a panel at a moment. */
export function savedEntry(
  id: string,
  state: { panel: PanelSpec; exclude: PanelExclusion[]; instrument?: string },
  now: Date,
): SavedPanel {
  return {
    id,
    name: savedName(state.panel),
    savedAt: now.toISOString(),
    panel: state.panel,
    exclude: [...state.exclude],
    ...(state.instrument ? { instrument: state.instrument } : {}),
  };
}

/** Entries newest first (by savedAt, then id for a stable order). */
export function newestFirst(list: readonly SavedPanel[]): SavedPanel[] {
  return [...list].sort((a, b) => b.savedAt.localeCompare(a.savedAt) || a.id.localeCompare(b.id));
}

/** The ids beyond the `limit` newest, to drop. */
export function beyondLimit(list: readonly SavedPanel[], limit = SAVED_PANEL_LIMIT): string[] {
  return newestFirst(list)
    .slice(limit)
    .map((e) => e.id);
}

/** True for a value read back from storage that has the shape of an entry. */
function isEntry(v: unknown): v is SavedPanel {
  const e = v as SavedPanel | null;
  return (
    typeof e === 'object' &&
    e !== null &&
    typeof e.id === 'string' &&
    typeof e.name === 'string' &&
    typeof e.savedAt === 'string' &&
    typeof e.panel === 'object' &&
    e.panel !== null &&
    Array.isArray(e.exclude)
  );
}

/** The kept panels in one IndexedDB object store. Reads return nothing when storage is off; writes throw. */
export class SavedPanels {
  constructor(
    private readonly store: UseStore,
    private readonly limit = SAVED_PANEL_LIMIT,
  ) {}

  /** Every entry, newest first; none when storage cannot be read. */
  async list(): Promise<SavedPanel[]> {
    try {
      const all = await entries<string, unknown>(this.store);
      return newestFirst(all.map(([, v]) => v).filter(isEntry));
    } catch {
      return [];
    }
  }

  /** One entry, or undefined (also when storage cannot be read). */
  async get(id: string): Promise<SavedPanel | undefined> {
    try {
      const v = await get<unknown>(id, this.store);
      return isEntry(v) ? v : undefined;
    } catch {
      return undefined;
    }
  }

  /** Writes an entry (replacing the one with its id) and drops the oldest beyond the limit. */
  async put(entry: SavedPanel): Promise<void> {
    await set(entry.id, entry, this.store);
    const drop = beyondLimit(await this.list(), this.limit);
    if (drop.length) await delMany(drop, this.store);
  }

  /** Gives an entry a new name (and its panel the same title); false when it is not there. */
  async rename(id: string, name: string): Promise<boolean> {
    const e = await this.get(id);
    if (!e) return false;
    const title = name.trim();
    await set(id, { ...e, name: title || UNTITLED, panel: { ...e.panel, title } }, this.store);
    return true;
  }

  /** Deletes an entry. */
  async remove(id: string): Promise<void> {
    await del(id, this.store);
  }

  /** Puts entries back as they were (the undo of a delete). */
  async restore(list: readonly SavedPanel[]): Promise<void> {
    await setMany(
      list.map((e) => [e.id, e]),
      this.store,
    );
  }
}

/** Where the page keeps the id of the working panel's entry in this browser, beside its last state. */
const LAST_SAVED_KEY = 'qdpanel.lastSavedId';

/** The id of the last working panel's entry, or '' when there is none or storage is off. */
export function readLastSavedId(): string {
  try {
    return localStorage.getItem(LAST_SAVED_KEY) ?? '';
  } catch {
    return '';
  }
}

/** Keeps the id of the working panel's entry (nothing happens when storage is off or full). */
export function writeLastSavedId(id: string): void {
  try {
    localStorage.setItem(LAST_SAVED_KEY, id);
  } catch {
    // Storage off or full: the address and the last state still hold the panel.
  }
}

/** The page's kept panels: database "qdpanel", object store "panels". */
export function openSavedPanels(dbName = 'qdpanel', storeName = 'panels'): SavedPanels {
  return new SavedPanels(createStore(dbName, storeName));
}

/**
 * Writes the working panel AUTOSAVE_DELAY_MS after the last change, or at once on flush() (pagehide). A failed write
 * calls `onFailure` once per page and is otherwise ignored.
 */
export class Autosaver {
  private pending?: SavedPanel;
  private timer?: ReturnType<typeof setTimeout>;
  private failed = false;
  /** The last write, for a caller (and a test) to wait on. */
  written: Promise<void> = Promise.resolve();
  /** Called after each write that succeeded (the list of panels reads itself again). */
  afterWrite?: () => void;

  constructor(
    private readonly store: SavedPanels,
    private readonly onFailure: (message: string) => void,
    private readonly delayMs = AUTOSAVE_DELAY_MS,
  ) {}

  /** Keeps `entry` to write after the delay, replacing any entry not yet written. */
  schedule(entry: SavedPanel): void {
    this.pending = entry;
    clearTimeout(this.timer);
    this.timer = setTimeout(() => this.flush(), this.delayMs);
  }

  /** Writes the entry waiting, if any, now. */
  flush(): Promise<void> {
    clearTimeout(this.timer);
    const entry = this.pending;
    this.pending = undefined;
    if (!entry) return this.written;
    this.written = this.written.then(() =>
      this.store.put(entry).then(
        () => this.afterWrite?.(),
        () => {
          if (this.failed) return;
          this.failed = true;
          this.onFailure(STORAGE_OFF_NOTICE);
        },
      ),
    );
    return this.written;
  }
}
