// Component tests in headless Chromium for My panels, on a real IndexedDB store of its own per test.
import { afterEach, describe, expect, it } from 'vitest';
import { createStore } from 'idb-keyval';
import type { PanelSpec } from '../../spectra/index';
import { loadChecks } from '../../web/state/load-checks';
import { SavedPanels, savedEntry, type SavedPanel } from '../../web/state/saved-panels';
import { demoPanel } from '../../web/state/demo-panel';
import '../../web/elements/my-panels';

const databases: string[] = [];

afterEach(() => {
  document.body.replaceChildren();
  for (const name of databases.splice(0)) indexedDB.deleteDatabase(name);
});

function freshStore(): SavedPanels {
  const name = `qdpanel-my-panels-${Date.now()}-${databases.length}`;
  databases.push(name);
  return new SavedPanels(createStore(name, 'panels'));
}

/** The demo with its Red band (channel 5) at `centerNm`/`widthNm`. */
function demoWithRed(centerNm: number, widthNm = 20): PanelSpec {
  const p = demoPanel();
  p.channels[4] = { ...p.channels[4], filters: [{ type: 'bandpass', centerNm, widthNm }] };
  return p;
}

/** A list on `store` with the working panel `current`, opened. */
async function mountOpen(store: SavedPanels, current?: { id: string; panel: PanelSpec }) {
  const el = document.createElement('qdp-my-panels');
  el.store = store;
  el.current = current;
  document.body.appendChild(el);
  await el.updateComplete;
  const details = el.shadowRoot!.querySelector('details')!;
  details.open = true;
  await waitFor(() => el.shadowRoot!.querySelector('ul.list') !== null);
  await el.reload();
  await el.updateComplete;
  return el;
}

async function waitFor(ok: () => boolean, ms = 2000): Promise<void> {
  const end = Date.now() + ms;
  while (!ok()) {
    if (Date.now() > end) throw new Error('timed out');
    await new Promise((r) => setTimeout(r, 20));
  }
}

const rows = (el: HTMLElement) => [...el.shadowRoot!.querySelectorAll('li.entry')] as HTMLElement[];
const button = (root: Element | ShadowRoot, name: RegExp) =>
  [...root.querySelectorAll('button')].find((b) => name.test(b.textContent ?? '')) as HTMLButtonElement;

describe('<qdp-my-panels>', () => {
  it('lists the working panel first, then saved ones with their counts, and Open sends the entry', async () => {
    const store = freshStore();
    const saved = savedEntry('s1', { panel: demoWithRed(640), exclude: [] }, new Date('2026-03-04T05:06:00Z'));
    await store.put(saved);
    const el = await mountOpen(store, { id: 'now', panel: { ...demoPanel(), title: '' } });
    const [first, second] = rows(el);
    expect(first.textContent).toContain('Untitled panel');
    expect(first.textContent).toContain('open now · 6 probes, 6 channels');
    expect(second.textContent).toContain('Demo: six targets');
    expect(second.querySelector('time')!.getAttribute('datetime')).toBe('2026-03-04T05:06:00.000Z');
    const opened: SavedPanel[] = [];
    el.addEventListener('saved-panel-open', (e) => opened.push((e as CustomEvent<{ entry: SavedPanel }>).detail.entry));
    button(second, /^Open$/).click();
    expect(opened.map((e) => e.id)).toEqual(['s1']);
  });

  it('Rename focuses the name box and keeps the name; Delete removes it and "Undo delete" brings it back', async () => {
    const store = freshStore();
    await store.put(savedEntry('s1', { panel: demoWithRed(640), exclude: [] }, new Date('2026-03-04T05:06:00Z')));
    const el = await mountOpen(store);
    button(rows(el)[0], /^Rename$/).click();
    await el.updateComplete;
    const input = el.shadowRoot!.querySelector('input[name="name"]') as HTMLInputElement;
    expect(el.shadowRoot!.activeElement).toBe(input);
    input.value = 'Kidney section';
    button(el.shadowRoot!, /^Save name$/).click();
    await waitFor(() => rows(el)[0]?.textContent?.includes('Kidney section') ?? false);
    expect((await store.get('s1'))!.panel.title).toBe('Kidney section');
    button(rows(el)[0], /^Delete$/).click();
    await waitFor(() => rows(el).length === 0);
    expect(await store.list()).toEqual([]);
    button(el.shadowRoot!, /^Undo delete$/).click();
    await waitFor(() => rows(el).length === 1);
    expect((await store.list()).map((e) => e.name)).toEqual(['Kidney section']);
  });

  it('ticking the working panel and a saved one compares them, saying the Red band moved', async () => {
    await loadChecks();
    const store = freshStore();
    await store.put(savedEntry('s1', { panel: demoWithRed(640, 30), exclude: [] }, new Date('2026-03-04T05:06:00Z')));
    const el = await mountOpen(store, { id: 'now', panel: demoPanel() });
    for (const row of rows(el)) (row.querySelector('input[type="checkbox"]') as HTMLInputElement).click();
    await el.updateComplete;
    const compare = el.shadowRoot!.querySelector('qdp-panel-compare')!;
    await compare.updateComplete;
    const diff = [...compare.shadowRoot!.querySelectorAll('ul.diff li')].map((li) => li.textContent?.trim());
    expect(diff).toContain("Channel 'Red': bandpass 660/20 → 640/30");
  });
});
