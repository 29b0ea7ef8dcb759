import { afterEach, describe, expect, it } from 'vitest';
import { createStore } from 'idb-keyval';
import type { PanelSpec } from '../../spectra/index';
import { Autosaver, SavedPanels, STORAGE_OFF_NOTICE, savedEntry, type SavedPanel } from '../../web/state/saved-panels';

/** A panel with a 605/20 band of `widthNm` width and a table of `points` points (the store keeps it whole). */
function panel(title: string, widthNm = 20, points = 0): PanelSpec {
  return {
    version: 1,
    title,
    excitation: [{ wavelengthNm: 405 }],
    probes: [{ id: 'p1', material: 'cdse', emissionPeakNm: 605 }],
    channels: [
      { id: 'c1', label: 'Orange', filters: [{ type: 'bandpass', centerNm: 605, widthNm }] },
      ...(points
        ? [
            {
              id: 'c2',
              filters: [
                {
                  type: 'table' as const,
                  points: Array.from({ length: points }, (_, i): [number, number] => [400 + i * 0.5, 0.5]),
                },
              ],
            },
          ]
        : []),
    ],
  };
}

let dbCount = 0;
const opened: string[] = [];

/** A store in a database of its own, deleted after the test. */
function freshStore(limit?: number): SavedPanels {
  const name = `qdpanel-test-${Date.now()}-${dbCount++}`;
  opened.push(name);
  return new SavedPanels(createStore(name, 'panels'), limit);
}

afterEach(async () => {
  for (const name of opened.splice(0)) indexedDB.deleteDatabase(name);
});

const at = (iso: string) => new Date(iso);

describe('saved panels in IndexedDB', () => {
  it('an entry written is read back whole: a 3,000-point table keeps all its points', async () => {
    const store = freshStore();
    const p = panel('Big table', 20, 3000);
    await store.put(savedEntry('a', { panel: p, exclude: ['lead'], instrument: 'scope1' }, at('2026-01-02T03:04:05Z')));
    const back = (await store.get('a'))!;
    expect(back.name).toBe('Big table');
    expect(back.savedAt).toBe('2026-01-02T03:04:05.000Z');
    expect(back.exclude).toEqual(['lead']);
    expect(back.instrument).toBe('scope1');
    const table = back.panel.channels[1].filters[0];
    expect(table.type === 'table' && table.points.length).toBe(3000);
    expect(back.panel).toEqual(p);
  });

  it('the list is newest first, and writing the same id again replaces its entry', async () => {
    const store = freshStore();
    await store.put(savedEntry('a', { panel: panel('First'), exclude: [] }, at('2026-01-01T00:00:00Z')));
    await store.put(savedEntry('b', { panel: panel('Second'), exclude: [] }, at('2026-01-02T00:00:00Z')));
    await store.put(savedEntry('a', { panel: panel('First, edited', 30), exclude: [] }, at('2026-01-03T00:00:00Z')));
    const list = await store.list();
    expect(list.map((e) => [e.id, e.name])).toEqual([
      ['a', 'First, edited'],
      ['b', 'Second'],
    ]);
  });

  it('beyond the limit of 3 the oldest entry is dropped', async () => {
    const store = freshStore(3);
    for (const [i, day] of ['01', '02', '03', '04'].entries())
      await store.put(savedEntry(`e${i}`, { panel: panel(`Day ${day}`), exclude: [] }, at(`2026-01-${day}T00:00:00Z`)));
    expect((await store.list()).map((e) => e.name)).toEqual(['Day 04', 'Day 03', 'Day 02']);
  });

  it('rename sets the name and the panel title; delete removes it and restore puts it back', async () => {
    const store = freshStore();
    await store.put(savedEntry('a', { panel: panel('Old name'), exclude: [] }, at('2026-01-01T00:00:00Z')));
    expect(await store.rename('a', '  Kidney panel ')).toBe(true);
    const renamed = (await store.get('a'))!;
    expect([renamed.name, renamed.panel.title]).toEqual(['Kidney panel', 'Kidney panel']);
    expect(await store.rename('missing', 'x')).toBe(false);
    await store.remove('a');
    expect(await store.list()).toEqual([]);
    await store.restore([renamed]);
    expect((await store.list()).map((e) => e.name)).toEqual(['Kidney panel']);
  });

  it('an untitled panel is saved as "Untitled panel"', async () => {
    const store = freshStore();
    await store.put(savedEntry('a', { panel: panel(''), exclude: [] }, at('2026-01-01T00:00:00Z')));
    expect((await store.get('a'))!.name).toBe('Untitled panel');
  });
});

describe('the autosaver', () => {
  it('writes only the last of a burst of edits, after the delay, and flush writes at once', async () => {
    const store = freshStore();
    const widths: number[] = [];
    const counting = {
      put: (e: SavedPanel) => {
        const f = e.panel.channels[0].filters[0];
        widths.push(f.type === 'bandpass' ? f.widthNm : NaN);
        return store.put(e);
      },
    } as unknown as SavedPanels;
    const saver = new Autosaver(counting, () => {}, 50);
    saver.schedule(savedEntry('a', { panel: panel('W', 21), exclude: [] }, at('2026-01-01T00:00:00Z')));
    saver.schedule(savedEntry('a', { panel: panel('W', 22), exclude: [] }, at('2026-01-01T00:00:01Z')));
    await new Promise((r) => setTimeout(r, 10));
    expect(widths).toEqual([]);
    await new Promise((r) => setTimeout(r, 120));
    await saver.written;
    expect(widths).toEqual([22]);
    const first = (await store.get('a'))!.panel.channels[0].filters[0];
    expect(first.type === 'bandpass' && first.widthNm).toBe(22);
    saver.schedule(savedEntry('a', { panel: panel('W', 23), exclude: [] }, at('2026-01-01T00:00:02Z')));
    await saver.flush();
    expect(widths).toEqual([22, 23]);
    const second = (await store.get('a'))!.panel.channels[0].filters[0];
    expect(second.type === 'bandpass' && second.widthNm).toBe(23);
  });

  it('a store that refuses writes is reported once and the page goes on', async () => {
    const refusing = {
      put: async (_e: SavedPanel) => {
        throw new DOMException('quota', 'QuotaExceededError');
      },
    } as unknown as SavedPanels;
    const notices: string[] = [];
    const saver = new Autosaver(refusing, (m) => notices.push(m), 10);
    for (const w of [21, 22]) {
      saver.schedule(savedEntry('a', { panel: panel('W', w), exclude: [] }, at('2026-01-01T00:00:00Z')));
      await saver.flush();
    }
    expect(notices).toEqual([STORAGE_OFF_NOTICE]);
  });
});
