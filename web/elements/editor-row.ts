/**
 * <qdp-editor-row>: one compact row of a table-like editor (a probe, a channel). The row reads as a line of cells
 * and is one button: pressing it opens the row's editor (the slotted element) in place under it, and pressing it
 * again closes it. The cells line up across rows through the list's `--row-columns` grid template. Fires
 * `row-toggle` {open}.
 */
import { LitElement, css, html } from 'lit';
import { customElement, property } from 'lit/decorators.js';
import { focusRing } from './shared-styles';

@customElement('qdp-editor-row')
export class EditorRow extends LitElement {
  /** The row's name (the probe's or channel's label), its first cell. */
  @property() heading = '';
  /** The other cells, as text. */
  @property({ attribute: false }) cells: string[] = [];
  /** What to call the row in the button's accessible name ("probe", "channel"). */
  @property() noun = '';
  @property({ type: Boolean, reflect: true }) open = false;
  /** A short problem on the row ("fix the marked field"), shown even while it is closed; '' for none. */
  @property() attention = '';

  static override styles = [
    focusRing,
    css`
      :host {
        display: block;
        border-bottom: 1px solid #d9dce6;
      }
      :host([open]) {
        background: #fff;
        border: 1px solid #9aa3c0;
        border-radius: 6px;
        margin: 0.3rem 0;
      }
      button.head {
        all: unset;
        box-sizing: border-box;
        display: grid;
        grid-template-columns: var(--row-columns, 1fr);
        gap: 0 0.6rem;
        align-items: baseline;
        width: 100%;
        padding: 0.3rem 0.4rem;
        cursor: pointer;
        font-size: 0.9rem;
        border-radius: 5px;
      }
      button.head:hover {
        background: #eef1f8;
      }
      button.head:focus-visible {
        outline: 3px solid #1a56db;
        outline-offset: -2px;
      }
      .name {
        font-weight: 600;
        overflow: hidden;
        text-overflow: ellipsis;
        white-space: nowrap;
      }
      .name::before {
        content: '▸';
        display: inline-block;
        width: 1em;
        color: #556;
      }
      :host([open]) .name::before {
        content: '▾';
      }
      .cell {
        overflow: hidden;
        text-overflow: ellipsis;
        white-space: nowrap;
        color: #2b3040;
        font-variant-numeric: tabular-nums;
      }
      .attention {
        grid-column: 1 / -1;
        color: #8b1a1a;
        font-weight: 600;
        font-size: 0.85rem;
      }
      .body {
        padding: 0 0.4rem 0.4rem;
      }
      /* On a phone the cells wrap under the name instead of keeping columns. */
      @media (max-width: 640px) {
        button.head {
          display: flex;
          flex-wrap: wrap;
          gap: 0 0.7rem;
        }
        .name {
          flex: 1 0 100%;
        }
      }
    `,
  ];

  private toggle(): void {
    this.open = !this.open;
    this.dispatchEvent(new CustomEvent('row-toggle', { detail: { open: this.open }, bubbles: true, composed: true }));
  }

  override render() {
    const label = `${this.heading}${this.noun ? ` (${this.noun})` : ''}: ${this.cells.join(', ')}`;
    return html`<button
        type="button"
        class="head"
        aria-expanded=${this.open ? 'true' : 'false'}
        aria-controls="body"
        aria-label=${label}
        title=${this.open ? 'Close this row' : 'Open this row to edit it'}
        @click=${this.toggle}
      >
        <span class="name">${this.heading}</span>
        ${this.cells.map((c) => html`<span class="cell">${c}</span>`)}
        ${this.attention ? html`<span class="attention">${this.attention}</span>` : ''}
      </button>
      <div class="body" id="body" ?hidden=${!this.open}><slot></slot></div>`;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'qdp-editor-row': EditorRow;
  }
}
