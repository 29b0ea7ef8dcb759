/**
 * The checks a panel gets before anything is resolved: what the spectral modules below do not check themselves
 * (the panel's arrays and their sizes, ids and the references between them, scale factors).
 */
import type { PanelSpec } from '../panel';
import { SpectraError } from '../errors';

/** Most lines, probes and channels one panel may hold, and the largest powerRel or abundance (request-size guards). */
export const PANEL_LIMITS = { probes: 16, channels: 64, lines: 16, scale: 1e6 } as const;

// A plain function, not a closure per call (name-keeping bundlers wrap each named closure when it is created).
function bad(message: string, path: (string | number)[]): SpectraError {
  return new SpectraError('invalid_input', message, path);
}

function checkList(panel: PanelSpec, key: 'excitation' | 'probes' | 'channels', max: number): void {
  const value = panel[key] as unknown;
  if (!Array.isArray(value) || value.length === 0) throw bad(`${key} must be a non-empty array`, [key]);
  if (value.length > max) throw bad(`at most ${max} ${key} are allowed, got ${value.length}`, [key]);
  for (let i = 0; i < value.length; i++) {
    if (value[i] === null || typeof value[i] !== 'object') throw bad(`${key}[${i}] must be an object`, [key, i]);
  }
}

function checkScale(value: unknown, key: 'excitation' | 'probes', index: number, field: string): void {
  if (value !== undefined && (typeof value !== 'number' || !(value >= 0 && value <= PANEL_LIMITS.scale))) {
    throw bad(`${field} must be a number from 0 to ${PANEL_LIMITS.scale}, got ${String(value)}`, [key, index, field]);
  }
}

function uniqueIds(panel: PanelSpec, key: 'probes' | 'channels'): Set<string> {
  const seen = new Set<string>();
  const items = panel[key];
  for (let i = 0; i < items.length; i++) {
    const id = items[i].id;
    if (typeof id !== 'string' || id === '') throw bad('id must be a non-empty string', [key, i, 'id']);
    if (seen.has(id)) throw bad(`duplicate id ${JSON.stringify(id)}`, [key, i, 'id']);
    seen.add(id);
  }
  return seen;
}

/** Throws SpectraError naming the field unless the panel's shape, ids, references and scale factors are sound. */
export function checkPanelShape(panel: PanelSpec): void {
  if (panel === null || typeof panel !== 'object') throw bad('a panel must be an object', []);
  if (panel.version !== undefined && panel.version !== 1) throw bad('version must be 1', ['version']);
  checkList(panel, 'excitation', PANEL_LIMITS.lines);
  checkList(panel, 'probes', PANEL_LIMITS.probes);
  checkList(panel, 'channels', PANEL_LIMITS.channels);
  const lines = panel.excitation;
  for (let l = 0; l < lines.length; l++) {
    const nm = lines[l].wavelengthNm;
    if (typeof nm !== 'number' || !(nm > 0 && nm < 10000))
      throw bad(`wavelengthNm must be a number above 0 nm, got ${String(nm)}`, ['excitation', l, 'wavelengthNm']);
    checkScale(lines[l].powerRel, 'excitation', l, 'powerRel');
  }
  uniqueIds(panel, 'probes');
  const channelIds = uniqueIds(panel, 'channels');
  const probes = panel.probes;
  for (let p = 0; p < probes.length; p++) {
    checkScale(probes[p].abundance, 'probes', p, 'abundance');
    const channel = probes[p].channel;
    if (channel !== undefined && !channelIds.has(channel)) {
      throw new SpectraError('unknown_channel', `channel ${JSON.stringify(channel)} names no channel of the panel`, [
        'probes',
        p,
        'channel',
      ]);
    }
  }
}
