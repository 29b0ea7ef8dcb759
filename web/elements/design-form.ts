/**
 * <qdp-design-form>: asks for targets (with abundances), excitation lines, material limits and a window, runs the
 * design search in a Web Worker (progress, stop, cancel) and shows the proposal beside the panel being edited
 * (<qdp-proposal-summary>), leaving the panel alone. Only "Load this proposal" fires a bubbling, composed
 * `panel-proposed` event with {panel, evaluation, objective, exact, stats}, on which the app loads the proposal as an
 * editable panel; "Discard" drops it, and a new search replaces it. With `candidates` set it can search only those
 * (catalog mode, exact). Each target can be locked to one of the user's probes and/or channels (`owned`, or the
 * candidates in catalog mode), and on a microscope (`microscope`) free mode can choose among its channels instead of
 * stock bandpass sizes. A refusal about a target, the lines or the microscope choice is shown beside that field.
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
  type DesignLock,
  type DesignOptions,
  type DesignRequest,
  type DesignResult,
  type Exclusion,
  type SearchProgress,
} from '../../spectra/index';
import type { DesignRequest as DesignRequestBody } from '../../worker/schemas';
import { designErrorText, formSpot, FORM_WORDS, spotText, type FormSpot } from '../state/design-error';
import { designRequest, type DesignParts } from '../state/design-request';
import type { DesignWorkerMessage } from '../state/design-worker';
import type { FieldError } from '../state/error-map';
import type { AttachedInstrument } from '../state/instrument';
import { loadChecks } from '../state/load-checks';
import { percent } from './proposal-summary';
import './target-lock';

/** The abundance words a target may take instead of a number (high, medium, low). */
const WORDS = Object.keys(ABUNDANCE_WORDS) as (keyof typeof ABUNDANCE_WORDS)[];

/** An abundance as typed: a word passes as is, anything else as a number (the API's schema names a bad one). */
function abundanceInput(text: string): AbundanceInput {
  const word = text.trim().toLowerCase();
  return WORDS.find((w) => w === word) ?? Number(word);
}

/**
 * "405, 488" → excitation lines; empty → undefined when `mayBeEmpty` (the microscope's lines are then used). Throws a
 * sentence when a value is not a number.
 */
function excitationLines(text: string, mayBeEmpty: boolean): { wavelengthNm: number }[] | undefined {
  const parts = text.split(/[\s,;]+/).filter(Boolean);
  if (parts.length === 0 && mayBeEmpty) return undefined;
  if (parts.length === 0 || parts.some((p) => !Number.isFinite(Number(p))))
    throw new Error('must be numbers in nm, e.g. 405, 488');
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

const CHECKS_UNAVAILABLE = 'the request checks could not be loaded: reload the page to try again';

interface TargetRow {
  name: string;
  abundance: string;
  lock?: DesignLock;
}

const NO_PARTS: DesignParts = { probes: [], channels: [] };

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
  /** What the user already has (the panel's probes and channels): free mode's locks choose among these. */
  @property({ attribute: false }) owned: DesignParts = NO_PARTS;
  /** The instrument profile the panel is on, if any: free mode may choose among its channels. */
  @property({ attribute: false }) microscope?: AttachedInstrument;

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
  /** Free mode chooses among the microscope's channels (when the panel is on one) instead of stock sizes. */
  @state() private useMicroscope = false;
  @state() private running = false;
  @state() private progress: SearchProgress | null = null;
  @state() private status = '';
  @state() private error = '';
  /** A refusal shown beside its field (a target's row, the lines, the microscope choice). */
  @state() private placed: { spot: FormSpot; text: string } | null = null;
  /** The last search's proposal, shown until it is loaded, discarded or replaced by a new search. */
  @state() private result: DesignResult | null = null;
  private worker: Worker | null = null;
  /** The request of the running search, to place its refusal. */
  private sent: DesignRequestBody | null = null;
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
    .error.beside {
      margin: 0 0 0.3rem;
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

  /** True when the search is over the candidates (catalog mode). */
  private get catalog(): boolean {
    return !!(this.candidates && this.useCandidates);
  }

  /** The microscope free mode chooses among, when the user asked for it. */
  private get onMicroscope(): AttachedInstrument | undefined {
    return !this.catalog && this.useMicroscope ? this.microscope : undefined;
  }

  private request(): DesignRequestBody {
    const catalog = this.catalog;
    return designRequest({
      targets: this.targets.map((t) => ({ name: t.name, abundance: abundanceInput(t.abundance), lock: t.lock })),
      excitation: excitationLines(this.excitationText, !!this.onMicroscope),
      ...(catalog ? { candidates: this.candidates } : {}),
      owned: this.owned,
      free: { exclude: [...this.exclude], allowedMaterials: [...this.allowed], windowNm: this.windowNm },
      ...(this.onMicroscope ? { instrument: this.onMicroscope.id } : {}),
      options: { ...this.options, ...this.checks },
      sample: this.sample,
    });
  }

  /** Shows a refusal beside the field it concerns, or below the buttons in `general` words. */
  private refuse(error: Pick<FieldError, 'message' | 'path'>, request: DesignRequestBody, general: string): void {
    const spot = formSpot(error.path, request);
    if (spot.at === 'form') this.error = general;
    else this.placed = { spot, text: spotText(error, request) };
  }

  /**
   * Checks the request with the API's schema, resolves it as the API would (the microscope's lines and channels
   * written in), then starts the search in a fresh worker.
   */
  async propose(): Promise<void> {
    this.cancel(false);
    this.error = '';
    this.placed = null;
    this.result = null;
    let body: DesignRequestBody;
    try {
      body = this.request();
    } catch (err) {
      this.placed = { spot: { at: 'excitation' }, text: `${FORM_WORDS.excitation}: ${(err as Error).message}` };
      return;
    }
    const ticket = ++this.proposals;
    this.running = true;
    this.status = 'checking';
    let resolved: ReturnType<Awaited<ReturnType<typeof loadChecks>>['designForSearch']>;
    try {
      const checks = await loadChecks();
      const problem = checks.checkDesignRequest(body);
      resolved = problem ? { ok: false, error: problem } : checks.designForSearch(body, this.onMicroscope?.spec);
    } catch {
      resolved = { ok: false, error: { code: 'network', message: CHECKS_UNAVAILABLE, path: [] } };
    }
    if (ticket !== this.proposals || !this.running) return; // cancelled, or a newer proposal, while checking
    if (!resolved.ok) {
      this.finish('');
      return this.refuse(resolved.error, body, resolved.error.message);
    }
    this.sent = body;
    const request = resolved.request;
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
      this.finish('failed');
      if (this.sent) this.refuse(message.error, this.sent, designErrorText(message.error, names));
      else this.error = designErrorText(message.error, names);
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

  private setTarget(i: number, field: 'name' | 'abundance', value: string): void {
    this.targets = this.targets.map((t, k) => (k === i ? { ...t, [field]: value } : t));
  }

  private setLock(i: number, lock: DesignLock | undefined): void {
    this.targets = this.targets.map((t, k) => {
      if (k !== i) return t;
      const { lock: _old, ...rest } = t;
      return lock ? { ...rest, lock } : rest;
    });
  }

  private toggle<T>(set: Set<T>, id: T, on: boolean): Set<T> {
    const next = new Set(set);
    if (on) next.add(id);
    else next.delete(id);
    return next;
  }

  /** A refusal placed at `spot`, if the current one is. */
  private placedAt(spot: FormSpot) {
    const p = this.placed;
    if (!p || p.spot.at !== spot.at || (p.spot.at === 'target' && spot.at === 'target' && p.spot.index !== spot.index))
      return '';
    return html`<p class="error beside" role="alert">${p.text}</p>`;
  }

  /** The microscope choice of free mode: shown when the panel is on an instrument profile. */
  private microscopeChoice() {
    const m = this.microscope;
    if (!m) return '';
    const label = `${FORM_WORDS.microscope} (${m.spec.name}) instead of stock bandpass sizes`;
    return html`<div class="microscope">
      ${checkbox(this.useMicroscope, label, (on) => (this.useMicroscope = on))} ${this.placedAt({ at: 'microscope' })}
    </div>`;
  }

  override render() {
    const free = !this.catalog;
    const parts = free ? this.owned : (this.candidates ?? NO_PARTS);
    const linesFromMicroscope = !!this.onMicroscope;
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
                <qdp-target-lock
                  .probes=${parts.probes}
                  .channels=${parts.channels}
                  .lock=${t.lock}
                  target=${t.name}
                  @lock-change=${(e: CustomEvent<{ lock?: DesignLock }>) => this.setLock(i, e.detail.lock)}
                ></qdp-target-lock>
              </div>
              ${this.placedAt({ at: 'target', index: i })}`,
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
          placeholder=${linesFromMicroscope ? "the microscope's lines" : ''}
          .value=${this.excitationText}
          @input=${(e: Event) => (this.excitationText = (e.target as HTMLInputElement).value)}
      /></label>
      ${this.placedAt({ at: 'excitation' })}
      ${this.candidates ? checkbox(this.useCandidates, CANDIDATES_ONLY, (on) => (this.useCandidates = on)) : ''}
      <fieldset ?disabled=${!free}>
        <legend>Free design</legend>
        ${this.microscopeChoice()}
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
