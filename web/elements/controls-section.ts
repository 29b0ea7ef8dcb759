/**
 * <qdp-controls-section>: measured single-stain controls against the plan. The user loads a controls CSV (the format
 * is in the help text and web/io/controls-csv.ts) or the page hands in `.measured` (e.g. from image regions); the
 * section checks it with the API's schema and computes the same report as POST /api/v1/controls/spillover: the
 * measured spillover beside the predicted one, entries outside the prediction marked by a symbol and bold with a
 * sentence each, and downloads (measured and predicted spillover CSV, FCS 3.1 $SPILLOVER text, unmixing CSV). "Use the
 * measured columns as the panel's reference" fires `use-measured-reference` {channels, columns}. A refused file keeps
 * what was loaded before and says what to fix.
 */
import { LitElement, css, html, nothing } from 'lit';
import { customElement, property, state } from 'lit/decorators.js';
import { focusRing } from './shared-styles';
import {
  SpectraError,
  controlsReport,
  fcsSpillover,
  percentText,
  type ControlsMeasurement,
  type ControlsReport,
  type PanelEvaluation,
  type PanelSpec,
} from '../../spectra/index';
import { readControlsCsv } from '../io/controls-csv';
import { spilloverCsv, unmixingCsv } from '../io/controls-export';
import { downloadText } from '../io/download';
import { controlsProblemText } from '../state/controls-problem';
import { loadChecks } from '../state/load-checks';

/** The demo controls CSV, made for the demo panel by scripts/make-demo-controls.mts. */
export const DEMO_CONTROLS_URL = '/demo/controls.csv';

/** What `use-measured-reference` carries: the unstained-subtracted mean of each control per channel. */
export interface MeasuredReference {
  channels: string[];
  columns: { probe: string; values: number[] }[];
}

const CSV_TYPE = 'text/csv;charset=utf-8';
const TEXT_TYPE = 'text/plain;charset=utf-8';

/** Smallest predicted spillover the table prints as a number: 0.1 %, the crosstalk table's resolution. */
const SMALLEST_PREDICTED = 0.001;

@customElement('qdp-controls-section')
export class ControlsSection extends LitElement {
  @property({ attribute: false }) panel?: PanelSpec;
  @property({ attribute: false }) evaluation?: PanelEvaluation;
  /** Controls measured elsewhere (image regions); shown as soon as they are set. */
  @property({ attribute: false }) measured?: ControlsMeasurement;

  @state() private report?: ControlsReport;
  @state() private message = '';
  @state() private source = '';
  private current?: { measurement: ControlsMeasurement; lines?: number[] };

  static override styles = [
    focusRing,
    css`
      :host {
        display: block;
      }
      .scroll {
        max-width: 100%;
        overflow-x: auto;
      }
      .tables {
        display: flex;
        flex-wrap: wrap;
        gap: 1rem;
      }
      table {
        border-collapse: collapse;
        font-size: 0.85rem;
      }
      th,
      td {
        border: 1px solid #ccd;
        padding: 0.2rem 0.4rem;
        text-align: right;
      }
      td.self {
        color: #666;
      }
      .flag {
        font-weight: 700;
        background: #fde8e8;
      }
      .error {
        color: #8b1a1a;
        font-weight: 600;
      }
      .row {
        display: flex;
        flex-wrap: wrap;
        gap: 0.4rem;
        margin: 0.5rem 0;
      }
      .help {
        font-size: 0.85rem;
      }
    `,
  ];

  protected override willUpdate(changed: Map<PropertyKey, unknown>): void {
    if (changed.has('measured') && this.measured) {
      this.source = 'measured regions';
      void this.use({ measurement: this.measured });
    } else if (changed.has('panel') && this.current) void this.use(this.current);
  }

  /** Reads a controls CSV text as the file input does (the demo button and tests use it too). */
  async loadCsv(text: string, name: string): Promise<void> {
    if (!this.panel) return;
    const read = readControlsCsv(text, this.panel);
    if (!read.ok) {
      this.message = `${name}: ${read.message}. The controls shown before are kept.`;
      return;
    }
    if (await this.use({ measurement: read.measurement, lines: read.lines })) this.source = name;
  }

  /** Checks and computes a measurement; on a refusal keeps the last report and says what to fix. */
  private async use(next: { measurement: ControlsMeasurement; lines?: number[] }): Promise<boolean> {
    const { checkControls } = await loadChecks();
    const say = (path: (string | number)[], message: string) =>
      controlsProblemText(path, message, next.measurement, this.panel, next.lines);
    const problem = checkControls(next.measurement);
    if (problem) {
      this.message = say(problem.path, problem.message);
      return false;
    }
    try {
      this.report = controlsReport(next.measurement, this.panel);
      this.current = next;
      this.message = '';
      return true;
    } catch (e) {
      if (!(e instanceof SpectraError)) throw e;
      this.message = say(e.path, e.message);
      return false;
    }
  }

  private async onFile(e: Event): Promise<void> {
    const input = e.target as HTMLInputElement;
    const file = input.files?.[0];
    if (file) await this.loadCsv(await file.text(), file.name);
    input.value = '';
  }

  private async loadDemo(): Promise<void> {
    const res = await fetch(DEMO_CONTROLS_URL).catch(() => null);
    if (!res?.ok) {
      this.message = 'The demo controls could not be fetched; try again.';
      return;
    }
    await this.loadCsv(await res.text(), 'demo controls');
  }

  private name(kind: 'probes' | 'channels', id: string): string {
    const list: { id: string; label?: string }[] = this.panel?.[kind] ?? [];
    return list.find((i) => i.id === id)?.label || id;
  }

  private useReference(r: ControlsReport): void {
    const detail: MeasuredReference = {
      channels: [...r.channels],
      columns: r.probes.map((probe, p) => ({ probe, values: r.signal.map((row) => row[p]) })),
    };
    this.dispatchEvent(new CustomEvent('use-measured-reference', { detail, bubbles: true, composed: true }));
  }

  /**
   * What the panel's own spillover is: predicted by the model, or the panel's reference once it holds measured
   * columns (the comparison above stays with the model's prediction).
   */
  private panelsWord(): string {
    return this.evaluation?.referenceColumns.includes('measured') ? "Panel's reference" : 'Predicted';
  }

  private predictedFcs(): string | null {
    const ev = this.evaluation;
    const panel = this.panel;
    if (!ev || !panel) return null;
    const m = {
      channels: panel.channels.map((c) => c.id),
      probes: panel.probes.map((p) => p.id),
      spillover: ev.spillover,
      primaryChannel: ev.primaryChannel,
    };
    const result = fcsSpillover(m);
    return result.ok ? result.text : null;
  }

  private downloads(r: ControlsReport) {
    const channels = r.channels.map((c) => this.name('channels', c));
    const probes = r.probes.map((p) => this.name('probes', p));
    const ev = this.evaluation;
    const panel = this.panel;
    const predictedFcs = this.predictedFcs();
    return html`<div class="row">
      <button
        @click=${() =>
          downloadText(spilloverCsv(channels, probes, r.spillover, r.se), 'measured-spillover.csv', CSV_TYPE)}
      >
        Measured spillover (CSV)
      </button>
      ${
        ev && panel
          ? html`<button
              @click=${() =>
                downloadText(
                  spilloverCsv(
                    panel.channels.map((c) => c.label || c.id),
                    panel.probes.map((p) => p.label || p.id),
                    ev.spillover,
                  ),
                  'predicted-spillover.csv',
                  CSV_TYPE,
                )}
            >
              ${this.panelsWord()} spillover (CSV)
            </button>`
          : nothing
      }
      <button
        ?disabled=${r.fcsSpillover === null}
        @click=${() => downloadText(`${r.fcsSpillover}\n`, 'measured-spillover-fcs.txt', TEXT_TYPE)}
      >
        FCS $SPILLOVER, measured (.txt)
      </button>
      ${
        predictedFcs
          ? html`<button @click=${() => downloadText(`${predictedFcs}\n`, 'predicted-spillover-fcs.txt', TEXT_TYPE)}>
              FCS $SPILLOVER, ${this.panelsWord().toLowerCase()} (.txt)
            </button>`
          : nothing
      }
      <button
        ?disabled=${r.unmixing === null}
        @click=${() => downloadText(unmixingCsv(probes, channels, r.unmixing ?? []), 'unmixing-matrix.csv', CSV_TYPE)}
      >
        Unmixing matrix (CSV)
      </button>
      <button @click=${() => this.useReference(r)}>Use the measured columns as the panel's reference</button>
    </div>`;
  }

  private table(r: ControlsReport, kind: 'measured' | 'predicted') {
    const cell = (c: number, p: number) => {
      // Both matrices are 100 % there by definition; the word says which cell the column is relative to.
      if (c === r.primaryChannel[p]) return html`<td class="self">primary</td>`;
      const entry = r.comparison?.entries[c][p];
      if (kind === 'predicted') {
        if (!entry || entry.predicted === null) return html`<td>—</td>`;
        // Below 0.1 % the model's tails are not a prediction worth reading (the crosstalk table's resolution).
        const shown = (v: number) => (v < SMALLEST_PREDICTED ? '< 0.1' : percentText(v));
        const band =
          entry.band && entry.band[1] >= SMALLEST_PREDICTED ? ` (${shown(entry.band[0])}–${shown(entry.band[1])})` : '';
        return html`<td>${shown(entry.predicted)}${band}</td>`;
      }
      const se = r.se[c][p];
      const withSe = se !== null;
      const text = `${percentText(r.spillover[c][p])}${withSe ? ` ± ${percentText(se)}` : ''}`;
      if (!entry?.flagged) return html`<td>${text}</td>`;
      const symbol = r.spillover[c][p] > (entry.predicted ?? 0) ? '▲' : '▼';
      return html`<td class="flag" title=${entry.sentence ?? ''}>
        <span aria-hidden="true">${symbol}</span> ${text}
      </td>`;
    };
    return html`<div class="scroll">
      <table>
        <caption>
          ${kind === 'measured' ? 'Measured spillover, % (± SE)' : 'Predicted spillover, % (lot-shift band)'}
        </caption>
        <tr>
          <th scope="col">channel</th>
          ${r.probes.map((p) => html`<th scope="col">${this.name('probes', p)}</th>`)}
        </tr>
        ${r.channels.map(
          (ch, c) =>
            html`<tr>
              <th scope="row">${this.name('channels', ch)}</th>
              ${r.probes.map((_, p) => cell(c, p))}
            </tr>`,
        )}
      </table>
    </div>`;
  }

  override render() {
    const r = this.report;
    return html`
      <p class="help">
        Load a CSV of your single-stain controls: a header row with a first cell (e.g. "sample") and one column per
        channel (its id or label), optionally <code>sd:&lt;channel&gt;</code> columns and an <code>n</code> column (the
        readings behind each mean); one row named "unstained"; then one row per probe named by its label or id. Repeat a
        probe's row for replicates. Staining controls uses the same probes as the panel: follow their hazard notes and
        your institution's rules and local regulations.
      </p>
      <div class="row">
        <label>Controls CSV <input type="file" accept=".csv,text/csv" @change=${this.onFile} /></label>
        <button @click=${this.loadDemo}>Try the demo controls</button>
      </div>
      ${this.message ? html`<p class="error" role="alert">${this.message}</p>` : nothing}
      ${
        r
          ? html`<p>
                Showing ${this.source}: ${r.probes.length} controls, ${r.replicates.reduce((a, v) => a + v, 0)} rows.
              </p>
              <div class="tables">
                ${this.table(r, 'measured')} ${r.comparison ? this.table(r, 'predicted') : nothing}
              </div>
              ${
                r.comparison && r.comparison.sentences.length
                  ? html`<p>Entries outside the prediction (marked ▲ above or ▼ below, in bold):</p>
                      <ul class="sentences">
                        ${r.comparison.sentences.map((s) => html`<li>${s}</li>`)}
                      </ul>`
                  : r.comparison
                    ? html`<p>Every entry is within the prediction's lot-shift band and its noise.</p>`
                    : nothing
              }
              ${
                r.warnings.length
                  ? html`<details class="warnings">
                      <summary>${r.warnings.length} note${r.warnings.length === 1 ? '' : 's'} on the readings</summary>
                      <ul>
                        ${r.warnings.map((w) => html`<li>${w}</li>`)}
                      </ul>
                    </details>`
                  : nothing
              }
              ${this.downloads(r)}`
          : nothing
      }
    `;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'qdp-controls-section': ControlsSection;
  }
}
