/**
 * <qdp-shell-editor>: the shell layers around a dot's core, innermost first. Each layer has a material and a
 * thickness (with its monolayer count); layers can be added, removed, reset to the material's typical shell or
 * cleared to a bare core. Fires `shell-change` {shell} with the new list ([] for a bare core).
 */
import { LitElement, css, html } from 'lit';
import { customElement, property } from 'lit/decorators.js';
import { LIMITS, SHELL_MATERIALS, type ShellLayer, type ShellMaterialId } from '../../spectra/index';
import { fieldRows, focusRing, textFields } from './shared-styles';
import './number-field';

/**
 * Thickness of a newly added layer, nm: about two monolayers of ZnS (0.31 nm each, see shells/materials.ts), a thin
 * silica encapsulation of 5 nm as in the typical CsPbBr3 shell, about two monolayers otherwise (ours).
 */
const NEW_LAYER_NM: Record<ShellMaterialId, number> = { zns: 0.6, znse: 0.7, cds: 0.7, silica: 5 };

@customElement('qdp-shell-editor')
export class ShellEditor extends LitElement {
  @property({ attribute: false }) shell: ShellLayer[] = [];
  /** The core material's usual shell (what "Typical shell" restores). */
  @property({ attribute: false }) typical: ShellLayer[] = [];
  /** Errors keyed by the path inside the shell, e.g. '1.thicknessNm' ('' for the list as a whole). */
  @property({ attribute: false }) errors: Record<string, string> = {};

  static override styles = [
    focusRing,
    fieldRows,
    textFields,
    css`
      :host {
        display: block;
      }
      fieldset {
        border: 1px solid #ccd;
        border-radius: 4px;
        padding: 0.2rem 0.5rem 0.4rem;
        margin: 0.3rem 0;
      }
      legend {
        font-size: 0.85rem;
      }
      .ml {
        font-size: 0.8rem;
        color: #333;
        align-self: center;
      }
      .bad {
        color: #8b1a1a;
        font-weight: 600;
        font-size: 0.85rem;
      }
      .none {
        font-size: 0.85rem;
        color: #333;
        margin: 0.2rem 0;
      }
    `,
  ];

  private fire(shell: ShellLayer[]): void {
    this.dispatchEvent(new CustomEvent('shell-change', { detail: { shell }, bubbles: true, composed: true }));
  }

  private setLayer(i: number, patch: Partial<ShellLayer>): void {
    this.fire(this.shell.map((layer, k) => (k === i ? { ...layer, ...patch } : layer)));
  }

  private layerRow(layer: ShellLayer, i: number) {
    const material = SHELL_MATERIALS[layer.material];
    const monolayers = layer.thicknessNm / material.monolayerNm;
    // Only a thickness the material takes gets a monolayer count (a refused one shows its error instead).
    const valid = layer.thicknessNm > 0 && layer.thicknessNm <= material.maxThicknessNm;
    const name = `Layer ${i + 1}`;
    return html`<div class="row" role="group" aria-label=${name}>
      <label class="text"
        >${name} material
        <select
          @change=${(e: Event) =>
            this.setLayer(i, { material: (e.target as HTMLSelectElement).value as ShellMaterialId })}
        >
          ${Object.values(SHELL_MATERIALS).map(
            (m) => html`<option value=${m.id} ?selected=${m.id === layer.material}>${m.name}</option>`,
          )}
        </select></label
      >
      <qdp-number-field
        .label=${`${name} thickness`}
        unit="nm"
        .value=${layer.thicknessNm}
        .error=${this.errors[`${i}.thicknessNm`] ?? this.errors[`${i}`] ?? ''}
        @value-change=${(e: CustomEvent<{ value?: number }>) =>
          e.detail.value !== undefined && this.setLayer(i, { thicknessNm: e.detail.value })}
      ></qdp-number-field>
      <span class="ml">${valid ? `≈ ${monolayers.toFixed(1)} monolayers` : ''}</span>
      <button
        type="button"
        aria-label=${`Remove shell layer ${i + 1}`}
        @click=${() => this.fire(this.shell.filter((_, k) => k !== i))}
      >
        Remove
      </button>
    </div>`;
  }

  override render() {
    const listError = this.errors[''];
    // A new outer layer is ZnS, the usual outermost shell, unless the outer layer already is: then silica.
    const outer = this.shell.length > 0 ? this.shell[this.shell.length - 1].material : null;
    const next: ShellMaterialId = outer === 'zns' ? 'silica' : 'zns';
    const full = this.shell.length >= LIMITS.shellLayers;
    return html`<fieldset>
      <legend>Shell (innermost first)</legend>
      ${this.shell.length === 0 ? html`<p class="none">Bare core: no shell.</p>` : ''}
      ${this.shell.map((layer, i) => this.layerRow(layer, i))}
      ${listError ? html`<p class="bad" role="alert">${listError}</p>` : ''}
      <div class="row">
        <button
          type="button"
          ?disabled=${full}
          title=${full ? `At most ${LIMITS.shellLayers} layers` : ''}
          @click=${() => this.fire([...this.shell, { material: next, thicknessNm: NEW_LAYER_NM[next] }])}
        >
          Add a layer
        </button>
        ${full ? html`<span class="ml">At most ${LIMITS.shellLayers} layers.</span>` : ''}
        <button
          type="button"
          ?disabled=${this.typical.length === 0}
          @click=${() => this.fire(this.typical.map((l) => ({ ...l })))}
        >
          Typical shell
        </button>
        <button type="button" ?disabled=${this.shell.length === 0} @click=${() => this.fire([])}>Bare core</button>
      </div>
    </fieldset>`;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'qdp-shell-editor': ShellEditor;
  }
}
