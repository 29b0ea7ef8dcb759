/**
 * Reading untrusted panel JSON (an imported file, a link's fragment, a shared panel) into a PanelSpec through the
 * API's own zod schema, so the page accepts exactly what the server would.
 */
import type { PanelSpec } from '../../spectra/index';
import { Panel } from '../../worker/schemas';
import type { PageState } from './fragment';
import type { ExcludableClass } from './exclusions';

/** A validated panel, or the first problem as "path: message". */
export function readPanel(raw: unknown): { ok: true; panel: PanelSpec } | { ok: false; message: string } {
  const r = Panel.safeParse(raw);
  if (r.success) return { ok: true, panel: r.data as PanelSpec };
  const issue = r.error.issues[0];
  return { ok: false, message: `${issue.path.length ? issue.path.join('.') + ': ' : ''}${issue.message}` };
}

/** A page state from a decoded fragment: a valid panel plus known view options (unknown options are dropped). */
export function readPageState(raw: unknown): { ok: true; state: PageState } | { ok: false; message: string } {
  const obj = (raw ?? {}) as { panel?: unknown; view?: { exclude?: unknown } };
  const panel = readPanel(obj.panel);
  if (!panel.ok) return panel;
  const ex = Array.isArray(obj.view?.exclude) ? obj.view!.exclude : [];
  const exclude = ex.filter((x): x is ExcludableClass => x === 'cadmium' || x === 'lead');
  return { ok: true, state: { panel: panel.panel, view: { exclude } } };
}
