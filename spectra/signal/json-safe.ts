/**
 * The last guard of evaluatePanel: JSON cannot carry NaN or ±Infinity, and the API promises neither. None is
 * expected (undefined figures are already null with a warning); this catches any that slip through, in place.
 */

function checkJsonItem(
  record: Record<string | number, unknown>,
  key: string | number,
  path: (string | number)[],
  warnings: string[],
): void {
  const item = record[key];
  if (typeof item === 'number') {
    if (item - item === 0) return; // false only for NaN and ±Infinity
    record[key] = null;
    warnings.push(`${[...path, key].join('.')} has no finite value and is reported as null`);
  } else if (item !== null && typeof item === 'object' && !ArrayBuffer.isView(item)) {
    path.push(key);
    makeJsonSafe(item, path, warnings);
    path.pop();
  }
}

/** Replaces any non-finite number in place by null, with a warning naming where (typed arrays are left alone). */
export function makeJsonSafe(value: object, path: (string | number)[], warnings: string[]): void {
  const record = value as Record<string | number, unknown>;
  if (Array.isArray(value)) for (let i = 0; i < value.length; i++) checkJsonItem(record, i, path, warnings);
  else for (const key in value) checkJsonItem(record, key, path, warnings);
}
