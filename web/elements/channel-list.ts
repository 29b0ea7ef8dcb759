/**
 * <qdp-channel-list>: the panel's detection channels as a table-like editor: one compact row per channel (name,
 * filters, excitation, detector) that opens its editor card in place; "Add channel", whose new row opens with the
 * focus on its label; "Add a spectral detector run" (N contiguous narrow bins over a range and bin width the user
 * gives: detectors differ, so there is no default); and the "snap to stock sizes" setting. Fires `channel-add`,
 * `spectral-run` {startNm, bins, binWidthNm} and `snap-stock-change` {snapStock}.
 */
import { LitElement, css, html, unsafeCSS } from 'lit';
import { customElement, property, state } from 'lit/decorators.js';
import { cardList, focusRing, rowTable } from './shared-styles';
import { LIMITS, type DetectorClass, type PanelSpec } from '../../spectra/index';
import { RANGES } from '../../worker/schemas';
import { OpenRows } from '../state/open-rows';
import { AddedRowFocus } from './added-row-focus';
import { CHANNEL_COLUMNS, channelCells } from '../state/row-summary';
import './channel-card';
import './editor-row';
import './number-field';

/** Where each column of a channel row starts: the name, filters, excitation, detector. */
const CHANNEL_ROW_COLUMNS = 'minmax(6rem, 1.2fr) minmax(8rem, 2fr) minmax(4rem, 0.8fr) minmax(5rem, 1.1fr)';

/** The spectral run as typed: a field left empty is undefined. */
interface RunInput {
  startNm?: number;
  bins?: number;
  binWidthNm?: number;
}

@customElement('qdp-channel-list')
export class ChannelList extends LitElement {
  @property({ attribute: false }) panel?: PanelSpec;
  @property({ attribute: false }) detectors: Pick<DetectorClass, 'id' | 'name'>[] = [];
  /** Errors keyed by channel index, then by field path inside the channel. */
  @property({ attribute: false }) errors: Record<number, Record<string, string>> = {};
  /** When on, bandpass sizes dragged on the chart or typed in land on the nearest stock size. */
  @property({ type: Boolean }) snapStock = false;
  /** Most channels a panel may hold (the API's limit). */
  @property({ type: Number }) maxChannels: number = LIMITS.channels;

  @state() private run: RunInput = {};
  /** Bumped when a row opens or closes, to draw again. */
  @state() private toggles = 0;
  private readonly rows = new OpenRows();
  /** Opens the row the user just added and moves the focus into it. */
  protected readonly addedFocus = new AddedRowFocus(
    this,
    this.rows,
    () => this.panel?.channels.map((c) => c.id) ?? [],
    'qdp-channel-card',
    () => this.toggles++,
  );

  static override styles = [
    focusRing,
    cardList,
    rowTable,
    css`
      :host {
        --row-columns: ${unsafeCSS(CHANNEL_ROW_COLUMNS)};
      }
      qdp-channel-card {
        border: none;
        padding: 0;
        background: transparent;
      }
      details {
        margin-top: 0.5rem;
      }
      fieldset {
        border: 1px solid #ccd;
        border-radius: 6px;
        margin-top: 0.6rem;
        display: flex;
        flex-wrap: wrap;
        gap: 0.5rem;
        align-items: flex-end;
      }
      .note {
        font-size: 0.85rem;
      }
      .snap {
        display: block;
        font-size: 0.85rem;
        margin-bottom: 0.4rem;
      }
    `,
  ];

  private fire(name: string, detail?: unknown): void {
    this.dispatchEvent(new CustomEvent(name, { detail, bubbles: true, composed: true }));
  }

  override render() {
    const panel = this.panel;
    if (!panel) return html``;
    const lines = panel.excitation.map((e) => e.wavelengthNm);
    const room = Math.max(0, this.maxChannels - panel.channels.length);
    const { startNm, bins, binWidthNm } = this.run;
    // The run must fit the API's wavelength range as well as the channel limit.
    const [minNm, maxNm] = RANGES.wavelengthNm;
    const runFits =
      startNm !== undefined &&
      bins !== undefined &&
      binWidthNm !== undefined &&
      Number.isInteger(bins) &&
      bins >= 1 &&
      bins <= room &&
      binWidthNm > 0 &&
      startNm >= minNm &&
      startNm + bins * binWidthNm <= maxNm;
    const set = (k: keyof RunInput) => (e: CustomEvent<{ value?: number }>) => {
      this.run = { ...this.run, [k]: e.detail.value };
    };
    const snap = (e: Event) => this.fire('snap-stock-change', { snapStock: (e.target as HTMLInputElement).checked });
    return html`<label class="snap"
        ><input type="checkbox" .checked=${this.snapStock} @change=${snap} /> Snap bandpass sizes to stock sizes (when
        dragging an edge on the chart or typing a centre or width)</label
      >
      <div class="columns" aria-hidden="true">${CHANNEL_COLUMNS.map((c) => html`<span>${c}</span>`)}</div>
      <div class="rows" data-toggles=${this.toggles}>
        ${panel.channels.map((c, i) => {
          const errors = this.errors[i] ?? {};
          const hasErrors = Object.keys(errors).length > 0;
          return html`<qdp-editor-row
            noun="channel"
            .heading=${c.label || c.id}
            .cells=${channelCells(c, this.detectors)}
            ?open=${this.rows.isOpen(c.id, hasErrors)}
            .attention=${hasErrors ? 'Fix the marked field below.' : ''}
            @row-toggle=${(e: CustomEvent<{ open: boolean }>) => {
              this.rows.choose(c.id, e.detail.open);
              this.toggles++;
            }}
          >
            <qdp-channel-card
              data-id=${c.id}
              .channel=${c}
              .index=${i}
              .lines=${lines}
              .detectors=${this.detectors}
              .errors=${errors}
              ?snapStock=${this.snapStock}
            ></qdp-channel-card>
          </qdp-editor-row>`;
        })}
      </div>
      <button
        type="button"
        ?disabled=${room < 1}
        @click=${() => {
          this.rows.expectAdded();
          this.fire('channel-add');
        }}
      >
        Add channel
      </button>
      <details>
        <summary>Spectral detector run: narrow bins side by side</summary>
        <fieldset>
          <legend>Add a spectral detector run</legend>
          <qdp-number-field
            label="From"
            unit="nm"
            .value=${this.run.startNm}
            @value-change=${set('startNm')}
          ></qdp-number-field>
          <qdp-number-field label="Bins" .value=${this.run.bins} @value-change=${set('bins')}></qdp-number-field>
          <qdp-number-field
            label="Bin width"
            unit="nm"
            .value=${this.run.binWidthNm}
            @value-change=${set('binWidthNm')}
          ></qdp-number-field>
          <button type="button" ?disabled=${!runFits} @click=${() => this.fire('spectral-run', { ...this.run })}>
            ${runFits ? `Add ${bins} × ${binWidthNm} nm bins` : 'Add the bins'}
          </button>
          <span class="note">${room} more channel${room === 1 ? '' : 's'} allowed (at most ${this.maxChannels}).</span>
          <span class="note hint">Take the start, bin count and bin width from your detector's settings.</span>
        </fieldset>
      </details>`;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'qdp-channel-list': ChannelList;
  }
}
