/**
 * <qdp-key-verdict>: the panel's verdict in two lines above the chart (its worst pair and its noisiest target after
 * unmixing), so it stays in view with the chart while the editors change the panel.
 */
import { LitElement, css, html } from 'lit';
import { customElement, property } from 'lit/decorators.js';
import type { CrosstalkView } from '../chart/crosstalk-view';
import { noisiestText, worstPairText } from '../chart/verdict';

/** Said while a large panel's figures wait for a pause in the typing. */
export const PENDING_NOTE = 'Updating after your edit: these are the figures from before it.';

@customElement('qdp-key-verdict')
export class KeyVerdict extends LitElement {
  @property({ attribute: false }) view?: CrosstalkView;
  /** True while the figures belong to an earlier, valid state of the panel (the current input is refused). */
  @property({ type: Boolean }) stale = false;
  /** True while a large panel's edit waits for a pause in the typing before the figures catch up. */
  @property({ type: Boolean }) pending = false;

  static override styles = css`
    :host {
      display: block;
      font-size: 0.9rem;
      border-left: 4px solid #3d4a7a;
      padding: 0.2rem 0.6rem;
      margin: 0 0 0.5rem;
      background: #fff;
    }
    p {
      margin: 0.1rem 0;
    }
    .stale {
      color: #8b1a1a;
    }
    .pending {
      color: #555;
      font-style: italic;
    }
  `;

  override render() {
    const v = this.view;
    if (!v)
      return this.stale
        ? html`<p class="stale">No verdict yet: fix the marked input and it appears.</p>`
        : html`<p>The verdict appears once the panel has a probe and a channel.</p>`;
    const pending = this.pending ? html`<p class="pending">${PENDING_NOTE}</p>` : '';
    return html`${pending}
      <div role="status" aria-live="polite" aria-atomic="true">
        ${this.stale ? html`<p class="stale">Figures of the last valid panel: fix the marked input.</p>` : ''}
        <p><strong>${worstPairText(v)}</strong></p>
        <p>${noisiestText(v)}</p>
      </div>`;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'qdp-key-verdict': KeyVerdict;
  }
}
