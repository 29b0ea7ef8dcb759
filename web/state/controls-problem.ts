/**
 * A refusal of measured controls in the user's words: where it is (the CSV line, or the control's probe and the
 * channel, by their labels) and what is wrong, e.g. 'Line 5: The control of Mito dot (p3) is dark in …' or
 * 'Control of Mito dot, channel Orange: must be a finite number'.
 */
import type { ControlsMeasurement, PanelSpec } from '../../spectra/index';
import { pathText } from '../../worker/schemas';

const nameOf = (list: readonly { id: string; label?: string }[] | undefined, id: string | undefined) =>
  (id !== undefined && list?.find((i) => i.id === id)?.label) || id || '';

/** The sentence for a refusal at `path` (the API's path into the controls). `lines[i]`: the CSV line of control i. */
export function controlsProblemText(
  path: readonly (string | number)[],
  message: string,
  m: ControlsMeasurement,
  panel: PanelSpec | undefined,
  lines?: readonly number[],
): string {
  const [head, index, field, at] = path;
  // The schema's messages start with the field's path ("controls[0].values[2] must be …"): the place is said below.
  const prefix = `${pathText(path as (string | number)[])} `;
  const bare = message.startsWith(prefix) ? message.slice(prefix.length) : message;
  const sentence = `${bare[0].toUpperCase()}${bare.slice(1)}`.replace(/\.?$/, '.');
  const channel = (c: unknown) =>
    typeof c === 'number' ? `, channel ${nameOf(panel?.channels, m.channels[c]) || c + 1}` : '';
  if (head === 'controls' && typeof index === 'number') {
    // A message from the library already names the probe and the channel; the line or row is what it lacks.
    if (lines) return `Line ${lines[index]}: ${sentence}`;
    const probe = nameOf(panel?.probes, m.controls[index]?.probe);
    const named = message.includes(probe) ? '' : ` of ${probe}${field === 'sd' ? ' (sd)' : ''}${channel(at)}`;
    return `Control ${index + 1}${named}: ${sentence}`;
  }
  if (head === 'unstained' || head === 'unstainedSd') return `Unstained sample${channel(index)}: ${sentence}`;
  if (head === 'channels') return `Channel ${typeof index === 'number' ? index + 1 : ''}: ${sentence}`.trim();
  return sentence;
}
