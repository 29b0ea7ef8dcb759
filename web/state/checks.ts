/**
 * Every check the page makes of a panel or a design request, in one place: the API's own zod schemas, read through
 * the API's issueToError, so the page refuses exactly what the server would and says so in the same words. Edited
 * panels, imported files, links' fragments and shared panels all pass through here. The module carries zod: the page
 * loads it just after it starts (load-checks.ts) so the first bundle stays small.
 */
import type { z } from 'zod';
import {
  SpectraError,
  type ControlsMeasurement,
  type DesignRequest as DesignRequestSpec,
  type InstrumentSpec,
  type PanelOnInstrumentSpec,
  type PanelSpec,
} from '../../spectra/index';
import {
  ApiError,
  ControlsInput,
  DesignRequest,
  Instrument,
  issueToError,
  Panel,
  PanelRequest,
  SHARE_ID_PATTERN,
  withInstrument,
} from '../../worker/schemas';
import type { FieldError } from './error-map';
import { isPanelExclusion } from './exclusions';
import type { PageState } from './fragment';

/** The first issue of a failed parse in the API's words (the API answers with the first one too). */
function firstProblem(error: z.ZodError | undefined): FieldError | undefined {
  return error && issueToError(error.issues[0]);
}

/** The API's complaint about a panel, or undefined when the API would take it. */
export function checkPanel(panel: PanelSpec): FieldError | undefined {
  return firstProblem(Panel.safeParse(panel).error);
}

/** The API's complaint about a design request, or undefined when the API would take it. */
export function checkDesignRequest(request: DesignRequest): FieldError | undefined {
  return firstProblem(DesignRequest.safeParse(request).error);
}

/**
 * A checked design request as the search takes it, resolved as the API resolves it: a request naming the instrument
 * gets that profile's lines and channels written in (`instrument`: the profile the page has loaded). Otherwise the
 * API's refusal, with the field's path.
 */
export function designForSearch(
  request: DesignRequest,
  instrument: InstrumentSpec | undefined,
): { ok: true; request: DesignRequestSpec } | { ok: false; error: FieldError } {
  try {
    return { ok: true, request: withInstrument(request, instrument) };
  } catch (e) {
    if (e instanceof ApiError || e instanceof SpectraError) {
      return { ok: false, error: { code: e.code, message: e.message, path: e.path } };
    }
    throw e;
  }
}

/** A panel from untrusted JSON (a file, a link, a shared panel), or the API's message about its first problem. */
export function readPanel(raw: unknown): { ok: true; panel: PanelSpec } | { ok: false; message: string } {
  const r = Panel.safeParse(raw);
  return r.success ? { ok: true, panel: r.data } : { ok: false, message: issueToError(r.error.issues[0]).message };
}

/**
 * A panel request from untrusted JSON (a file, a shared panel): written out, or naming an instrument profile that the
 * caller then loads; or the API's message about its first problem.
 */
export function readPanelRequest(
  raw: unknown,
): { ok: true; request: PanelOnInstrumentSpec } | { ok: false; message: string } {
  const r = PanelRequest.safeParse(raw);
  return r.success ? { ok: true, request: r.data } : { ok: false, message: issueToError(r.error.issues[0]).message };
}

/** An instrument profile from untrusted JSON, or the API's complaint about it (with the field's path). */
export function readInstrument(raw: unknown): { ok: true; spec: InstrumentSpec } | { ok: false; error: FieldError } {
  const r = Instrument.safeParse(raw);
  return r.success ? { ok: true, spec: r.data } : { ok: false, error: issueToError(r.error.issues[0]) };
}

/**
 * True for the shape the page's editors can hold: an object whose lines, probes and channels are lists of objects
 * (the page keeps a panel with a refused value, so that typed work survives a reload; the checks then mark it).
 */
function editablePanel(raw: unknown): raw is PanelSpec {
  const p = raw as Record<string, unknown> | null;
  const listOfObjects = (x: unknown) => Array.isArray(x) && x.every((i) => typeof i === 'object' && i !== null);
  return (
    typeof p === 'object' &&
    p !== null &&
    ['excitation', 'probes', 'channels'].every((k) => listOfObjects(p[k])) &&
    (p.channels as { filters?: unknown }[]).every((c) => listOfObjects(c.filters))
  );
}

/**
 * A page state from a decoded fragment: the panel plus known view options (unknown options are dropped). A panel the
 * API would refuse is still kept when the editors can hold it (`problem` says why); anything else is refused.
 */
export function readPageState(
  raw: unknown,
): { ok: true; state: PageState; problem?: string } | { ok: false; message: string } {
  const obj = (raw ?? {}) as {
    panel?: unknown;
    view?: { exclude?: unknown; instrument?: unknown; snapStock?: unknown };
  };
  const checked = readPanel(obj.panel);
  if (!checked.ok && !editablePanel(obj.panel)) return checked;
  const panel = checked.ok ? checked.panel : (obj.panel as PanelSpec);
  const problem = checked.ok ? {} : { problem: checked.message };
  const words = obj.view?.exclude;
  const exclude = Array.isArray(words) ? words.filter(isPanelExclusion) : [];
  const instrument = obj.view?.instrument;
  const id = typeof instrument === 'string' && SHARE_ID_PATTERN.test(instrument) ? { instrument } : {};
  const snap = obj.view?.snapStock === true ? { snapStock: true } : {};
  return { ok: true, state: { panel, view: { exclude, ...id, ...snap } }, ...problem };
}

/**
 * Measured controls the page read or was handed, checked as POST /api/v1/controls/spillover checks them (without the
 * panel, which the page has checked already), or the API's complaint with the field's path.
 */
export function checkControls(m: ControlsMeasurement): FieldError | undefined {
  return firstProblem(ControlsInput.safeParse(m).error);
}
