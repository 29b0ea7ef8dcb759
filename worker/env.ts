/** The bindings wrangler.toml gives the worker: the shared-panel KV namespace and the built front end. */
export interface Bindings {
  /** Shared panels, keyed `panel:<id>`, values the canonical JSON text (immutable once written). */
  PANELS: KVNamespace;
  /** The static front end built by Vite into dist/. */
  ASSETS: Fetcher;
  /** Budget of share links per client (wrangler.toml [[ratelimits]]); absent means unlimited. */
  SHARE_WRITES?: RateLimit;
  /**
   * The secret key of share ids (worker/share-id.ts), a Workers secret: `npx wrangler secret put SHARE_ID_KEY`. Local
   * runs and tests read a key for local use only from local.env.
   */
  SHARE_ID_KEY?: string;
}

/** The Hono environment every route app of the worker is typed with. */
export type AppEnv = { Bindings: Bindings };
