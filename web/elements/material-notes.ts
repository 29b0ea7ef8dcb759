/**
 * <qdp-material-notes>: the hazard notes and cautions of every material in the panel, a panel-level summary
 * ("contains cadmium"), and the cadmium-free / lead-free choices. It never calls a probe safe: it defers to local
 * regulations, institutional safety rules and licensed practice.
 */
import { LitElement, css, html } from 'lit';
import { customElement, property } from 'lit/decorators.js';
import type { PanelSpec } from '../../spectra/index';
import { hazardNotes } from './hazard-notes';
import { offendingProbes, PANEL_EXCLUSIONS, type PanelExclusion } from '../state/exclusions';
import {
  containsSentence,
  GENERAL_CAUTION,
  LASER_CAUTION,
  notesEntries,
  type MaterialNotesInput,
} from '../state/hazards';

export type { MaterialNotesInput } from '../state/hazards';

/** Which probes break the exclusions and why, and what that turns off. */
function blockedText(panel: PanelSpec, offending: Map<string, string>): string {
  const probes = [...offending].map(([id, why]) => `${panel.probes.find((p) => p.id === id)?.label ?? id} ${why}`);
  return `Blocked: ${probes.join('; ')}. Share and export stay off until they are replaced or the choice is changed.`;
}

@customElement('qdp-material-notes')
export class MaterialNotes extends LitElement {
  @property({ attribute: false }) panel?: PanelSpec;
  @property({ attribute: false }) materials: MaterialNotesInput[] = [];
  @property({ attribute: false }) exclude: PanelExclusion[] = [];

  static override styles = css`
    :host {
      display: block;
      font-size: 0.9rem;
    }
    .summary {
      font-weight: 600;
    }
    .level {
      display: inline-block;
      padding: 0 0.4rem;
      border-radius: 3px;
      border: 1px solid currentColor;
      font-size: 0.8rem;
    }
    .high {
      color: #8b1a1a;
    }
    .moderate {
      color: #7a4a00;
    }
    .low {
      color: #2f4f2f;
    }
    .blocked {
      color: #8b1a1a;
      font-weight: 600;
    }
    fieldset {
      border: 1px solid #ccd;
      margin: 0.5rem 0;
    }
    section {
      border-top: 1px solid #dde;
      padding-top: 0.4rem;
      margin-top: 0.4rem;
    }
    h4 {
      margin: 0.2rem 0;
      font-size: 0.95rem;
    }
    ul {
      margin: 0.2rem 0;
      padding-left: 1.2rem;
    }
    input:focus-visible {
      outline: 3px solid #1a56db;
    }
  `;

  private toggle(id: PanelExclusion, on: boolean): void {
    const exclude = on ? [...new Set([...this.exclude, id])] : this.exclude.filter((x) => x !== id);
    this.dispatchEvent(new CustomEvent('exclude-change', { detail: { exclude }, bubbles: true, composed: true }));
  }

  override render() {
    const panel = this.panel;
    if (!panel) return html``;
    const offending = offendingProbes(panel, this.materials, this.exclude);
    return html`
      <p class="summary">${containsSentence(panel, this.materials)}</p>
      <fieldset>
        <legend>Exclude material classes</legend>
        ${PANEL_EXCLUSIONS.map(
          (word) =>
            html`<label
              ><input
                type="checkbox"
                .checked=${this.exclude.includes(word)}
                @change=${(e: Event) => this.toggle(word, (e.target as HTMLInputElement).checked)}
              />
              ${word}-free</label
            > `,
        )}
      </fieldset>
      ${offending.size ? html`<p class="blocked" role="alert">${blockedText(panel, offending)}</p>` : ''}
      ${notesEntries(panel, this.materials).map((entry) =>
        entry.toxicity
          ? html`<section data-material=${entry.key}>
              <h4>${entry.name} <span class="level ${entry.toxicity.level}">hazard: ${entry.toxicity.level}</span></h4>
              <p>Used by: ${entry.probes.join(', ')}</p>
              ${hazardNotes(entry.toxicity)}
            </section>`
          : html`<section>
              <h4>${entry.name}</h4>
              <p>No notes for this material.</p>
            </section>`,
      )}
      <p>${LASER_CAUTION}</p>
      <p>${GENERAL_CAUTION}</p>
    `;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'qdp-material-notes': MaterialNotes;
  }
}
