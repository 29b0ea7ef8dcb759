/**
 * The last resolved dots, kept for panel evaluation: the same probes come back again and again (editing one probe of
 * a panel, the design search), and resolving a dot (inverting a size law, sampling its line) costs more than the rest
 * of its part of an evaluation. A resolved dot is never changed after it is made, so a cached one can be shared.
 */
import type { WavelengthGrid } from '../core/grid';
import { DOT_INPUT_FIELDS, type DotInput, type ProbeSpec } from '../core/panel';
import { resolveDot, type ResolvedDot } from './resolve';

/** Resolutions kept (oldest out first). */
const CACHE_SIZE = 256;
const cache = new Map<string, ResolvedDot>();

/** Empties the cache (benchmarks that time an evaluation from scratch call it before each run). */
export function clearResolvedDotCache(): void {
  cache.clear();
}

/** A probe's dot fields (every field resolveDot reads), plus the exciting line when one is given. */
export function dotInputOf(probe: ProbeSpec, excitationNm?: number): DotInput {
  const input: Record<string, unknown> = {};
  for (const field of DOT_INPUT_FIELDS) if (probe[field] !== undefined) input[field] = probe[field];
  if (excitationNm !== undefined) input.excitationNm = excitationNm;
  return input as unknown as DotInput;
}

/**
 * resolveDot for a probe's dot fields, from the cache when the same fields were resolved on the same grid. The key is
 * the JSON text of exactly the input resolveDot is given, so nothing it reads can be left out of the key.
 */
export function resolveDotCached(input: DotInput, grid: WavelengthGrid): ResolvedDot {
  const key = `${grid.startNm} ${grid.stepNm} ${grid.count} ${JSON.stringify(input)}`;
  const hit = cache.get(key);
  if (hit) return hit;
  const dot = resolveDot(input, { grid });
  cache.set(key, dot);
  if (cache.size > CACHE_SIZE) cache.delete(cache.keys().next().value!);
  return dot;
}
