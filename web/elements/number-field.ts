/**
 * <qdp-number-field>: a labelled number input that keeps whatever was typed. It fires `value-change` only for a
 * finite number (or undefined when an optional field is emptied) on every keystroke, and `value-commit` {value} with a
 * finite number when the typing is done (Enter or leaving the field); anything else is marked invalid in place, and an
 * `error` from the computation (e.g. an out-of-range peak naming the reachable range) is shown under it.
 */
import { LitElement, css, html, type PropertyValues } from 'lit';
import { customElement, property, state } from 'lit/decorators.js';

@customElement('qdp-number-field')
export class NumberField extends LitElement {
  @property() label = '';
  /** Unit shown after the input, e.g. "nm". */
  @property() unit = '';
  @property({ attribute: false }) value: number | undefined;
  /** Empty is allowed and means "use the default"; `placeholder` says what that default is. */
  @property({ type: Boolean }) optional = false;
  @property() placeholder = '';
  /** A message from the computation about this field (keeps the typed text, marks it invalid). */
  @property() error = '';

  @state() private localError = '';
  private raw = '';

  static override styles = css`
    :host {
      display: inline-block;
      font-size: 0.85rem;
    }
    label {
      display: flex;
      flex-direction: column;
      gap: 0.1rem;
    }
    input {
      width: 6.5rem;
      font: inherit;
      padding: 0.2rem 0.3rem;
      border: 1px solid #889;
      border-radius: 3px;
    }
    input[aria-invalid='true'] {
      border: 2px solid #8b1a1a;
      background: #fff4f4;
    }
    input:focus-visible {
      outline: 3px solid #1a56db;
      outline-offset: 1px;
    }
    .msg {
      color: #8b1a1a;
      max-width: 18rem;
    }
  `;

  protected override willUpdate(changed: PropertyValues<this>): void {
    // A new value from outside (e.g. an edge dragged on the chart) replaces the text unless it is what was typed.
    if (changed.has('value') && Number(this.raw) !== this.value) {
      this.raw = this.value === undefined ? '' : String(this.value);
      this.localError = '';
    }
  }

  private onInput(e: Event): void {
    const text = (e.target as HTMLInputElement).value;
    this.raw = text;
    const trimmed = text.trim().replace(',', '.');
    if (trimmed === '' && this.optional) {
      this.localError = '';
      this.fire(undefined);
      return;
    }
    const n = Number(trimmed);
    if (trimmed === '' || !Number.isFinite(n)) {
      this.localError = `${this.label}: enter a number${this.optional ? ' or leave it empty for the default' : ''}.`;
      return;
    }
    this.localError = '';
    this.fire(n);
  }

  private onCommit(): void {
    const n = Number(this.raw.trim().replace(',', '.'));
    if (this.raw.trim() === '' || !Number.isFinite(n)) return;
    this.dispatchEvent(new CustomEvent('value-commit', { detail: { value: n }, bubbles: true, composed: true }));
  }

  private fire(value: number | undefined): void {
    this.dispatchEvent(new CustomEvent('value-change', { detail: { value }, bubbles: true, composed: true }));
  }

  override render() {
    const msg = this.localError || this.error;
    return html`<label
        >${this.label}${this.unit ? ` (${this.unit})` : ''}
        <input
          type="text"
          inputmode="decimal"
          .value=${this.raw}
          placeholder=${this.placeholder}
          aria-invalid=${msg ? 'true' : 'false'}
          @input=${this.onInput}
          @change=${this.onCommit}
      /></label>
      ${msg ? html`<div class="msg" role="alert">${msg}</div>` : ''}`;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'qdp-number-field': NumberField;
  }
}
