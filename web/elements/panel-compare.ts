/**
 * <qdp-panel-compare>: two panels side by side (probes with material and peak, channels with their filters, the worst
 * crosstalk pair, the condition number and each target's unmixing noise) and what changed from the first to the
 * second in words. The figures come from the page's own computation (computePanel) of each panel.
 */
import { LitElement, css, html } from 'lit';
import { customElement, property } from 'lit/decorators.js';
import { listDyes, type PanelSpec } from '../../spectra/index';
import { focusRing } from './shared-styles';
import { computePanel, MATERIALS } from '../state/compute';
import { checksIfLoaded } from '../state/load-checks';
import {
  formatGain,
  formatPeak,
  formatWorst,
  panelDifferences,
  panelFigures,
  type MaterialNamer,
  type PanelFigures,
} from '../state/panel-diff';

/** One side of the comparison: a panel and what it is ("open now", "saved 2 Dec, 19:20"). */
export interface CompareSide {
  panel: PanelSpec;
  caption: string;
}

const DYE_NAMES = new Map(listDyes().map((d) => [d.id, d.name]));
const MATERIAL_NAMES = new Map(MATERIALS.map((m) => [m.id, m.name]));

/** The library's name of a probe's material, or of its dye. */
const materialName: MaterialNamer = (p) =>
  p.material === 'dye'
    ? `dye: ${DYE_NAMES.get(p.dye ?? '') ?? p.dye ?? '—'}`
    : (MATERIAL_NAMES.get(p.material) ?? p.material);

/** Figures already computed, by panel (a panel is never changed in place: an edit makes a new object). */
const computed = new WeakMap<PanelSpec, PanelFigures>();

/** The figures of a panel, computed when the API's checks take it and the models compute it. */
export function figuresOf(panel: PanelSpec): PanelFigures {
  const known = computed.get(panel);
  if (known) return known;
  const checks = checksIfLoaded();
  const invalid = !checks || checks.checkPanel(panel);
  const r = invalid ? undefined : computePanel(panel, { byBrightness: true });
  const figures = panelFigures(panel, r?.ok ? r.value.evaluation : undefined, materialName);
  if (checks) computed.set(panel, figures);
  return figures;
}

@customElement('qdp-panel-compare')
export class PanelCompare extends LitElement {
  @property({ attribute: false }) a?: CompareSide;
  @property({ attribute: false }) b?: CompareSide;

  private figures?: [PanelFigures, PanelFigures];

  static override styles = [
    focusRing,
    css`
      :host {
        display: block;
      }
      .sides {
        display: grid;
        grid-template-columns: repeat(auto-fit, minmax(min(100%, 16rem), 1fr));
        gap: 0.6rem;
      }
      section {
        border: 1px solid #ccd;
        border-radius: 6px;
        padding: 0.4rem 0.6rem;
        background: #fff;
        min-width: 0;
        overflow-wrap: anywhere;
      }
      h3,
      h4 {
        margin: 0.2rem 0;
        font-size: 1rem;
      }
      h4 {
        font-size: 0.92rem;
      }
      .caption {
        margin: 0;
        color: #444;
        font-size: 0.9rem;
      }
      ul {
        margin: 0.2rem 0 0.4rem;
        padding-left: 1.2rem;
      }
      p {
        margin: 0.2rem 0;
      }
      .diff li {
        margin: 0.1rem 0;
      }
    `,
  ];

  override willUpdate(changed: Map<string, unknown>): void {
    if ((changed.has('a') || changed.has('b')) && this.a && this.b) {
      this.figures = [figuresOf(this.a.panel), figuresOf(this.b.panel)];
    }
  }

  private side(f: PanelFigures, caption: string, heading: string) {
    return html`<section aria-label=${`${heading}: ${f.name}`}>
      <h3>${f.name}</h3>
      <p class="caption">${heading}, ${caption}</p>
      ${f.computed ? '' : html`<p>This panel cannot be computed as it is, so it has no figures.</p>`}
      <h4>Probes</h4>
      <ul>
        ${f.probes.map(
          (p) =>
            html`<li>
              ${p.label}: ${p.material}, peak ${formatPeak(p.peakNm)}, unmixing noise ${formatGain(p.noiseGain)}×
            </li>`,
        )}
      </ul>
      <h4>Channels</h4>
      <ul>
        ${f.channels.map((c) => html`<li>${c.label}: ${c.filters}</li>`)}
      </ul>
      <p>Worst crosstalk: ${formatWorst(f.worst)}</p>
      <p>Condition number: ${formatGain(f.conditionNumber)}</p>
    </section>`;
  }

  override render() {
    if (!this.a || !this.b || !this.figures) return html``;
    const [fa, fb] = this.figures;
    const diff = panelDifferences(fa, fb);
    const differences = diff.length
      ? html`<ul class="diff">
          ${diff.map((d) => html`<li>${d}</li>`)}
        </ul>`
      : html`<p class="diff">No differences in these figures.</p>`;
    return html`<h4>From the first to the second</h4>
      ${differences}
      <div class="sides">${this.side(fa, this.a.caption, 'First')} ${this.side(fb, this.b.caption, 'Second')}</div>`;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'qdp-panel-compare': PanelCompare;
  }
}
