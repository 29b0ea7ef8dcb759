/** A template shared by the probe card and the material notes: one material's hazard notes and cautions. */
import { html } from 'lit';
import type { Material } from '../../spectra/index';

/** A material's hazard notes and its cautions, as lists (the probe card and the notes panel both show them). */
export function hazardNotes(toxicity: Material['toxicity']) {
  return html`${
      toxicity.notes.length
        ? html`<ul>
            ${toxicity.notes.map((n) => html`<li>${n}</li>`)}
          </ul>`
        : ''
    }
    <p><strong>Cautions</strong></p>
    <ul>
      ${toxicity.cautions.map((n) => html`<li>${n}</li>`)}
    </ul>`;
}
