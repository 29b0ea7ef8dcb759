/**
 * <qdp-channel-card>: edit one detection channel: its filters (bandpass centre/width, longpass or shortpass edge, or a
 * measured transmission table), the excitation lines on while it is read, and its detector class. Fires
 * `channel-change` {index, channel} and `channel-remove` {index}.
 */
import { LitElement, css, html } from 'lit';
import { customElement, property } from 'lit/decorators.js';
import { cardFrame, fieldRows, focusRing, textFields } from './shared-styles';
import type { ChannelSpec, DetectorClass, FilterSpec } from '../../spectra/index';
import { messagesBesides } from '../state/error-map';
import { IDEAL_DETECTOR } from '../state/row-summary';
import { CHANNEL_FILTER_KINDS, filterRowKeys, filterRowStyles, filterRows, withFilter } from './filter-rows';

@customElement('qdp-channel-card')
export class ChannelCard extends LitElement {
  @property({ attribute: false }) channel!: ChannelSpec;
  @property({ type: Number }) index = 0;
  /** The panel's excitation lines, nm. */
  @property({ attribute: false }) lines: number[] = [];
  @property({ attribute: false }) detectors: Pick<DetectorClass, 'id' | 'name'>[] = [];
  /** Errors keyed by the path inside the channel, e.g. "filters.0.widthNm"; those without a field show together. */
  @property({ attribute: false }) errors: Record<string, string> = {};
  /** When on, a bandpass centre or width typed in lands on the nearest stock size once the typing is done. */
  @property({ type: Boolean }) snapStock = false;

  static override styles = [
    focusRing,
    cardFrame,
    fieldRows,
    textFields,
    filterRowStyles,
    css`
      header {
        display: flex;
        justify-content: space-between;
        align-items: center;
        gap: 0.5rem;
      }
    `,
  ];

  /** Moves the keyboard focus to the first field (the label), once the card has drawn. */
  async focusFirst(): Promise<void> {
    await this.updateComplete;
    this.renderRoot.querySelector<HTMLElement>('input, select')?.focus();
  }

  private change(channel: ChannelSpec): void {
    this.dispatchEvent(
      new CustomEvent('channel-change', { detail: { index: this.index, channel }, bubbles: true, composed: true }),
    );
  }

  private setFilter(j: number, filter: FilterSpec | null): void {
    this.change({ ...this.channel, filters: withFilter(this.channel.filters, j, filter) });
  }

  private fireRemove(): void {
    this.dispatchEvent(
      new CustomEvent('channel-remove', { detail: { index: this.index }, bubbles: true, composed: true }),
    );
  }

  /** Sets or clears one optional field of the channel: `undefined` removes it. */
  private setOptional<K extends 'excitationNm' | 'detector'>(key: K, value: ChannelSpec[K] | undefined): void {
    const next = { ...this.channel };
    if (value === undefined) delete next[key];
    else next[key] = value;
    this.change(next);
  }

  override render() {
    const c = this.channel;
    const ex =
      c.excitationNm === undefined ? 'all' : String(Array.isArray(c.excitationNm) ? c.excitationNm[0] : c.excitationNm);
    return html` <header>
        <strong>${c.label || c.id}</strong>
        <button type="button" aria-label=${`Remove channel ${c.label || c.id}`} @click=${this.fireRemove}>
          Remove
        </button>
      </header>
      <div class="row">
        <label class="text"
          >Label
          <input
            type="text"
            .value=${c.label ?? ''}
            @change=${(e: Event) => this.change({ ...c, label: (e.target as HTMLInputElement).value })}
        /></label>
        <label class="text"
          >Excitation on
          <select
            @change=${(e: Event) => {
              const v = (e.target as HTMLSelectElement).value;
              this.setOptional('excitationNm', v === 'all' ? undefined : Number(v));
            }}
          >
            <option value="all" ?selected=${ex === 'all'}>all lines</option>
            ${this.lines.map((l) => html`<option value=${l} ?selected=${ex === String(l)}>${l} nm</option>`)}
          </select></label
        >
        <label class="text"
          >Detector
          <select
            @change=${(e: Event) => this.setOptional('detector', (e.target as HTMLSelectElement).value || undefined)}
          >
            <option value="" ?selected=${!c.detector}>${IDEAL_DETECTOR}</option>
            ${this.detectors.map(
              (d) => html`<option value=${d.id} ?selected=${d.id === c.detector}>${d.name}</option>`,
            )}
          </select></label
        >
      </div>
      ${filterRows({
        filters: c.filters,
        prefix: 'filters',
        errors: this.errors,
        kinds: CHANNEL_FILTER_KINDS,
        noun: 'Filter',
        removable: c.filters.length > 1,
        set: (j, filter) => this.setFilter(j, filter),
        snapStock: this.snapStock,
      })}
      <button
        type="button"
        @click=${() => this.change({ ...c, filters: [...c.filters, { type: 'longpass', edgeNm: 500 }] })}
      >
        Add filter to this channel
      </button>
      ${messagesBesides(this.errors, filterRowKeys(c.filters, 'filters')).map(
        (m) => html`<p class="bad" role="alert">${m}</p>`,
      )}`;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'qdp-channel-card': ChannelCard;
  }
}
