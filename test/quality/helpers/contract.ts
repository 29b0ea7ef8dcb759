/** Checks shared by the quality tests: the contract's error shape and the panels the traffic is made of. */
import { demoPanel } from '../../../web/state/demo-panel';

/** The contract's error body (docs/api.md, "Errors"). */
export interface ContractError {
  code: string;
  message: string;
  path?: (string | number)[];
}

/**
 * Why a response body is not in the contract's error shape `{"error": {"code", "message", "path"?}}`, or null when
 * it is. Used instead of a bare boolean so a failing test prints what was wrong.
 */
export function errorShapeProblem(text: string): string | null {
  let body: unknown;
  try {
    body = JSON.parse(text);
  } catch {
    return `not JSON: ${text.slice(0, 200)}`;
  }
  const error = (body as { error?: unknown } | null)?.error as Partial<ContractError> | undefined;
  if (error === undefined || error === null || typeof error !== 'object')
    return `no error object: ${text.slice(0, 200)}`;
  if (typeof error.code !== 'string' || !/^[a-z_]+$/.test(error.code)) return `bad code: ${text.slice(0, 200)}`;
  if (typeof error.message !== 'string' || error.message.length === 0) return `bad message: ${text.slice(0, 200)}`;
  if (
    error.path !== undefined &&
    !(Array.isArray(error.path) && error.path.every((p) => typeof p === 'string' || typeof p === 'number'))
  ) {
    return `bad path: ${text.slice(0, 200)}`;
  }
  return null;
}

/** The front end's demo panel (six probes, six channels, background) with a title that makes it unique. */
export function demoPanelTitled(title: string): Record<string, unknown> {
  return { ...(demoPanel() as unknown as Record<string, unknown>), title };
}

/** The demo panel with the orange probe moved to `peakNm` (so evaluations do not all hit one cached dot). */
export function demoPanelWithPeak(peakNm: number): Record<string, unknown> {
  const panel = demoPanel();
  panel.probes[3] = { ...panel.probes[3], emissionPeakNm: peakNm };
  return panel as unknown as Record<string, unknown>;
}

/** A POST of a JSON value. */
export function postJson(
  baseUrl: string,
  path: string,
  body: unknown,
  headers: Record<string, string> = {},
): Promise<Response> {
  return fetch(baseUrl + path, {
    method: 'POST',
    headers: { 'content-type': 'application/json', ...headers },
    body: JSON.stringify(body),
  });
}
