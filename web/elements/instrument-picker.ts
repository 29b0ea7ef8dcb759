/**
 * <qdp-instrument-picker>: which instrument profile the panel is on, a switch to another (an example or a pasted
 * link), what the last switch changed with an undo, and a way back to the panel's own set-up. Fires
 * `instrument-switch` {id}, `instrument-detach` and `instrument-undo`; the page does the loading and the switching.
 */
import { LitElement, css, html } from 'lit';
import { customElement, property, state } from 'lit/decorators.js';
import { fieldRows, focusRing } from './shared-styles';
import type { AttachedInstrument, InstrumentChanges } from '../state/instrument';
import { SHARE_ID_PATTERN } from '../../worker/schemas';

/** An example profile as GET /api/v1/instruments lists it. */
interface ExampleEntry {
  id: string;
  name: string;
  description: string;
}

/** The id in a pasted instrument link (…/i/<id>) or a bare id; null when there is none. */
export function instrumentIdOf(text: string): string | null {
  const t = text.trim();
  const m = /\/i\/([A-Za-z0-9_-]+)\/?(?:[?#].*)?$/.exec(t);
  const id = m ? m[1] : t;
  return SHARE_ID_PATTERN.test(id) ? id : null;
}

const fmt = (x: number | null) => (x === null ? '—' : x.toPrecision(3));

@customElement('qdp-instrument-picker')
export class InstrumentPicker extends LitElement {
  @property({ attribute: false }) attached?: AttachedInstrument;
  @property({ attribute: false }) changes?: InstrumentChanges;
  /** True while a profile is loading (the switch buttons wait). */
  @property({ type: Boolean }) busy = false;
  @state() private examples: ExampleEntry[] = [];
  @state() private examplesNote = '';
  @state() private pasted = '';
  @state() private pasteError = '';

  static override styles = [
    focusRing,
    fieldRows,
    css`
      :host {
        display: block;
        font-size: 0.9rem;
      }
      .current {
        margin: 0 0 0.4rem;
      }
      .desc {
        color: #444;
        margin: 0.1rem 0 0.4rem;
      }
      input[type='text'] {
        font: inherit;
        width: min(24rem, 100%);
      }
      table {
        border-collapse: collapse;
        font-size: 0.85rem;
        margin: 0.3rem 0;
      }
      th,
      td {
        border-bottom: 1px solid #dde;
        padding: 0.15rem 0.4rem;
        text-align: left;
      }
      td.num {
        text-align: right;
        font-variant-numeric: tabular-nums;
      }
      .changes {
        border-left: 3px solid #6b4fa0;
        padding-left: 0.6rem;
        margin-top: 0.5rem;
        overflow-x: auto;
      }
      .err {
        color: #a00;
      }
    `,
  ];

  override connectedCallback(): void {
    super.connectedCallback();
    void this.loadExamples();
  }

  private async loadExamples(): Promise<void> {
    try {
      const { listExampleInstruments } = await import('../io/api');
      this.examples = (await listExampleInstruments()).instruments;
    } catch (e) {
      this.examplesNote = `The example profiles could not be listed (${e instanceof Error ? e.message : String(e)}).`;
    }
  }

  private fire(name: string, detail?: unknown): void {
    this.dispatchEvent(new CustomEvent(name, { detail, bubbles: true, composed: true }));
  }

  private usePasted(): void {
    const id = instrumentIdOf(this.pasted);
    this.pasteError = id ? '' : 'Paste an instrument link (…/i/ followed by 24 letters, digits, - or _).';
    if (id) this.fire('instrument-switch', { id });
  }

  private current() {
    const a = this.attached;
    if (!a) {
      return html`<p class="current">
        This panel has its own lines, shared light path and channels (no instrument profile).
      </p>`;
    }
    const link = new URL(`/i/${a.id}`, location.origin).href;
    return html`<p class="current">
        On the instrument <strong>${a.spec.name}</strong>: its lines, shared light path and channel presets are used (<a
          href=${link}
          >profile link</a
        >).
        <button type="button" @click=${() => this.fire('instrument-detach')}>Keep the parts, drop the profile</button>
      </p>
      ${a.spec.description ? html`<p class="desc">${a.spec.description}</p>` : ''}`;
  }

  private changeTable(ch: InstrumentChanges) {
    return html`<div class="changes" role="status">
      <p>
        Switched from ${ch.from} to ${ch.to}. Lines: ${ch.linesNm.before.join(', ')} nm → ${ch.linesNm.after.join(', ')}
        nm; channels: ${ch.channels.before} → ${ch.channels.after}.
        <button type="button" @click=${() => this.fire('instrument-undo')}>Undo the switch</button>
      </p>
      <table>
        <thead>
          <tr>
            <th>Probe</th>
            <th>Channel before</th>
            <th>Collected before</th>
            <th>Channel after</th>
            <th>Collected after</th>
          </tr>
        </thead>
        <tbody>
          ${ch.probes.map(
            (p) =>
              html`<tr>
                <td>${p.probe}</td>
                <td>${p.before.channel ?? '—'}</td>
                <td class="num">${fmt(p.before.collected)}</td>
                <td>${p.after.channel ?? '—'}</td>
                <td class="num">${fmt(p.after.collected)}</td>
              </tr>`,
          )}
        </tbody>
      </table>
      ${
        ch.newWarnings.length
          ? html`<p>New warnings:</p>
              <ul>
                ${ch.newWarnings.map((w) => html`<li>${w}</li>`)}
              </ul>`
          : ''
      }
    </div>`;
  }

  override render() {
    return html`${this.current()}
      <div class="row">
        ${this.examples.map(
          (e) =>
            html`<button
              type="button"
              title=${e.description}
              ?disabled=${this.busy || this.attached?.id === e.id}
              @click=${() => this.fire('instrument-switch', { id: e.id })}
            >
              Use “${e.name}”
            </button>`,
        )}
      </div>
      ${this.examplesNote ? html`<p class="err">${this.examplesNote}</p>` : ''}
      <div class="row">
        <label
          >Instrument link
          <input
            type="text"
            .value=${this.pasted}
            placeholder="https://…/i/…"
            @input=${(e: Event) => (this.pasted = (e.target as HTMLInputElement).value)}
        /></label>
        <button type="button" ?disabled=${this.busy} @click=${this.usePasted}>Switch to this instrument</button>
      </div>
      ${this.pasteError ? html`<p class="err" role="alert">${this.pasteError}</p>` : ''}
      ${this.changes ? this.changeTable(this.changes) : ''}`;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'qdp-instrument-picker': InstrumentPicker;
  }
}
