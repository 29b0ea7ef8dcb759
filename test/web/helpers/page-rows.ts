/**
 * Reaching the page's editors as a user does: a narrow window shows the results first, so switch to the editors;
 * then press a compact row to open its editor in place.
 */
import { page, userEvent } from 'vitest/browser';

type Host = HTMLElement & { updateComplete: Promise<unknown> };

/** Shows the editors of `app` (<qdp-panel-app>) and opens row `index` of `list`'s compact rows; returns the row. */
export async function openRow(app: Host, list: 'qdp-probe-list' | 'qdp-channel-list', index: number): Promise<Host> {
  const views = app.shadowRoot!.querySelector('nav.views') as HTMLElement;
  if (getComputedStyle(views).display !== 'none')
    await userEvent.click(page.elementLocator(views).getByRole('button', { name: 'Edit the panel' }));
  const listEl = app.shadowRoot!.querySelector(list)!;
  const row = listEl.shadowRoot!.querySelectorAll('qdp-editor-row')[index] as Host & { open: boolean };
  if (!row.open) await userEvent.click(page.elementLocator(row).getByRole('button').first());
  return row;
}
