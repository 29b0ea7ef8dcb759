/**
 * <qdp-panel-report>: the panel as a report a lab can file, one or two printed pages: title, date, the link to the
 * panel, the spectra chart with its legend (the chart export's standalone SVG), the probe and channel tables, the
 * crosstalk and spillover matrices, each target's unmixing noise, the hazards and cautions, and the settings.
 * `show()` opens it on screen as a preview; `show({ print: true })` also prints it. Printing the page by other means
 * (the browser's menu, Ctrl+P) prints it too: the page's print style hides everything else, and the report draws
 * itself before the browser lays the pages out.
 */
import { LitElement, css, html, nothing } from 'lit';
import { customElement, property, query, state } from 'lit/decorators.js';
import type { PanelSpec } from '../../spectra/index';
import type { CrosstalkView } from '../chart/crosstalk-view';
import { chartSvgExport } from '../io/chart-export';
import { SHEET_COLUMNS } from '../io/csv-export';
import { containsSentence, type MaterialNotesInput } from '../state/hazards';
import {
  REPORT_WORDS,
  reportChannelRows,
  reportHazards,
  reportLink,
  reportProbeRows,
  reportSettings,
} from '../state/report';
import type { Computed } from '../state/compute';
import { crosstalkMatrix, MATRIX_WORDS, noiseList, shadeStyles, spilloverMatrix } from './crosstalk-table';
import { focusRing } from './shared-styles';
import './spectrum-chart';
import type { SpectrumChart } from './spectrum-chart';

/**
 * Narrowest page chart the report copies as it is (px); a narrower one (a phone) is drawn again at the chart's default
 * width, which the report's copy gets by never being shown (the chart keeps its default width until it is measured).
 */
export const REPORT_CHART_MIN_PX = 600;

/** Said in place of the matrices when the page has no figures for the panel as it is. */
export const NO_FIGURES = 'No figures: the panel as it is cannot be computed (fix the marked input first).';

/** What the report holds at the moment it was opened (the chart and the link are read then). */
interface Snapshot {
  chart: SVGSVGElement | null;
  dateText: string;
  link: string;
}

/** The chart export's document as an inline <svg> that scales to the report's width. */
function inlineChart(text: string): SVGSVGElement | null {
  const doc = new DOMParser().parseFromString(text, 'image/svg+xml');
  const root = doc.documentElement;
  if (!(root instanceof SVGSVGElement)) return null;
  const svg = document.importNode(root, true);
  svg.removeAttribute('width');
  svg.removeAttribute('height');
  svg.setAttribute('role', 'img');
  return svg;
}

@customElement('qdp-panel-report')
export class PanelReport extends LitElement {
  @property({ attribute: false }) panel?: PanelSpec;
  /** The page's evaluation of the panel; none while the panel as it is cannot be computed. */
  @property({ attribute: false }) computed?: Pick<Computed, 'evaluation' | 'crosstalk'>;
  @property({ attribute: false }) materials: readonly MaterialNotesInput[] = [];
  @property({ attribute: false }) detectors: readonly { id: string; name: string }[] = [];
  /** The instrument profile the panel is on, or ''. */
  @property() instrumentName = '';
  /** The id of the shared copy shown, or '': the report then links the page's own address. */
  @property() sharedId = '';
  /** Returns the page's spectra chart. */
  @property({ attribute: false }) chart: () => SpectrumChart | null | undefined = () => null;
  /** True while the preview is shown on screen. */
  @property({ type: Boolean, reflect: true }) open = false;

  @state() private snap?: Snapshot;
  /** What the report's own full-width copy of the chart draws, while the page's chart is too narrow to print. */
  @state() private wideCopy?: Pick<
    SpectrumChart,
    'curves' | 'passbands' | 'shared' | 'background' | 'excitationNm' | 'yLabel'
  >;
  @query('h1') private heading?: HTMLHeadingElement;

  static override styles = [
    focusRing,
    shadeStyles,
    css`
      :host {
        display: block;
        color: #111;
      }
      :host(:not([open])) {
        display: none;
      }
      .bar {
        display: flex;
        gap: 0.5rem;
        justify-content: flex-end;
        margin-bottom: 0.5rem;
      }
      button {
        font: inherit;
        padding: 0.25rem 0.6rem;
        border: 1px solid #556;
        border-radius: 4px;
        background: #fff;
        cursor: pointer;
      }
      article {
        background: #fff;
        border: 1px solid #ccd;
        box-shadow: 0 1px 6px rgb(0 0 0 / 12%);
        max-width: 23cm;
        margin: 0 auto;
        padding: 1.2rem;
        font-size: 0.8rem;
        line-height: 1.3;
      }
      h1 {
        font-size: 1.15rem;
        margin: 0 0 0.2rem;
      }
      h2 {
        font-size: 0.9rem;
        margin: 0 0 0.25rem;
      }
      .meta {
        margin: 0 0 0.4rem;
        overflow-wrap: anywhere;
        color: #333;
      }
      .meta a {
        color: inherit;
      }
      .link {
        font-size: 0.75em;
        word-break: break-all;
      }
      section {
        margin: 0.5rem 0 0;
        break-inside: avoid;
      }
      .chart svg {
        display: block;
        width: 100%;
        max-width: 17cm;
        height: auto;
      }
      .wide {
        overflow-x: auto;
      }
      table {
        border-collapse: collapse;
      }
      th,
      td {
        padding: 0.1rem 0.3rem;
        border: 1px solid #ccd;
        text-align: right;
        white-space: nowrap;
      }
      th {
        background: #f3f4f8;
        font-weight: 600;
      }
      th[scope='row'],
      th.text,
      td.text {
        text-align: left;
      }
      td.text {
        white-space: normal;
      }
      td.self {
        color: #666;
      }
      .pair {
        display: flex;
        flex-wrap: wrap;
        gap: 0 1.2rem;
      }
      .pair > section {
        min-width: 0;
        max-width: 100%;
      }
      p {
        margin: 0.2rem 0;
      }
      ul {
        margin: 0.15rem 0;
        padding-left: 1.1rem;
      }
      .hazards li p {
        display: inline;
      }
      .level {
        font-weight: 600;
      }
      dl {
        margin: 0;
      }
      dl > div {
        break-inside: avoid;
      }
      dt {
        display: inline;
        font-weight: 600;
      }
      dt::after {
        content: ': ';
      }
      dd {
        display: inline;
        margin: 0;
      }
      @media (max-width: 600px) {
        article {
          padding: 0.6rem;
        }
      }
      @media print {
        :host {
          display: block !important;
        }
        .bar {
          display: none;
        }
        article {
          border: 0;
          box-shadow: none;
          max-width: none;
          padding: 0;
          font-size: 7.5pt;
        }
        h1 {
          font-size: 13pt;
        }
        h2 {
          font-size: 8.5pt;
          margin-bottom: 0.1rem;
        }
        section {
          margin-top: 0.3rem;
        }
        .wide {
          overflow: visible;
        }
        .chart svg {
          width: 17cm;
          max-height: 8cm;
        }
        .hazards ul,
        dl {
          columns: 2;
          column-gap: 0.6cm;
        }
        .hazards li {
          break-inside: avoid;
        }
        .hazards,
        .settings {
          font-size: 7pt;
        }

        td,
        th {
          print-color-adjust: exact;
        }
      }
    `,
  ];

  override connectedCallback(): void {
    super.connectedCallback();
    window.addEventListener('beforeprint', this.onBeforePrint);
  }

  override disconnectedCallback(): void {
    window.removeEventListener('beforeprint', this.onBeforePrint);
    super.disconnectedCallback();
  }

  /** While the preview is open, an edit of the panel reads the chart and the link again. */
  protected override willUpdate(changed: Map<PropertyKey, unknown>): void {
    if (this.open && this.snap && (changed.has('panel') || changed.has('computed'))) void this.refresh();
  }

  /** Printing from the browser's menu: the report is drawn afresh from the page's chart unless a preview is open. */
  private onBeforePrint = () => {
    if (!this.open) this.takeSnapshot(this.chart());
  };

  /**
   * The chart to copy: the page's own (as the reader set it: hidden layers, range, log scale) when it is at least
   * REPORT_CHART_MIN_PX wide, else the report's copy of it drawn at its full width, so a phone prints a legible chart.
   */
  private async chartSource(): Promise<SpectrumChart | null> {
    const live = this.chart();
    if (!live) return null;
    await live.updateComplete;
    if (live.getBoundingClientRect().width >= REPORT_CHART_MIN_PX) {
      this.wideCopy = undefined;
      return live;
    }
    const { curves, passbands, shared, background, excitationNm, yLabel } = live;
    this.wideCopy = { curves, passbands, shared, background, excitationNm, yLabel };
    await this.updateComplete;
    const copy = this.renderRoot.querySelector<SpectrumChart>('.copy qdp-spectrum-chart');
    await copy?.updateComplete;
    return copy ?? live;
  }

  /** Reads the chart (once drawn), the date and the link again. */
  private async refresh(): Promise<void> {
    await this.updateComplete;
    this.takeSnapshot(await this.chartSource());
  }

  /** Reads the chart, the date and the link as they are now. */
  private takeSnapshot(chart: SpectrumChart | null | undefined): void {
    const svg = chart?.shadowRoot?.querySelector('svg');
    const title = this.panel?.title || 'Untitled panel';
    this.snap = {
      chart: svg
        ? inlineChart(chartSvgExport(svg, { title, showTitle: false, legend: chart!.legendEntries() }).text)
        : null,
      dateText: new Date().toLocaleDateString(undefined, { dateStyle: 'long' }),
      link: reportLink(location, this.sharedId),
    };
  }

  /** Opens the preview (read from the panel as it is now) and moves to it; with `print`, prints it as well. */
  async show(options: { print?: boolean } = {}): Promise<void> {
    await this.refresh();
    this.open = true;
    await this.updateComplete;
    this.heading?.focus();
    this.scrollIntoView({ block: 'start' });
    if (options.print) window.print();
  }

  private close(): void {
    this.open = false;
    this.dispatchEvent(new CustomEvent('report-close', { bubbles: true, composed: true }));
  }

  private probeTable(panel: PanelSpec) {
    const rows = reportProbeRows(panel, this.computed?.evaluation.probes ?? [], this.materials);
    const c = SHEET_COLUMNS;
    const dash = (v: number | null) => (v === null ? '—' : String(v));
    return html`<div class="wide">
      <table aria-label=${REPORT_WORDS.probes}>
        <thead>
          <tr>
            ${[c.label, c.target, `${c.material} / ${c.shell}`].map(
              (h) => html`<th class="text" scope="col">${h}</th>`,
            )}
            ${[c.emissionPeak, c.fwhm, c.quantumYield, c.abundance].map((h) => html`<th scope="col">${h}</th>`)}
          </tr>
        </thead>
        <tbody>
          ${rows.map(
            (r) =>
              html`<tr>
                <th scope="row">${r.label}</th>
                <td class="text">${r.target}</td>
                <td class="text">${r.material}</td>
                <td>${dash(r.emissionPeakNm)}</td>
                <td>${dash(r.fwhmNm)}</td>
                <td>${dash(r.quantumYield)}</td>
                <td>${r.abundance}</td>
              </tr>`,
          )}
        </tbody>
      </table>
    </div>`;
  }

  private channelTable(panel: PanelSpec) {
    const c = SHEET_COLUMNS;
    return html`<div class="wide">
      <table aria-label=${REPORT_WORDS.channels}>
        <thead>
          <tr>
            ${[c.label, c.filters, c.excitation].map((h) => html`<th class="text" scope="col">${h}</th>`)}
          </tr>
        </thead>
        <tbody>
          ${reportChannelRows(panel).map(
            (r) =>
              html`<tr>
                <th scope="row">${r.label}</th>
                <td class="text">${r.filters}</td>
                <td class="text">${r.excitation}</td>
              </tr>`,
          )}
        </tbody>
      </table>
    </div>`;
  }

  private figures(view: CrosstalkView | undefined) {
    if (!view) return html`<section><p>${NO_FIGURES}</p></section>`;
    return html`<div class="pair">
        <section class="crosstalk">
          <h2>${MATRIX_WORDS.crosstalk}</h2>
          <div class="wide">${crosstalkMatrix(view)}</div>
        </section>
        <section class="spillover">
          <h2>${MATRIX_WORDS.spillover}</h2>
          <div class="wide">${spilloverMatrix(view)}</div>
        </section>
      </div>
      <p>${MATRIX_WORDS.crosstalkAbout} ${MATRIX_WORDS.spilloverAbout}</p>
      <section class="noise">
        <h2>${MATRIX_WORDS.noise}</h2>
        ${noiseList(view)}
      </section>`;
  }

  private hazards(panel: PanelSpec) {
    const { hazards, cautions } = reportHazards(panel, this.materials);
    return html`<section class="hazards">
      <h2>${REPORT_WORDS.hazards}</h2>
      <p class="level">${containsSentence(panel, this.materials)}</p>
      <ul>
        ${hazards.map(
          (h) =>
            html`<li>
              <strong>${h.name}</strong>${h.level ? html` <span class="level">(hazard: ${h.level})</span>` : nothing},
              ${h.probes.join(', ')}. ${h.notes.join(' ')}
            </li>`,
        )}
      </ul>
      <p><strong>Cautions</strong></p>
      <ul>
        ${cautions.map((c) => html`<li>${c}</li>`)}
      </ul>
    </section>`;
  }

  /** The full-width copy of a narrow page chart, drawn but never shown (only its picture is). */
  private copyOfChart() {
    const c = this.wideCopy;
    if (!c) return nothing;
    return html`<div class="copy" hidden>
      <qdp-spectrum-chart
        .curves=${c.curves}
        .passbands=${c.passbands}
        .shared=${c.shared}
        .background=${c.background}
        .excitationNm=${c.excitationNm}
        .yLabel=${c.yLabel}
      ></qdp-spectrum-chart>
    </div>`;
  }

  override render() {
    const panel = this.panel;
    const snap = this.snap;
    if (!panel || !snap) return this.copyOfChart();
    const settings = reportSettings(panel, { detectors: this.detectors, instrumentName: this.instrumentName });
    return html`<div class="bar">
        <button type="button" @click=${() => window.print()}>Print</button>
        <button type="button" @click=${this.close}>Close preview</button>
      </div>
      <article aria-labelledby="report-title">
        <h1 id="report-title" tabindex="-1">${panel.title || 'Untitled panel'}</h1>
        <p class="meta">${snap.dateText}</p>
        <p class="meta link"><a href=${snap.link}>${snap.link}</a></p>
        ${snap.chart ? html`<section class="chart">${snap.chart}</section>` : nothing} ${this.copyOfChart()}
        <section>
          <h2>${REPORT_WORDS.probes}</h2>
          ${this.probeTable(panel)}
        </section>
        <section>
          <h2>${REPORT_WORDS.channels}</h2>
          ${this.channelTable(panel)}
        </section>
        ${this.figures(this.computed?.crosstalk)} ${this.hazards(panel)}
        <section class="settings">
          <h2>${REPORT_WORDS.settings}</h2>
          <dl>
            ${settings.map(
              (s) =>
                html`<div>
                  <dt>${s.term}</dt>
                  <dd>${s.value}</dd>
                </div>`,
            )}
          </dl>
        </section>
      </article>`;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'qdp-panel-report': PanelReport;
  }
}
