/**
 * <qdp-panel-app>: the whole page. Holds the panel, checks it with the API's schema and recomputes it locally on every
 * edit (keeping the last good result when an edit is invalid), keeps the state in the URL fragment, opens shared
 * panels from /p/<id>, and starts panels on instrument profiles from /i/<id>. Undo and Redo (buttons, Ctrl+Z and
 * Ctrl+Shift+Z, or Cmd on a Mac) step through the panel's own history; inside a text box the keys are left to the
 * browser, which undoes the typing in that box (and the panel follows the text), so they never take two steps at once.
 */
import { LitElement, html } from 'lit';
import { customElement, query, state } from 'lit/decorators.js';
import {
  resolveOnInstrument,
  SpectraError,
  type ChannelSpec,
  type ControlsMeasurement,
  type MeasuredReferenceSpec,
  type PanelSpec,
  type ProbeSpec,
} from '../../spectra/index';
import { appStyles } from './panel-app-styles';
import type { EdgeDragDetail } from '../chart/types';
import { computePanel, DETECTORS, MATERIALS, withLotShift, type Computed } from '../state/compute';
import { demoPanel } from '../state/demo-panel';
import type { ImageReference } from '../state/image-reference';
import { placeError, type FieldError } from '../state/error-map';
import { inUserWords } from '../state/user-words';
import { isPanelExclusion, offendingProbes, withExclusions, type PanelExclusion } from '../state/exclusions';
import { designParts } from '../state/design-request';
import {
  decodeFragment,
  draftFragment,
  draftIdOf,
  DRAFT_NOT_HERE,
  encodeFragment,
  KEPT_IN_BROWSER,
  MAX_LINK_CHARS,
  type ViewOptions,
} from '../state/fragment';
import { checksIfLoaded, loadChecks } from '../state/load-checks';
import { fileTooLarge, MAX_STATE_BYTES } from '../state/state-size';
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
import { UPDATE_PAUSE_MS, waitsForPause } from '../state/edit-pace';
import { editKey, emptyHistory, recordEdit, redo, STEP_MS, undo } from '../state/undo-history';
import {
  instrumentChanges,
  switchInstrument,
  toRequest,
  type AttachedInstrument,
  type InstrumentChanges,
} from '../state/instrument';
import {
  Autosaver,
  newSavedId,
  openSavedPanels,
  readLastSavedId,
  savedEntry,
  writeLastSavedId,
  type SavedPanel,
} from '../state/saved-panels';
import './channel-list';
import './crosstalk-table';
import './height-toggle';
import { loadLaterParts } from './later-parts';
import './instrument-picker';
import './key-verdict';
import './light-editor';
import './material-notes';
import './my-panels';
import type { MyPanels } from './my-panels';
import type { PanelReport } from './panel-report';
import './probe-list';
import './spectrum-chart';
import type { SpectrumChart } from './spectrum-chart';

/** Where the page keeps the last state (its fragment) in this browser, for a reload of the bare address. */
const LAST_STATE_KEY = 'qdpanel.lastState';

/** The last state's fragment, or '' when there is none or storage is off. */
function readLastState(): string {
  try {
    return localStorage.getItem(LAST_STATE_KEY) ?? '';
  } catch {
    return '';
  }
}

function writeLastState(fragment: string): void {
  try {
    localStorage.setItem(LAST_STATE_KEY, fragment);
  } catch {
    // Storage off or full: the address still holds the state.
  }
}

/** Pushes or replaces the history entry; a state the browser will not keep in it is left to My panels. */
function writeHistory(push: boolean, state: { savedId: string; page?: unknown }, url: string): void {
  const write = (s: unknown) => (push ? history.pushState(s, '', url) : history.replaceState(s, '', url));
  try {
    write(state);
  } catch {
    write({ savedId: state.savedId });
  }
}

/** What one undo step brings back: the panel, the excluded materials and the instrument profile it is on. */
interface Snapshot {
  panel: PanelSpec;
  exclude: PanelExclusion[];
  instrument?: AttachedInstrument;
  /** The entry in My panels the panel is saved as. */
  savedId: string;
}

/** Input kinds that undo their own typing (a checkbox, a button or a menu does not). */
const TEXT_INPUTS = new Set(['text', 'search', 'url', 'tel', 'email', 'password', 'number']);

/** True when `target` is a text box the browser undoes by itself: the page leaves Ctrl+Z to it there. */
function undoesItsOwnTyping(target: EventTarget | undefined): boolean {
  if (!(target instanceof HTMLElement)) return false;
  if (target.isContentEditable || target instanceof HTMLTextAreaElement) return true;
  return target instanceof HTMLInputElement && TEXT_INPUTS.has(target.type);
}

/**
 * What to do first on a panel with no probe or no channel (a new panel), instead of the schema's refusal; '' when the
 * panel has both.
 */
export function firstSteps(panel: PanelSpec): string {
  const needs = [
    ...(panel.probes.length ? [] : ['a probe (the dot or dye for your first target: "Add probe" under Probes)']),
    ...(panel.channels.length
      ? []
      : ['a channel (a filter set your microscope has: "Add channel" under Detection channels)']),
  ];
  if (!needs.length) return '';
  return `To start, add ${needs.join(' and ')}: the spectra, crosstalk and noise appear once there is one of each.`;
}

/** The two views a narrow screen switches between (a wide one shows both), results first. */
const PAGE_VIEWS = [
  ['results', 'Chart and results'],
  ['edit', 'Edit the panel'],
] as const;

type PageView = (typeof PAGE_VIEWS)[number][0];

/** The excitation and sample settings in one line, for the folded section's heading. */
export function lightSummary(p: PanelSpec): string {
  const lines = p.excitation.length ? `${p.excitation.map((l) => l.wavelengthNm).join(' + ')} nm` : 'no line';
  const shared = (p.lightPath?.emissionFilters?.length ?? 0) + (p.lightPath?.excitationFilters?.length ?? 0);
  return [
    `excitation ${lines}`,
    p.background ? 'sample background on' : 'no sample background',
    ...(p.waterRaman ? ['water Raman on'] : []),
    ...(shared ? [`${shared} shared filter${shared === 1 ? '' : 's'}`] : []),
  ].join(' · ');
}

/** The pause in editing after which the lot-to-lot check is added, ms (our choice: a typing pause). */
const LOT_SHIFT_PAUSE_MS = 250;

/**
 * The reference the pilot image is unmixed with when the panel holds measured columns: the evaluation's collected
 * signal, measured columns in place (undefined otherwise: the image section uses the modelled signal and says so).
 */
function measuredImageReference(p: PanelSpec, c: Computed | undefined): ImageReference | undefined {
  const ev = c?.evaluation;
  if (!ev || !ev.referenceColumns.includes('measured')) return undefined;
  return {
    channels: p.channels.map((ch) => ch.id),
    columns: p.probes.map((probe, j) => ({ probe: probe.id, values: ev.collected.map((row) => row[j]) })),
  };
}

/** The path of a shared copy, /p/<id>. */
const SHARED_PATH = /^\/p\/([A-Za-z0-9_-]+)$/;

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
  /** What a narrow screen shows: the results (first) or the editors. */
  @state() private shownView: PageView = 'results';
  /** The instrument profile the panel is on, if any (the panel holds its parts written out). */
  @state() private instrument?: AttachedInstrument;
  /** What the last switch of instrument changed, until the next edit of the panel's set-up. */
  @state() private changes?: InstrumentChanges;
  @state() private instrumentBusy = false;
  /** The panel and instrument before the last switch, for its undo. */
  private beforeSwitch?: { panel: PanelSpec; instrument?: AttachedInstrument };
  /** Bandpass sizes dragged or typed land on the nearest stock size (kept in the fragment). */
  @state() private snapStock = false;
  /** True while the panel is too large for the address and is kept in this browser instead (a notice says so). */
  @state() private keptInBrowser = false;
  @query('qdp-spectrum-chart') private chart?: SpectrumChart;
  @query('qdp-panel-report') private report?: PanelReport;
  private lastPushMs = 0;
  /** The steps to undo and redo. */
  @state() private steps = emptyHistory<Snapshot>();
  /** The state the last step left, once the first panel is shown (before it, nothing is recorded). */
  private shown?: Snapshot;
  /** The pending lot-to-lot check (see addLotShiftLater). */
  private lotShiftTimer?: number;
  /** Controls measured on regions of the pilot image, handed to the controls section. */
  @state() private imageControls?: ControlsMeasurement;
  /** The chart's line wavelengths and the panel's lines they were read from (see excitationNm). */
  private linesNm?: { from: PanelSpec['excitation']; nm: number[] };
  /** An edit of a large panel waiting for a typing pause: its history mode and timer (see updateAfterPause). */
  @state() private pendingUpdate?: { history: 'push' | 'replace' | 'none'; timer: number };
  /** True while a panel waits for the checks to arrive before it is computed. */
  private awaitingChecks = false;
  /** The working panel's entry in My panels: a new one for each panel loaded, the entry's own for a saved panel. */
  @state() private savedId = newSavedId();
  /** The panel as loaded: it is saved once edited (or once its entry exists). */
  private loadedPanel?: PanelSpec;
  /** Entries this page has written or opened. */
  private keptIds = new Set<string>();
  private savedPanels = openSavedPanels();
  private saver = new Autosaver(this.savedPanels, (message) => (this.notice = message));
  @query('qdp-my-panels') private myPanels?: MyPanels;

  static override styles = appStyles;

  override connectedCallback(): void {
    super.connectedCallback();
    window.addEventListener('popstate', this.onPopState);
    window.addEventListener('keydown', this.onKeyDown);
    window.addEventListener('pagehide', this.onPageHide);
    this.saver.afterWrite = () => void this.myPanels?.reload();
    void this.startChecks();
    void loadLaterParts();
    const shared = SHARED_PATH.exec(location.pathname);
    const profile = /^\/i\/([A-Za-z0-9_-]+)$/.exec(location.pathname);
    if (shared) void this.openShared(shared[1]);
    else if (profile && !location.hash) void this.startOnInstrument(profile[1]);
    else void this.restoreFromFragment();
  }

  /** A folded section that must show something (a refusal, what a switch changed) opens; none closes by itself. */
  protected override updated(): void {
    for (const fold of this.renderRoot.querySelectorAll<HTMLDetailsElement>('details.fold[data-needs-open="true"]'))
      fold.open = true;
  }

  override disconnectedCallback(): void {
    window.removeEventListener('popstate', this.onPopState);
    window.removeEventListener('keydown', this.onKeyDown);
    window.removeEventListener('pagehide', this.onPageHide);
    super.disconnectedCallback();
  }

  /** Back and Forward: a shared copy's /p/<id> opens it again; a fragment elsewhere is the panel it holds. */
  private onPopState = () => {
    const shared = SHARED_PATH.exec(location.pathname);
    if (shared && !location.hash) {
      void this.openShared(shared[1]);
    } else if (location.hash && !(shared && this.sharedId)) {
      this.sharedId = '';
      void this.restoreFromFragment();
    }
  };

  /** Ctrl+Z undoes and Ctrl+Shift+Z redoes (Cmd on a Mac), except in a text box, which undoes its own typing. */
  private onKeyDown = (e: KeyboardEvent) => {
    if (!(e.ctrlKey || e.metaKey) || e.altKey || e.key.toLowerCase() !== 'z') return;
    if (undoesItsOwnTyping(e.composedPath()[0])) return;
    e.preventDefault();
    if (e.shiftKey) this.redoStep();
    else this.undoStep();
  };

  private onPageHide = () => {
    this.catchUp();
    void this.saver.flush();
  };

  private snapshot(): Snapshot {
    return { panel: this.panel, exclude: this.exclude, instrument: this.instrument, savedId: this.savedId };
  }

  /** Records the change since the last step: a burst of edits of the same fields joins one step, a load is its own. */
  private track(own: boolean): void {
    const before = this.shown;
    if (!before) return;
    const now = this.snapshot();
    if (before.panel === now.panel && before.exclude === now.exclude && before.instrument === now.instrument) return;
    const samePlace = before.exclude === now.exclude && before.instrument === now.instrument;
    const key = own || !samePlace ? undefined : editKey(before.panel, now.panel);
    this.steps = recordEdit(this.steps, before, { key, atMs: Date.now() });
    this.shown = now;
  }

  /** The first panel is shown: steps are recorded from here on. */
  private settle(): void {
    this.shown ??= this.snapshot();
  }

  private undoStep(): void {
    const r = this.sharedId ? undefined : undo(this.steps, this.snapshot());
    if (!r) return;
    this.steps = r.history;
    this.restore(r.state);
  }

  private redoStep(): void {
    const r = this.sharedId ? undefined : redo(this.steps, this.snapshot());
    if (!r) return;
    this.steps = r.history;
    this.restore(r.state);
  }

  /** Shows a state from the undo history; the address and this browser's last state follow without a Back step. */
  private restore(s: Snapshot): void {
    this.catchUp();
    this.shown = s;
    this.savedId = s.savedId;
    this.instrument = s.instrument;
    this.exclude = s.exclude;
    this.changes = undefined;
    this.beforeSwitch = undefined;
    this.panel = s.panel;
    this.refresh();
    this.writeFragment('replace');
  }

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
      // A bare address opens the last state of this browser, so a reload never loses the work.
      const last = location.hash ? '' : readLastState();
      const raw = await this.addressState(location.hash || last, !!location.hash);
      if (raw === null) return this.loadFirst(demoPanel());
      if (last) {
        this.notice = 'Your last panel in this browser is back. "New panel" or "Open the demo panel" starts afresh.';
      }
      const { readPageState } = await loadChecks();
      const r = readPageState(raw);
      if (!r.ok) throw new Error(`The link's panel is not valid (${r.message}).`);
      this.snapStock = r.state.view.snapStock ?? false;
      // The same working panel keeps its entry in My panels.
      const savedId =
        draftIdOf(location.hash || last) ??
        (location.hash ? (history.state as { savedId?: string } | null)?.savedId : readLastSavedId());
      const entry = savedId ? await this.savedPanels.get(savedId) : undefined;
      this.load(r.state.panel, r.state.view.exclude, false, savedId || undefined);
      this.keptInBrowser = draftIdOf(location.hash || last) !== undefined;
      if (entry) this.keptIds.add(entry.id);
      if (r.state.view.instrument) await this.reattach(r.state.view.instrument);
    } catch (e) {
      this.notice = `${e instanceof Error ? e.message : String(e)} The demo panel is shown instead.`;
      this.load(demoPanel(), []);
    }
    this.settle();
  }

  /**
   * The raw state a fragment holds: a link's, or, for a panel too large for the address, the copy in this page's
   * history entry (`inHistory`: the fragment is the address's) or in My panels. Null for an empty fragment.
   */
  private async addressState(fragment: string, inHistory: boolean): Promise<unknown> {
    const draftId = draftIdOf(fragment);
    if (draftId === undefined) return decodeFragment(fragment);
    const page = inHistory ? (history.state as { page?: unknown } | null)?.page : undefined;
    if (page) return page;
    const entry = await this.savedPanels.get(draftId);
    if (!entry) throw new Error(DRAFT_NOT_HERE);
    const view = { exclude: entry.exclude, ...(entry.instrument ? { instrument: entry.instrument } : {}) };
    return { panel: entry.panel, view };
  }

  private async openShared(id: string): Promise<void> {
    this.sharedId = id;
    this.notice = 'Loading the shared panel…';
    try {
      const { loadSharedPanelPatiently, SHARED_NOT_YET } = await import('../io/shared-retry');
      const raw = await loadSharedPanelPatiently(id, { onWait: () => (this.notice = SHARED_NOT_YET) });
      const { panel, instrument } = await this.readRequest(raw);
      this.notice = '';
      this.instrument = instrument;
      this.load(panel, [], false);
    } catch (e) {
      this.notice = `This shared panel could not be opened: ${e instanceof Error ? e.message : String(e)}`;
    }
    this.settle();
  }

  /** A profile by id, checked with the API's schema; throws an Error with the reason. */
  private async fetchInstrument(id: string): Promise<AttachedInstrument> {
    const [{ readInstrument }, raw] = await Promise.all([
      loadChecks(),
      import('../io/api').then((api) => api.loadInstrument(id)),
    ]);
    const r = readInstrument(raw);
    if (!r.ok) throw new Error(`the instrument profile is not valid (${r.error.message})`);
    return { id, spec: r.spec };
  }

  /**
   * A panel from untrusted JSON (a shared panel, a file): written out, or naming a profile, which is loaded and whose
   * parts are written out. Throws an Error with the API's words.
   */
  private async readRequest(raw: unknown): Promise<{ panel: PanelSpec; instrument?: AttachedInstrument }> {
    const { readPanelRequest, readPanel } = await loadChecks();
    const r = readPanelRequest(raw);
    if (!r.ok) throw new Error(r.message);
    const instrument = r.request.instrument ? await this.fetchInstrument(r.request.instrument) : undefined;
    const written = readPanel(resolveOnInstrument(r.request, instrument?.spec));
    if (!written.ok) throw new Error(written.message);
    return { panel: written.panel, instrument };
  }

  /** /i/<id>: a new panel on the profile (its lines, shared path and channels; no probes yet). */
  private async startOnInstrument(id: string): Promise<void> {
    this.notice = 'Loading the instrument profile…';
    try {
      const instrument = await this.fetchInstrument(id);
      this.instrument = instrument;
      this.notice =
        `New panel on the instrument “${instrument.spec.name}”: its lines, shared light path and channels are set; ` +
        'add your probes.';
      history.replaceState(null, '', '/');
      this.load({ ...switchInstrument(newPanel(), instrument.spec), title: `Panel on ${instrument.spec.name}` }, []);
    } catch (e) {
      this.notice = `This instrument profile could not be opened: ${e instanceof Error ? e.message : String(e)}`;
      this.load(newPanel(), []);
    }
    this.settle();
  }

  /** After a reload: ties the restored panel to its profile again (the panel already holds the parts). */
  private async reattach(id: string): Promise<void> {
    try {
      this.instrument = await this.fetchInstrument(id);
      if (this.shown) this.shown = { ...this.shown, instrument: this.instrument };
      this.refresh();
    } catch (e) {
      this.notice =
        `The instrument profile of this panel could not be loaded (${e instanceof Error ? e.message : String(e)}); ` +
        'the panel is shown with its parts written out.';
    }
  }

  /** Moves the panel onto another profile, keeping what it was for an undo and showing what changed. */
  private async switchTo(id: string): Promise<void> {
    this.instrumentBusy = true;
    try {
      const next = await this.fetchInstrument(id);
      const before = this.computed && !this.error ? this.computed.evaluation : undefined;
      const from = this.instrument?.spec.name ?? 'the panel’s own set-up';
      this.beforeSwitch = { panel: this.panel, instrument: this.instrument };
      const oldPanel = this.panel;
      this.instrument = next;
      this.apply(switchInstrument(this.panel, next.spec));
      this.changes =
        before && this.computed && !this.error
          ? instrumentChanges(
              { name: from, panel: oldPanel, evaluation: before },
              { name: next.spec.name, panel: this.panel, evaluation: this.computed.evaluation },
            )
          : undefined;
      this.notice = '';
    } catch (e) {
      this.notice = `The instrument could not be used: ${e instanceof Error ? e.message : String(e)}`;
    } finally {
      this.instrumentBusy = false;
    }
  }

  private undoSwitch(): void {
    const back = this.beforeSwitch;
    if (!back) return;
    this.instrument = back.instrument;
    this.beforeSwitch = undefined;
    this.changes = undefined;
    this.apply(back.panel);
  }

  /** Replaces the whole panel by one with its own set-up (no instrument profile). */
  private loadOwn(panel: PanelSpec): void {
    this.instrument = undefined;
    this.changes = undefined;
    this.load(panel, []);
  }

  /**
   * Replaces the panel by a loaded design proposal (or a panel from My panels, as its entry `savedId`), always as a
   * new history step so that Back returns to the panel
   * before it (even one edited a moment ago, or a shared copy at /p/<id>, which the proposal leaves for /). The
   * proposal has its own set-up, with any shared filters already in its channels, so it is on no instrument profile.
   */
  private loadProposal(panel: PanelSpec, exclude = this.exclude, savedId?: string): void {
    this.sharedId = '';
    this.lastPushMs = 0;
    this.instrument = undefined;
    this.changes = undefined;
    this.load(panel, exclude, true, savedId);
  }

  /**
   * Replaces the whole panel (new, demo, import, shared) and recomputes: one undo step of its own, saved in My panels
   * as `savedId` (by default a new entry) once edited.
   */
  private load(panel: PanelSpec, exclude: PanelExclusion[], writeUrl = true, savedId = newSavedId()): void {
    this.computed = undefined;
    this.savedId = savedId;
    // A panel that states its exclusions (a shared or saved one) brings them; else the view's are kept.
    this.exclude = panel.exclude ? panel.exclude.filter(isPanelExclusion) : exclude;
    this.loadedPanel = withExclusions(panel, this.exclude);
    this.apply(this.loadedPanel, writeUrl ? 'push' : 'none', true);
  }

  /** A panel from My panels, through the same checks as a link: one undoable step, then edited as that entry. */
  private async openSaved(entry: SavedPanel): Promise<void> {
    const { readPageState } = await loadChecks();
    const r = readPageState({ panel: entry.panel, view: { exclude: entry.exclude, instrument: entry.instrument } });
    if (!r.ok) {
      this.notice = `“${entry.name}” could not be opened: ${r.message}`;
      return;
    }
    this.keptIds.add(entry.id);
    this.loadProposal(r.state.panel, r.state.view.exclude, entry.id);
    if (r.state.view.instrument) await this.reattach(r.state.view.instrument);
  }

  /** Saves the working panel in My panels (after a pause in the edits) once it is edited or already kept. */
  private autosave(): void {
    writeLastSavedId(this.savedId);
    if (this.panel === this.loadedPanel && !this.keptIds.has(this.savedId)) return;
    this.keptIds.add(this.savedId);
    const state = { panel: this.panel, exclude: this.exclude, instrument: this.instrument?.id };
    this.saver.schedule(savedEntry(this.savedId, state, new Date()));
  }

  /** The first panel of a visit, when the address holds none: the history of steps starts on it. */
  private loadFirst(panel: PanelSpec): void {
    this.load(panel, []);
    this.settle();
  }

  /**
   * Sets the panel, checks and recomputes it, records the change as an undo step (`own`: never joined with the edits
   * before it) and records it in the fragment.
   */
  private apply(panel: PanelSpec, history: 'push' | 'replace' | 'none' = 'push', own = false): void {
    this.panel = panel;
    this.track(own);
    if (!own && waitsForPause(panel)) {
      this.updateAfterPause(history);
      return;
    }
    this.dropPendingUpdate();
    this.refresh();
    if (history !== 'none' && !this.sharedId) this.writeFragment(history, own);
  }

  /**
   * An edit of a large panel: the field shows the keystroke at once, and the check, the figures and the address
   * catch up after a pause in the typing (UPDATE_PAUSE_MS), once for the whole burst.
   */
  private updateAfterPause(history: 'push' | 'replace' | 'none'): void {
    const mode = this.pendingUpdate?.history === 'push' ? 'push' : history;
    clearTimeout(this.pendingUpdate?.timer);
    this.pendingUpdate = { history: mode, timer: window.setTimeout(() => this.catchUp(), UPDATE_PAUSE_MS) };
  }

  /** Does a waiting update now (after the pause, or before the page is left or a step is undone). */
  private catchUp(): void {
    const pending = this.pendingUpdate;
    if (!pending) return;
    this.dropPendingUpdate();
    this.refresh();
    if (pending.history !== 'none' && !this.sharedId) this.writeFragment(pending.history);
  }

  private dropPendingUpdate(): void {
    clearTimeout(this.pendingUpdate?.timer);
    this.pendingUpdate = undefined;
  }

  /**
   * Checks the panel with the API's schema and computes it only when the API would take it: an invalid edit shows the
   * API's message under its field and keeps the last good numbers; a model's refusal comes from computing.
   */
  private refresh(): void {
    const checks = checksIfLoaded();
    this.awaitingChecks = !checks;
    if (!checks) return;
    const problem = checks.checkPanel(this.panel) ?? this.instrumentProblem();
    if (problem) {
      this.error = { ...problem, message: inUserWords(problem, this.panel) };
      return;
    }
    const r = computePanel(this.panel, { byBrightness: this.byBrightness, sensitivity: false }, this.computed);
    if (r.ok) {
      this.computed = r.value;
      this.error = undefined;
      this.addLotShiftLater();
    } else {
      this.error = { ...r.error, message: inUserWords(r.error, this.panel) };
    }
  }

  /**
   * Adds the lot-to-lot check (about as costly as the rest of the evaluation) once the edits pause, so typing and
   * dragging redraw the chart and the tables without it; a later edit cancels the pending check.
   */
  private addLotShiftLater(): void {
    clearTimeout(this.lotShiftTimer);
    const panel = this.panel;
    this.lotShiftTimer = window.setTimeout(() => {
      if (this.panel !== panel || !this.computed?.crosstalk.lotShiftPending) return;
      this.computed = withLotShift(this.computed, panel);
    }, LOT_SHIFT_PAUSE_MS);
  }

  /** What the API would refuse in the panel as a request naming its profile (a line the instrument lacks). */
  private instrumentProblem(): FieldError | undefined {
    if (!this.instrument) return undefined;
    try {
      resolveOnInstrument(toRequest(this.panel, this.instrument), this.instrument.spec);
      return undefined;
    } catch (e) {
      if (e instanceof SpectraError) return { code: e.code, message: e.message, path: e.path };
      throw e;
    }
  }

  /**
   * Writes the state into the address and this browser. A push within STEP_MS of the last joins its entry, except a
   * loaded panel (`own`), which always gets an entry of its own, as does the edit after it: Back shows every state. A
   * state too long for the address (MAX_LINK_CHARS) is kept whole in the history entry and My panels instead.
   */
  private writeFragment(mode: 'push' | 'replace', own = false): void {
    // A shared copy's /p/<id> opens the stored panel whatever the fragment: an edited panel lives at /.
    const path = SHARED_PATH.test(location.pathname) ? '/' : location.pathname;
    const page = { panel: this.panel, view: this.view() };
    const link = encodeFragment(page);
    this.keptInBrowser = link.length > MAX_LINK_CHARS;
    const fragment = this.keptInBrowser ? draftFragment(this.savedId) : link;
    writeLastState(fragment);
    if (this.keptInBrowser) this.keptIds.add(this.savedId);
    this.autosave();
    // The address does not hold a kept panel: its copy in My panels is written at once, not after a pause.
    if (this.keptInBrowser) void this.saver.flush();
    const now = Date.now();
    const push = mode === 'push' && (own || now - this.lastPushMs > STEP_MS);
    writeHistory(push, { savedId: this.savedId, ...(this.keptInBrowser ? { page } : {}) }, `${path}#${fragment}`);
    this.lastPushMs = own ? 0 : now;
  }

  /** The view options the fragment keeps besides the panel. */
  private view(): ViewOptions {
    return {
      exclude: this.exclude,
      ...(this.instrument ? { instrument: this.instrument.id } : {}),
      ...(this.snapStock ? { snapStock: true } : {}),
    };
  }

  private duplicate(): void {
    this.sharedId = '';
    this.panel = { ...this.panel, title: `${this.panel.title ?? 'Panel'} (copy)` };
    history.pushState(null, '', '/');
    this.apply(this.panel, 'replace');
  }

  private async importJson(file: File | undefined): Promise<void> {
    if (!file) return;
    if (file.size > MAX_STATE_BYTES) {
      this.notice = fileTooLarge(file.name);
      return;
    }
    try {
      const { panel, instrument } = await this.readRequest(JSON.parse(await file.text()));
      this.notice = `Opened ${file.name}.`;
      this.instrument = instrument;
      this.load(panel, this.exclude);
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
    if (this.sharedId) return;
    this.apply(moveEdge(this.panel, e.detail, { snapStock: this.snapStock }), e.detail.done ? 'push' : 'replace');
  }

  /** The panel's probes and channels as a design takes them, for a search among them; none when either is empty. */
  private candidates() {
    const p = this.panel;
    if (p.probes.length === 0 || p.channels.length === 0) return undefined;
    return designParts(p);
  }

  /** The panel lives in this browser, not the address: say so, with a way to Share it. */
  private keptNote() {
    return html`<p class="notice kept" role="status">
      ${KEPT_IN_BROWSER} <button type="button" @click=${this.goToShare}>Go to Share</button>
    </p>`;
  }

  /** Shows the results and puts the focus on the Share button under "Share and export". */
  private async goToShare(): Promise<void> {
    this.shownView = 'results';
    await this.updateComplete;
    const actions = this.renderRoot.querySelector('qdp-panel-actions');
    this.renderRoot.querySelector('#h-share')?.scrollIntoView({ block: 'start' });
    actions?.shadowRoot?.querySelector<HTMLButtonElement>('button')?.focus();
  }

  /**
   * The panel's line wavelengths for the chart, the same array while the lines are unchanged: a new array would make
   * the chart rebuild its paths on every keystroke in an editor.
   */
  private excitationNm(p: PanelSpec): number[] {
    if (this.linesNm?.from !== p.excitation)
      this.linesNm = { from: p.excitation, nm: p.excitation.map((l) => l.wavelengthNm) };
    return this.linesNm.nm;
  }

  /** Controls measured on image regions: the controls section takes them and opens. */
  private onImageControls(e: CustomEvent<ControlsMeasurement>): void {
    this.imageControls = e.detail;
    this.notice = `Controls measured on ${e.detail.controls.length} image regions are in “Measured controls”.`;
  }

  /** Puts measured reference columns (from the controls) into the panel as one undoable step of its own. */
  private onMeasuredReference(e: CustomEvent<MeasuredReferenceSpec>): void {
    const used = e.detail.columns.map(
      (column) => this.panel.probes.find((p) => p.id === column.probe)?.label || column.probe,
    );
    this.notice = `Unmixing now uses the measured columns of ${used.join(', ')}. Undo puts the modelled ones back.`;
    this.apply({ ...this.panel, measuredReference: e.detail }, 'push', true);
  }

  /** Which columns are measured, with the way back to the modelled ones. */
  private measuredNote(c: Computed | undefined) {
    if (!this.panel.measuredReference) return '';
    const measured = c?.crosstalk.probes.filter((p) => p.measured).map((p) => p.label) ?? [];
    const { measuredReference: _, ...modelled } = this.panel;
    return html`<p class="measured-note">
      ${
        measured.length
          ? `Spillover, unmixing and noise use the measured columns of ${measured.join(', ')} (from their controls).`
          : 'The measured columns are not used (see the warnings).'
      }
      <button type="button" ?disabled=${!!this.sharedId} @click=${() => this.apply(modelled, 'push', true)}>
        Use the modelled columns
      </button>
    </p>`;
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
    // A panel still missing a probe or a channel is not refused input: it shows what to do first instead.
    const refused = !!this.error && !firstSteps(p);
    const blocked = blockedProbes.size
      ? 'a probe is made of an excluded material.'
      : firstSteps(p)
        ? 'the panel needs a probe and a channel first.'
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
          <span class="undo" role="group" aria-label="Undo and redo">
            <button
              type="button"
              aria-keyshortcuts="Control+Z Meta+Z"
              title="Undo the last change (Ctrl+Z, or Cmd+Z on a Mac, outside a text box)"
              ?disabled=${!!this.sharedId || this.steps.past.length === 0}
              @click=${this.undoStep}
            >
              Undo
            </button>
            <button
              type="button"
              aria-keyshortcuts="Control+Shift+Z Meta+Shift+Z"
              title="Redo the change last undone (Ctrl+Shift+Z, or Cmd+Shift+Z on a Mac, outside a text box)"
              ?disabled=${!!this.sharedId || this.steps.future.length === 0}
              @click=${this.redoStep}
            >
              Redo
            </button>
          </span>
          <button type="button" @click=${() => this.loadOwn(newPanel())}>New panel</button>
          <button type="button" @click=${() => this.loadOwn(demoPanel())}>Open the demo panel</button>
          <label class="file"
            >Open panel JSON
            <input
              type="file"
              accept=".json,application/json"
              @change=${(e: Event) => this.importJson((e.target as HTMLInputElement).files?.[0])}
          /></label>
        </div>
        <qdp-my-panels
          .store=${this.savedPanels}
          .current=${{ id: this.savedId, panel: p }}
          @saved-panel-open=${(e: CustomEvent<{ entry: SavedPanel }>) => this.openSaved(e.detail.entry)}
        ></qdp-my-panels>
        ${this.notice ? html`<p class="notice" role="status">${this.notice}</p>` : ''}
        ${this.keptInBrowser ? this.keptNote() : ''} ${this.sharedId ? this.sharedNote() : ''}
        ${
          firstSteps(p)
            ? html`<p class="notice first-steps" role="status">${firstSteps(p)}</p>`
            : this.error
              ? html`<p class="error" role="alert">Not updated: ${this.error.message}</p>`
              : ''
        }
      </header>
      <nav class="views" aria-label="What to show">
        ${PAGE_VIEWS.map(
          ([id, name]) =>
            html`<button
              type="button"
              aria-pressed=${this.shownView === id ? 'true' : 'false'}
              @click=${() => (this.shownView = id)}
            >
              ${name}
            </button>`,
        )}
      </nav>
      <main
        class=${`view-${this.shownView}`}
        @panel-proposed=${(e: CustomEvent<{ panel: PanelSpec }>) => this.loadProposal(e.detail.panel)}
        @report-show=${(e: CustomEvent<{ print: boolean }>) => this.report?.show(e.detail)}
        @use-measured-reference=${this.onMeasuredReference}
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
          <section
            aria-labelledby="h-instrument"
            @instrument-switch=${(e: CustomEvent<{ id: string }>) => this.switchTo(e.detail.id)}
            @instrument-detach=${() => {
              this.instrument = undefined;
              this.changes = undefined;
              this.apply(this.panel);
            }}
            @instrument-undo=${this.undoSwitch}
          >
            <details class="fold" data-needs-open=${!!this.changes || this.instrumentBusy || !!this.sharedId}>
              <summary>
                <h2 id="h-instrument">Microscope</h2>
                <span>${this.instrument ? this.instrument.spec.name : "this panel's own lines and filters"}</span>
              </summary>
              <qdp-instrument-picker
                .attached=${this.instrument}
                .changes=${this.changes}
                ?busy=${this.instrumentBusy}
              ></qdp-instrument-picker>
              <details>
                <summary>Make an instrument profile of this set-up (for facility staff)</summary>
                <qdp-instrument-maker .panel=${p}></qdp-instrument-maker>
              </details>
            </details>
          </section>
          <section aria-labelledby="h-light">
            <details
              class="fold"
              data-needs-open=${(refused && Object.keys(errors.other).length > 0) || !!this.sharedId}
            >
              <summary>
                <h2 id="h-light">Excitation and sample</h2>
                <span>${lightSummary(p)}</span>
              </summary>
              <qdp-light-editor
                .panel=${p}
                .errors=${errors.other}
                .fromInstrument=${this.instrument?.spec.name ?? ''}
              ></qdp-light-editor>
            </details>
          </section>
          <section aria-labelledby="h-probes">
            <h2 id="h-probes">Probes</h2>
            <qdp-probe-list
              .panel=${p}
              .materials=${MATERIALS}
              .predictions=${c?.predictions ?? []}
              .primary=${c?.evaluation.primaryChannel ?? []}
              .errors=${errors.probes}
              .blocked=${blockedProbes}
            ></qdp-probe-list>
          </section>
          <section aria-labelledby="h-channels">
            <h2 id="h-channels">Detection channels</h2>
            <qdp-channel-list
              .panel=${p}
              .detectors=${DETECTORS}
              .errors=${errors.channels}
              ?snapStock=${this.snapStock}
              @snap-stock-change=${(e: CustomEvent<{ snapStock: boolean }>) => {
                this.snapStock = e.detail.snapStock;
                this.apply(p, 'replace');
              }}
            ></qdp-channel-list>
          </section>
          <section aria-labelledby="h-propose">
            <details class="fold">
              <summary>
                <h2 id="h-propose">Propose a panel</h2>
                <span>let the search choose dots and filters for your targets</span>
              </summary>
              <p>
                Name the targets and how abundant each is; the search proposes dots and filters (or picks from this
                panel's probes and channels) that give the weakest target the highest signal-to-noise after unmixing,
                with no probe's light in another's channel above your limit. It shows the proposal beside your panel, to
                load for editing or discard. A target can keep a probe or channel you already have, and on a microscope
                profile the search can choose among its filters.
              </p>
              <qdp-design-form
                .candidates=${this.candidates()}
                .measuredReference=${p.measuredReference}
                .owned=${designParts(p)}
                .microscope=${this.instrument}
                .sample=${sampleOf(p)}
              ></qdp-design-form>
            </details>
          </section>
        </div>
        <div class="results">
          <section aria-labelledby="h-spectra">
            <h2 id="h-spectra">Spectra</h2>
            <qdp-key-verdict .view=${c?.crosstalk} ?stale=${refused} ?pending=${!!this.pendingUpdate}></qdp-key-verdict>
            <qdp-height-toggle
              .byBrightness=${this.byBrightness}
              @heights-change=${(e: CustomEvent<{ byBrightness: boolean }>) => {
                this.byBrightness = e.detail.byBrightness;
                this.apply(p, 'none');
              }}
            ></qdp-height-toggle>
            <qdp-spectrum-chart
              .curves=${c?.chart.curves ?? []}
              .passbands=${c?.chart.passbands ?? []}
              .shared=${c?.chart.shared ?? []}
              .background=${c?.chart.background}
              .excitationNm=${this.excitationNm(p)}
              .yLabel=${this.byBrightness ? 'relative emission × brightness' : 'emission (peak = 1)'}
              @edge-drag=${this.onEdgeDrag}
            ></qdp-spectrum-chart>
          </section>
          <section aria-labelledby="h-crosstalk">
            <h2 id="h-crosstalk">Crosstalk and unmixing</h2>
            <qdp-crosstalk-table .view=${c?.crosstalk} ?stale=${refused}></qdp-crosstalk-table>
            ${this.measuredNote(c)}
          </section>
          <section aria-labelledby="h-materials">
            <h2 id="h-materials">Material cautions</h2>
            <qdp-material-notes
              .panel=${p}
              .materials=${MATERIALS}
              .exclude=${this.exclude}
              @exclude-change=${(e: CustomEvent<{ exclude: PanelExclusion[] }>) => {
                this.exclude = e.detail.exclude;
                this.apply(withExclusions(p, this.exclude), 'replace');
              }}
            ></qdp-material-notes>
          </section>
          <section aria-labelledby="h-controls">
            <details class="fold" data-needs-open=${!!this.imageControls}>
              <summary><h2 id="h-controls">Measured controls</h2></summary>
              <qdp-controls-section
                .panel=${p}
                .evaluation=${this.error ? undefined : c?.evaluation}
                .measured=${this.imageControls}
              ></qdp-controls-section>
            </details>
          </section>
          <section aria-labelledby="h-pilot-image">
            <details class="fold">
              <summary>
                <h2 id="h-pilot-image">Unmix a pilot image</h2>
                <span>a TIFF of a sample stained with this panel, unmixed in this browser</span>
              </summary>
              <qdp-pilot-image
                .panel=${p}
                .reference=${measuredImageReference(p, this.error ? undefined : c)}
                @controls-measured=${this.onImageControls}
              ></qdp-pilot-image>
            </details>
          </section>
          <section aria-labelledby="h-share">
            <h2 id="h-share">Share and export</h2>
            <qdp-panel-actions
              .panel=${p}
              .request=${toRequest(p, this.instrument)}
              .blocked=${blocked}
              .localResolved=${c?.resolved ?? []}
              .chartSvg=${() => this.chart?.shadowRoot?.querySelector('svg') ?? null}
              .chartLegend=${() => this.chart?.legendEntries() ?? []}
              .evaluation=${this.error ? undefined : c?.evaluation}
            ></qdp-panel-actions>
          </section>
        </div>
      </main>
      <qdp-panel-report
        .panel=${p}
        .computed=${this.error ? undefined : c}
        .materials=${MATERIALS}
        .detectors=${DETECTORS}
        instrumentName=${this.instrument?.spec.name ?? ''}
        sharedId=${this.sharedId}
        .chart=${() => this.chart}
      ></qdp-panel-report>`;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'qdp-panel-app': PanelApp;
  }
}
