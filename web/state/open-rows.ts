/**
 * Which rows of a compact editor are open. A row opens when the user opens it, and stays open while it holds an
 * error (its messages sit beside its fields). A row the user just added opens and is the one to take the focus.
 */
export class OpenRows {
  private readonly chosen = new Map<string, boolean>();
  private known?: Set<string>;
  private awaitingAdd = false;

  /** True when the row `id` shows its editor. */
  isOpen(id: string, hasErrors: boolean): boolean {
    return hasErrors || (this.chosen.get(id) ?? false);
  }

  /** The user opened or closed the row `id`. */
  choose(id: string, open: boolean): void {
    this.chosen.set(id, open);
  }

  /** The user asked for a new row: the next row to appear is opened and focused. */
  expectAdded(): void {
    this.awaitingAdd = true;
  }

  /**
   * Takes the rows now shown; returns the id of the row the user just added (opened by this call), if one appeared
   * since the last call after `expectAdded`. Rows that come back through undo or a load take no focus.
   */
  arrived(ids: readonly string[]): string | undefined {
    const before = this.known;
    this.known = new Set(ids);
    if (!before || !this.awaitingAdd) return undefined;
    const fresh = ids.filter((id) => !before.has(id));
    if (fresh.length === 0) return undefined;
    this.awaitingAdd = false;
    const added = fresh[fresh.length - 1];
    this.chosen.set(added, true);
    return added;
  }
}
