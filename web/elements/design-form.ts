/**
 * <qdp-design-form>: asks for targets (with abundances), excitation lines, material limits and a window, runs the
 * design search in a Web Worker (progress, stop, cancel) and shows the proposal beside the panel being edited
 * (<qdp-proposal-summary>), leaving the panel alone. Only "Load this proposal" fires a bubbling, composed
 * `panel-proposed` event with {panel, evaluation, objective, exact, stats}, on which the app loads the proposal as an
 * editable panel; "Discard" drops it, and a new search replaces it. With `candidates` set it can search only those
 * (catalog mode, exact). Each target can be locked to one of the user's probes and/or channels (`owned`, or the
 * candidates in catalog mode), and on a microscope (`microscope`) free mode can choose among its channels instead of
 * stock bandpass sizes. What it holds is checked with the API's schema as it is typed (and on Propose), and a refusal
 * is shown beside the field it is about. The inputs are kept in this browser (design-draft.ts), so a reload finds
 * them again, refused values with their messages. After a search the focus moves to the answer, or to the refused
 * field.
 */
import { LitElement, css, html, type PropertyValues } from 'lit';
import { customElement, property, query, state } from 'lit/decorators.js';
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
  type MeasuredReferenceSpec,
  type SearchProgress,
} from '../../spectra/index';
import type { DesignRequest as DesignRequestBody } from '../../worker/schemas';
import {
  CHECK_WORDS,
  designErrorText,
  formSpot,
  FORM_WORDS,
  sameSpot,
  spotText,
  type CheckKey,
  type FormSpot,
} from '../state/design-error';
import { loadDraft, saveDraft, type DesignDraft, type TargetRow } from '../state/design-draft';
import { designRequest, type DesignParts } from '../state/design-request';
import type { DesignWorkerMessage } from '../state/design-worker';
import type { FieldError } from '../state/error-map';
import type { AttachedInstrument } from '../state/instrument';
import { loadChecks } from '../state/load-checks';
import { percent, type ProposalSummary } from './proposal-summary';
import './number-field';
import './target-lock';

/** The abundance words a target may take instead of a number (high, medium, low). */
const WORDS = Object.keys(ABUNDANCE_WORDS) as (keyof typeof ABUNDANCE_WORDS)[];

/** An abundance as typed: a word passes as is, anything else as a number (the API's schema names a bad one). */
function abundanceInput(text: string): AbundanceInput {
  const word = text.trim().toLowerCase();
  return WORDS.find((w) => w === word) ?? Number(word);
}

/**
 * "405, 488" → excitation lines; empty → undefined (the microscope's lines are then used; without one the schema
 * refuses it in its words). Throws a sentence when a value is not a number.
 */
function excitationLines(text: string): { wavelengthNm: number }[] | undefined {
  const parts = text.split(/[\s,;]+/).filter(Boolean);
  if (parts.length === 0) return undefined;
  if (parts.some((p) => !Number.isFinite(Number(p)))) throw new Error('must be numbers in nm, e.g. 405, 488');
  return parts.map((p) => ({ wavelengthNm: Number(p) }));
}

/**
 * How far the search has got, after its status word: partial designs examined or refinement steps, and the best
 * value so far.
 */
function progressText(progress: SearchProgress): string {
  const steps = progress.stage === 'refine' ? 'refinement steps' : 'partial designs examined';
  const best =
    progress.incumbent === null
      ? ''
      : progress.measure === 'signalToNoise'
        ? ` · weakest target's signal-to-noise so far ${progress.incumbent.toPrecision(3)}`
        : ` · worst interference so far ${percent(progress.incumbent)}`;
  return ` · ${progress.nodesVisited.toLocaleString('en')} ${steps}${best}`;
}

/**
 * A labelled checkbox that reports its new state; the trailing space keeps a row of them apart. `spot` names the
 * place in the form whose refusal moves the focus to it.
 */
function checkbox(checked: boolean, label: string, set: (on: boolean) => void, spot?: string) {
  const changed = (e: Event) => set((e.target as HTMLInputElement).checked);
  return html`<label
    ><input type="checkbox" data-spot=${spot ?? ''} .checked=${checked} @change=${changed} /> ${label}</label
  > `;
}

/** The practice checks and verdict thresholds the form lets the user set, in order. */
const CHECK_KEYS = Object.keys(CHECK_WORDS) as CheckKey[];

const CHECKS_UNAVAILABLE = 'the request checks could not be loaded: reload the page to try again';

/** The form's inputs, kept in this browser when one of them changes. */
const DRAFT_FIELDS: readonly (keyof DesignDraft)[] = [
  'targets',
  'excitationText',
  'useCandidates',
  'useMicroscope',
  'exclude',
  'allowed',
  'windowNm',
  'checks',
];

/** What the request is built from besides the inputs: a change re-checks what the form holds. */
const CONTEXT_FIELDS = ['candidates', 'owned', 'microscope', 'sample', 'options'] as const;

/** Typing pauses this long (ms) before what the form holds is checked, so a half-typed value is not marked. */
const CHECK_DELAY_MS = 300;

/** A refusal shown beside its field: from checking what the form holds, or from the last search. */
interface Placed {
  spot: FormSpot;
  text: string;
  from: 'check' | 'search';
  /** The refused field's path in the request, to find the field within a target's row. */
  path: FieldError['path'];
}

const NO_PARTS: DesignParts = { probes: [], channels: [] };

/** The materials free design can size: those with a size law or an accepted peak range (not the custom probe). */
const MATERIALS = listMaterials().filter((m) => m.emissionRangeNm !== null);

@customElement('qdp-design-form')
export class DesignForm extends LitElement {
  /** Probes and channels to choose from (catalog mode); absent: free mode only. */
  @property({ attribute: false }) candidates?: DesignRequest['candidates'];
  /** The panel's measured reference columns: a search among the panel's own parts uses them. */
  @property({ attribute: false }) measuredReference?: MeasuredReferenceSpec;
  /** The sample's own light (the panel's scatterLevel, waterRaman): sent with every request, kept in the proposal. */
  @property({ attribute: false }) sample: Pick<DesignRequest, 'scatterLevel' | 'waterRaman'> = {};
  /** Extra search options passed with every request (e.g. a node budget). */
  @property({ attribute: false }) options: DesignOptions = {};
  /** What the user already has (the panel's probes and channels): free mode's locks choose among these. */
  @property({ attribute: false }) owned: DesignParts = NO_PARTS;
  /** The instrument profile the panel is on, if any: free mode may choose among its channels. */
  @property({ attribute: false }) microscope?: AttachedInstrument;

  // The inputs start as this browser left them (design-draft.ts), else with these defaults.
  private readonly kept = loadDraft();
  @state() private targets: TargetRow[] = this.kept.targets ?? [
    { name: 'target 1', abundance: 'high' },
    { name: 'target 2', abundance: 'low' },
  ];
  @state() private excitationText = this.kept.excitationText ?? '405';
  @state() private exclude = new Set<Exclusion>(this.kept.exclude ?? []);
  /** Materials ticked for free design: all but those unsuitable by default (illustrative, LEFT_OUT_BY_DEFAULT). */
  @state() private allowed = new Set(
    this.kept.allowed ??
      MATERIALS.filter((m) => !m.illustrative && LEFT_OUT_BY_DEFAULT[m.id] === undefined).map((m) => m.id),
  );
  /** The practice checks and verdict thresholds as typed (absent: the documented default). */
  @state() private checks: Partial<Record<CheckKey, number>> = this.kept.checks ?? {};
  @state() private windowNm: [number, number] = this.kept.windowNm ?? [DEFAULT_WINDOW_NM[0], DEFAULT_WINDOW_NM[1]];
  @state() private useCandidates = this.kept.useCandidates ?? true;
  /** Free mode chooses among the microscope's channels (when the panel is on one) instead of stock sizes. */
  @state() private useMicroscope = this.kept.useMicroscope ?? false;
  @state() private running = false;
  @state() private progress: SearchProgress | null = null;
  @state() private status = '';
  /** A failure that is about no field (the design worker could not run). */
  @state() private error = '';
  /** A refusal shown beside its field, or below the buttons when it is about no field of the form. */
  @state() private placed: Placed | null = null;
  /** The last search's proposal, shown until it is loaded, discarded or replaced by a new search. */
  @state() private result: DesignResult | null = null;
  @query('qdp-proposal-summary') private summary?: ProposalSummary;
  private worker: Worker | null = null;
  /** The request of the running search, to place its refusal and to read its answer in the user's words. */
  private sent: DesignRequestBody | null = null;
  /** Counts proposals, so a check that returns after a newer proposal or a cancel starts nothing. */
  private proposals = 0;
  /** Counts checks of what the form holds, so only the latest one places its refusal. */
  private checksRun = 0;
  private checkTimer: ReturnType<typeof setTimeout> | undefined;

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
    /* Each target: name, abundance and Remove on one line, what it must use below, a rule between targets. */
    .target-head,
    .row.target {
      display: grid;
      grid-template-columns: minmax(0, 1fr) minmax(0, 1fr) auto;
      gap: 0.2rem 0.4rem;
      align-items: center;
    }
    .target-head {
      font-size: 0.8rem;
      color: #444;
    }
    .target-head .spacer {
      visibility: hidden;
      padding: 0 0.4rem;
    }
    .row.target {
      margin: 0;
      padding: 0.35rem 0;
      border-top: 1px solid #dde;
    }
    .row.target input[type='text'] {
      width: auto;
      max-width: none;
      min-width: 0;
    }
    .row.target qdp-target-lock {
      grid-column: 1 / -1;
      padding-left: 0.8rem;
    }
    fieldset.mode label {
      display: block;
    }
    .choices label {
      white-space: nowrap;
    }
    input[type='number'] {
      width: 5.5rem;
    }
    .error {
      color: #8b1a1a;
      font-weight: 600;
    }
    .error.beside {
      margin: 0 0 0.3rem;
    }
    input[aria-invalid='true'] {
      border: 2px solid #8b1a1a;
      background: #fff4f4;
    }
    button:focus-visible,
    input:focus-visible {
      outline: 3px solid #1a56db;
    }
  `;

  override disconnectedCallback(): void {
    super.disconnectedCallback();
    clearTimeout(this.checkTimer);
    this.cancel(false);
  }

  /** Keeps the inputs in this browser when one changed, and checks what the form holds when it or the panel did. */
  protected override updated(changed: PropertyValues): void {
    super.updated(changed);
    if (DRAFT_FIELDS.some((f) => changed.has(f))) saveDraft(this.draft());
    if ([...DRAFT_FIELDS, ...CONTEXT_FIELDS].some((f) => changed.has(f))) {
      clearTimeout(this.checkTimer);
      this.checkTimer = setTimeout(() => void this.checkInputs(), CHECK_DELAY_MS);
    }
  }

  /** The inputs as the form holds them. */
  private draft(): DesignDraft {
    return {
      targets: this.targets,
      excitationText: this.excitationText,
      useCandidates: this.useCandidates,
      useMicroscope: this.useMicroscope,
      exclude: [...this.exclude],
      allowed: [...this.allowed],
      windowNm: this.windowNm,
      checks: this.checks,
    };
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
      excitation: excitationLines(this.excitationText),
      ...(catalog ? { candidates: this.candidates, measuredReference: this.measuredReference } : {}),
      owned: this.owned,
      free: { exclude: [...this.exclude], allowedMaterials: [...this.allowed], windowNm: this.windowNm },
      ...(this.onMicroscope ? { instrument: this.onMicroscope.id } : {}),
      options: { ...this.options, ...this.checks },
      sample: this.sample,
    });
  }

  /** A refusal as the form shows it: beside the field it concerns, or below the buttons in the form's words. */
  private placement(
    error: Pick<FieldError, 'message' | 'path'>,
    request: DesignRequestBody,
    from: Placed['from'],
  ): Placed {
    const spot = formSpot(error.path, request);
    const names = this.targets.map((t) => t.name);
    const text = spot.at === 'form' ? designErrorText(error, names) : spotText(error, request);
    return { spot, text, from, path: error.path };
  }

  /**
   * What the form holds as the search takes it: the request checked with the API's schema and resolved as the API
   * would (the microscope's lines and channels written in); else the refusal, placed.
   */
  private async checked(): Promise<
    { ok: true; body: DesignRequestBody; request: DesignRequest } | { ok: false; placed: Placed }
  > {
    let body: DesignRequestBody;
    try {
      body = this.request();
    } catch (err) {
      const text = `${FORM_WORDS.excitation}: ${(err as Error).message}`;
      return { ok: false, placed: { spot: { at: 'excitation' }, text, from: 'check', path: ['excitation'] } };
    }
    let resolved: ReturnType<Awaited<ReturnType<typeof loadChecks>>['designForSearch']>;
    try {
      const checks = await loadChecks();
      const problem = checks.checkDesignRequest(body);
      resolved = problem ? { ok: false, error: problem } : checks.designForSearch(body, this.onMicroscope?.spec);
    } catch {
      resolved = { ok: false, error: { code: 'network', message: CHECKS_UNAVAILABLE, path: [] } };
    }
    if (!resolved.ok) return { ok: false, placed: this.placement(resolved.error, body, 'check') };
    return { ok: true, body, request: resolved.request };
  }

  /**
   * Checks what the form holds and shows the refusal beside its field (replacing the last check's; a search's
   * refusal stays until something else is refused). Waits while the microscope the inputs choose among is not there
   * yet (after a reload its profile loads a moment later), and while a search is checked or runs.
   */
  private async checkInputs(): Promise<void> {
    if (this.running || (this.useMicroscope && !this.catalog && !this.microscope)) return;
    const ticket = ++this.checksRun;
    const r = await this.checked();
    if (ticket !== this.checksRun || this.running) return;
    if (!r.ok) this.placed = r.placed;
    else if (this.placed?.from === 'check') this.placed = null;
  }

  /**
   * Checks the request with the API's schema, resolves it as the API would (the microscope's lines and channels
   * written in), then starts the search in a fresh worker. A refusal is shown beside its field, which takes the focus.
   */
  async propose(): Promise<void> {
    this.cancel(false);
    this.error = '';
    this.placed = null;
    this.result = null;
    const ticket = ++this.proposals;
    this.checksRun++; // a check of the inputs still under way places nothing
    this.running = true;
    this.status = 'checking';
    const r = await this.checked();
    if (ticket !== this.proposals || !this.running) return; // cancelled, or a newer proposal, while checking
    if (!r.ok) {
      this.finish('');
      this.placed = { ...r.placed, from: 'search' };
      return this.focusRefused(r.placed.spot, r.placed.path);
    }
    this.sent = r.body;
    const request = r.request;
    const worker = new Worker(new URL('../state/design-worker.ts', import.meta.url), { type: 'module' });
    this.worker = worker;
    this.running = true;
    this.status = 'starting';
    worker.onmessage = (event: MessageEvent<DesignWorkerMessage>) => this.receive(event.data);
    worker.onerror = () => this.finish('', 'the design worker could not run');
    worker.postMessage({ type: 'run', request });
  }

  /** Moves the focus to the field a refusal is about (the Propose button when it is about none). */
  private async focusRefused(spot: FormSpot, path: FieldError['path']): Promise<void> {
    await this.updateComplete;
    const root = this.renderRoot;
    const pick = (selector: string) => root.querySelector<HTMLElement>(selector);
    let field: HTMLElement | null = null;
    if (spot.at === 'target') {
      const part = path[2] === 'name' || path[2] === 'abundance' ? path[2] : 'lock';
      field = pick(`[data-target="${spot.index}"][data-part="${part}"]`);
    } else if (spot.at === 'check') {
      field = pick(`qdp-number-field[data-check="${spot.key}"]`)?.shadowRoot?.querySelector('input') ?? null;
    } else if (spot.at !== 'form') {
      field = pick(`[data-spot="${spot.at}"]`);
    }
    (field ?? this.proposeButton())?.focus();
  }

  private proposeButton(): HTMLButtonElement | null {
    return this.renderRoot.querySelector<HTMLButtonElement>('button.propose');
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
      if (!this.sent) {
        this.error = designErrorText(message.error, names);
        void this.focusRefused({ at: 'form' }, []);
        return;
      }
      const placed = this.placement(message.error, this.sent, 'search');
      this.placed = placed;
      void this.focusRefused(placed.spot, placed.path);
      return;
    }
    this.result = message.result;
    this.finish('done');
    void this.updateComplete.then(() => this.summary?.focusHeading());
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
    void this.updateComplete.then(() => this.proposeButton()?.focus());
  }

  private discardProposal(): void {
    this.result = null;
    this.status = 'proposal discarded';
    void this.updateComplete.then(() => this.proposeButton()?.focus());
  }

  /** Adds a target named "target N" with the first N no other target is named by. */
  private addTarget(): void {
    const names = new Set(this.targets.map((t) => t.name.trim()));
    let n = this.targets.length + 1;
    while (names.has(`target ${n}`)) n++;
    this.targets = [...this.targets, { name: `target ${n}`, abundance: 'medium' }];
  }

  /** Removes a target; the focus goes to the row that takes its place (or Add target after the last). */
  private removeTarget(i: number): void {
    this.targets = this.targets.filter((_, k) => k !== i);
    void this.updateComplete.then(() => {
      const next = this.renderRoot.querySelector<HTMLElement>(
        `[data-target="${Math.min(i, this.targets.length - 1)}"][data-part="name"]`,
      );
      next?.focus();
    });
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

  /** 'true' when the shown refusal is about this part of target `index`'s row (its input is then marked). */
  private refused(index: number, part: 'name' | 'abundance'): 'true' | 'false' {
    const p = this.placed;
    return p?.spot.at === 'target' && p.spot.index === index && p.path[2] === part ? 'true' : 'false';
  }

  /** The refusal placed at `spot`, if the current one is. */
  private placedAt(spot: FormSpot) {
    const p = this.placed;
    if (!p || !sameSpot(p.spot, spot)) return '';
    return html`<p class="error beside" role="alert">${p.text}</p>`;
  }

  /** The microscope choice of free mode: shown when the panel is on an instrument profile. */
  private microscopeChoice() {
    const m = this.microscope;
    if (!m) return '';
    const label = `${FORM_WORDS.microscope} (${m.spec.name}) instead of stock bandpass sizes`;
    return html`<div class="microscope">
      ${checkbox(this.useMicroscope, label, (on) => (this.useMicroscope = on), 'microscope')}
      ${this.placedAt({ at: 'microscope' })}
    </div>`;
  }

  /** Catalog mode or free design, when the panel has probes and channels to pick from. */
  private modeChoice() {
    if (!this.candidates) return '';
    const radio = (catalog: boolean, label: string) =>
      html`<label
        ><input
          type="radio"
          name="mode"
          data-spot=${catalog ? 'mode' : 'free'}
          .checked=${this.useCandidates === catalog}
          @change=${() => (this.useCandidates = catalog)}
        />
        ${label}</label
      >`;
    return html`<fieldset class="mode">
      <legend>${FORM_WORDS.mode}</legend>
      ${radio(true, FORM_WORDS.modeCatalog)} ${radio(false, `${FORM_WORDS.modeFree} (free design, set below)`)}
      ${this.placedAt({ at: 'mode' })}
    </fieldset>`;
  }

  /** One target: its name, its abundance and Remove, with the probe and channel it must use below. */
  private targetRow(t: TargetRow, i: number, parts: DesignParts) {
    return html`<div class="row target" role="group" aria-label=${`target ${i + 1}`}>
        <input
          type="text"
          aria-label="target name"
          aria-invalid=${this.refused(i, 'name')}
          data-target=${i}
          data-part="name"
          .value=${t.name}
          @input=${(e: Event) => this.setTarget(i, 'name', (e.target as HTMLInputElement).value)}
        />
        <input
          type="text"
          aria-label="abundance"
          aria-invalid=${this.refused(i, 'abundance')}
          list="abundance-words"
          data-target=${i}
          data-part="abundance"
          .value=${t.abundance}
          @input=${(e: Event) => this.setTarget(i, 'abundance', (e.target as HTMLInputElement).value)}
        />
        <button type="button" @click=${() => this.removeTarget(i)} ?disabled=${this.targets.length <= 1}>Remove</button>
        <qdp-target-lock
          data-target=${i}
          data-part="lock"
          .probes=${parts.probes}
          .channels=${parts.channels}
          .lock=${t.lock}
          target=${t.name}
          @lock-change=${(e: CustomEvent<{ lock?: DesignLock }>) => this.setLock(i, e.detail.lock)}
        ></qdp-target-lock>
      </div>
      ${this.placedAt({ at: 'target', index: i })}`;
  }

  override render() {
    const free = !this.catalog;
    const parts = free ? this.owned : (this.candidates ?? NO_PARTS);
    const linesFromMicroscope = !!this.onMicroscope;
    const formRefusal = this.placed?.spot.at === 'form' ? this.placed.text : '';
    return html`
      <fieldset class="targets">
        <legend>Targets</legend>
        <div class="target-head" aria-hidden="true">
          <span>${FORM_WORDS.target}</span><span>${FORM_WORDS.abundance}: high, medium, low or a number</span
          ><span class="spacer">Remove</span>
        </div>
        ${this.targets.map((t, i) => this.targetRow(t, i, parts))}
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
          aria-invalid=${this.placed?.spot.at === 'excitation' ? 'true' : 'false'}
          data-spot="excitation"
          placeholder=${linesFromMicroscope ? "the microscope's lines" : ''}
          .value=${this.excitationText}
          @input=${(e: Event) => (this.excitationText = (e.target as HTMLInputElement).value)}
      /></label>
      ${this.placedAt({ at: 'excitation' })} ${this.modeChoice()}
      <fieldset ?disabled=${!free}>
        <legend>Free design${free ? '' : ` (off: the search proposes ${FORM_WORDS.modeCatalog})`}</legend>
        ${this.microscopeChoice()}
        <div class="choices">
          ${EXCLUSION_WORDS.map((word, k) =>
            checkbox(
              this.exclude.has(word),
              `${word}-free`,
              (on) => (this.exclude = this.toggle(this.exclude, word, on)),
              k === 0 ? 'materials' : undefined,
            ),
          )}
        </div>
        <div class="choices">
          ${FORM_WORDS.materials}:
          ${MATERIALS.map((m) =>
            checkbox(this.allowed.has(m.id), m.name, (on) => (this.allowed = this.toggle(this.allowed, m.id, on))),
          )}
        </div>
        ${this.placedAt({ at: 'materials' })}
        <label
          >${FORM_WORDS.window}
          <input
            type="number"
            aria-label="window start"
            aria-invalid=${this.placed?.spot.at === 'window' ? 'true' : 'false'}
            data-spot="window"
            .value=${String(this.windowNm[0])}
            @change=${(e: Event) => this.setWindow(0, (e.target as HTMLInputElement).value)} />
          –
          <input
            type="number"
            aria-label="window end"
            aria-invalid=${this.placed?.spot.at === 'window' ? 'true' : 'false'}
            .value=${String(this.windowNm[1])}
            @change=${(e: Event) => this.setWindow(1, (e.target as HTMLInputElement).value)}
        /></label>
        ${this.placedAt({ at: 'window' })}
      </fieldset>
      <fieldset>
        <legend>Checks every proposal must pass (empty: the default shown)</legend>
        ${CHECK_KEYS.map((key) => {
          const p = this.placed;
          return html`<qdp-number-field
            data-check=${key}
            .label=${CHECK_WORDS[key][0]}
            unit=${CHECK_WORDS[key][1]}
            optional
            placeholder=${String(PRACTICE_DEFAULTS[key])}
            .value=${this.checks[key]}
            .error=${p && sameSpot(p.spot, { at: 'check', key }) ? p.text : ''}
            @value-change=${(e: CustomEvent<{ value: number | undefined }>) => {
              const { [key]: _old, ...rest } = this.checks;
              this.checks = e.detail.value === undefined ? rest : { ...rest, [key]: e.detail.value };
            }}
          ></qdp-number-field>`;
        })}
      </fieldset>
      <div class="row">
        <button type="button" class="propose" @click=${() => this.propose()} ?disabled=${this.running}>Propose</button>
        <button type="button" @click=${() => this.stop()} ?disabled=${!this.running}>Stop and keep best</button>
        <button type="button" @click=${() => this.cancel()} ?disabled=${!this.running}>Cancel</button>
        <output aria-live="polite" class="progress"
          >${this.status}${this.progress && this.running ? progressText(this.progress) : ''}</output
        >
      </div>
      ${formRefusal ? html`<p class="error" role="alert">${formRefusal}</p>` : ''}
      ${this.error ? html`<p class="error" role="alert">${this.error}</p>` : ''}
      ${
        this.result
          ? html`<qdp-proposal-summary
              .result=${this.result}
              .request=${this.sent ?? undefined}
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
