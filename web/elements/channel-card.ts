/**
 * <qdp-channel-card>: edit one detection channel: its filters (bandpass centre/width, longpass or shortpass edge, or a
 * measured transmission table), the excitation lines on while it is read, and its detector class. Fires
 * `channel-change` {index, channel} and `channel-remove` {index}.
 */
import { LitElement, css, html } from 'lit';
import { customElement, property } from 'lit/decorators.js';
import { cardFrame, fieldRows, focusRing, textFields } from './shared-styles';
import {
  FILTER_TYPES,
  isStockBandpass,
  nearestStockBandpass,
  type ChannelSpec,
  type DetectorClass,
  type FilterSpec,
  type FilterType,
  type SpectrumPoints,
} from '../../spectra/index';
import { describeFilter } from '../io/filter-text';
import { messagesBesides } from '../state/error-map';
import { snapToStock } from '../state/stock-snap';
import './number-field';
import './spectrum-input';

/** A filter kind the card offers: every kind but the dichroic, which it edits by its edge like a longpass. */
type FilterKind = Exclude<FilterType, 'dichroic'>;
const KINDS = FILTER_TYPES.filter((t): t is FilterKind => t !== 'dichroic');

/** A new filter of a kind, placed near `nearNm` so switching kind keeps it where it was. */
function filterOfKind(kind: FilterKind, nearNm: number): FilterSpec {
  if (kind === 'bandpass') return { type: 'bandpass', centerNm: nearNm, widthNm: 20 };
  if (kind === 'table')
    return {
      type: 'table',
      points: [
        [nearNm - 10, 0],
        [nearNm - 9, 0.9],
        [nearNm + 9, 0.9],
        [nearNm + 10, 0],
      ],
    };
  return { type: kind, edgeNm: nearNm };
}

const centreOf = (f: FilterSpec) =>
  'centerNm' in f
    ? f.centerNm
    : 'edgeNm' in f
      ? f.edgeNm
      : f.points.length
        ? f.points[Math.floor(f.points.length / 2)][0]
        : 600;

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
    css`
      .stock {
        font-size: 0.8rem;
        color: #333;
        align-self: center;
      }
      header {
        display: flex;
        justify-content: space-between;
        align-items: center;
        gap: 0.5rem;
      }
      .filter {
        border-left: 3px solid #8a94a6;
        padding-left: 0.5rem;
        margin: 0.3rem 0;
      }
      .bad {
        color: #8b1a1a;
      }
    `,
  ];

  private change(channel: ChannelSpec): void {
    this.dispatchEvent(
      new CustomEvent('channel-change', { detail: { index: this.index, channel }, bubbles: true, composed: true }),
    );
  }

  private setFilter(j: number, filter: FilterSpec | null): void {
    const filters =
      filter === null
        ? this.channel.filters.filter((_, k) => k !== j)
        : this.channel.filters.map((f, k) => (k === j ? filter : f));
    this.change({ ...this.channel, filters });
  }

  private num(j: number, f: FilterSpec, key: 'centerNm' | 'widthNm' | 'edgeNm', label: string) {
    const typed = (e: CustomEvent<{ value?: number }>) =>
      e.detail.value !== undefined && this.setFilter(j, { ...f, [key]: e.detail.value } as FilterSpec);
    const done = (e: CustomEvent<{ value: number }>) => {
      if (this.snapStock && f.type === 'bandpass') this.setFilter(j, snapToStock({ ...f, [key]: e.detail.value }));
    };
    return html`<qdp-number-field
      .label=${label}
      unit="nm"
      .value=${(f as Record<string, unknown>)[key] as number}
      data-field=${`filters.${j}.${key}`}
      .error=${this.errors[`filters.${j}.${key}`] ?? ''}
      @value-change=${typed}
      @value-commit=${done}
    ></qdp-number-field>`;
  }

  /** The filter's kind; choosing another puts a new filter of that kind where this one was. */
  private kindChoice(f: FilterSpec, j: number) {
    const kind = (f.type === 'dichroic' ? 'longpass' : f.type) as FilterKind;
    const chosen = (e: Event) =>
      this.setFilter(j, filterOfKind((e.target as HTMLSelectElement).value as FilterKind, centreOf(f)));
    return html`<label class="text"
      >Filter ${j + 1}
      <select @change=${chosen}>
        ${KINDS.map(
          (k) => html`<option value=${k} ?selected=${k === kind}>${k === 'table' ? 'measured table' : k}</option>`,
        )}
      </select></label
    >`;
  }

  /** Whether a bandpass is a stock size, and the nearest stock size when it is not. */
  private stockSize(f: Extract<FilterSpec, { type: 'bandpass' }>, j: number) {
    if (isStockBandpass(f.centerNm, f.widthNm)) return html`<span class="stock">stock size</span>`;
    const near = nearestStockBandpass(f.centerNm, f.widthNm);
    return html`<span class="stock"
      >custom size
      <button type="button" @click=${() => this.setFilter(j, { ...f, ...near })}>
        Use stock ${near.centerNm}/${near.widthNm}
      </button></span
    >`;
  }

  /** The numbers that place a filter: a bandpass's centre and width, an edge filter's edge, a table's summary. */
  private filterFields(f: FilterSpec, j: number) {
    if (f.type === 'bandpass')
      return html`${this.num(j, f, 'centerNm', 'Centre')}${this.num(j, f, 'widthNm', 'Width (FWHM)')}
      ${this.stockSize(f, j)}`;
    if (f.type === 'table') return html`<span>${describeFilter(f)}</span>`;
    return this.num(j, f, 'edgeNm', 'Edge');
  }

  private filterRow(f: FilterSpec, j: number) {
    const loaded = (e: CustomEvent<{ points: SpectrumPoints }>) =>
      this.setFilter(j, { type: 'table', points: e.detail.points });
    const message = this.errors[`filters.${j}`];
    return html`<div class="filter" aria-label=${`Filter ${j + 1}: ${describeFilter(f)}`}>
      <div class="row">
        ${this.kindChoice(f, j)} ${this.filterFields(f, j)}
        ${
          this.channel.filters.length > 1
            ? html`<button type="button" @click=${() => this.setFilter(j, null)}>Remove filter</button>`
            : ''
        }
      </div>
      ${
        f.type === 'table'
          ? html`<qdp-spectrum-input
              kind="transmission"
              label="filter transmission"
              @spectrum-loaded=${loaded}
            ></qdp-spectrum-input>`
          : ''
      }
      ${message ? html`<p class="bad" role="alert">${message}</p>` : ''}
    </div>`;
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

  /** The error keys this card shows in place: each filter's number fields and the filter as a whole. */
  private shownKeys(): string[] {
    return this.channel.filters.flatMap((f, j) => {
      const keys = f.type === 'bandpass' ? ['centerNm', 'widthNm'] : f.type === 'table' ? [] : ['edgeNm'];
      return [`filters.${j}`, ...keys.map((k) => `filters.${j}.${k}`)];
    });
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
            <option value="" ?selected=${!c.detector}>ideal (QE 1)</option>
            ${this.detectors.map(
              (d) => html`<option value=${d.id} ?selected=${d.id === c.detector}>${d.name}</option>`,
            )}
          </select></label
        >
      </div>
      ${c.filters.map((f, j) => this.filterRow(f, j))}
      <button
        type="button"
        @click=${() => this.change({ ...c, filters: [...c.filters, { type: 'longpass', edgeNm: 500 }] })}
      >
        Add filter to this channel
      </button>
      ${messagesBesides(this.errors, this.shownKeys()).map((m) => html`<p class="bad" role="alert">${m}</p>`)}`;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'qdp-channel-card': ChannelCard;
  }
}
