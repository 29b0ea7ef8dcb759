/**
 * A reactive controller for a list of compact editor rows: after each update of its host, it opens the row the user
 * just added (OpenRows decides which) and, once that row is drawn open, moves the focus to its card's first field.
 */
import type { LitElement, ReactiveController } from 'lit';
import type { OpenRows } from '../state/open-rows';

/** An editor card that can take the focus on its first field. */
type FocusableCard = HTMLElement & { focusFirst(): Promise<void> };

export class AddedRowFocus implements ReactiveController {
  /**
   * `ids` lists the rows shown now; `cardTag` is the tag of the rows' cards (each with `data-id`); `redraw` makes the
   * host render again with the new row open.
   */
  constructor(
    private readonly host: LitElement,
    private readonly rows: OpenRows,
    private readonly ids: () => string[],
    private readonly cardTag: string,
    private readonly redraw: () => void,
  ) {
    host.addController(this);
  }

  hostUpdated(): void {
    const added = this.rows.arrived(this.ids());
    if (added !== undefined) void this.focus(added);
  }

  private async focus(id: string): Promise<void> {
    this.redraw();
    await this.host.updateComplete;
    const card = this.host.renderRoot.querySelector<FocusableCard>(`${this.cardTag}[data-id="${CSS.escape(id)}"]`);
    await (card?.parentElement as LitElement | null)?.updateComplete;
    await card?.focusFirst();
  }
}
