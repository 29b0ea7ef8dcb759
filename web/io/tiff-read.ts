/**
 * Reads a pilot image: a TIFF (TIFF 6.0, Adobe 1992) whose grey pages are the channels or lambda bins, into one
 * Float32Array plane per page. Pages may hold 8-, 16- or 32-bit unsigned integers or 32-bit floats, stored
 * uncompressed, with PackBits or with Deflate (the compressions utif2 decodes that the tests check; LZW, JPEG and the
 * others are refused by name). The chain of pages, the sizes and the strips are checked here before anything is
 * decoded, so a damaged or oversized file is refused in words before it costs memory; utif2 then decodes the strips.
 * An OME-TIFF's OME-XML (ImageDescription of the first page) gives the channel names and wavelengths.
 */
import UTIF from 'utif2';
import { LIMITS } from '../../spectra/index';
import { ImageReadError } from './image-read-error';
import { parseOmeXml, type OmeImage } from './ome-xml';

export { ImageReadError };

/** A decoded pilot image: one plane per page, row by row from the top left. */
export interface PilotImage {
  width: number;
  height: number;
  planes: Float32Array[];
  /** How the values were stored, e.g. "16-bit unsigned". */
  storedAs: string;
  /** The OME-XML's channels, when the file is an OME-TIFF (and its XML has been read, see `readOme`). */
  ome: OmeImage | null;
  /** The OME-XML itself, when the file is an OME-TIFF. */
  omeXml: string | null;
}

/** Compression codes (TIFF 6.0, Sections 3, 9, 10, 11 and 22; TIFF Technical Notes for 8 and 32946). */
const COMPRESSIONS: Record<number, string> = {
  1: 'none',
  2: 'CCITT modified Huffman',
  3: 'CCITT Group 3 fax',
  4: 'CCITT Group 4 fax',
  5: 'LZW',
  6: 'old-style JPEG',
  7: 'JPEG',
  8: 'Deflate',
  32773: 'PackBits',
  32946: 'Deflate',
  34712: 'JPEG 2000',
  34925: 'LZMA',
  50000: 'Zstandard',
};
/** What this reader decodes: none, PackBits and Deflate (both codes). */
const SUPPORTED_COMPRESSIONS = new Set([1, 8, 32773, 32946]);

const MIB = 2 ** 20;
/** The largest file read at all: a quarter of the image budget (LIMITS.imageBytes). */
export const MAX_IMAGE_FILE_BYTES = LIMITS.imageBytes / 4;

/** Refuses a file larger than MAX_IMAGE_FILE_BYTES before it is read. */
export function checkImageFileSize(bytes: number): void {
  if (bytes > MAX_IMAGE_FILE_BYTES)
    throw new ImageReadError(
      `This file is ${(bytes / MIB).toFixed(0)} MiB; the page reads images up to ${MAX_IMAGE_FILE_BYTES / MIB} MiB. ` +
        'Crop it to the region of interest or bin it, then load it again.',
    );
}

const TRUNCATED = 'The file ends early: it may be truncated (an interrupted download or copy). Save or copy it again.';

/** Walks the chain of page directories (IFDs), refusing a cycle or an offset past the end; returns the count. */
function countPages(bytes: Uint8Array, le: boolean): number {
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const seen = new Set<number>();
  let offset = view.getUint32(4, le);
  while (offset !== 0) {
    if (offset + 2 > bytes.length) throw new ImageReadError(TRUNCATED);
    if (seen.has(offset)) throw new ImageReadError('The file is damaged: its list of pages loops back on itself.');
    seen.add(offset);
    if (seen.size > LIMITS.imagePages)
      throw new ImageReadError(`The image has more than ${LIMITS.imagePages} pages; the page reads at most that many.`);
    const entries = view.getUint16(offset, le);
    if (offset + 2 + entries * 12 + 4 > bytes.length) throw new ImageReadError(TRUNCATED);
    offset = view.getUint32(offset + 2 + entries * 12, le);
  }
  if (seen.size === 0) throw new ImageReadError('The file holds no image pages.');
  return seen.size;
}

const first = (ifd: UTIF.IFD, tag: number): number | undefined => {
  const v = ifd[`t${tag}`];
  return Array.isArray(v) ? (v[0] as number) : undefined;
};
const list = (ifd: UTIF.IFD, tag: number): number[] => {
  const v = ifd[`t${tag}`];
  return Array.isArray(v) ? (v as number[]) : [];
};

interface PageShape {
  width: number;
  height: number;
  bits: number;
  float: boolean;
  compression: number;
}

/** Checks one page's tags against what the reader decodes; returns its shape. */
function checkPage(ifd: UTIF.IFD, n: number): PageShape {
  const page = `Page ${n}`;
  const width = first(ifd, 256) ?? 0;
  const height = first(ifd, 257) ?? 0;
  if (!(width > 0 && height > 0)) throw new ImageReadError(`${page} has no image size: the file may be damaged.`);
  const samples = first(ifd, 277) ?? 1;
  const photometric = first(ifd, 262) ?? 1;
  if (samples !== 1 || photometric === 2 || photometric === 3)
    throw new ImageReadError(
      `${page} is a colour image; the page reads grey pages only, one page per channel. ` +
        'Save each channel as its own grey page.',
    );
  if (photometric !== 1)
    throw new ImageReadError(`${page} is not stored as black-is-zero grey values, which the page reads.`);
  const bitList = list(ifd, 258);
  const bits = bitList[0] ?? 1;
  const format = first(ifd, 339) ?? 1;
  if (format === 2) throw new ImageReadError(`${page} holds signed integers; the page reads unsigned or float values.`);
  if (![8, 16, 32].includes(bits) || (format !== 1 && format !== 3) || (format === 3 && bits !== 32))
    throw new ImageReadError(
      `${page} holds ${bits}-bit values of a kind the page does not read; it reads 8-, 16- or 32-bit unsigned ` +
        'integers and 32-bit floats.',
    );
  const compression = first(ifd, 259) ?? 1;
  if (!SUPPORTED_COMPRESSIONS.has(compression))
    throw new ImageReadError(
      `${page} is compressed with ${COMPRESSIONS[compression] ?? `compression code ${compression}`}, which the page ` +
        'does not read. Save the image uncompressed (or with Deflate or PackBits) and load it again.',
    );
  const predictor = first(ifd, 317) ?? 1;
  if (predictor !== 1 && !(predictor === 2 && bits <= 16))
    throw new ImageReadError(`${page} uses a compression predictor the page does not read; save it without one.`);
  if (ifd.t322 !== undefined)
    throw new ImageReadError(`${page} is stored in tiles; the page reads images stored in strips (the usual way).`);
  return { width, height, bits, float: format === 3, compression };
}

/** Refuses a page whose strips reach past the end of the file. */
function checkStrips(ifd: UTIF.IFD, shape: PageShape, n: number, fileBytes: number): void {
  const { width, height, bits, compression } = shape;
  const offsets = list(ifd, 273);
  const counts = list(ifd, 279);
  if (offsets.length === 0 || offsets.length !== counts.length)
    throw new ImageReadError(`Page ${n} has no readable pixel data: the file may be damaged.`);
  const rowBytes = (width * bits) / 8;
  const rowsPerStrip = Math.min(first(ifd, 278) ?? height, height);
  offsets.forEach((offset, s) => {
    // Uncompressed strips must hold their rows whatever the byte count says (utif2 reads them so).
    const rows = Math.min(rowsPerStrip, height - s * rowsPerStrip);
    if (compression === 1 && counts[s] < rows * rowBytes)
      throw new ImageReadError(`Page ${n} holds fewer pixels than its size says: the file may be damaged.`);
    const need = compression === 1 ? rows * rowBytes : counts[s];
    if (offset + need > fileBytes) throw new ImageReadError(TRUNCATED);
  });
}

/** Values of a decoded strip buffer as floats (utif2 gives 16-bit values little-endian, 32-bit as stored). */
function toPlane(bytes: Uint8Array, shape: PageShape, fileLittleEndian: boolean, n: number): Float32Array {
  const pixels = shape.width * shape.height;
  if (bytes.length < (pixels * shape.bits) / 8)
    throw new ImageReadError(`Page ${n} holds fewer pixels than its size says: the file may be damaged.`);
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const plane = new Float32Array(pixels);
  if (shape.bits === 8) plane.set(bytes.subarray(0, pixels));
  else if (shape.bits === 16) for (let k = 0; k < pixels; k++) plane[k] = view.getUint16(2 * k, true);
  else if (shape.float) for (let k = 0; k < pixels; k++) plane[k] = view.getFloat32(4 * k, fileLittleEndian);
  else for (let k = 0; k < pixels; k++) plane[k] = view.getUint32(4 * k, fileLittleEndian);
  return plane;
}

/** How readTiff reports progress and reads the OME-XML. */
export interface ReadOptions {
  /** Hears after each page is decoded (for a progress bar). */
  onPage?: (decoded: number, pages: number) => void;
  /**
   * Reads the OME-XML before any page is decoded, throwing an ImageReadError to refuse the file; parseOmeXml unless
   * given (a Web Worker, which has no XML parser, gives checkOmePlanes and null, and the page reads it after).
   */
  readOme?: (xml: string, pages: number) => OmeImage | null;
}

/**
 * Decodes a pilot image, or throws an ImageReadError saying what is wrong: not a TIFF, truncated, a compression or
 * value type it does not read, pages of different sizes or value types, or more memory than LIMITS.imageBytes
 * (checked before decoding).
 */
export function readTiff(buffer: ArrayBuffer, options: ReadOptions = {}): PilotImage {
  const { onPage, readOme = parseOmeXml } = options;
  checkImageFileSize(buffer.byteLength);
  const bytes = new Uint8Array(buffer);
  const mark = String.fromCharCode(bytes[0] ?? 0, bytes[1] ?? 0);
  if (bytes.length < 8 || (mark !== 'II' && mark !== 'MM'))
    throw new ImageReadError('This file is not a TIFF image. Load a multi-page TIFF with one grey page per channel.');
  const le = mark === 'II';
  const version = new DataView(buffer).getUint16(2, le);
  if (version === 43) throw new ImageReadError('This is a BigTIFF file, which the page does not read. Save as TIFF.');
  if (version !== 42) throw new ImageReadError('This file is not a TIFF image: its header is damaged.');
  const pages = countPages(bytes, le);
  let ifds: UTIF.IFD[];
  try {
    // utif2 takes an options object its type declarations leave out: no maker notes, no debug output.
    const decode = UTIF.decode as (b: ArrayBuffer, options: { parseMN: boolean; debug: boolean }) => UTIF.IFD[];
    ifds = decode(buffer, { parseMN: false, debug: false });
  } catch {
    throw new ImageReadError('The file could not be read as TIFF: it may be damaged.');
  }
  if (ifds.length !== pages) throw new ImageReadError('The file could not be read as TIFF: it may be damaged.');
  const shapes = ifds.map((ifd, i) => checkPage(ifd, i + 1));
  const one = shapes[0];
  shapes.forEach((s, i) => {
    if (s.width !== one.width || s.height !== one.height)
      throw new ImageReadError(
        `Page ${i + 1} is ${s.width} × ${s.height} pixels but page 1 is ${one.width} × ${one.height}: ` +
          'every channel must be the same size.',
      );
    if (s.bits !== one.bits || s.float !== one.float)
      throw new ImageReadError(
        `Page ${i + 1} holds ${s.bits}-bit values but page 1 ${one.bits}-bit: ` +
          'every channel must be stored the same way.',
      );
  });
  const needBytes = one.width * one.height * pages * 4 * 4;
  if (needBytes > LIMITS.imageBytes)
    throw new ImageReadError(
      `This image (${one.width} × ${one.height} pixels, ${pages} pages) would need about ` +
        `${(needBytes / MIB).toFixed(0)} MiB to unmix; the page allows ${LIMITS.imageBytes / MIB} MiB. ` +
        'Crop it or bin it, then load it again.',
    );
  ifds.forEach((ifd, i) => checkStrips(ifd, shapes[i], i + 1, bytes.length));
  const description = ifds[0].t270;
  const text = Array.isArray(description) ? String(description[0]) : '';
  // utif2 gives one character per byte; OME-XML is UTF-8 (OME schema 2016-06), e.g. the "µ" of µm.
  const ome = /<(?:\w+:)?OME[\s>]/.test(text)
    ? new TextDecoder().decode(Uint8Array.from(text, (c) => c.charCodeAt(0)))
    : null;
  const omeImage = ome === null ? null : readOme(ome, pages);
  const planes = ifds.map((ifd, i) => {
    try {
      UTIF.decodeImage(buffer, ifd);
    } catch {
      throw new ImageReadError(`Page ${i + 1} could not be decoded: the file may be damaged.`);
    }
    const plane = toPlane(ifd.data, shapes[i], le, i + 1);
    onPage?.(i + 1, pages);
    return plane;
  });
  const storedAs = one.float ? '32-bit float' : `${one.bits}-bit unsigned`;
  return { width: one.width, height: one.height, planes, storedAs, ome: omeImage, omeXml: ome };
}
