/**
 * The API's contract as zod schemas (shared/api-v1.md): they validate requests, give the TypeScript types
 * (z.infer) and generate GET /api/v1/openapi.json. The web front end imports this module too.
 */
import type { z } from 'zod';
import type { PanelSpec } from '../spectra/index';
import { DotRequest as DotRequestSchema, Panel as PanelSchema } from './schemas/index';

export * from './schemas/index';

/** A panel as the API takes it (shared/api-v1.md, "Panels"): the single source of truth for its shape. */
export const Panel = PanelSchema;
/** A validated panel. */
export type Panel = z.infer<typeof Panel>;

/** The body of POST /api/v1/dots/resolve. */
export const DotRequest = DotRequestSchema;
/** A validated POST /api/v1/dots/resolve body. */
export type DotRequest = z.infer<typeof DotRequest>;

// spectra/ cannot import zod, so its PanelSpec is the one allowed hand-written mirror of this schema. This line
// stops compiling if the two drift apart in either direction.
type Assert<T extends true> = T;
/** `true` while the zod Panel and spectra's PanelSpec describe the same shape (a compile error otherwise). */
export type PanelMatchesSpec = Assert<Panel extends PanelSpec ? (PanelSpec extends Panel ? true : false) : false>;
