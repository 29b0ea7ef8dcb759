/**
 * <qdp-probe-list>: the panel's probes as a table-like editor: one compact row per probe (name, what it is made of,
 * peak, FWHM, channel, brightness) that opens its editor card in place, and "Add probe", whose new row opens with the
 * focus on its label. Card events bubble up unchanged; this element adds `probe-add`.
 */
import { LitElement, css, html, unsafeCSS } from 'lit';
import { customElement, property, state } from 'lit/decorators.js';
import { cardList, focusRing, rowTable } from './shared-styles';
import { LIMITS, type PanelSpec } from '../../spectra/index';
import type { ProbePrediction } from '../state/compute';
import { OpenRows } from '../state/open-rows';
import { AddedRowFocus } from './added-row-focus';
import { PROBE_COLUMNS, probeCells } from '../state/row-summary';
import './editor-row';
import './probe-card';
import type { ProbeCardMaterial } from './probe-card';

/** Where each column of a probe row starts: the name, made of, peak, FWHM, channel, brightness. */
const PROBE_ROW_COLUMNS = 'minmax(8.5rem, 1.5fr) minmax(4.5rem, 1fr) 3.8rem 3.6rem minmax(6.5rem, 1.2fr) 5.4rem';

@customElement('qdp-probe-list')
export class ProbeList extends LitElement {
  @property({ attribute: false }) panel?: PanelSpec;
  @property({ attribute: false }) materials: ProbeCardMaterial[] = [];
  @property({ attribute: false }) predictions: (ProbePrediction | undefined)[] = [];
  /** Errors keyed by probe index, then by field name. */
  @property({ attribute: false }) errors: Record<number, Record<string, string>> = {};
  /** The channel (index) that collects most of each probe's light, from the last evaluation. */
  @property({ attribute: false }) primary: (number | null)[] = [];
  /** Exclusion reasons keyed by probe id. */
  @property({ attribute: false }) blocked: Map<string, string> = new Map();
  /** Most probes a panel may hold (the API's limit). */
  @property({ type: Number }) maxProbes: number = LIMITS.probes;

  /** Bumped when a row opens or closes, to draw again. */
  @state() private toggles = 0;
  private readonly rows = new OpenRows();
  /** Opens the row the user just added and moves the focus into it. */
  protected readonly addedFocus = new AddedRowFocus(
    this,
    this.rows,
    () => this.panel?.probes.map((p) => p.id) ?? [],
    'qdp-probe-card',
    () => this.toggles++,
  );

  static override styles = [
    focusRing,
    cardList,
    rowTable,
    css`
      :host {
        --row-columns: ${unsafeCSS(PROBE_ROW_COLUMNS)};
      }
      button {
        margin-top: 0.5rem;
      }
      /* The card is the open row's body: the row draws the frame. */
      qdp-probe-card {
        border: none;
        padding: 0;
        background: transparent;
      }
    `,
  ];

  override render() {
    const panel = this.panel;
    if (!panel) return html``;
    const full = panel.probes.length >= this.maxProbes;
    const name = (id: string) => this.materials.find((m) => m.id === id)?.name ?? id;
    return html`<div class="columns" aria-hidden="true">${PROBE_COLUMNS.map((c) => html`<span>${c}</span>`)}</div>
      <div class="rows" data-toggles=${this.toggles}>
        ${panel.probes.map((p, i) => {
          const errors = this.errors[i] ?? {};
          const hasErrors = Object.keys(errors).length > 0;
          const blocked = this.blocked.get(p.id) ?? '';
          const prediction = hasErrors ? undefined : this.predictions[i];
          return html`<qdp-editor-row
            noun="probe"
            .heading=${p.label || p.id}
            .cells=${probeCells(p, name(p.material), prediction, panel.channels, this.primary[i])}
            ?open=${this.rows.isOpen(p.id, hasErrors)}
            .attention=${hasErrors ? 'Fix the marked field below.' : blocked ? `Blocked: ${blocked}.` : ''}
            @row-toggle=${(e: CustomEvent<{ open: boolean }>) => {
              this.rows.choose(p.id, e.detail.open);
              this.toggles++;
            }}
          >
            <qdp-probe-card
              data-id=${p.id}
              .probe=${p}
              .index=${i}
              .materials=${this.materials}
              .channels=${panel.channels}
              .prediction=${this.predictions[i]}
              .errors=${errors}
              .blocked=${blocked}
              ?excluded=${this.blocked.has(p.id)}
            ></qdp-probe-card>
          </qdp-editor-row>`;
        })}
      </div>
      <button
        type="button"
        ?disabled=${full}
        @click=${() => {
          this.rows.expectAdded();
          this.dispatchEvent(new CustomEvent('probe-add', { bubbles: true, composed: true }));
        }}
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
