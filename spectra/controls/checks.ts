/**
 * The shape checks of a controls measurement that the measured spillover needs, each a SpectraError naming the field
 * and the probe or channel in the user's words (the API's schema checks types and sizes before this).
 */
import { SpectraError } from '../core/errors';
import type { PanelSpec } from '../core/panel';
import type { ControlsMeasurement } from './types';

/** "Mito dot (p3)" for a panel probe with a label, else the id. */
export function probeName(id: string, panel: PanelSpec | undefined): string {
  const label = panel?.probes.find((p) => p.id === id)?.label;
  return label ? `${label} (${id})` : id;
}

/** "Red (c4)" for a panel channel with a label, else the id. */
export function channelName(id: string, panel: PanelSpec | undefined): string {
  const label = panel?.channels.find((c) => c.id === id)?.label;
  return label ? `${label} (${id})` : id;
}

/** Throws SpectraError for the first value count, missing value, unknown probe or unknown channel. */
export function checkMeasurement(m: ControlsMeasurement, panel: PanelSpec | undefined): void {
  const count = m.channels.length;
  if (count === 0) throw new SpectraError('invalid_input', 'the controls name no channel', ['channels']);
  if (m.controls.length === 0) {
    throw new SpectraError('invalid_input', 'there is no single-stain control: add one row per probe', ['controls']);
  }
  if (panel) {
    m.channels.forEach((id, c) => {
      if (!panel.channels.some((ch) => ch.id === id)) {
        throw new SpectraError('unknown_channel', `channel ${id} is not a channel of the panel`, ['channels', c]);
      }
    });
  }
  checkValues(m.unstained, count, 'the unstained sample', ['unstained'], m.channels, panel);
  if (m.unstainedSd) checkValues(m.unstainedSd, count, 'the unstained sample', ['unstainedSd'], m.channels, panel);
  m.controls.forEach((row, i) => {
    const name = `the control of ${probeName(row.probe, panel)}`;
    if (panel && !panel.probes.some((p) => p.id === row.probe)) {
      throw new SpectraError('invalid_input', `probe ${row.probe} is not a probe of the panel`, [
        'controls',
        i,
        'probe',
      ]);
    }
    checkValues(row.values, count, name, ['controls', i, 'values'], m.channels, panel);
    if (row.sd) checkValues(row.sd, count, name, ['controls', i, 'sd'], m.channels, panel);
  });
}

function checkValues(
  values: readonly number[],
  count: number,
  what: string,
  path: (string | number)[],
  channels: readonly string[],
  panel: PanelSpec | undefined,
): void {
  if (values.length !== count) {
    throw new SpectraError(
      'invalid_input',
      `${what} has ${values.length} values for ${count} channels: give one value per channel`,
      path,
    );
  }
  values.forEach((v, c) => {
    if (!Number.isFinite(v)) {
      const field = path[path.length - 1] === 'values' || path[0] === 'unstained' ? 'value' : 'standard deviation';
      throw new SpectraError(
        'invalid_input',
        `${what} has no ${field} for channel ${channelName(channels[c], panel)}`,
        [...path, c],
      );
    }
  });
}
