/**
 * Loads the page's checks (checks.ts, with zod and the API's schemas) once, in the background. The page starts it as
 * soon as it starts; until it is there, nothing is computed, so no number is shown for a panel the API would refuse.
 */
type Checks = typeof import('./checks');

let loaded: Checks | undefined;
let loading: Promise<Checks> | undefined;

/** The checks, loading them on the first call (a failed load is retried on the next call). */
export function loadChecks(): Promise<Checks> {
  loading ??= import('./checks').then(
    (checks) => (loaded = checks),
    (error: unknown) => {
      loading = undefined;
      throw error;
    },
  );
  return loading;
}

/** The checks if they have arrived, else undefined. */
export function checksIfLoaded(): Checks | undefined {
  return loaded;
}
