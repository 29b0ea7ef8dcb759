/**
 * <qdp-my-panels>: the panels kept in this browser, in a <details> under the header (one Tab stop while closed). Each
 * shows its name, when it was saved, its probe and channel counts, and Open, Rename and Delete (Delete offers an undo);
 * ticking two (the panel open now counts as one) compares them side by side. Open sends `saved-panel-open` with the
 * entry; the page loads it as one undoable step.
 */
import { LitElement, css, html } from 'lit';
import { customElement, property, state } from 'lit/decorators.js';
import type { PanelSpec } from '../../spectra/index';
import { focusRing } from './shared-styles';
import { SAVED_PANEL_LIMIT, savedName, type SavedPanel, type SavedPanels } from '../state/saved-panels';
import type { CompareSide } from './panel-compare';
import './panel-compare';

/** "2 probes, 1 channel". */
export function counts(panel: PanelSpec): string {
  const n = (k: number, one: string) => `${k} ${one}${k === 1 ? '' : 's'}`;
  return `${n(panel.probes.length, 'probe')}, ${n(panel.channels.length, 'channel')}`;
}

/** A saved date in the reader's own format ("2 Dec 2026, 19:20" in en-GB). */
export function savedWhen(iso: string): string {
  const d = new Date(iso);
  return Number.isNaN(d.getTime()) ? iso : d.toLocaleString(undefined, { dateStyle: 'medium', timeStyle: 'short' });
}

@customElement('qdp-my-panels')
export class MyPanels extends LitElement {
  /** Where the panels are kept. */
  @property({ attribute: false }) store?: SavedPanels;
  /** The working panel and its entry's id (listed first, as "open now"). */
  @property({ attribute: false }) current?: { id: string; panel: PanelSpec };

  @state() private entries: SavedPanel[] = [];
  @state() private open = false;
  /** Ids ticked for comparing, in the order ticked (at most two). */
  @state() private picked: string[] = [];
  @state() private renaming = '';
  @state() private message = '';
  /** True from Open until the page shows the panel opened (its message stays). */
  private justOpened = false;
  /** The entry last deleted, for its undo. */
  @state() private deleted?: SavedPanel;

  static override styles = [
    focusRing,
    css`
      :host {
        display: block;
      }
      summary {
        cursor: pointer;
        font-weight: 600;
      }
      ul.list {
        list-style: none;
        margin: 0.4rem 0;
        padding: 0;
        display: grid;
        gap: 0.4rem;
      }
      li.entry {
        border: 1px solid #ccd;
        border-radius: 6px;
        padding: 0.3rem 0.5rem;
        background: #fff;
        display: flex;
        flex-wrap: wrap;
        gap: 0.2rem 0.6rem;
        align-items: center;
        min-width: 0;
      }
      .name {
        font-weight: 600;
        overflow-wrap: anywhere;
        min-width: 0;
      }
      .meta {
        color: #444;
        font-size: 0.9rem;
      }
      .actions {
        display: flex;
        flex-wrap: wrap;
        gap: 0.3rem;
        margin-left: auto;
      }
      input[type='text'] {
        font: inherit;
        width: min(18rem, 100%);
      }
      button {
        font: inherit;
      }
      p {
        margin: 0.3rem 0;
      }
    `,
  ];

  override willUpdate(changed: Map<string, unknown>): void {
    const before = changed.get('current') as MyPanels['current'];
    // Another working panel: what was said about the last one no longer applies.
    if (!changed.has('current') || !before || before.id === this.current?.id) return;
    if (!this.justOpened) this.message = '';
    this.justOpened = false;
  }

  /** Keyboard focus follows the action: into the new-name box on Rename, onto "Undo delete" after Delete. */
  override updated(changed: Map<string, unknown>): void {
    const root = this.renderRoot;
    if (changed.has('renaming') && this.renaming) root.querySelector<HTMLInputElement>('input[name="name"]')?.focus();
    if (changed.has('deleted') && this.deleted) root.querySelector<HTMLButtonElement>('button.undo-delete')?.focus();
  }

  /** Reads the list again (after opening the list, an action, or a save of the working panel). */
  async reload(): Promise<void> {
    this.entries = this.store ? await this.store.list() : [];
    const known = new Set([this.current?.id, ...this.entries.map((e) => e.id)]);
    this.picked = this.picked.filter((id) => known.has(id));
  }

  private onToggle(e: Event): void {
    this.open = (e.target as HTMLDetailsElement).open;
    if (this.open) void this.reload();
  }

  private pick(id: string, on: boolean): void {
    const rest = this.picked.filter((p) => p !== id);
    this.picked = on ? [...rest, id].slice(-2) : rest;
  }

  private openEntry(entry: SavedPanel): void {
    this.deleted = undefined;
    this.dispatchEvent(new CustomEvent('saved-panel-open', { detail: { entry }, bubbles: true, composed: true }));
    this.message = `Opened “${entry.name}”. Undo goes back to the panel before it.`;
    this.justOpened = true;
  }

  private async rename(entry: SavedPanel, form: HTMLFormElement): Promise<void> {
    const name = (new FormData(form).get('name') as string | null) ?? '';
    this.renaming = '';
    this.deleted = undefined;
    try {
      await this.store?.rename(entry.id, name);
      this.message = `Renamed to “${name.trim() || savedName({ ...entry.panel, title: '' })}”.`;
    } catch {
      this.message = 'The new name could not be kept: this browser’s storage refused it.';
    }
    await this.reload();
  }

  private async deleteEntry(entry: SavedPanel): Promise<void> {
    try {
      await this.store?.remove(entry.id);
      this.deleted = entry;
      this.message = `Deleted “${entry.name}”.`;
    } catch {
      this.message = 'The panel could not be deleted: this browser’s storage refused it.';
    }
    await this.reload();
  }

  private async undoDelete(): Promise<void> {
    const entry = this.deleted;
    if (!entry) return;
    this.deleted = undefined;
    try {
      await this.store?.restore([entry]);
      this.message = `“${entry.name}” is back.`;
    } catch {
      this.message = `“${entry.name}” could not be put back: this browser’s storage refused it.`;
    }
    await this.reload();
  }

  /** The side of a comparison an id stands for (the working panel as it is now, or a saved one). */
  private sideOf(id: string): CompareSide | undefined {
    if (id === this.current?.id) return { panel: this.current.panel, caption: 'open now' };
    const e = this.entries.find((x) => x.id === id);
    return e ? { panel: e.panel, caption: `saved ${savedWhen(e.savedAt)}` } : undefined;
  }

  private compareBox(id: string, name: string) {
    return html`<label
      ><input
        type="checkbox"
        aria-label=${`Compare ${name}`}
        .checked=${this.picked.includes(id)}
        @change=${(e: Event) => this.pick(id, (e.target as HTMLInputElement).checked)}
      />
      Compare</label
    >`;
  }

  private currentRow() {
    const c = this.current;
    if (!c) return '';
    const name = savedName(c.panel);
    return html`<li class="entry current">
      <span class="name">${name}</span>
      <span class="meta">open now · ${counts(c.panel)}</span>
      <span class="actions">${this.compareBox(c.id, name)}</span>
    </li>`;
  }

  private entryRow(e: SavedPanel) {
    if (this.renaming === e.id) {
      return html`<li class="entry">
        <form
          @submit=${(ev: Event) => {
            ev.preventDefault();
            void this.rename(e, ev.target as HTMLFormElement);
          }}
        >
          <label>New name <input type="text" name="name" .value=${e.name} /></label>
          <button type="submit">Save name</button>
          <button type="button" @click=${() => (this.renaming = '')}>Cancel</button>
        </form>
      </li>`;
    }
    return html`<li class="entry">
      <span class="name">${e.name}</span>
      <span class="meta"><time datetime=${e.savedAt}>${savedWhen(e.savedAt)}</time> · ${counts(e.panel)}</span>
      <span class="actions">
        <button type="button" aria-label=${`Open ${e.name}`} @click=${() => this.openEntry(e)}>Open</button>
        <button type="button" aria-label=${`Rename ${e.name}`} @click=${() => (this.renaming = e.id)}>Rename</button>
        <button type="button" aria-label=${`Delete ${e.name}`} @click=${() => this.deleteEntry(e)}>Delete</button>
        ${this.compareBox(e.id, e.name)}
      </span>
    </li>`;
  }

  private comparison() {
    const [a, b] = this.picked.map((id) => this.sideOf(id));
    if (this.picked.length < 2 || !a || !b) {
      return html`<p class="hint">Tick two panels (the one open now counts) to compare them side by side.</p>`;
    }
    return html`<qdp-panel-compare .a=${a} .b=${b}></qdp-panel-compare>`;
  }

  /** What the last action did, with "Undo delete" after a delete. */
  private status() {
    if (!this.message) return '';
    const undo = html`<button type="button" class="undo-delete" @click=${this.undoDelete}>Undo delete</button>`;
    return html`<p role="status">${this.message} ${this.deleted ? undo : ''}</p>`;
  }

  private body() {
    const saved = this.entries.filter((e) => e.id !== this.current?.id);
    return html`<p class="meta">
        Every panel you edit is kept in this browser (the newest ${SAVED_PANEL_LIMIT} at most); nothing leaves your
        computer.
      </p>
      ${this.status()}
      <ul class="list" aria-label="Panels kept in this browser">
        ${this.currentRow()} ${saved.map((e) => this.entryRow(e))}
      </ul>
      ${this.comparison()}`;
  }

  override render() {
    return html`<details @toggle=${this.onToggle}>
      <summary>My panels</summary>
      ${this.open ? this.body() : ''}
    </details>`;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'qdp-my-panels': MyPanels;
  }
}
