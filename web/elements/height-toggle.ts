/**
 * <qdp-height-toggle>: what the height of each emission curve means, one of two: the signal the probe is expected to
 * give (its brightness and abundance, as the crosstalk figures count it) or its shape alone, every peak at 1.
 * Fires `heights-change` {byBrightness}.
 */
import { LitElement, css, html } from 'lit';
import { customElement, property } from 'lit/decorators.js';
import { focusRing } from './shared-styles';

/** The two readings of a curve's height, in the page's words. */
export const HEIGHT_CHOICES = [
  { byBrightness: true, label: 'expected signal', hint: 'brightness × abundance' },
  { byBrightness: false, label: 'shape only', hint: 'every peak at 1' },
] as const;

@customElement('qdp-height-toggle')
export class HeightToggle extends LitElement {
  /** True while heights show the expected signal. */
  @property({ type: Boolean }) byBrightness = true;

  static override styles = [
    focusRing,
    css`
      fieldset {
        display: inline-flex;
        flex-wrap: wrap;
        align-items: center;
        gap: 0.3rem;
        border: 0;
        padding: 0;
        margin: 0.2rem 0;
        font-size: 0.85rem;
      }
      legend {
        float: left;
        margin-right: 0.4rem;
        font-weight: 600;
      }
      label {
        display: inline-flex;
        align-items: center;
        gap: 0.3rem;
        border: 1px solid #2f6f7e;
        border-radius: 999px;
        padding: 0.15rem 0.7rem;
        cursor: pointer;
        color: #1d4751;
      }
      label.on {
        background: #2f6f7e;
        color: #fff;
      }
      input {
        margin: 0;
        accent-color: #fff;
      }
      small {
        opacity: 0.85;
      }
    `,
  ];

  private choose(byBrightness: boolean): void {
    this.dispatchEvent(new CustomEvent('heights-change', { detail: { byBrightness }, bubbles: true, composed: true }));
  }

  override render() {
    return html`<fieldset>
      <legend>Curve heights</legend>
      ${HEIGHT_CHOICES.map(
        (c) =>
          html`<label class=${c.byBrightness === this.byBrightness ? 'on' : ''}
            ><input
              type="radio"
              name="heights"
              .checked=${c.byBrightness === this.byBrightness}
              @change=${() => this.choose(c.byBrightness)}
            />${c.label} <small>(${c.hint})</small></label
          >`,
      )}
    </fieldset>`;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'qdp-height-toggle': HeightToggle;
  }
}
