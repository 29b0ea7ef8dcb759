/**
 * <qdp-light-path-editor>: the filters every channel and every line share (the panel's `lightPath`): emission-side
 * filters in front of every detector (typically the main dichroic, or a longpass) and excitation clean-up filters on
 * every line. Fires `panel-edit` {panel}; an emptied list leaves the panel without it.
 */
import { LitElement, css, html } from 'lit';
import { customElement, property } from 'lit/decorators.js';
import { fieldRows, focusRing, textFields } from './shared-styles';
import type { FilterSpec, LightPathSpec, PanelSpec } from '../../spectra/index';
import { messagesBesides } from '../state/error-map';
import { describeFilter } from '../io/filter-text';
import { ALL_FILTER_KINDS, filterRowKeys, filterRowStyles, filterRows, withFilter } from './filter-rows';

type Side = keyof LightPathSpec;

/** Each side of the shared path in the user's words, and the filter a new one starts as. */
const SIDES: Record<Side, { title: string; noun: string; add: string; first: (p: PanelSpec) => FilterSpec }> = {
  emissionFilters: {
    title: 'Shared emission filters (in front of every channel)',
    noun: 'Shared emission filter',
    add: 'Add a shared emission filter',
    // A main dichroic just above the reddest line, passing the emission above it to the detectors.
    first: (p) => ({
      type: 'dichroic',
      edgeNm: Math.max(...p.excitation.map((l) => l.wavelengthNm)) + 10,
      passes: 'above',
    }),
  },
  excitationFilters: {
    title: 'Excitation clean-up filters (on every line)',
    noun: 'Clean-up filter',
    add: 'Add a clean-up filter',
    first: (p) => ({ type: 'bandpass', centerNm: p.excitation[0].wavelengthNm, widthNm: 10 }),
  },
};

@customElement('qdp-light-path-editor')
export class LightPathEditor extends LitElement {
  @property({ attribute: false }) panel?: PanelSpec;
  /** Errors keyed by the panel path joined with dots, e.g. "lightPath.emissionFilters.0.edgeNm". */
  @property({ attribute: false }) errors: Record<string, string> = {};
  /** The name of the instrument profile the path comes from; the path is then shown, not edited. */
  @property() fromInstrument = '';

  static override styles = [
    focusRing,
    fieldRows,
    textFields,
    filterRowStyles,
    css`
      :host {
        display: block;
      }
      h3 {
        font-size: 0.9rem;
        margin: 0.6rem 0 0.2rem;
      }
    `,
  ];

  /** The panel with one side of the path set to `filters` (no empty list, no empty path). */
  private withSide(p: PanelSpec, side: Side, filters: FilterSpec[]): PanelSpec {
    const path: LightPathSpec = { ...p.lightPath };
    if (filters.length) path[side] = filters;
    else delete path[side];
    if (path.emissionFilters || path.excitationFilters) return { ...p, lightPath: path };
    const { lightPath: _gone, ...rest } = p;
    return rest;
  }

  private edit(panel: PanelSpec): void {
    this.dispatchEvent(new CustomEvent('panel-edit', { detail: { panel }, bubbles: true, composed: true }));
  }

  private side(p: PanelSpec, side: Side) {
    const words = SIDES[side];
    const filters = p.lightPath?.[side] ?? [];
    return html`<h3>${words.title}</h3>
      ${filterRows({
        filters,
        prefix: `lightPath.${side}`,
        errors: this.errors,
        kinds: ALL_FILTER_KINDS,
        noun: words.noun,
        removable: true,
        set: (j, filter) => this.edit(this.withSide(p, side, withFilter(filters, j, filter))),
      })}
      <button type="button" @click=${() => this.edit(this.withSide(p, side, [...filters, words.first(p)]))}>
        ${words.add}
      </button>`;
  }

  /** The path as the instrument profile gives it, read only. */
  private fromProfile(p: PanelSpec) {
    const list = (filters: readonly FilterSpec[] | undefined) =>
      filters?.length ? filters.map((f) => describeFilter(f)).join('; ') : 'none';
    return html`<p>
      The shared light path comes from the instrument “${this.fromInstrument}”: in front of every detector
      ${list(p.lightPath?.emissionFilters)}; on every line ${list(p.lightPath?.excitationFilters)}. To change it, keep
      the parts and drop the profile under Microscope.
    </p>`;
  }

  override render() {
    const p = this.panel;
    if (!p) return html``;
    if (this.fromInstrument) return this.fromProfile(p);
    const mine = Object.fromEntries(Object.entries(this.errors).filter(([key]) => /^lightPath\b/.test(key)));
    const shown = (['emissionFilters', 'excitationFilters'] as const).flatMap((side) =>
      filterRowKeys(p.lightPath?.[side] ?? [], `lightPath.${side}`),
    );
    return html`${this.side(p, 'emissionFilters')} ${this.side(p, 'excitationFilters')}
    ${messagesBesides(mine, shown).map((m) => html`<p class="bad" role="alert">${m}</p>`)}`;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'qdp-light-path-editor': LightPathEditor;
  }
}
