/**
 * <qdp-spectrum-input>: load a measured two-column CSV spectrum from a file or pasted text. Fires `spectrum-loaded`
 * with {points, warnings}; shows the parser's message inline on bad input and keeps the pasted text.
 */
import { LitElement, css, html } from 'lit';
import { customElement, property, state } from 'lit/decorators.js';
import { importSpectrumFile, importSpectrumText, type ImportKind, type ImportResult } from '../io/spectrum-import';

@customElement('qdp-spectrum-input')
export class SpectrumInput extends LitElement {
  /** What the values mean (sets the parser's checks). */
  @property() kind: ImportKind = 'emission';
  /** Visible name of what is being loaded, e.g. "measured emission". */
  @property() label = 'measured spectrum';

  @state() private message = '';
  @state() private failed = false;
  private pasted = '';

  static override styles = css`
    :host {
      display: block;
      font-size: 0.85rem;
    }
    textarea {
      width: 100%;
      box-sizing: border-box;
      font:
        0.8rem ui-monospace,
        monospace;
    }
    .bad {
      color: #8b1a1a;
    }
    .ok {
      color: #2f4f2f;
    }
    textarea[aria-invalid='true'] {
      border: 2px solid #8b1a1a;
    }
    :focus-visible {
      outline: 3px solid #1a56db;
    }
  `;

  private done(r: ImportResult): void {
    this.failed = !r.ok;
    if (!r.ok) {
      this.message = r.message;
      return;
    }
    this.message = `Loaded ${r.points.length} points.${r.warnings.length ? ' ' + r.warnings.join('; ') : ''}`;
    this.dispatchEvent(
      new CustomEvent('spectrum-loaded', {
        detail: { points: r.points, warnings: r.warnings },
        bubbles: true,
        composed: true,
      }),
    );
  }

  override render() {
    return html` <details>
      <summary>Load ${this.label} (CSV: wavelength nm, value)</summary>
      <label
        >From a file
        <input
          type="file"
          accept=".csv,.txt,text/csv,text/plain"
          @change=${async (e: Event) => {
            const f = (e.target as HTMLInputElement).files?.[0];
            if (f) this.done(await importSpectrumFile(f, this.kind));
          }}
      /></label>
      <label
        >Or paste
        <textarea
          rows="4"
          aria-invalid=${this.failed ? 'true' : 'false'}
          placeholder="500,0.01&#10;510,0.12&#10;…"
          @input=${(e: Event) => (this.pasted = (e.target as HTMLTextAreaElement).value)}
        ></textarea>
      </label>
      <button type="button" @click=${() => this.done(importSpectrumText(this.pasted, this.kind))}>
        Use pasted ${this.label}
      </button>
      <p class=${this.failed ? 'bad' : 'ok'} role="status">${this.message}</p>
    </details>`;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'qdp-spectrum-input': SpectrumInput;
  }
}
