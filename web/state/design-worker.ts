/**
 * The design search in a browser Web Worker, so the page stays responsive. Messages in: `{type: 'run', request}` starts
 * a design; `{type: 'stop'}` asks the search to finish with the best design found so far (exact: false). Messages out:
 * `{type: 'progress', progress}` after each chunk of the search, then `{type: 'result', result}` or
 * `{type: 'error', error: {code, message, path}}`. Cancelling outright is the page's `worker.terminate()`.
 */
import {
  runDesignAsync,
  SpectraError,
  type DesignRequest,
  type DesignResult,
  type SearchProgress,
} from '../../spectra/index';
import type { FieldError } from './error-map';

/** What the worker posts back. */
export type DesignWorkerMessage =
  | { type: 'progress'; progress: SearchProgress }
  | { type: 'result'; result: DesignResult }
  | { type: 'error'; error: FieldError };

const scope = self as unknown as DedicatedWorkerGlobalScope;
let stopRequested = false;

scope.onmessage = async (event: MessageEvent<{ type: 'run'; request: DesignRequest } | { type: 'stop' }>) => {
  const message = event.data;
  if (message?.type === 'stop') {
    stopRequested = true;
    return;
  }
  if (message?.type !== 'run') return;
  stopRequested = false;
  const post = (m: DesignWorkerMessage) => scope.postMessage(m);
  try {
    const result = await runDesignAsync(message.request, {
      // A macrotask between chunks lets a 'stop' message in before the search goes on.
      pause: () => new Promise((resolve) => setTimeout(resolve, 0)),
      onProgress: (progress) => post({ type: 'progress', progress }),
      shouldStop: () => stopRequested,
    });
    post({ type: 'result', result });
  } catch (err) {
    const error: FieldError =
      err instanceof SpectraError
        ? { code: err.code, message: err.message, path: err.path }
        : { code: 'internal_error', message: 'the design search failed unexpectedly', path: [] };
    post({ type: 'error', error });
  }
};
