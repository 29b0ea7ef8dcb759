/**
 * <qdp-probe-list>: the panel's probes as editable cards, with "Add probe". Card events bubble up unchanged;
 * this element adds `probe-add`.
 */
import { LitElement, css, html } from 'lit';
import { customElement, property } from 'lit/decorators.js';
import { cardList, focusRing } from './shared-styles';
import { LIMITS, type PanelSpec } from '../../spectra/index';
import type { ProbePrediction } from '../state/compute';
import './probe-card';
import type { ProbeCardMaterial } from './probe-card';

@customElement('qdp-probe-list')
export class ProbeList extends LitElement {
  @property({ attribute: false }) panel?: PanelSpec;
  @property({ attribute: false }) materials: ProbeCardMaterial[] = [];
  @property({ attribute: false }) predictions: (ProbePrediction | undefined)[] = [];
  /** Errors keyed by probe index, then by field name. */
  @property({ attribute: false }) errors: Record<number, Record<string, string>> = {};
  /** Exclusion reasons keyed by probe id. */
  @property({ attribute: false }) blocked: Map<string, string> = new Map();
  /** Most probes a panel may hold (the API's limit). */
  @property({ type: Number }) maxProbes: number = LIMITS.probes;

  static override styles = [
    focusRing,
    cardList,
    css`
      button {
        margin-top: 0.5rem;
      }
    `,
  ];

  override render() {
    const panel = this.panel;
    if (!panel) return html``;
    const full = panel.probes.length >= this.maxProbes;
    return html`<div class="cards">
        ${panel.probes.map(
          (p, i) =>
            html`<qdp-probe-card
              .probe=${p}
              .index=${i}
              .materials=${this.materials}
              .channels=${panel.channels}
              .prediction=${this.predictions[i]}
              .errors=${this.errors[i] ?? {}}
              .blocked=${this.blocked.get(p.id) ?? ''}
              ?excluded=${this.blocked.has(p.id)}
            ></qdp-probe-card>`,
        )}
      </div>
      <button
        type="button"
        ?disabled=${full}
        @click=${() => this.dispatchEvent(new CustomEvent('probe-add', { bubbles: true, composed: true }))}
      >
        Add probe
      </button>
      ${full ? html`<span>A panel holds at most ${this.maxProbes} probes.</span>` : ''}`;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'qdp-probe-list': ProbeList;
  }
}
