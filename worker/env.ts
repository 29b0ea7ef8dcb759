/** The bindings wrangler.toml gives the worker: the shared-panel KV namespace and the built front end. */
export interface Bindings {
  /** Shared panels, keyed `panel:<id>`, values the canonical JSON text (immutable once written). */
  PANELS: KVNamespace;
  /** The static front end built by Vite into dist/. */
  ASSETS: Fetcher;
}

/** The Hono environment every route app of the worker is typed with. */
export type AppEnv = { Bindings: Bindings };
