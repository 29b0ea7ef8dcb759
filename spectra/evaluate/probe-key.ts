/**
 * The cache key of one probe resolution: every given input field in a fixed order, numbers by their exact bits.
 * Formatting numbers as decimal text (the obvious key) costs more than the rest of a cache hit; a double's 64 bits
 * as four UTF-16 code units are exact, cheap, and unambiguous.
 */
import { MATERIAL_IDS, type ProbeSpec } from '../panel';
import type { WavelengthGrid } from '../grid';

/** The probe fields a resolution depends on, in key order. */
export const DOT_FIELDS = [
  'material',
  'emissionPeakNm',
  'diameterNm',
  'sizeDispersionPct',
  'fwhmNm',
  'quantumYield',
  'measuredEmission',
  'extinction',
] as const;

const MATERIAL_INDEX = new Map<unknown, number>(MATERIAL_IDS.map((id, i) => [id, i]));

// One double's bits read as four 16-bit units (scratch views of one buffer).
const bits = new Float64Array(1);
const units = new Uint16Array(bits.buffer);
const codes: number[] = [];

function pushNumber(x: number): void {
  bits[0] = x;
  codes.push(units[0], units[1], units[2], units[3]);
}

/**
 * The key of probe fields on a grid (and the line, for carbon dots resolved per line). Each token starts with a tag
 * that fixes its length (field number, then 'n' + 4 units for a number, 'm' + 1 for a material id, 'j' + 2 length
 * units + JSON text for anything else), so no input can forge another input's key.
 */
export function probeKey(probe: ProbeSpec, grid: WavelengthGrid, excitationNm?: number): string {
  codes.length = 0;
  pushNumber(grid.startNm);
  pushNumber(grid.stepNm);
  pushNumber(grid.count);
  let key = '';
  for (let f = 0; f < DOT_FIELDS.length; f++) {
    const value = probe[DOT_FIELDS[f]] as unknown;
    if (value === undefined) continue;
    codes.push(f);
    const material = MATERIAL_INDEX.get(value);
    if (typeof value === 'number') {
      codes.push(110); // 'n'
      pushNumber(value);
    } else if (material !== undefined) {
      codes.push(109, material); // 'm'
    } else {
      // Strings and tables as JSON text, after their length: the text cannot run into the next token.
      const json = JSON.stringify(value) ?? 'undefined';
      codes.push(106, json.length >>> 16, json.length & 0xffff); // 'j'
      key += String.fromCharCode(...codes) + json;
      codes.length = 0;
    }
  }
  if (excitationNm !== undefined) {
    codes.push(DOT_FIELDS.length, 110);
    pushNumber(excitationNm);
  }
  return key + String.fromCharCode(...codes);
}
