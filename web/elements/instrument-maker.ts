/**
 * <qdp-instrument-maker>: makes an instrument profile of the microscope this panel is set up for (its lines with
 * their power at the sample, its shared light path, every channel filter by its size, its detectors and channels),
 * stores it and gives its link, for a facility to hand to its users. Fires `instrument-switch` {id} when the panel is
 * to use the stored profile.
 */
import { LitElement, css, html, type PropertyValues } from 'lit';
import { customElement, property, state } from 'lit/decorators.js';
import { fieldRows, focusRing } from './shared-styles';
import type { PanelSpec } from '../../spectra/index';
import { loadChecks } from '../state/load-checks';
import { profileFromPanel } from '../state/instrument';
import './number-field';

@customElement('qdp-instrument-maker')
export class InstrumentMaker extends LitElement {
  @property({ attribute: false }) panel?: PanelSpec;
  @state() private name = '';
  @state() private description = '';
  /** Power per line, mW, by wavelength (kept while lines come and go). */
  @state() private powers: Record<number, number | undefined> = {};
  @state() private error = '';
  @state() private link = '';
  @state() private storedId = '';
  @state() private busy = false;

  static override styles = [
    focusRing,
    fieldRows,
    css`
      :host {
        display: block;
        font-size: 0.9rem;
      }
      input[type='text'] {
        font: inherit;
        width: min(24rem, 100%);
      }
      .err {
        color: #a00;
      }
    `,
  ];

  protected override willUpdate(changed: PropertyValues<this>): void {
    if (changed.has('panel')) {
      for (const line of this.panel?.excitation ?? []) {
        if (!(line.wavelengthNm in this.powers)) this.powers[line.wavelengthNm] = line.powerRel ?? 1;
      }
    }
  }

  private async store(): Promise<void> {
    if (!this.panel) return;
    this.error = '';
    this.link = '';
    const powersMw = this.panel.excitation.map((l) => this.powers[l.wavelengthNm] ?? Number.NaN);
    const profile = profileFromPanel(this.panel, { name: this.name.trim(), description: this.description, powersMw });
    const { readInstrument } = await loadChecks();
    const checked = readInstrument(profile);
    if (!checked.ok) {
      this.error = `The profile is not valid yet: ${this.words(checked.error.path)} ${checked.error.message}.`;
      return;
    }
    this.busy = true;
    try {
      const { shareInstrument } = await import('../io/api');
      const { id, url } = await shareInstrument(checked.spec);
      this.storedId = id;
      this.link = new URL(url, location.origin).href;
    } catch (e) {
      this.error = `The profile could not be stored: ${e instanceof Error ? e.message : String(e)}`;
    } finally {
      this.busy = false;
    }
  }

  /** A profile path in the user's words. */
  private words(path: (string | number)[]): string {
    const [head, index] = path;
    if (head === 'name') return 'Name:';
    if (head === 'lasers' && typeof index === 'number') {
      return `Power of the ${this.panel?.excitation[index]?.wavelengthNm} nm line:`;
    }
    if (head === 'channels' && typeof index === 'number') return `Channel ${index + 1}:`;
    return `${path.join('.')}:`;
  }

  override render() {
    const p = this.panel;
    if (!p) return html``;
    const selectAll = (e: Event) => (e.target as HTMLInputElement).select();
    return html`<p>
        A profile describes this panel's microscope once: its lines, shared light path, channel filters, detectors and
        channels. Anyone with its link can start panels on it or switch a panel to it.
      </p>
      <div class="row">
        <label
          >Instrument name
          <input
            type="text"
            .value=${this.name}
            placeholder="e.g. Room 2 widefield"
            @input=${(e: Event) => (this.name = (e.target as HTMLInputElement).value)}
        /></label>
        <label
          >Description (optional)
          <input
            type="text"
            .value=${this.description}
            @input=${(e: Event) => (this.description = (e.target as HTMLInputElement).value)}
        /></label>
      </div>
      <div class="row">
        ${p.excitation.map(
          (line) =>
            html`<qdp-number-field
              label=${`${line.wavelengthNm} nm line power at the sample`}
              unit="mW"
              .value=${this.powers[line.wavelengthNm]}
              @value-change=${(e: CustomEvent<{ value: number | undefined }>) =>
                (this.powers = { ...this.powers, [line.wavelengthNm]: e.detail.value })}
            ></qdp-number-field>`,
        )}
      </div>
      <div class="row">
        <button type="button" ?disabled=${this.busy} @click=${this.store}>Store the profile and show its link</button>
        ${
          this.storedId
            ? html`<button
                type="button"
                @click=${() =>
                  this.dispatchEvent(
                    new CustomEvent('instrument-switch', {
                      detail: { id: this.storedId },
                      bubbles: true,
                      composed: true,
                    }),
                  )}
              >
                Put this panel on the profile
              </button>`
            : ''
        }
      </div>
      ${this.error ? html`<p class="err" role="alert">${this.error}</p>` : ''}
      ${
        this.link
          ? html`<label class="row"
              >Instrument link <input type="text" readonly .value=${this.link} @focus=${selectAll}
            /></label>`
          : ''
      }`;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'qdp-instrument-maker': InstrumentMaker;
  }
}
