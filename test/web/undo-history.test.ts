import { describe, expect, it } from 'vitest';
import { editKey, emptyHistory, recordEdit, redo, undo, STEP_MS, type UndoHistory } from '../../web/state/undo-history';

/** A history of numbered states 0…n-1, each step recorded `gapMs` after the last with its own key. */
function steps(n: number, gapMs = STEP_MS * 2): { history: UndoHistory<number>; current: number } {
  let history = emptyHistory<number>();
  for (let s = 1; s < n; s++) history = recordEdit(history, s - 1, { key: 'x', atMs: s * gapMs });
  return { history, current: n - 1 };
}

describe('undo history', () => {
  it('an empty history has nothing to undo or redo', () => {
    expect(undo(emptyHistory<number>(), 0)).toBeUndefined();
    expect(redo(emptyHistory<number>(), 0)).toBeUndefined();
  });

  it('undo twice then redo once walks 2 → 1 → 0 → 1, and redo past the end gives nothing', () => {
    const { history, current } = steps(3);
    const u1 = undo(history, current)!;
    expect(u1.state).toBe(1);
    const u2 = undo(u1.history, u1.state)!;
    expect(u2.state).toBe(0);
    expect(undo(u2.history, u2.state)).toBeUndefined();
    const r1 = redo(u2.history, u2.state)!;
    expect(r1.state).toBe(1);
    const r2 = redo(r1.history, r1.state)!;
    expect(r2.state).toBe(2);
    expect(redo(r2.history, r2.state)).toBeUndefined();
  });

  it('a new edit after an undo clears what could be redone', () => {
    const { history, current } = steps(3);
    const u = undo(history, current)!;
    const edited = recordEdit(u.history, u.state, { atMs: 99_000 });
    expect(redo(edited, 7)).toBeUndefined();
    expect(edited.past).toEqual([0, 1]);
  });

  it('of 150 steps it keeps the last 100: undoing them all goes back to state 50, not 0', () => {
    let { history, current } = steps(151);
    expect(history.past.length).toBe(100);
    let last = current;
    for (let r = undo(history, current); r; r = undo(history, current)) {
      ({ history, state: current } = r);
      last = current;
    }
    expect(last).toBe(50);
  });

  it('edits of the same field less than a second apart are one step; a pause or another field starts a new one', () => {
    let h = emptyHistory<string>();
    h = recordEdit(h, '', { key: 'centerNm', atMs: 0 });
    h = recordEdit(h, '6', { key: 'centerNm', atMs: STEP_MS - 1 });
    h = recordEdit(h, '64', { key: 'centerNm', atMs: 2 * STEP_MS - 2 });
    expect(h.past).toEqual(['']);
    h = recordEdit(h, '645', { key: 'centerNm', atMs: 4 * STEP_MS });
    h = recordEdit(h, '6451', { key: 'widthNm', atMs: 4 * STEP_MS + 1 });
    expect(h.past).toEqual(['', '645', '6451']);
  });

  it('edits without a key (a loaded panel, an added channel) are each a step even a millisecond apart', () => {
    let h = emptyHistory<string>();
    h = recordEdit(h, 'a', { atMs: 0 });
    h = recordEdit(h, 'b', { atMs: 1 });
    expect(h.past).toEqual(['a', 'b']);
  });
});

describe('editKey', () => {
  const panel = { channels: [{ label: '655/20', filters: [{ centerNm: 655, widthNm: 20 }] }] };

  it('names the changed numbers and texts by their paths, sorted', () => {
    const after = { channels: [{ label: '645/20', filters: [{ centerNm: 645, widthNm: 20 }] }] };
    expect(editKey(panel, after)).toBe('channels.0.filters.0.centerNm channels.0.label');
  });

  it('is undefined for an added channel, a field set where there was none, and no change at all', () => {
    expect(editKey(panel, { channels: [...panel.channels, panel.channels[0]] })).toBeUndefined();
    expect(editKey(panel, { channels: [{ ...panel.channels[0], detector: 'emccd' }] })).toBeUndefined();
    expect(editKey(panel, structuredClone(panel))).toBeUndefined();
  });
});
