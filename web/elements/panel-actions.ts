/**
 * <qdp-panel-actions>: share the panel (stores it through the API and copies the link, with a visible link field as
 * the fallback) and export it: ordering sheet CSV, matrices CSV, panel JSON, chart SVG and PNG. Its report buttons fire
 * `report-show` {print} for the page to open the printable report (a preview on screen, or printed at once).
 */
import { LitElement, css, html } from 'lit';
import { customElement, property, state } from 'lit/decorators.js';
import { focusRing } from './shared-styles';
import type { PanelEvaluation, PanelOnInstrumentSpec, PanelSpec } from '../../spectra/index';
import type { LegendEntry } from '../chart/looks';
import { chartSvgExport } from '../io/chart-export';
import { orderingSheetCsv, type ResolvedForSheet } from '../io/csv-export';
import { downloadBlob, downloadText, svgToPng } from '../io/download';
import { matricesCsv } from '../io/matrix-export';

/** A file name from the panel title: letters, digits and dashes only. */
export function fileStem(panel: PanelSpec): string {
  return (
    (panel.title ?? 'panel')
      .toLowerCase()
      .replace(/[^a-z0-9]+/g, '-')
      .replace(/^-|-$/g, '')
      .slice(0, 60) || 'panel'
  );
}

@customElement('qdp-panel-actions')
export class PanelActions extends LitElement {
  @property({ attribute: false }) panel?: PanelSpec;
  /** What is shared, evaluated on the server and saved as JSON: the panel, naming its instrument profile if on one. */
  @property({ attribute: false }) request?: PanelOnInstrumentSpec;
  /** Why share and export are off (an excluded material, an input error), or '' when they are on. */
  @property() blocked = '';
  /** The page's own resolved dots, used for the sheet only if the server cannot be reached. */
  @property({ attribute: false }) localResolved: ResolvedForSheet[] = [];
  /** The page's evaluation of the panel, for the matrices file (none while the panel cannot be computed). */
  @property({ attribute: false }) evaluation?: Pick<PanelEvaluation, 'collected' | 'spillover'>;
  /** Returns the chart's <svg> for image export. */
  @property({ attribute: false }) chartSvg: () => SVGSVGElement | null = () => null;
  /** Returns the chart's legend entries, drawn under the exported chart. */
  @property({ attribute: false }) chartLegend: () => LegendEntry[] = () => [];

  @state() private link = '';
  @state() private message = '';
  @state() private busy = false;

  static override styles = [
    focusRing,
    css`
      :host {
        display: block;
      }
      .row {
        display: flex;
        flex-wrap: wrap;
        gap: 0.4rem;
        align-items: center;
      }
      input {
        font: inherit;
        width: min(32rem, 100%);
        padding: 0.25rem;
      }
      .msg {
        font-size: 0.9rem;
      }
      .report {
        margin-top: 0.4rem;
      }
    `,
  ];

  private async share(): Promise<void> {
    if (!this.panel) return;
    this.busy = true;
    try {
      const { sharePanel } = await import('../io/api');
      const { url } = await sharePanel(this.request ?? this.panel);
      this.link = new URL(url, location.origin).href;
      try {
        await navigator.clipboard.writeText(this.link);
        this.message = 'Link copied. Anyone with it sees this panel as a shared copy.';
      } catch {
        this.message = 'The link could not be copied automatically: copy it from the field.';
      }
    } catch (e) {
      this.message = `Sharing failed: ${e instanceof Error ? e.message : String(e)}`;
    } finally {
      this.busy = false;
    }
  }

  private async exportCsv(): Promise<void> {
    if (!this.panel) return;
    let resolved: ResolvedForSheet[] = this.localResolved;
    try {
      const { evaluateOnServer } = await import('../io/api');
      resolved = (await evaluateOnServer(this.request ?? this.panel)).probes;
      this.message = 'Ordering sheet saved (values from the server).';
    } catch (e) {
      const why = e instanceof Error ? e.message : String(e);
      this.message = `Ordering sheet saved with values computed in this page (server: ${why}).`;
    }
    downloadText(orderingSheetCsv(this.panel, resolved), `${fileStem(this.panel)}-order.csv`, 'text/csv;charset=utf-8');
  }

  private async exportImage(kind: 'svg' | 'png'): Promise<void> {
    const svg = this.chartSvg();
    if (!svg || !this.panel) return;
    const { text, widthPx, heightPx } = chartSvgExport(svg, {
      title: this.panel.title || 'Untitled panel',
      legend: this.chartLegend(),
    });
    if (kind === 'svg') downloadText(text, `${fileStem(this.panel)}-spectra.svg`, 'image/svg+xml');
    else downloadBlob(await svgToPng(text, widthPx, heightPx), `${fileStem(this.panel)}-spectra.png`);
  }

  private saveMatrices(): void {
    if (!this.panel || !this.evaluation) return;
    downloadText(
      matricesCsv(this.panel, this.evaluation),
      `${fileStem(this.panel)}-matrices.csv`,
      'text/csv;charset=utf-8',
    );
    this.message = 'Matrices saved (collected signal, spillover and unmixing, values computed in this page).';
  }

  private saveJson(): void {
    if (!this.panel) return;
    downloadText(
      JSON.stringify(this.request ?? this.panel, null, 2),
      `${fileStem(this.panel)}.json`,
      'application/json',
    );
  }

  private showReport(print: boolean): void {
    this.dispatchEvent(new CustomEvent('report-show', { detail: { print }, bubbles: true, composed: true }));
  }

  /** The shared link in a field that selects itself, for copying by hand. */
  private linkField() {
    const selectAll = (e: Event) => (e.target as HTMLInputElement).select();
    return html`<label class="row"
      >Share link <input type="text" readonly .value=${this.link} @focus=${selectAll}
    /></label>`;
  }

  override render() {
    const off = !!this.blocked || this.busy;
    const offNote =
      'Sharing, the ordering sheet, the matrices and the panel file are off (the chart can still be saved): ' +
      this.blocked;
    return html`<div class="row">
        <button type="button" ?disabled=${off} @click=${this.share}>Share: store and copy link</button>
        <button type="button" ?disabled=${off} @click=${this.exportCsv}>Ordering sheet (CSV)</button>
        <button type="button" ?disabled=${off || !this.evaluation} @click=${this.saveMatrices}>Matrices (CSV)</button>
        <button type="button" ?disabled=${off} @click=${this.saveJson}>Panel (JSON)</button>
        <button type="button" @click=${() => this.exportImage('svg')}>Chart (SVG)</button>
        <button type="button" @click=${() => this.exportImage('png')}>Chart (PNG)</button>
      </div>
      <div class="row report">
        <button type="button" @click=${() => this.showReport(false)}>Preview report</button>
        <button type="button" @click=${() => this.showReport(true)}>Print report</button>
      </div>
      ${this.blocked ? html`<p class="msg" role="status">${offNote}</p>` : ''} ${this.link ? this.linkField() : ''}
      <p class="msg" role="status" aria-live="polite">${this.message}</p>`;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'qdp-panel-actions': PanelActions;
  }
}
