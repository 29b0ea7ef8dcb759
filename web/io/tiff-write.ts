/**
 * A small baseline TIFF writer (TIFF 6.0, Adobe 1992): grey pages, one sample per pixel, uncompressed, one strip per
 * page, each page its own image file directory (IFD). It writes the abundance maps as 32-bit float pages and the demo
 * pilot image as 16-bit pages; the tests build their 8-, 16- and 32-bit inputs with it.
 */

/** One grey page: `data` holds width × height values, row by row from the top left. */
export interface TiffPage {
  width: number;
  height: number;
  /** 8, 16 or 32 bits per value; `float` only with 32. */
  bitsPerSample: 8 | 16 | 32;
  /** Unsigned integers (TIFF 6.0 SampleFormat 1) or IEEE floating point (SampleFormat 3). */
  sampleFormat: 'uint' | 'float';
  data: ArrayLike<number>;
  /** ImageDescription (tag 270), ASCII: e.g. the probe a page holds, or the OME-XML on the first page. */
  description?: string;
}

// Tag numbers and field types from TIFF 6.0, Section 2 ("Image File Directory") and Sections 3–4 and 19.
const SHORT = 3;
const LONG = 4;
const RATIONAL = 5;
const ASCII = 2;
const TYPE_BYTES: Record<number, number> = { [ASCII]: 1, [SHORT]: 2, [LONG]: 4, [RATIONAL]: 8 };

interface Entry {
  tag: number;
  type: number;
  values: number[] | string;
}

/**
 * An entry's count (TIFF 6.0, Section 2): characters plus the closing NUL for ASCII, numerator–denominator pairs for
 * RATIONAL, else the values.
 */
const countOf = (e: Entry) =>
  typeof e.values === 'string' ? e.values.length + 1 : e.type === RATIONAL ? e.values.length / 2 : e.values.length;

/** Bytes of an entry's values; more than 4 go out of line, at an offset the entry holds. */
const sizeOf = (e: Entry) => countOf(e) * TYPE_BYTES[e.type];

/** Rounds up to an even offset: TIFF 6.0, Section 2, asks for word-aligned offsets. */
const even = (n: number) => n + (n & 1);
/** Rounds up to a multiple of 4, so 32-bit float strips sit aligned in the file. */
const four = (n: number) => (n + 3) & ~3;

function checkPage(page: TiffPage, i: number): void {
  const { width, height, bitsPerSample, sampleFormat, data } = page;
  if (!(Number.isInteger(width) && width > 0 && Number.isInteger(height) && height > 0))
    throw new Error(`page ${i + 1}: width and height must be whole numbers above 0`);
  if (data.length !== width * height) throw new Error(`page ${i + 1}: ${data.length} values for ${width} × ${height}`);
  if (sampleFormat === 'float' && bitsPerSample !== 32) throw new Error(`page ${i + 1}: floats are 32-bit here`);
  if (page.description !== undefined && /[^\x20-\x7e\t\n\r]/.test(page.description))
    throw new Error(`page ${i + 1}: the description must be plain ASCII (TIFF 6.0 type 2)`);
}

function entriesOf(page: TiffPage, stripOffset: number): Entry[] {
  const bytes = page.width * page.height * (page.bitsPerSample / 8);
  const entries: Entry[] = [
    { tag: 256, type: LONG, values: [page.width] }, // ImageWidth
    { tag: 257, type: LONG, values: [page.height] }, // ImageLength
    { tag: 258, type: SHORT, values: [page.bitsPerSample] }, // BitsPerSample
    { tag: 259, type: SHORT, values: [1] }, // Compression: none
    { tag: 262, type: SHORT, values: [1] }, // PhotometricInterpretation: BlackIsZero
  ];
  if (page.description !== undefined) entries.push({ tag: 270, type: ASCII, values: page.description });
  entries.push(
    { tag: 273, type: LONG, values: [stripOffset] }, // StripOffsets
    { tag: 277, type: SHORT, values: [1] }, // SamplesPerPixel
    { tag: 278, type: LONG, values: [page.height] }, // RowsPerStrip: the whole page in one strip
    { tag: 279, type: LONG, values: [bytes] }, // StripByteCounts
    { tag: 282, type: RATIONAL, values: [1, 1] }, // XResolution (required in baseline grey images; no unit known)
    { tag: 283, type: RATIONAL, values: [1, 1] }, // YResolution
    { tag: 296, type: SHORT, values: [1] }, // ResolutionUnit: none
    { tag: 339, type: SHORT, values: [page.sampleFormat === 'float' ? 3 : 1] }, // SampleFormat (Section 19)
  );
  return entries;
}

/**
 * The pages as one TIFF file: header, then per page its strip and its IFD (entries sorted by tag, values longer than
 * 4 bytes after it). Little-endian ("II") unless `littleEndian` is false ("MM").
 */
export function writeTiff(
  pages: readonly TiffPage[],
  options: { littleEndian?: boolean } = {},
): Uint8Array<ArrayBuffer> {
  if (pages.length === 0) throw new Error('a TIFF needs at least one page');
  pages.forEach(checkPage);
  const le = options.littleEndian ?? true;
  // First pass: where each page's strip, IFD and out-of-line values go.
  let at = 8;
  const layout = pages.map((page) => {
    const strip = four(at);
    const stripBytes = page.width * page.height * (page.bitsPerSample / 8);
    const ifd = even(strip + stripBytes);
    const entries = entriesOf(page, strip);
    let extra = ifd + 2 + entries.length * 12 + 4;
    const outOfLine = entries.map((e) => {
      if (sizeOf(e) <= 4) return -1;
      const offset = even(extra);
      extra = offset + sizeOf(e);
      return offset;
    });
    at = extra;
    return { page, strip, ifd, entries, outOfLine };
  });
  const out = new Uint8Array(even(at));
  const view = new DataView(out.buffer);
  out[0] = out[1] = le ? 0x49 : 0x4d;
  view.setUint16(2, 42, le);
  view.setUint32(4, layout[0].ifd, le);
  const put = (type: number, offset: number, values: number[] | string) => {
    if (typeof values === 'string') {
      for (let k = 0; k < values.length; k++) out[offset + k] = values.charCodeAt(k);
      return; // the closing NUL is already 0
    }
    values.forEach((v, k) => {
      if (type === SHORT) view.setUint16(offset + 2 * k, v, le);
      else view.setUint32(offset + 4 * k, v, le);
    });
  };
  layout.forEach(({ page, strip, ifd, entries, outOfLine }, i) => {
    const { data } = page;
    const step = page.bitsPerSample / 8;
    for (let k = 0; k < data.length; k++) {
      const offset = strip + k * step;
      if (page.sampleFormat === 'float') view.setFloat32(offset, data[k], le);
      else if (step === 1) view.setUint8(offset, data[k]);
      else if (step === 2) view.setUint16(offset, data[k], le);
      else view.setUint32(offset, data[k], le);
    }
    view.setUint16(ifd, entries.length, le);
    entries.forEach((e, j) => {
      const p = ifd + 2 + j * 12;
      view.setUint16(p, e.tag, le);
      view.setUint16(p + 2, e.type, le);
      view.setUint32(p + 4, countOf(e), le);
      if (outOfLine[j] < 0) put(e.type, p + 8, e.values);
      else {
        view.setUint32(p + 8, outOfLine[j], le);
        put(e.type, outOfLine[j], e.values);
      }
    });
    view.setUint32(ifd + 2 + entries.length * 12, i + 1 < layout.length ? layout[i + 1].ifd : 0, le);
  });
  return out;
}
