// Reading and writing the pilot image's TIFF pages in Chromium, against hand-built bytes (TIFF 6.0) and utif2.
import { describe, expect, it } from 'vitest';
import { zlibSync } from 'fflate';
import UTIF from 'utif2';
import { LIMITS } from '../../spectra/index';
import { checkOmePlanes } from '../../web/io/ome-xml';
import { checkImageFileSize, readTiff } from '../../web/io/tiff-read';
import { writeTiff, type TiffPage } from '../../web/io/tiff-write';
import { greyEntries, handTiff, packBits } from './helpers/hand-tiff';

const buf = (bytes: Uint8Array): ArrayBuffer => Uint8Array.from(bytes).buffer;
const page = (bits: 8 | 16 | 32, data: number[], format: 'uint' | 'float' = 'uint'): TiffPage => ({
  width: 3,
  height: 2,
  bitsPerSample: bits,
  sampleFormat: format,
  data,
});
const refusal = (bytes: Uint8Array) => {
  try {
    readTiff(buf(bytes));
  } catch (err) {
    return (err as Error).message;
  }
  return 'read without a refusal';
};

describe('readTiff', () => {
  it('readTiff returns a hand-built big-endian 16-bit 2 × 2 page (TIFF 6.0, Section 2) as its four values', () => {
    // Header "MM", 42, IFD at 16; strip of four big-endian values at 8: 1, 256, 65535, 4660 (0x1234).
    const strip = Uint8Array.from([0, 1, 1, 0, 255, 255, 0x12, 0x34]);
    const bytes = handTiff([{ entries: greyEntries(2, 2, 16), strips: [strip] }], false);
    const image = readTiff(buf(bytes));
    expect([image.width, image.height, image.storedAs]).toEqual([2, 2, '16-bit unsigned']);
    expect([...image.planes[0]]).toEqual([1, 256, 65535, 4660]);
  });

  it('readTiff reads 8-, 16-, 32-bit unsigned and 32-bit float pages, little- and big-endian, value for value', () => {
    const cases: [TiffPage, string][] = [
      [page(8, [0, 1, 127, 128, 254, 255]), '8-bit unsigned'],
      [page(16, [0, 1, 255, 256, 40000, 65535]), '16-bit unsigned'],
      [page(32, [0, 1, 65536, 2 ** 31, 4e9, 2 ** 32 - 1]), '32-bit unsigned'],
      [page(32, [0, -1.5, 0.1, 3.4e38, -1e-30, 12345.678], 'float'), '32-bit float'],
    ];
    for (const [p, storedAs] of cases)
      for (const littleEndian of [true, false]) {
        const image = readTiff(buf(writeTiff([p, { ...p, data: Array.from(p.data).reverse() }], { littleEndian })));
        expect(image.storedAs).toBe(storedAs);
        // Float32 holds every 8- and 16-bit value exactly; 32-bit values are compared after the same rounding.
        expect([...image.planes[0]]).toEqual([...Float32Array.from(p.data)]);
        expect([...image.planes[1]]).toEqual([...Float32Array.from(p.data)].reverse());
      }
  });

  it('readTiff gives the same 16-bit values as utif2 decodeImage does for the same file', () => {
    const data = Array.from({ length: 6 }, (_, k) => k * 9001);
    const bytes = writeTiff([page(16, data)]);
    const [ifd] = UTIF.decode(buf(bytes));
    UTIF.decodeImage(buf(bytes), ifd);
    const theirs = new Uint16Array(ifd.data.buffer, ifd.data.byteOffset, 6);
    expect([...readTiff(buf(bytes)).planes[0]]).toEqual([...theirs]);
  });

  it('readTiff reads PackBits (TIFF 6.0, Section 9) and Deflate pages, also with the horizontal predictor', () => {
    const values = [7, 7, 7, 7, 9, 200, 3, 3];
    const packed = packBits(Uint8Array.from(values));
    const packedFile = handTiff([{ entries: greyEntries(4, 2, 8, { compression: 32773 }), strips: [packed] }]);
    expect([...readTiff(buf(packedFile)).planes[0]]).toEqual(values);
    // Deflate of 16-bit little-endian values (code 8, zlib stream: TIFF Technical Note, Adobe 2002, as remembered).
    const wide = Uint16Array.from([1000, 2000, 65535, 0, 12, 13, 14, 15]);
    const deflated = zlibSync(new Uint8Array(wide.buffer));
    const deflateFile = handTiff([{ entries: greyEntries(4, 2, 16, { compression: 8 }), strips: [deflated] }]);
    expect([...readTiff(buf(deflateFile)).planes[0]]).toEqual([...wide]);
    // Predictor 2 (TIFF 6.0, Section 14): each row stores differences from the pixel on its left, modulo 2^16.
    const diffs = Uint16Array.from([1000, 1000, 63535, 1, 12, 1, 1, 1]);
    const predicted = handTiff([
      {
        entries: greyEntries(4, 2, 16, { compression: 8, extra: [{ tag: 317, type: 3, values: [2] }] }),
        strips: [zlibSync(new Uint8Array(diffs.buffer))],
      },
    ]);
    expect([...readTiff(buf(predicted)).planes[0]]).toEqual([...wide]);
  });

  it('readTiff reads the OME-XML channel names and wavelengths of an OME-TIFF (OME schema 2016-06)', () => {
    const xml =
      '<?xml version="1.0" encoding="UTF-8"?><OME xmlns="http://www.openmicroscopy.org/Schemas/OME/2016-06">' +
      '<Image ID="Image:0"><Pixels ID="Pixels:0" DimensionOrder="XYCZT" Type="uint8" SizeX="3" SizeY="2" ' +
      'SizeC="2" SizeZ="1" SizeT="1"><Channel ID="Channel:0:0" Name="Green" EmissionWavelength="520" ' +
      'ExcitationWavelength="488" EmissionWavelengthUnit="nm"/><Channel ID="Channel:0:1" Name="Far red" ' +
      'EmissionWavelength="0.72" EmissionWavelengthUnit="µm"/></Pixels></Image></OME>';
    // The writer keeps to ASCII (TIFF 6.0 type 2); OME-XML is UTF-8, so "~~" is swapped for the bytes of "µ" (C2 B5).
    const p = page(8, [1, 2, 3, 4, 5, 6]);
    const bytes = writeTiff([{ ...p, description: xml.replace('µm', '~~m') }, p]);
    const at = bytes.findIndex((b, k) => b === 0x7e && bytes[k + 1] === 0x7e);
    bytes.set([0xc2, 0xb5], at);
    const image = readTiff(buf(bytes));
    expect(image.ome?.channels).toEqual([
      { name: 'Green', emissionNm: 520, excitationNm: 488 },
      { name: 'Far red', emissionNm: 720, excitationNm: null },
    ]);
  });
});

describe('readTiff refusals', () => {
  const p = page(16, [1, 2, 3, 4, 5, 6]);

  it('readTiff refuses a file that is not a TIFF, saying so', () => {
    expect(refusal(new TextEncoder().encode('channel,value\n1,2\n'))).toMatch(/^This file is not a TIFF image/);
  });

  it('readTiff refuses an LZW and a JPEG page naming the compression', () => {
    for (const [code, name] of [
      [5, 'LZW'],
      [7, 'JPEG'],
    ] as const) {
      const bytes = handTiff([{ entries: greyEntries(3, 2, 8, { compression: code }), strips: [new Uint8Array(6)] }]);
      expect(refusal(bytes)).toBe(
        `Page 1 is compressed with ${name}, which the page does not read. Save the image uncompressed (or with ` +
          'Deflate or PackBits) and load it again.',
      );
    }
  });

  it('readTiff refuses a truncated file as ending early', () => {
    const whole = writeTiff([p, p, p]);
    for (const cut of [whole.length - 30, 40, 12])
      expect(refusal(whole.subarray(0, cut))).toMatch(/^The file ends early: it may be truncated/);
    // Directories first, pixels after them (as many microscope programs write): the cut falls in the last strip.
    const page16 = { entries: greyEntries(3, 2, 16), strips: [new Uint8Array(12)] };
    const ifdFirst = handTiff([page16, page16], true, true);
    expect(refusal(ifdFirst.subarray(0, ifdFirst.length - 4))).toMatch(/^The file ends early/);
    expect(readTiff(buf(ifdFirst)).planes).toHaveLength(2);
  });

  it('readTiff refuses an uncompressed page whose strip holds fewer bytes than its size needs', () => {
    const short = handTiff([{ entries: greyEntries(3, 2, 16), strips: [new Uint8Array(8)] }]);
    expect(refusal(short)).toBe('Page 1 holds fewer pixels than its size says: the file may be damaged.');
  });

  it('readTiff refuses pages of different bit depths or sizes, naming the page', () => {
    expect(refusal(writeTiff([p, page(8, [1, 2, 3, 4, 5, 6])]))).toBe(
      'Page 2 holds 8-bit values but page 1 16-bit: every channel must be stored the same way.',
    );
    const wide: TiffPage = { ...p, width: 6, height: 1 };
    expect(refusal(writeTiff([p, p, wide]))).toBe(
      'Page 3 is 6 × 1 pixels but page 1 is 3 × 2: every channel must be the same size.',
    );
  });

  it('readTiff refuses a colour page, a tiled page and signed integers in words', () => {
    const rgb = greyEntries(1, 1, 8).map((e) => (e.tag === 277 ? { ...e, values: [3] } : e));
    expect(refusal(handTiff([{ entries: rgb, strips: [new Uint8Array(3)] }]))).toMatch(/^Page 1 is a colour image/);
    const tiled = greyEntries(1, 1, 8, { extra: [{ tag: 322, type: 4, values: [16] }] });
    expect(refusal(handTiff([{ entries: tiled, strips: [new Uint8Array(1)] }]))).toMatch(/stored in tiles/);
    const signed = greyEntries(1, 1, 16, { format: 2 });
    expect(refusal(handTiff([{ entries: signed, strips: [new Uint8Array(2)] }]))).toMatch(/signed integers/);
  });

  it('readTiff refuses an image past the memory budget before decoding, stating the limit', () => {
    // 8192 × 8192 × 2 pages × 4 bytes × 4 = 2 GiB > 1 GiB; the strips are a few bytes, so nothing could decode.
    const big = { entries: greyEntries(8192, 8192, 8), strips: [new Uint8Array(2)] };
    expect(LIMITS.imageBytes).toBe(2 ** 30);
    expect(refusal(handTiff([big, big]))).toBe(
      'This image (8192 × 8192 pixels, 2 pages) would need about 2048 MiB to unmix; the page allows 1024 MiB. ' +
        'Crop it or bin it, then load it again.',
    );
    expect(() => checkImageFileSize(300 * 2 ** 20)).toThrow(
      'This file is 300 MiB; the page reads images up to 256 MiB. Crop it to the region of interest or bin it',
    );
  });

  it('readTiff refuses an OME-TIFF with several z-planes per channel', () => {
    const xml =
      '<OME xmlns="http://www.openmicroscopy.org/Schemas/OME/2016-06"><Image ID="Image:0"><Pixels ID="Pixels:0" ' +
      'SizeC="1" SizeZ="2" SizeT="1"/></Image></OME>';
    expect(refusal(writeTiff([{ ...p, description: xml }, p]))).toMatch(/holds 2 z-planes and 1 time points/);
  });

  it("the reader worker's pattern check refuses a z-stack or time series as parseOmeXml does, before decoding", () => {
    let decoded = 0;
    const inWorker = (xml: string) => {
      try {
        readTiff(buf(writeTiff([{ ...p, description: xml }, p])), {
          onPage: () => decoded++,
          readOme: (text) => (checkOmePlanes(text), null),
        });
      } catch (err) {
        return (err as Error).message;
      }
      return 'read without a refusal';
    };
    const ome = (attributes: string) =>
      '<OME xmlns="http://www.openmicroscopy.org/Schemas/OME/2016-06"><Image ID="Image:0">' +
      `<Pixels ID="Pixels:0" SizeC="1" ${attributes}/></Image></OME>`;
    const prefixed =
      '<ome:OME xmlns:ome="http://www.openmicroscopy.org/Schemas/OME/2016-06"><ome:Image ID="Image:0">' +
      '<ome:Pixels ID="Pixels:0" SizeC="1" SizeZ="4"/></ome:Image></ome:OME>';
    expect(inWorker(ome('SizeZ="2" SizeT="1"'))).toBe(refusal(writeTiff([{ ...p, description: ome('SizeZ="2"') }, p])));
    expect(inWorker(ome("SizeT = '3'"))).toMatch(/holds 1 z-planes and 3 time points/);
    expect(inWorker(prefixed)).toBe(refusal(writeTiff([{ ...p, description: prefixed }, p])));
    expect(decoded).toBe(0);
    expect(inWorker(ome('SizeZ="1" SizeT="1"'))).toBe('read without a refusal');
    expect(decoded).toBe(2);
  });
});

describe('writeTiff', () => {
  it('writeTiff writes 32-bit float pages that utif2 reads back bit for bit, with the TIFF 6.0 baseline tags', () => {
    const values = [Math.PI, -0, -2.5e-7, 1e30, Number.MIN_VALUE, 65504.125];
    const data = Float32Array.from(values);
    const bytes = writeTiff([
      { ...page(32, [...data], 'float'), description: 'abundance of p1 (Nuclear stain)' },
      { ...page(32, [...data].reverse(), 'float'), description: 'residual' },
    ]);
    const ifds = UTIF.decode(buf(bytes));
    expect(ifds).toHaveLength(2);
    for (const [i, ifd] of ifds.entries()) {
      UTIF.decodeImage(buf(bytes), ifd);
      // TIFF 6.0: BitsPerSample 32, no compression, BlackIsZero, one strip, SampleFormat 3 (IEEE float, Section 19).
      expect([ifd.t258, ifd.t259, ifd.t262, ifd.t277, ifd.t339]).toEqual([[32], [1], [1], [1], [3]]);
      expect((ifd.t273 as number[]).length).toBe(1);
      const back = new Uint32Array(ifd.data.slice().buffer, 0, 6);
      const want = new Uint32Array((i === 0 ? data : data.slice().reverse()).buffer);
      expect([...back]).toEqual([...want]);
    }
    expect(ifds.map((d) => d.t270)).toEqual([['abundance of p1 (Nuclear stain)'], ['residual']]);
  });
});
