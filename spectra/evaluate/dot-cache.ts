/**
 * The resolved-dot cache of panel evaluation. Resolving a dot (sizing law inversion, line shape on the grid) costs
 * far more than the rest of an evaluation, and the same probes come back again and again (editing one probe of a
 * panel, the design search): the last resolutions are kept, keyed by the exact input and grid. Resolved cores are
 * never mutated after this point, except to fill in what they make on first need (the grid-long emission, the
 * public ResolvedDot).
 */
import type { ProbeSpec } from '../panel';
import type { WavelengthGrid } from '../grid';
import { SpectraError } from '../errors';
import { resolveDotCore, type DotCore, type DotInput } from '../dot-core';
import { DOT_FIELDS, probeKey } from './probe-key';

/** Resolutions kept (oldest out first). */
const RESOLVED_CACHE_SIZE = 256;
const resolvedCache = new Map<string, DotCore>();

/** Empties the cache of resolved dots (for benchmarks that time an evaluation from scratch). */
export function clearResolvedDotCache(): void {
  resolvedCache.clear();
}

/**
 * The probe as resolveDot's input: the probe itself when it carries no excitationNm of its own and none is to be
 * added (resolveDotCore reads only the dot fields and excitationNm), else a copy of its dot fields.
 */
function dotInput(probe: ProbeSpec, excitationNm: number | undefined): DotInput {
  if (excitationNm === undefined && (probe as { excitationNm?: unknown }).excitationNm === undefined)
    return probe as DotInput;
  const input: Record<string, unknown> = {};
  for (let f = 0; f < DOT_FIELDS.length; f++)
    if (probe[DOT_FIELDS[f]] !== undefined) input[DOT_FIELDS[f]] = probe[DOT_FIELDS[f]];
  if (excitationNm !== undefined) input.excitationNm = excitationNm;
  return input as unknown as DotInput;
}

/**
 * resolveDot's core for probe p of a panel (cached; `excitationNm` for the per-line resolutions of carbon dots), with
 * any error's path moved under ['probes', p].
 */
export function resolveProbe(probe: ProbeSpec, p: number, grid: WavelengthGrid, excitationNm?: number): DotCore {
  const key = probeKey(probe, grid, excitationNm);
  const hit = resolvedCache.get(key);
  if (hit) return hit;
  try {
    const dot = resolveDotCore(dotInput(probe, excitationNm), grid);
    resolvedCache.set(key, dot);
    // Oldest first out: cheaper than a strict LRU and just as good for a few hundred probes.
    if (resolvedCache.size > RESOLVED_CACHE_SIZE) resolvedCache.delete(resolvedCache.keys().next().value!);
    return dot;
  } catch (err) {
    if (err instanceof SpectraError) throw new SpectraError(err.code, err.message, ['probes', p, ...err.path]);
    throw err;
  }
}
