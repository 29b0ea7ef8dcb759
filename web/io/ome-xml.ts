/**
 * The parts of an OME-TIFF's OME-XML the page uses: the image size in channels, z-planes and time points, and each
 * channel's name and emission and excitation wavelengths (OME Data Model, schema 2016-06: the Pixels element's SizeC,
 * SizeZ, SizeT and its Channel elements' Name, EmissionWavelength, ExcitationWavelength and their Unit attributes,
 * nm by default; as remembered from the OME documentation, not checked against the schema file here).
 */
import { ImageReadError } from './image-read-error';

/** One channel as the OME-XML describes it; a wavelength the file does not give is null. */
export interface OmeChannel {
  name: string;
  emissionNm: number | null;
  excitationNm: number | null;
}

/** What the page takes from the OME-XML. */
export interface OmeImage {
  channels: OmeChannel[];
}

/** Nanometres per unit of the OME length units a wavelength may be given in. */
const NM_PER_UNIT: Record<string, number> = { nm: 1, µm: 1000, um: 1000, Å: 0.1, pm: 0.001 };

function wavelengthNm(el: Element, name: string): number | null {
  const text = el.getAttribute(name);
  if (text === null) return null;
  const unit = el.getAttribute(`${name}Unit`) ?? 'nm';
  const value = Number(text) * (NM_PER_UNIT[unit] ?? NaN);
  return Number.isFinite(value) && value > 0 ? value : null;
}

/** The refusal of an image with more than one plane per channel. */
function planesError(sizeZ: number, sizeT: number): ImageReadError {
  return new ImageReadError(
    `This OME-TIFF holds ${sizeZ} z-planes and ${sizeT} time points per channel; the page reads ` +
      'one plane per channel. Save one plane (or a projection) per channel and load it again.',
  );
}

/**
 * The same refusal as parseOmeXml's, read from the Pixels start tag's SizeZ and SizeT by pattern, where no XML parser
 * exists (a Web Worker has no DOMParser): lets the reader refuse a z-stack before decoding it. parseOmeXml, on the
 * page, stays the reading that counts.
 */
export function checkOmePlanes(xml: string): void {
  const tag = /<(?:\w+:)?Pixels\s[^>]*>/.exec(xml)?.[0];
  if (!tag) return;
  const size = (name: string) => Number(new RegExp(`\\s${name}\\s*=\\s*["'](\\d+)["']`).exec(tag)?.[1] ?? '1');
  if (size('SizeZ') * size('SizeT') > 1) throw planesError(size('SizeZ'), size('SizeT'));
}

/**
 * The channels of the first image of an OME-XML document, or null when the text is not readable OME-XML (the file
 * is then read as a plain TIFF). Throws when the image holds several z-planes or time points per channel, since the
 * page reads exactly one page per channel.
 */
export function parseOmeXml(xml: string, pages: number): OmeImage | null {
  const doc = new DOMParser().parseFromString(xml, 'application/xml');
  if (doc.getElementsByTagName('parsererror').length > 0) return null;
  const pixels = doc.getElementsByTagNameNS('*', 'Pixels')[0];
  if (!pixels) return null;
  const size = (name: string) => Number(pixels.getAttribute(name) ?? '1');
  const planesPerChannel = size('SizeZ') * size('SizeT');
  if (planesPerChannel > 1) throw planesError(size('SizeZ'), size('SizeT'));
  const channels = [...pixels.getElementsByTagNameNS('*', 'Channel')].map((el, i) => ({
    name: el.getAttribute('Name')?.trim() || `channel ${i + 1}`,
    emissionNm: wavelengthNm(el, 'EmissionWavelength'),
    excitationNm: wavelengthNm(el, 'ExcitationWavelength'),
  }));
  // Channel elements describe the pages only when there is one per page.
  return channels.length === pages ? { channels } : null;
}
