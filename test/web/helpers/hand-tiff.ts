/**
 * TIFF files built byte by byte from TIFF 6.0 (Adobe 1992), Section 2 (header, IFD entries of 12 bytes: tag, type,
 * count, value or offset), independent of the page's writer: for compressed strips, tiles, colour pages and sizes
 * that do not match their data.
 */

/** One IFD entry: SHORT (3) or LONG (4) values. */
export interface HandEntry {
  tag: number;
  type: 3 | 4;
  values: number[];
}

/**
 * One page per entry list, each with its strips. Strip offsets (tag 273) and byte counts (279) are filled in from
 * `strips`; every other tag is written as given, in tag order.
 */
export function handTiff(
  pages: { entries: HandEntry[]; strips: Uint8Array[] }[],
  littleEndian = true,
  stripsLast = false,
): Uint8Array {
  // Two passes: the first finds where everything goes with the strip offsets still unknown (their count is known).
  const place = (stripAt: (number[] | null)[]) => {
    const parts: { at: number; bytes: Uint8Array }[] = [];
    let at = 8;
    const putStrips = (i: number) =>
      pages[i].strips.map((s) => {
        const offset = at;
        parts.push({ at, bytes: s });
        at += s.length + (s.length & 1);
        return offset;
      });
    const stripOffsets: number[][] = [];
    const layouts = pages.map((page, i) => {
      if (!stripsLast) stripOffsets[i] = putStrips(i);
      const offsets = stripsLast ? (stripAt[i] ?? page.strips.map(() => 0)) : stripOffsets[i];
      const entries = [
        ...page.entries,
        { tag: 273, type: 4 as const, values: offsets },
        { tag: 279, type: 4 as const, values: page.strips.map((s) => s.length) },
      ].sort((a, b) => a.tag - b.tag);
      const ifd = at;
      at += 2 + entries.length * 12 + 4;
      const outOfLine = entries.map((e) => {
        const size = e.values.length * (e.type === 3 ? 2 : 4);
        if (size <= 4) return -1;
        const offset = at;
        at += size + (size & 1);
        return offset;
      });
      return { entries, ifd, outOfLine };
    });
    if (stripsLast) pages.forEach((_, i) => (stripOffsets[i] = putStrips(i)));
    return { parts, at, layouts, stripOffsets };
  };
  const firstPass = place(pages.map(() => null));
  const { parts, at, layouts } = stripsLast ? place(firstPass.stripOffsets) : firstPass;
  const ifdOffsets = layouts.map((l) => l.ifd);
  const out = new Uint8Array(at);
  const view = new DataView(out.buffer);
  const le = littleEndian;
  out[0] = out[1] = le ? 0x49 : 0x4d;
  view.setUint16(2, 42, le);
  view.setUint32(4, ifdOffsets[0], le);
  for (const p of parts) out.set(p.bytes, p.at);
  layouts.forEach(({ entries, ifd, outOfLine }, i) => {
    view.setUint16(ifd, entries.length, le);
    entries.forEach((e, j) => {
      const p = ifd + 2 + 12 * j;
      view.setUint16(p, e.tag, le);
      view.setUint16(p + 2, e.type, le);
      view.setUint32(p + 4, e.values.length, le);
      const base = outOfLine[j] < 0 ? p + 8 : outOfLine[j];
      if (outOfLine[j] >= 0) view.setUint32(p + 8, base, le);
      e.values.forEach((v, k) => {
        if (e.type === 3) view.setUint16(base + 2 * k, v, le);
        else view.setUint32(base + 4 * k, v, le);
      });
    });
    view.setUint32(ifd + 2 + entries.length * 12, ifdOffsets[i + 1] ?? 0, le);
  });
  return out;
}

/** The usual entries of a grey page: width, height, bits, compression, BlackIsZero, one sample, rows per strip. */
export function greyEntries(
  width: number,
  height: number,
  bits: number,
  options: { compression?: number; format?: number; rowsPerStrip?: number; extra?: HandEntry[] } = {},
): HandEntry[] {
  return [
    { tag: 256, type: 4, values: [width] },
    { tag: 257, type: 4, values: [height] },
    { tag: 258, type: 3, values: [bits] },
    { tag: 259, type: 3, values: [options.compression ?? 1] },
    { tag: 262, type: 3, values: [1] },
    { tag: 277, type: 3, values: [1] },
    { tag: 278, type: 4, values: [options.rowsPerStrip ?? height] },
    { tag: 339, type: 3, values: [options.format ?? 1] },
    ...(options.extra ?? []),
  ];
}

/**
 * PackBits (TIFF 6.0, Section 9) written the simplest valid way: literal runs of up to 128 bytes, each preceded by
 * its length − 1, plus one replicate run (−3 then the byte: four copies) at the start to exercise both kinds.
 */
export function packBits(bytes: Uint8Array): Uint8Array {
  const out: number[] = [];
  let k = 0;
  if (bytes.length >= 4 && bytes[0] === bytes[1] && bytes[1] === bytes[2] && bytes[2] === bytes[3]) {
    out.push(256 - 3, bytes[0]);
    k = 4;
  }
  while (k < bytes.length) {
    const n = Math.min(128, bytes.length - k);
    out.push(n - 1, ...bytes.subarray(k, k + n));
    k += n;
  }
  return Uint8Array.from(out);
}
