/**
 * The page's calls to the qdpanel API (shared/api-v1.md): share a panel, load a shared one, evaluate for export.
 * Every failure becomes an ApiError with the contract's code and message, never an unhandled rejection.
 */
import type { PanelSpec } from '../../spectra/index';

/** An API error as the contract shapes it ({error: {code, message, path}}), or a network failure (code "network"). */
export class ApiError extends Error {
  readonly code: string;
  readonly status: number;
  readonly path: (string | number)[];
  constructor(code: string, message: string, status: number, path: (string | number)[] = []) {
    super(message);
    this.name = 'ApiError';
    this.code = code;
    this.status = status;
    this.path = path;
  }
}

async function call<T>(path: string, init?: RequestInit): Promise<T> {
  let res: Response;
  try {
    res = await fetch(path, { ...init, headers: { 'content-type': 'application/json', ...(init?.headers ?? {}) } });
  } catch {
    throw new ApiError(
      'network',
      'The server could not be reached; your panel is still here and in the page address.',
      0,
    );
  }
  const body = (await res.json().catch(() => null)) as {
    error?: { code?: string; message?: string; path?: (string | number)[] };
  } | null;
  if (!res.ok) {
    const err = body?.error;
    throw new ApiError(
      err?.code ?? `http_${res.status}`,
      err?.message ?? `The server answered ${res.status}.`,
      res.status,
      err?.path ?? [],
    );
  }
  return body as T;
}

/** Stores the panel; the answer's `url` is the share path ("/p/<id>"). */
export function sharePanel(panel: PanelSpec): Promise<{ id: string; url: string }> {
  return call('/api/v1/panels', { method: 'POST', body: JSON.stringify(panel) });
}

/** Loads a shared panel by id. */
export function loadSharedPanel(id: string): Promise<unknown> {
  return call(`/api/v1/panels/${encodeURIComponent(id)}`);
}

/** The server's evaluation of a panel (the numbers the exported sheet carries). */
export function evaluateOnServer(
  panel: PanelSpec,
): Promise<{
  probes: {
    diameterNm?: number | null;
    emissionPeakNm?: number | null;
    fwhmNm?: number | null;
    firstExcitonNm?: number | null;
  }[];
}> {
  return call('/api/v1/panels/evaluate', { method: 'POST', body: JSON.stringify(panel) });
}
