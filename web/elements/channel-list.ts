/**
 * <qdp-channel-list>: the panel's detection channels as editable cards, "Add channel", and "Add a spectral detector
 * run" (N contiguous narrow bins), and the "snap to stock sizes" setting. Fires `channel-add`, `spectral-run`
 * {startNm, bins, binWidthNm} and `snap-stock-change` {snapStock}.
 */
import { LitElement, css, html } from 'lit';
import { customElement, property, state } from 'lit/decorators.js';
import { cardList, focusRing } from './shared-styles';
import { LIMITS, type DetectorClass, type PanelSpec } from '../../spectra/index';
import { RANGES } from '../../worker/schemas';
import './channel-card';
import './number-field';

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

  @state() private run = { startNm: 480, bins: 16, binWidthNm: 10 };

  static override styles = [
    focusRing,
    cardList,
    css`
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
      Number.isInteger(bins) &&
      bins >= 1 &&
      bins <= room &&
      binWidthNm > 0 &&
      startNm >= minNm &&
      startNm + bins * binWidthNm <= maxNm;
    const set = (k: keyof typeof this.run) => (e: CustomEvent<{ value?: number }>) => {
      if (e.detail.value !== undefined) this.run = { ...this.run, [k]: e.detail.value };
    };
    const snap = (e: Event) => this.fire('snap-stock-change', { snapStock: (e.target as HTMLInputElement).checked });
    return html`<label class="snap"
        ><input type="checkbox" .checked=${this.snapStock} @change=${snap} /> Snap bandpass sizes to stock sizes (when
        dragging an edge on the chart or typing a centre or width)</label
      >
      <div class="cards">
        ${panel.channels.map(
          (c, i) =>
            html`<qdp-channel-card
              .channel=${c}
              .index=${i}
              .lines=${lines}
              .detectors=${this.detectors}
              .errors=${this.errors[i] ?? {}}
              ?snapStock=${this.snapStock}
            ></qdp-channel-card>`,
        )}
      </div>
      <button type="button" ?disabled=${room < 1} @click=${() => this.fire('channel-add')}>Add channel</button>
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
          Add ${this.run.bins} × ${this.run.binWidthNm} nm bins
        </button>
        <span class="note">${room} more channel${room === 1 ? '' : 's'} allowed (at most ${this.maxChannels}).</span>
      </fieldset>`;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'qdp-channel-list': ChannelList;
  }
}
