/**
 * <qdp-chart-controls>: how the spectra chart is read: a log scale for spillover tails, and the wavelength range,
 * either following the panel or set by hand. Fires `chart-view` with {log} or {rangeNm} (null: follow the panel).
 */
import { LitElement, css, html } from 'lit';
import { customElement, property, state } from 'lit/decorators.js';
import { DEFAULT_GRID } from '../../spectra/index';
import { LOG_FLOOR_FRACTION } from '../chart/geometry';
import { focusRing } from './shared-styles';
import './number-field';

/** Range a hand-set view may span: the model grid, nm (spectra's DEFAULT_GRID). */
const GRID_NM: [number, number] = [
  DEFAULT_GRID.startNm,
  DEFAULT_GRID.startNm + (DEFAULT_GRID.count - 1) * DEFAULT_GRID.stepNm,
];

/** Narrowest hand-set range, nm: two stock bandpass widths of 10 nm (our convention). */
export const MIN_RANGE_SPAN_NM = 20;

/** What is wrong with a hand-set range, or '' when the chart can show it. */
export function rangeProblem([lo, hi]: [number, number]): string {
  if (lo < GRID_NM[0] || hi > GRID_NM[1]) return `The range must lie within ${GRID_NM[0]}–${GRID_NM[1]} nm.`;
  if (hi - lo < MIN_RANGE_SPAN_NM) return `"To" must be at least ${MIN_RANGE_SPAN_NM} nm above "From".`;
  return '';
}

@customElement('qdp-chart-controls')
export class ChartControls extends LitElement {
  /** The range shown, nm. */
  @property({ attribute: false }) rangeNm: [number, number] = [380, 800];
  /** True while the range follows the panel. */
  @property({ type: Boolean }) follow = true;
  @property({ type: Boolean }) log = false;

  @state() private problem = '';

  static override styles = [
    focusRing,
    css`
      :host {
        display: flex;
        flex-wrap: wrap;
        gap: 0.4rem 1.2rem;
        align-items: flex-end;
        font-size: 0.85rem;
        margin: 0.3rem 0;
      }
      fieldset {
        display: flex;
        flex-wrap: wrap;
        gap: 0.3rem 0.6rem;
        align-items: flex-end;
        border: 1px solid #ccd;
        border-radius: 6px;
        margin: 0;
        padding: 0.2rem 0.6rem 0.4rem;
      }
      .bad {
        color: #8b1a1a;
        flex-basis: 100%;
        margin: 0;
      }
    `,
  ];

  private fire(detail: { log: boolean } | { rangeNm: [number, number] | null }): void {
    this.dispatchEvent(new CustomEvent('chart-view', { detail, bubbles: true, composed: true }));
  }

  /** A typed end of the range: applied when the typing is done and the range is one the chart can show. */
  private setEnd(end: 0 | 1, value: number): void {
    const next: [number, number] = [...this.rangeNm];
    next[end] = value;
    this.problem = rangeProblem(next);
    if (!this.problem) this.fire({ rangeNm: next });
  }

  /** A refused range opens the fold so its message shows beside the fields; the fold never closes by itself. */
  protected override updated(): void {
    const fold = this.renderRoot.querySelector('details');
    if (this.problem && fold) fold.open = true;
  }

  override render() {
    const [lo, hi] = this.rangeNm;
    const floorPct = LOG_FLOOR_FRACTION * 100;
    return html`<label
        ><input
          type="checkbox"
          .checked=${this.log}
          @change=${(e: Event) => this.fire({ log: (e.target as HTMLInputElement).checked })}
        />
        Log scale (reads tails down to ${floorPct} % of the top)</label
      >
      <details>
        <summary>Wavelength range: ${lo}–${hi} nm${this.follow ? ', following the panel' : ', as you set it'}</summary>
        <fieldset>
          <legend>Wavelength range</legend>
          <label
            ><input
              type="checkbox"
              .checked=${this.follow}
              @change=${(e: Event) => {
                this.problem = '';
                this.fire({ rangeNm: (e.target as HTMLInputElement).checked ? null : [lo, hi] });
              }}
            />
            Follow the panel</label
          >
          <qdp-number-field
            label="From"
            unit="nm"
            .value=${lo}
            @value-commit=${(e: CustomEvent<{ value: number }>) => this.setEnd(0, e.detail.value)}
          ></qdp-number-field>
          <qdp-number-field
            label="To"
            unit="nm"
            .value=${hi}
            @value-commit=${(e: CustomEvent<{ value: number }>) => this.setEnd(1, e.detail.value)}
          ></qdp-number-field>
          ${this.problem ? html`<p class="bad" role="alert">${this.problem}</p>` : ''}
        </fieldset>
      </details>`;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'qdp-chart-controls': ChartControls;
  }
}
