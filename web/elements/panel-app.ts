/**
 * <qdp-panel-app>: the whole page. Holds the panel, checks it with the API's schema and recomputes it locally on every
 * edit (keeping the last good result when an edit is invalid), keeps the state in the URL fragment, and opens shared
 * panels from /p/<id>.
 */
import { LitElement, html } from 'lit';
import { customElement, query, state } from 'lit/decorators.js';
import type { ChannelSpec, PanelSpec, ProbeSpec } from '../../spectra/index';
import { appStyles } from './panel-app-styles';
import type { EdgeDragDetail } from '../chart/types';
import { computePanel, DETECTORS, MATERIALS, type Computed } from '../state/compute';
import { demoPanel } from '../state/demo-panel';
import { placeError, type FieldError } from '../state/error-map';
import { offendingProbes, type PanelExclusion } from '../state/exclusions';
import { decodeFragment, encodeFragment } from '../state/fragment';
import { checksIfLoaded, loadChecks } from '../state/load-checks';
import {
  addChannel,
  addProbe,
  addSpectralRun,
  newPanel,
  removeChannel,
  removeProbe,
  setChannel,
  setProbe,
} from '../state/panel-edit';
import { moveEdge } from '../state/edge-drag';
import './channel-list';
import './crosstalk-table';
import './design-form';
import './light-editor';
import './material-notes';
import './panel-actions';
import './probe-list';
import './spectrum-chart';
import type { SpectrumChart } from './spectrum-chart';

/** Edits closer together than this share one back-button step (ms): typing a number is one step, not five. */
const HISTORY_STEP_MS = 1000;

/** The panel's sample light that a design request carries: its scatterLevel and waterRaman, when set. */
function sampleOf(p: PanelSpec): Pick<PanelSpec, 'scatterLevel' | 'waterRaman'> {
  return {
    ...(p.scatterLevel !== undefined ? { scatterLevel: p.scatterLevel } : {}),
    ...(p.waterRaman ? { waterRaman: { ...p.waterRaman } } : {}),
  };
}

@customElement('qdp-panel-app')
export class PanelApp extends LitElement {
  @state() private panel: PanelSpec = newPanel();
  @state() private exclude: PanelExclusion[] = [];
  @state() private computed?: Computed;
  @state() private error?: FieldError;
  @state() private sharedId = '';
  @state() private notice = '';
  @state() private byBrightness = true;
  @query('qdp-spectrum-chart') private chart?: SpectrumChart;
  private lastPushMs = 0;
  /** True while a panel waits for the checks to arrive before it is computed. */
  private awaitingChecks = false;

  static override styles = appStyles;

  override connectedCallback(): void {
    super.connectedCallback();
    window.addEventListener('popstate', this.onPopState);
    void this.startChecks();
    const shared = /^\/p\/([A-Za-z0-9_-]+)$/.exec(location.pathname);
    if (shared) void this.openShared(shared[1]);
    else void this.restoreFromFragment();
  }

  override disconnectedCallback(): void {
    window.removeEventListener('popstate', this.onPopState);
    super.disconnectedCallback();
  }

  private onPopState = () => {
    if (!this.sharedId && location.hash) void this.restoreFromFragment();
  };

  /** Loads the checks in the background; a panel set before they arrived is checked and computed then. */
  private async startChecks(): Promise<void> {
    try {
      await loadChecks();
      if (this.awaitingChecks) this.refresh();
    } catch {
      this.notice = 'The page could not load its panel checks, so nothing is computed: reload the page to try again.';
    }
  }

  /**
   * Loads the state in the fragment, if any. Without a fragment, or with one that cannot be read (a notice says why),
   * the demo panel is shown.
   */
  private async restoreFromFragment(): Promise<void> {
    try {
      const raw = decodeFragment(location.hash);
      if (raw === null) return this.load(demoPanel(), []);
      const { readPageState } = await loadChecks();
      const r = readPageState(raw);
      if (!r.ok) throw new Error(`The link's panel is not valid (${r.message}).`);
      this.load(r.state.panel, r.state.view.exclude, false);
    } catch (e) {
      this.notice = `${e instanceof Error ? e.message : String(e)} The demo panel is shown instead.`;
      this.load(demoPanel(), []);
    }
  }

  private async openShared(id: string): Promise<void> {
    this.sharedId = id;
    this.notice = 'Loading the shared panel…';
    try {
      const fetched = import('../io/api').then((api) => api.loadSharedPanel(id));
      const [{ readPanel }, raw] = await Promise.all([loadChecks(), fetched]);
      const r = readPanel(raw);
      if (!r.ok) throw new Error(r.message);
      this.notice = '';
      this.load(r.panel, [], false);
    } catch (e) {
      this.notice = `This shared panel could not be opened: ${e instanceof Error ? e.message : String(e)}`;
    }
  }

  /** Replaces the whole panel (new, demo, import, shared) and recomputes. */
  private load(panel: PanelSpec, exclude: PanelExclusion[], writeUrl = true): void {
    this.computed = undefined;
    this.exclude = exclude;
    this.apply(panel, writeUrl ? 'push' : 'none');
  }

  /** Sets the panel, checks and recomputes it, and records it in the fragment. */
  private apply(panel: PanelSpec, history: 'push' | 'replace' | 'none' = 'push'): void {
    this.panel = panel;
    this.refresh();
    if (history !== 'none' && !this.sharedId) this.writeFragment(history);
  }

  /**
   * Checks the panel with the API's schema and computes it only when the API would take it: an invalid edit shows the
   * API's message under its field and keeps the last good numbers; a model's refusal comes from computing.
   */
  private refresh(): void {
    const checks = checksIfLoaded();
    this.awaitingChecks = !checks;
    if (!checks) return;
    const problem = checks.checkPanel(this.panel);
    if (problem) {
      this.error = problem;
      return;
    }
    const r = computePanel(this.panel, { byBrightness: this.byBrightness });
    if (r.ok) {
      this.computed = r.value;
      this.error = undefined;
    } else {
      this.error = r.error;
    }
  }

  private writeFragment(mode: 'push' | 'replace'): void {
    const url = `${location.pathname}#${encodeFragment({ panel: this.panel, view: { exclude: this.exclude } })}`;
    const now = Date.now();
    if (mode === 'push' && now - this.lastPushMs > HISTORY_STEP_MS) history.pushState(null, '', url);
    else history.replaceState(null, '', url);
    this.lastPushMs = now;
  }

  private duplicate(): void {
    this.sharedId = '';
    this.panel = { ...this.panel, title: `${this.panel.title ?? 'Panel'} (copy)` };
    history.pushState(null, '', `/#${encodeFragment({ panel: this.panel, view: { exclude: this.exclude } })}`);
    this.apply(this.panel, 'replace');
  }

  private async importJson(file: File | undefined): Promise<void> {
    if (!file) return;
    try {
      const { readPanel } = await loadChecks();
      const r = readPanel(JSON.parse(await file.text()));
      if (!r.ok) throw new Error(r.message);
      this.notice = `Opened ${file.name}.`;
      this.load(r.panel, this.exclude);
    } catch (e) {
      this.notice = `${file.name} is not a panel: ${e instanceof Error ? e.message : String(e)}`;
    }
  }

  private onProbeChange(e: CustomEvent<{ index: number; probe: ProbeSpec }>): void {
    this.apply(setProbe(this.panel, e.detail.index, e.detail.probe));
  }

  private onChannelChange(e: CustomEvent<{ index: number; channel: ChannelSpec }>): void {
    this.apply(setChannel(this.panel, e.detail.index, e.detail.channel));
  }

  private onSpectralRun(e: CustomEvent<{ startNm: number; bins: number; binWidthNm: number }>): void {
    this.apply(addSpectralRun(this.panel, e.detail.startNm, e.detail.bins, e.detail.binWidthNm));
  }

  /** A dragged edge moves the filter; the drag's last event is one history step, the ones before it replace it. */
  private onEdgeDrag(e: CustomEvent<EdgeDragDetail>): void {
    if (!this.sharedId) this.apply(moveEdge(this.panel, e.detail), e.detail.done ? 'push' : 'replace');
  }

  /** The panel's probes (without their channel choice) and channels, for a search among them; none when empty. */
  private candidates() {
    const p = this.panel;
    if (p.probes.length === 0 || p.channels.length === 0) return undefined;
    return { probes: p.probes.map(({ channel: _c, ...probe }) => probe), channels: p.channels };
  }

  private sharedNote() {
    return html`<p class="shared" role="note">
      Shared copy (read only). <button type="button" @click=${this.duplicate}>Duplicate and edit</button>
    </p>`;
  }

  override render() {
    const p = this.panel;
    const c = this.computed;
    const errors = placeError(this.error);
    const blockedProbes = offendingProbes(p, MATERIALS, this.exclude);
    const blocked = blockedProbes.size
      ? 'a probe is made of an excluded material.'
      : this.error
        ? 'fix the marked input first.'
        : '';
    return html` <header>
        <h1>qdpanel <span>plan a quantum-dot panel</span></h1>
        <div class="row">
          <label
            >Panel title
            <input
              type="text"
              .value=${p.title ?? ''}
              ?disabled=${!!this.sharedId}
              @change=${(e: Event) => this.apply({ ...p, title: (e.target as HTMLInputElement).value })}
          /></label>
          <button type="button" @click=${() => this.load(newPanel(), [])}>New panel</button>
          <button type="button" @click=${() => this.load(demoPanel(), [])}>Open the demo panel</button>
          <label class="file"
            >Open panel JSON
            <input
              type="file"
              accept=".json,application/json"
              @change=${(e: Event) => this.importJson((e.target as HTMLInputElement).files?.[0])}
          /></label>
        </div>
        ${this.notice ? html`<p class="notice" role="status">${this.notice}</p>` : ''}
        ${this.sharedId ? this.sharedNote() : ''}
        ${this.error ? html`<p class="error" role="alert">Not updated: ${this.error.message}</p>` : ''}
      </header>
      <main
        @panel-proposed=${(e: CustomEvent<{ panel: PanelSpec }>) => {
          this.sharedId = '';
          this.load(e.detail.panel, this.exclude);
        }}
      >
        <div
          class="edit"
          ?inert=${!!this.sharedId}
          @probe-change=${this.onProbeChange}
          @probe-remove=${(e: CustomEvent<{ index: number }>) => this.apply(removeProbe(p, e.detail.index))}
          @probe-add=${() => this.apply(addProbe(p))}
          @channel-change=${this.onChannelChange}
          @channel-remove=${(e: CustomEvent<{ index: number }>) => this.apply(removeChannel(p, e.detail.index))}
          @channel-add=${() => this.apply(addChannel(p))}
          @spectral-run=${this.onSpectralRun}
          @panel-edit=${(e: CustomEvent<{ panel: PanelSpec }>) => this.apply(e.detail.panel)}
        >
          <section aria-labelledby="h-light">
            <h2 id="h-light">Excitation, sample background and shared light path</h2>
            <qdp-light-editor .panel=${p} .errors=${errors.other}></qdp-light-editor>
          </section>
          <section aria-labelledby="h-probes">
            <h2 id="h-probes">Probes</h2>
            <qdp-probe-list
              .panel=${p}
              .materials=${MATERIALS}
              .predictions=${c?.predictions ?? []}
              .errors=${errors.probes}
              .blocked=${blockedProbes}
            ></qdp-probe-list>
          </section>
          <section aria-labelledby="h-channels">
            <h2 id="h-channels">Detection channels</h2>
            <qdp-channel-list .panel=${p} .detectors=${DETECTORS} .errors=${errors.channels}></qdp-channel-list>
          </section>
          <section aria-labelledby="h-propose">
            <h2 id="h-propose">Propose a panel</h2>
            <p>
              Name the targets and how abundant each is; the search proposes dots and filters (or picks from this
              panel's probes and channels) that keep the worst bleed-through low, and loads the proposal here for
              editing.
            </p>
            <qdp-design-form .candidates=${this.candidates()} .sample=${sampleOf(p)}></qdp-design-form>
          </section>
        </div>
        <div class="results">
          <section aria-labelledby="h-spectra">
            <h2 id="h-spectra">Spectra</h2>
            <label
              ><input
                type="checkbox"
                .checked=${this.byBrightness}
                @change=${(e: Event) => {
                  this.byBrightness = (e.target as HTMLInputElement).checked;
                  this.apply(p, 'none');
                }}
              />
              Scale curves by expected brightness (otherwise each peaks at 1)</label
            >
            <qdp-spectrum-chart
              .curves=${c?.chart.curves ?? []}
              .passbands=${c?.chart.passbands ?? []}
              .background=${c?.chart.background}
              .excitationNm=${p.excitation.map((l) => l.wavelengthNm)}
              .yLabel=${this.byBrightness ? 'relative emission × brightness' : 'emission (peak = 1)'}
              @edge-drag=${this.onEdgeDrag}
            ></qdp-spectrum-chart>
          </section>
          <section aria-labelledby="h-crosstalk">
            <h2 id="h-crosstalk">Crosstalk and unmixing</h2>
            <qdp-crosstalk-table .view=${c?.crosstalk} ?stale=${!!this.error}></qdp-crosstalk-table>
          </section>
          <section aria-labelledby="h-materials">
            <h2 id="h-materials">Material cautions</h2>
            <qdp-material-notes
              .panel=${p}
              .materials=${MATERIALS}
              .exclude=${this.exclude}
              @exclude-change=${(e: CustomEvent<{ exclude: PanelExclusion[] }>) => {
                this.exclude = e.detail.exclude;
                this.apply(p, 'replace');
              }}
            ></qdp-material-notes>
          </section>
          <section aria-labelledby="h-share">
            <h2 id="h-share">Share and export</h2>
            <qdp-panel-actions
              .panel=${p}
              .blocked=${blocked}
              .localResolved=${c?.resolved ?? []}
              .chartSvg=${() => this.chart?.shadowRoot?.querySelector('svg') ?? null}
            ></qdp-panel-actions>
          </section>
        </div>
      </main>`;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'qdp-panel-app': PanelApp;
  }
}
