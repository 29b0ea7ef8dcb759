/**
 * The panel's undo history: the states before each step (past) and the states undone (future), bounded, with a burst
 * of edits of the same fields (keystrokes typed into one number, an edge dragged) kept as one step. Pure: every
 * function returns a new history and the caller keeps the state it shows.
 */

/** Most steps kept to undo; the oldest is dropped beyond it. */
export const UNDO_LIMIT = 100;

/**
 * Edits of the same fields closer together than this are one step (ms): typing a number is one step, not five. The
 * browser's Back button groups its steps by the same time.
 */
export const STEP_MS = 1000;

export interface UndoHistory<S> {
  /** States before each step, oldest first. */
  readonly past: readonly S[];
  /** States undone, the next to redo first. */
  readonly future: readonly S[];
  /** The fields the last step edited and when it last changed them, while its burst may go on. */
  readonly burst?: { readonly key: string; readonly atMs: number };
}

export function emptyHistory<S>(): UndoHistory<S> {
  return { past: [], future: [] };
}

/**
 * The history after an edit that left `before`: a new step, unless the edit changed the same fields (`key`, from
 * editKey) as the step before within STEP_MS of its last change, when it joins that step. Any edit clears the redo.
 */
export function recordEdit<S>(
  h: UndoHistory<S>,
  before: S,
  edit: { key?: string; atMs: number },
  limit = UNDO_LIMIT,
): UndoHistory<S> {
  const burst = edit.key === undefined ? undefined : { key: edit.key, atMs: edit.atMs };
  const joins = burst && h.burst && h.burst.key === burst.key && burst.atMs - h.burst.atMs < STEP_MS;
  if (joins && h.past.length > 0) return { past: h.past, future: [], burst };
  return { past: [...h.past, before].slice(-limit), future: [], burst };
}

/** The state before the last step and the history after undoing it, or undefined when there is nothing to undo. */
export function undo<S>(h: UndoHistory<S>, current: S): { history: UndoHistory<S>; state: S } | undefined {
  if (h.past.length === 0) return undefined;
  const state = h.past[h.past.length - 1];
  return { history: { past: h.past.slice(0, -1), future: [current, ...h.future] }, state };
}

/** The state last undone and the history after redoing it, or undefined when there is nothing to redo. */
export function redo<S>(h: UndoHistory<S>, current: S): { history: UndoHistory<S>; state: S } | undefined {
  if (h.future.length === 0) return undefined;
  return { history: { past: [...h.past, current], future: h.future.slice(1) }, state: h.future[0] };
}

/**
 * The fields an edit changed, as their sorted paths joined with spaces (e.g. "channels.3.filters.0.centerNm
 * channels.3.label"), or undefined when it changed the shape (an item added or removed, a field set or cleared, a
 * kind switched): such an edit is always a step of its own. Compares plain JSON values.
 */
export function editKey(before: unknown, after: unknown): string | undefined {
  const paths: string[] = [];
  const walk = (a: unknown, b: unknown, path: string): boolean => {
    if (a === b) return true;
    const bothObjects = typeof a === 'object' && a !== null && typeof b === 'object' && b !== null;
    if (!bothObjects) {
      if (typeof a !== typeof b || typeof a === 'object') return false;
      paths.push(path);
      return true;
    }
    if (Array.isArray(a) !== Array.isArray(b)) return false;
    const ka = Object.keys(a);
    const kb = Object.keys(b);
    if (ka.length !== kb.length || ka.some((k) => !Object.hasOwn(b, k))) return false;
    const ra = a as Record<string, unknown>;
    const rb = b as Record<string, unknown>;
    return ka.every((k) => walk(ra[k], rb[k], path ? `${path}.${k}` : k));
  };
  if (!walk(before, after, '') || paths.length === 0) return undefined;
  return paths.sort().join(' ');
}
