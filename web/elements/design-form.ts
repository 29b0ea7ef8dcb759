/**
 * <qdp-design-form>: asks for targets (with abundances), excitation lines, material limits and a window, runs the
 * design search in a Web Worker (progress, stop, cancel) and shows the proposal beside the panel being edited
 * (<qdp-proposal-summary>), leaving the panel alone. Only "Load this proposal" fires a bubbling, composed
 * `panel-proposed` event with {panel, evaluation, objective, exact, stats}, on which the app loads the proposal as an
 * editable panel; "Discard" drops it, and a new search replaces it. With `candidates` set it can search only those
 * (catalog mode, exact).
 */
import { LitElement, css, html } from 'lit';
import { customElement, property, state } from 'lit/decorators.js';
import {
  ABUNDANCE_WORDS,
  DEFAULT_WINDOW_NM,
  EXCLUSION_WORDS,
  LEFT_OUT_BY_DEFAULT,
  LIMITS,
  listMaterials,
  PRACTICE_DEFAULTS,
  type AbundanceInput,
  type DesignOptions,
  type DesignRequest,
  type DesignResult,
  type Exclusion,
  type SearchProgress,
} from '../../spectra/index';
import { designErrorText, FORM_WORDS } from '../state/design-error';
import type { DesignWorkerMessage } from '../state/design-worker';
import { loadChecks } from '../state/load-checks';
import { percent } from './proposal-summary';

/** The abundance words a target may take instead of a number (high, medium, low). */
const WORDS = Object.keys(ABUNDANCE_WORDS) as (keyof typeof ABUNDANCE_WORDS)[];

/** An abundance as typed: a word passes as is, anything else as a number (the API's schema names a bad one). */
function abundanceInput(text: string): AbundanceInput {
  const word = text.trim().toLowerCase();
  return WORDS.find((w) => w === word) ?? Number(word);
}

/** "405, 488" → excitation lines; throws a sentence naming the field when a value is not a number. */
function excitationLines(text: string): { wavelengthNm: number }[] {
  const parts = text.split(/[\s,;]+/).filter(Boolean);
  if (parts.length === 0 || parts.some((p) => !Number.isFinite(Number(p))))
    throw new Error('excitation lines must be numbers in nm, e.g. 405, 488');
  return parts.map((p) => ({ wavelengthNm: Number(p) }));
}

/** How far the search has got, after its status word: nodes or refinement steps, and the best value so far. */
function progressText(progress: SearchProgress): string {
  const steps = progress.stage === 'refine' ? 'refinement steps' : 'nodes visited';
  const best =
    progress.incumbent === null
      ? ''
      : progress.measure === 'signalToNoise'
        ? ` · weakest target's signal-to-noise so far ${progress.incumbent.toPrecision(3)}`
        : ` · worst interference so far ${percent(progress.incumbent)}`;
  return ` · ${progress.nodesVisited.toLocaleString('en')} ${steps}${best}`;
}

/** A labelled checkbox that reports its new state; the trailing space keeps a row of them apart. */
function checkbox(checked: boolean, label: string, set: (on: boolean) => void) {
  const changed = (e: Event) => set((e.target as HTMLInputElement).checked);
  return html`<label><input type="checkbox" .checked=${checked} @change=${changed} /> ${label}</label> `;
}

/** The practice checks and verdict thresholds the form lets the user set: option key, label, unit. */
type CheckKey = keyof typeof PRACTICE_DEFAULTS;
const CHECKS: readonly [CheckKey, string, string][] = [
  ['minBlockingOD', 'Each channel blocks its lines by at least (OD)', ''],
  ['minChannelShare', "Share of a probe's light its channel passes, at least (0–1)", ''],
  ['lineClearanceNm', 'Emission peak at least this far from every line', 'nm'],
  ['minSignalToNoise', 'Signal-to-noise after unmixing, at least', ''],
  ['maxInterference', "Another probe's light in a channel, at most (× the target's own)", ''],
];

/** The catalog-mode choice. */
const CANDIDATES_ONLY = `choose only from ${FORM_WORDS.candidates}`;

interface TargetRow {
  name: string;
  abundance: string;
}

/** The materials free design can size: those with a size law or an accepted peak range (not the custom probe). */
const MATERIALS = listMaterials().filter((m) => m.emissionRangeNm !== null);

@customElement('qdp-design-form')
export class DesignForm extends LitElement {
  /** Probes and channels to choose from (catalog mode); absent: free mode only. */
  @property({ attribute: false }) candidates?: DesignRequest['candidates'];
  /** The sample's own light (the panel's scatterLevel, waterRaman): sent with every request, kept in the proposal. */
  @property({ attribute: false }) sample: Pick<DesignRequest, 'scatterLevel' | 'waterRaman'> = {};
  /** Extra search options passed with every request (e.g. a node budget). */
  @property({ attribute: false }) options: DesignOptions = {};

  @state() private targets: TargetRow[] = [
    { name: 'target 1', abundance: 'high' },
    { name: 'target 2', abundance: 'low' },
  ];
  @state() private excitationText = '405';
  @state() private exclude = new Set<Exclusion>();
  /** Materials ticked for free design: all but those unsuitable by default (illustrative, LEFT_OUT_BY_DEFAULT). */
  @state() private allowed = new Set(
    MATERIALS.filter((m) => !m.illustrative && LEFT_OUT_BY_DEFAULT[m.id] === undefined).map((m) => m.id),
  );
  /** The practice checks and verdict thresholds as typed (absent: the documented default). */
  @state() private checks: Partial<Record<CheckKey, number>> = {};
  @state() private windowNm: [number, number] = [DEFAULT_WINDOW_NM[0], DEFAULT_WINDOW_NM[1]];
  @state() private useCandidates = true;
  @state() private running = false;
  @state() private progress: SearchProgress | null = null;
  @state() private status = '';
  @state() private error = '';
  /** The last search's proposal, shown until it is loaded, discarded or replaced by a new search. */
  @state() private result: DesignResult | null = null;
  private worker: Worker | null = null;
  /** Counts proposals, so a check that returns after a newer proposal or a cancel starts nothing. */
  private proposals = 0;

  static override styles = css`
    :host {
      display: block;
      font-size: 0.9rem;
    }
    fieldset {
      border: 1px solid #ccd;
      margin: 0.4rem 0;
    }
    .row {
      display: flex;
      flex-wrap: wrap;
      gap: 0.4rem;
      align-items: center;
      margin: 0.2rem 0;
    }
    fieldset {
      min-width: 0;
    }
    input[type='text'],
    input[type='number'] {
      width: 8rem;
      max-width: 40vw;
    }
    .error {
      color: #8b1a1a;
      font-weight: 600;
    }
    button:focus-visible,
    input:focus-visible {
      outline: 3px solid #1a56db;
    }
  `;

  override disconnectedCallback(): void {
    super.disconnectedCallback();
    this.cancel(false);
  }

  private request(): DesignRequest {
    const request: DesignRequest = {
      targets: this.targets.map((t) => ({ name: t.name.trim(), abundance: abundanceInput(t.abundance) })),
      excitation: excitationLines(this.excitationText),
      options: { ...this.options, ...this.checks },
      ...this.sample,
    };
    if (this.candidates && this.useCandidates) return { ...request, candidates: this.candidates };
    return {
      ...request,
      exclude: [...this.exclude],
      allowedMaterials: [...this.allowed],
      windowNm: this.windowNm,
    };
  }

  /** Checks the request with the API's schema, then starts the search in a fresh worker. */
  async propose(): Promise<void> {
    this.cancel(false);
    this.error = '';
    this.result = null;
    let request: DesignRequest;
    try {
      request = this.request();
    } catch (err) {
      this.error = (err as Error).message;
      return;
    }
    const ticket = ++this.proposals;
    this.running = true;
    this.status = 'checking';
    let problem: string | undefined;
    try {
      problem = (await loadChecks()).checkDesignRequest(request)?.message;
    } catch {
      problem = 'the request checks could not be loaded: reload the page to try again';
    }
    if (ticket !== this.proposals || !this.running) return; // cancelled, or a newer proposal, while checking
    if (problem) return this.finish('', problem);
    const worker = new Worker(new URL('../state/design-worker.ts', import.meta.url), { type: 'module' });
    this.worker = worker;
    this.running = true;
    this.status = 'starting';
    worker.onmessage = (event: MessageEvent<DesignWorkerMessage>) => this.receive(event.data);
    worker.onerror = () => this.finish('', 'the design worker could not run');
    worker.postMessage({ type: 'run', request });
  }

  /** Asks the search to stop and keep the best design found so far. */
  stop(): void {
    this.worker?.postMessage({ type: 'stop' });
    this.status = 'stopping…';
  }

  /** Ends the search now (terminates the worker, or drops a request still being checked); nothing is proposed. */
  cancel(show = true): void {
    this.worker?.terminate();
    this.worker = null;
    if (!this.running) return;
    this.running = false;
    if (show) this.status = 'cancelled';
  }

  private finish(status: string, error = ''): void {
    this.worker?.terminate();
    this.worker = null;
    this.running = false;
    this.status = status;
    this.error = error;
  }

  private receive(message: DesignWorkerMessage): void {
    if (message.type === 'progress') {
      this.progress = message.progress;
      this.status = message.progress.stage;
      return;
    }
    if (message.type === 'error') {
      const names = this.targets.map((t) => t.name);
      this.finish('failed', designErrorText(message.error, names));
      return;
    }
    this.result = message.result;
    this.finish('done');
  }

  /** Hands the shown proposal to the app (which loads it as the panel) and stops showing it. */
  private loadProposal(): void {
    const r = this.result;
    if (!r) return;
    const { panel, evaluation, objective, exact, stats } = r;
    if (panel === null) return; // no usable panel: nothing to load
    this.result = null;
    this.status = 'proposal loaded';
    this.dispatchEvent(
      new CustomEvent('panel-proposed', {
        detail: { panel, evaluation, objective, exact, stats },
        bubbles: true,
        composed: true,
      }),
    );
  }

  private discardProposal(): void {
    this.result = null;
    this.status = 'proposal discarded';
  }

  private addTarget(): void {
    this.targets = [...this.targets, { name: `target ${this.targets.length + 1}`, abundance: 'medium' }];
  }

  /** Sets one end of the free-design window from its typed text. */
  private setWindow(end: 0 | 1, text: string): void {
    const next: [number, number] = [...this.windowNm];
    next[end] = Number(text);
    this.windowNm = next;
  }

  private setTarget(i: number, field: keyof TargetRow, value: string): void {
    this.targets = this.targets.map((t, k) => (k === i ? { ...t, [field]: value } : t));
  }

  private toggle<T>(set: Set<T>, id: T, on: boolean): Set<T> {
    const next = new Set(set);
    if (on) next.add(id);
    else next.delete(id);
    return next;
  }

  override render() {
    const free = !(this.candidates && this.useCandidates);
    return html`
      <fieldset>
        <legend>Targets (abundance: a number, or high / medium / low)</legend>
        ${this.targets.map(
          (t, i) =>
            html`<div class="row">
              <input
                type="text"
                aria-label="target name"
                .value=${t.name}
                @input=${(e: Event) => this.setTarget(i, 'name', (e.target as HTMLInputElement).value)}
              />
              <input
                type="text"
                aria-label="abundance"
                list="abundance-words"
                .value=${t.abundance}
                @input=${(e: Event) => this.setTarget(i, 'abundance', (e.target as HTMLInputElement).value)}
              />
              <button
                type="button"
                @click=${() => (this.targets = this.targets.filter((_, k) => k !== i))}
                ?disabled=${this.targets.length <= 1}
              >
                Remove
              </button>
            </div>`,
        )}
        <datalist id="abundance-words">${WORDS.map((w) => html`<option value=${w}></option>`)}</datalist>
        <button type="button" @click=${this.addTarget} ?disabled=${this.targets.length >= LIMITS.probes}>
          Add target
        </button>
      </fieldset>
      <label
        >${FORM_WORDS.excitation}
        <input
          type="text"
          aria-label="excitation lines"
          .value=${this.excitationText}
          @input=${(e: Event) => (this.excitationText = (e.target as HTMLInputElement).value)}
      /></label>
      ${this.candidates ? checkbox(this.useCandidates, CANDIDATES_ONLY, (on) => (this.useCandidates = on)) : ''}
      <fieldset ?disabled=${!free}>
        <legend>Free design</legend>
        ${EXCLUSION_WORDS.map((word) =>
          checkbox(
            this.exclude.has(word),
            `${word}-free`,
            (on) => (this.exclude = this.toggle(this.exclude, word, on)),
          ),
        )}
        <div>
          ${FORM_WORDS.materials}:
          ${MATERIALS.map((m) =>
            checkbox(this.allowed.has(m.id), m.name, (on) => (this.allowed = this.toggle(this.allowed, m.id, on))),
          )}
        </div>
        <label
          >${FORM_WORDS.window}
          <input
            type="number"
            aria-label="window start"
            .value=${String(this.windowNm[0])}
            @change=${(e: Event) => this.setWindow(0, (e.target as HTMLInputElement).value)} />
          –
          <input
            type="number"
            aria-label="window end"
            .value=${String(this.windowNm[1])}
            @change=${(e: Event) => this.setWindow(1, (e.target as HTMLInputElement).value)}
        /></label>
      </fieldset>
      <fieldset>
        <legend>Checks every proposal must pass (empty: the default shown)</legend>
        ${CHECKS.map(
          ([key, label, unit]) =>
            html`<qdp-number-field
              .label=${label}
              unit=${unit}
              optional
              placeholder=${String(PRACTICE_DEFAULTS[key])}
              .value=${this.checks[key]}
              @value-change=${(e: CustomEvent<{ value: number | undefined }>) => {
                const { [key]: _old, ...rest } = this.checks;
                this.checks = e.detail.value === undefined ? rest : { ...rest, [key]: e.detail.value };
              }}
            ></qdp-number-field>`,
        )}
      </fieldset>
      <div class="row">
        <button type="button" @click=${() => this.propose()} ?disabled=${this.running}>Propose</button>
        <button type="button" @click=${() => this.stop()} ?disabled=${!this.running}>Stop and keep best</button>
        <button type="button" @click=${() => this.cancel()} ?disabled=${!this.running}>Cancel</button>
        <output aria-live="polite" class="progress"
          >${this.status}${this.progress && this.running ? progressText(this.progress) : ''}</output
        >
      </div>
      ${this.error ? html`<p class="error" role="alert">${this.error}</p>` : ''}
      ${
        this.result
          ? html`<qdp-proposal-summary
              .result=${this.result}
              @proposal-load=${this.loadProposal}
              @proposal-discard=${this.discardProposal}
            ></qdp-proposal-summary>`
          : ''
      }
      <p>
        Proposals can include cadmium-, lead- or arsenic-containing dots unless excluded: read the material notes.
        Handle nanoparticles and excitation lasers as your local regulations, institutional safety rules and licensed
        practice require.
      </p>
    `;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'qdp-design-form': DesignForm;
  }
}
