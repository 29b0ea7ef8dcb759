/**
 * When the page recomputes after an edit. A small panel is checked, computed, drawn and written to the address on
 * every keystroke; a large one (many probes × channels, or long measured tables) waits for a pause in the typing, so
 * a keystroke only updates its field and the figures catch up once, after the pause.
 */
import type { FilterSpec, PanelSpec } from '../../spectra/index';

/**
 * Weight at and above which a panel waits for a pause: the work of one update grows with probes × channels (the
 * matrices and tables) and with the measured table points (checked and resampled on every update). The demo panel
 * weighs 36 and stays immediate; 16 probes × 16 channels weighs 256 (our choice, from the page's measured redraw
 * times: docs/benchmarks.md, the frontend suite).
 */
export const PAUSED_UPDATE_WEIGHT = 100;

/** The typing pause after which a large panel's figures catch up, ms (our choice: between two keystrokes). */
export const UPDATE_PAUSE_MS = 200;

/** Measured table points worth one probe × channel cell of work (our estimate from the page's profile). */
const POINTS_PER_CELL = 50;

const filterPoints = (filters: readonly FilterSpec[] | undefined) =>
  (filters ?? []).reduce((n, f) => n + (f.type === 'table' ? f.points.length : 0), 0);

/** The panel's update weight: probes × channels, plus its measured table points / POINTS_PER_CELL. */
export function panelWeight(panel: PanelSpec): number {
  let points = (panel.background?.points?.length ?? 0) + filterPoints(panel.lightPath?.emissionFilters);
  points += filterPoints(panel.lightPath?.excitationFilters);
  for (const p of panel.probes) points += (p.measuredEmission?.points.length ?? 0) + (p.extinction?.points.length ?? 0);
  for (const c of panel.channels) points += filterPoints(c.filters);
  return panel.probes.length * panel.channels.length + points / POINTS_PER_CELL;
}

/** True when an edit of `panel` should wait for a typing pause before its figures are recomputed. */
export const waitsForPause = (panel: PanelSpec) => panelWeight(panel) >= PAUSED_UPDATE_WEIGHT;
