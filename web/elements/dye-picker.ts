/**
 * <qdp-dye-picker>: choose a dye, counterstain or fluorescent protein from the library by typing part of its name, its
 * kind or a wavelength (a number finds the dyes that absorb or emit within 20 nm of it). Shows the chosen dye's peaks,
 * ε, QY and conditions with how sure each number is. Fires `dye-choose` {id}.
 */
import { LitElement, css, html } from 'lit';
import { customElement, property, state } from 'lit/decorators.js';
import { listDyes, type Dye, type DyeKind } from '../../spectra/index';
import { focusRing, textFields } from './shared-styles';

/** The library, read once. */
const DYES = listDyes();

/** How the page names each kind of dye. */
const KIND_NAMES: Record<DyeKind, string> = {
  'nuclear-counterstain': 'nuclear counterstain',
  'small-molecule-dye': 'small-molecule dye',
  'fluorescent-protein': 'fluorescent protein',
};

/**
 * How far (nm) a typed wavelength may lie from a dye's absorption peak (a laser line excites it) or its emission peak
 * (a filter collects it) for the dye to match.
 */
const NEAR_ABSORPTION_NM = 25;
const NEAR_EMISSION_NM = 10;

/**
 * Other names scientists search by: generic abbreviations of the same chemistry (the isothiocyanate conjugates of
 * fluorescein and tetramethylrhodamine) and plain descriptions. Never a brand or catalogue name.
 */
const ALSO_KNOWN_AS: Record<string, string[]> = {
  fluorescein: ['FITC', 'fluorescein isothiocyanate'],
  tetramethylrhodamine: ['TRITC', 'TAMRA', 'rhodamine'],
  'rhodamine-6g': ['rhodamine'],
  'ethoxyphenyl-bisbenzimide': ['bisbenzimide', 'bis-benzimide', 'benzimidazole'],
  indodicarbocyanine: ['cyanine', 'far red'],
  dapi: ['diamidino-phenylindole'],
  'propidium-iodide': ['PI', 'dead cell'],
  egfp: ['GFP', 'green fluorescent protein'],
  mcherry: ['RFP', 'red fluorescent protein'],
  tagrfp: ['RFP', 'red fluorescent protein'],
  mkate2: ['far-red fluorescent protein', 'far red'],
  venus: ['YFP', 'yellow fluorescent protein'],
  mturquoise2: ['CFP', 'cyan fluorescent protein'],
};

/** Colour words and the emission peaks (nm) they mean (common practice, approximate). */
const COLOURS: Record<string, [number, number]> = {
  blue: [420, 490],
  cyan: [470, 500],
  green: [495, 540],
  yellow: [540, 580],
  orange: [580, 610],
  red: [600, 650],
  'far red': [640, 720],
  'far-red': [640, 720],
};

/** The dyes a query matches: by name, other name, kind, conditions or colour, or by a wavelength ("488", "488 nm"). */
export function matchDyes(query: string, dyes: readonly Dye[] = DYES): Dye[] {
  const q = query.trim().toLowerCase();
  if (!q) return [...dyes];
  const number = /^(\d+(?:\.\d+)?)\s*(?:nm)?$/.exec(q);
  if (number) {
    const nm = Number(number[1]);
    return dyes.filter(
      (d) =>
        Math.abs(d.absorptionPeakNm.value - nm) <= NEAR_ABSORPTION_NM ||
        Math.abs(d.emissionPeakNm.value - nm) <= NEAR_EMISSION_NM,
    );
  }
  const colour = COLOURS[q];
  return dyes.filter(
    (d) =>
      (colour !== undefined && d.emissionPeakNm.value >= colour[0] && d.emissionPeakNm.value <= colour[1]) ||
      [d.name, d.id, KIND_NAMES[d.kind], d.conditions, ...(ALSO_KNOWN_AS[d.id] ?? [])].some((text) =>
        text.toLowerCase().includes(q),
      ),
  );
}

/** One line about a dye: kind and peaks. */
const summary = (d: Dye) =>
  `${KIND_NAMES[d.kind]}, absorbs ${d.absorptionPeakNm.value} nm, emits ${d.emissionPeakNm.value} nm`;

@customElement('qdp-dye-picker')
export class DyePicker extends LitElement {
  /** The chosen dye's id. */
  @property() selected = '';
  @state() private query = '';

  static override styles = [
    focusRing,
    textFields,
    css`
      :host {
        display: block;
        font-size: 0.85rem;
      }
      input[type='search'] {
        font: inherit;
        padding: 0.2rem 0.3rem;
        border: 1px solid #889;
        border-radius: 3px;
        width: 100%;
        max-width: 24rem;
        box-sizing: border-box;
      }
      ul {
        list-style: none;
        margin: 0.3rem 0;
        padding: 0;
        max-height: 11rem;
        overflow-y: auto;
        border: 1px solid #ccd;
        border-radius: 4px;
        max-width: 32rem;
      }
      li button {
        display: block;
        width: 100%;
        text-align: left;
        font: inherit;
        background: #fff;
        border: 0;
        border-bottom: 1px solid #eef;
        padding: 0.25rem 0.4rem;
        cursor: pointer;
      }
      li button[aria-pressed='true'] {
        background: #e8eefc;
        font-weight: 600;
      }
      .facts {
        margin: 0.2rem 0;
        color: #222;
      }
      .none {
        color: #333;
        padding: 0.3rem;
      }
    `,
  ];

  private choose(id: string): void {
    this.dispatchEvent(new CustomEvent('dye-choose', { detail: { id }, bubbles: true, composed: true }));
  }

  /** The chosen dye's numbers, each with its status (approximate where it is from memory). */
  private facts(d: Dye) {
    const fmt = (label: string, v: Dye['extinctionPeak'], unit = '') =>
      `${label} ${v.value.toLocaleString('en')}${unit}${v.status === 'M' ? ' (approximate)' : ''}`;
    return html`<p class="facts">
      ${d.name} (${d.conditions}): ${fmt('absorption peak', d.absorptionPeakNm, ' nm')},
      ${fmt('emission peak', d.emissionPeakNm, ' nm')}, ${fmt('ε', d.extinctionPeak, ' M⁻¹ cm⁻¹')},
      ${fmt('quantum yield', d.quantumYield)}. Sources:
      ${[...new Set([d.extinctionPeak.source, d.quantumYield.source])]
        .join('; ')
        .replace(/ \(from memory, unverified\)/g, '')}.
    </p>`;
  }

  override render() {
    const found = matchDyes(this.query);
    const chosen = DYES.find((d) => d.id === this.selected);
    return html`<label class="text"
        >Find a dye (name, kind, colour or wavelength)
        <input
          type="search"
          .value=${this.query}
          placeholder="e.g. nuclear, FITC, green, 488 nm"
          @input=${(e: Event) => (this.query = (e.target as HTMLInputElement).value)}
      /></label>
      <ul aria-label="Dyes in the library">
        ${found.map(
          (d) =>
            html`<li>
              <button
                type="button"
                aria-pressed=${d.id === this.selected ? 'true' : 'false'}
                @click=${() => this.choose(d.id)}
              >
                ${d.name} · ${summary(d)}
              </button>
            </li>`,
        )}
        ${found.length === 0 ? html`<li class="none">No dye in the library matches “${this.query}”.</li>` : ''}
      </ul>
      ${chosen ? this.facts(chosen) : ''}`;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'qdp-dye-picker': DyePicker;
  }
}
