/**
 * Grid-long buffers for the channel transmissions of panel evaluation, reused from one evaluation to the next.
 */

// Transmission buffers reused from one evaluation to the next (by grid size, a few sizes at most): a grid-long
// typed array per channel per evaluation costs more to collect than to fill. Valid until the next modelPanel call
// with `reuse`; nothing returned to callers holds them.
const MAX_BUFFER_SIZES = 4;
const buffersBySize = new Map<number, Float64Array[]>();

/** Buffer number c of `count` points (contents: whatever the last user wrote; the caller writes every point). */
export function reusedBuffer(count: number, c: number): Float64Array {
  let list = buffersBySize.get(count);
  if (!list) {
    list = [];
    buffersBySize.set(count, list);
    if (buffersBySize.size > MAX_BUFFER_SIZES) buffersBySize.delete(buffersBySize.keys().next().value!);
  }
  while (list.length <= c) list.push(new Float64Array(count));
  return list[c];
}
