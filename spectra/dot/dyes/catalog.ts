import { SpectraError } from '../../core/errors';
import { DYES } from './library';
import type { Dye } from './types';

/** The ids of the dye library, in its order. */
export const DYE_IDS: readonly string[] = Object.freeze(DYES.map((d) => d.id));

// Records are plain JSON data: callers get deep copies they may change.
function copy(dye: Dye): Dye {
  return JSON.parse(JSON.stringify(dye)) as Dye;
}

/** Every dye of the library, with each number's source and status; plain JSON-serialisable data. */
export function listDyes(): Dye[] {
  return DYES.map(copy);
}

/** One dye by id; `unknown_dye` naming `dye` otherwise. */
export function getDye(id: string): Dye {
  const found = DYES.find((d) => d.id === id);
  if (!found)
    throw new SpectraError('unknown_dye', `unknown dye ${JSON.stringify(id)}; known: ${DYE_IDS.join(', ')}`, ['dye']);
  return copy(found);
}
