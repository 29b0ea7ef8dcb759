/**
 * A design run bounded for the API: the request's cost is estimated before any work (spectra/design/cost.ts), an
 * over-limit request is refused with `400 request_too_large`, a large node budget is shortened to the work limit, and
 * the search is stepped with a pause (a zero-delay timer) between chunks, so that other requests to the same isolate
 * (`/api/v1/health`) are answered while it runs and a stop is checked: the processor-time deadline or a client that
 * has gone.
 */
import {
  estimateDesignCost,
  planBoundedDesign,
  runDesignAsync,
  type DesignRequest,
  type DesignResult,
} from '../spectra/index';
import { ApiError } from './schemas/index';

/**
 * Time after which a running design stops with its best design so far, ms: under the 2 s of processor time the API
 * allows a request (our convention). Measured as elapsed time across the pauses (the Workers clock advances only
 * between them), which is never less than the processor time spent.
 */
export const DESIGN_DEADLINE_MS = 1500;

/** A zero-delay timer: lets the isolate answer other requests and move its clock between search chunks. */
const pause = () => new Promise<void>((resolve) => setTimeout(resolve, 0));

/** The request with its node budget set to `nodeBudget`. */
function withNodeBudget(request: DesignRequest, nodeBudget: number): DesignRequest {
  return { ...request, options: { ...request.options, nodeBudget } };
}

/**
 * Runs a checked design request within the API's work, memory and time limits; throws ApiError 400
 * `request_too_large` (before any spectrum or working array is made) when it cannot fit them.
 */
export async function runBoundedDesign(request: DesignRequest, signal?: AbortSignal): Promise<DesignResult> {
  const plan = planBoundedDesign(estimateDesignCost(request));
  if (plan.refusal) throw new ApiError(400, 'request_too_large', plan.refusal.message, []);
  const started = Date.now();
  let timedOut = false;
  const shouldStop = () => {
    timedOut ||= Date.now() - started >= DESIGN_DEADLINE_MS;
    return timedOut || signal?.aborted === true;
  };
  const bounded = plan.shortened ? withNodeBudget(request, plan.nodeBudget) : request;
  const result = await runDesignAsync(bounded, { shouldStop, pause });
  if (plan.shortened) {
    result.warnings.push(
      `the API bounds each design's work: the search could visit ${plan.nodeBudget.toLocaleString('en-US')} of the ` +
        `${plan.nodesAsked.toLocaleString('en-US')} nodes asked for; run the ` +
        'search in the page for a longer one',
    );
  }
  if (timedOut) {
    result.warnings.push(
      `the design stopped at the API's time limit (${DESIGN_DEADLINE_MS / 1000} s) with the best design found so ` +
        'far; run the search in the page for a longer one',
    );
  }
  return result;
}
