/**
 * <qdp-chart-legend>: one line per layer of the spectra chart, each with a checkbox that shows or hides it. A hidden
 * layer stays listed, marked "hidden". Fires `layer-visibility` {key, shown}.
 */
import { LitElement, css, html } from 'lit';
import { customElement, property } from 'lit/decorators.js';
import type { LegendEntry } from '../chart/looks';
import { legendSwatch } from '../chart/swatch';
import { focusRing } from './shared-styles';

@customElement('qdp-chart-legend')
export class ChartLegend extends LitElement {
  @property({ attribute: false }) entries: LegendEntry[] = [];

  static override styles = [
    focusRing,
    css`
      ul {
        display: flex;
        flex-wrap: wrap;
        gap: 0.25rem 1rem;
        list-style: none;
        padding: 0;
        margin: 0.4rem 0 0;
        font-size: 0.85rem;
      }
      svg {
        display: inline-block;
        width: 28px;
        height: 10px;
        vertical-align: middle;
      }
      .hidden {
        color: #555;
      }
      .hidden svg {
        opacity: 0.3;
      }
      em {
        font-style: normal;
        font-weight: 600;
      }
    `,
  ];

  private toggle(key: string, shown: boolean): void {
    this.dispatchEvent(new CustomEvent('layer-visibility', { detail: { key, shown }, bubbles: true, composed: true }));
  }

  override render() {
    return html`<ul aria-label="Legend (untick a layer to hide it)">
      ${this.entries.map(
        (e) =>
          html`<li class=${e.hidden ? 'hidden' : ''} data-key=${e.key}>
            <label
              ><input
                type="checkbox"
                .checked=${!e.hidden}
                @change=${(ev: Event) => this.toggle(e.key, (ev.target as HTMLInputElement).checked)}
              />
              <svg viewBox="0 0 28 10" aria-hidden="true">${legendSwatch(e)}</svg>
              ${e.label}${e.nir ? html` <strong>NIR</strong>` : ''}${e.hidden ? html` <em>(hidden)</em>` : ''}</label
            >
          </li>`,
      )}
    </ul>`;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'qdp-chart-legend': ChartLegend;
  }
}
