/**
 * The page's calls to the qdpanel API (docs/api.md): share a panel, load a shared one, evaluate for export, list,
 * load and store instrument profiles. Every failure becomes the contract's ApiError (the server's code, message and
 * path, or code "network" with status 0 when there is no answer), never an unhandled rejection. The page imports this
 * module on demand (`import('../io/api')`): the module that defines ApiError also defines the error body's zod
 * schema, which keeps zod in the first bundle.
 */
import type { z } from 'zod';
import type { InstrumentSpec, PanelOnInstrumentSpec } from '../../spectra/index';
import {
  ApiError,
  type ApiErrorCode,
  type ErrorBody,
  type Evaluation,
  type InstrumentCreated,
  type InstrumentList,
  type ShareCreated,
} from '../../worker/schemas';

async function call<T>(path: string, init?: RequestInit): Promise<T> {
  let res: Response;
  try {
    res = await fetch(path, { ...init, headers: { 'content-type': 'application/json', ...init?.headers } });
  } catch {
    throw new ApiError(
      0,
      'network',
      'The server could not be reached; your panel is still here and in the page address.',
    );
  }
  const body = (await res.json().catch(() => null)) as Partial<ErrorBody> | null;
  if (!res.ok) {
    const err = body?.error;
    // An answer without the contract's body (a proxy's error page) still carries its status.
    const code = (err?.code ?? 'internal_error') as ApiErrorCode;
    throw new ApiError(res.status, code, err?.message ?? `The server answered ${res.status}.`, err?.path ?? []);
  }
  return body as T;
}

/** Stores the panel; the answer's `url` is the share path ("/p/<id>"). */
export function sharePanel(panel: PanelOnInstrumentSpec): Promise<z.infer<typeof ShareCreated>> {
  return call('/api/v1/panels', { method: 'POST', body: JSON.stringify(panel) });
}

/** Loads a shared panel by id (the caller checks it with the API's Panel schema). */
export function loadSharedPanel(id: string): Promise<unknown> {
  return call(`/api/v1/panels/${encodeURIComponent(id)}`);
}

/** The server's evaluation of a panel (the ordering sheet takes its resolved probes). */
export function evaluateOnServer(panel: PanelOnInstrumentSpec): Promise<Pick<z.infer<typeof Evaluation>, 'probes'>> {
  return call('/api/v1/panels/evaluate', { method: 'POST', body: JSON.stringify(panel) });
}

/** The example instrument profiles the server lists. */
export function listExampleInstruments(): Promise<z.infer<typeof InstrumentList>> {
  return call('/api/v1/instruments');
}

/** Loads an instrument profile by id (the caller checks it with the API's Instrument schema). */
export function loadInstrument(id: string): Promise<unknown> {
  return call(`/api/v1/instruments/${encodeURIComponent(id)}`);
}

/** Stores an instrument profile; the answer's `url` is its page link ("/i/<id>"). */
export function shareInstrument(profile: InstrumentSpec): Promise<z.infer<typeof InstrumentCreated>> {
  return call('/api/v1/instruments', { method: 'POST', body: JSON.stringify(profile) });
}
