/**
 * Example instrument profiles: invented microscopes of the bundled demo (a histology group imaging six targets on
 * tissue sections), for trying instrument links. No real instrument, maker or part is described; the filter sizes are
 * generic stock sizes (filters/stock.ts) and the laser powers are typical orders of magnitude at the sample for such
 * set-ups (common practice), not measurements.
 */
import type { FilterSpec } from '../core/panel';
import type { InstrumentSpec } from './instrument';

const bandpass = (centerNm: number, widthNm: number): FilterSpec => ({ type: 'bandpass', centerNm, widthNm });

/**
 * A multiband main dichroic as a measured-style table: transmission `passT` everywhere except a reflection notch of
 * ±`halfWidthNm` around each line (transmission `notchT`), with 4 nm edges. An idealised shape of our own.
 */
function multibandDichroic(linesNm: readonly number[], halfWidthNm = 8, passT = 0.93, notchT = 0.01): FilterSpec {
  const points: [number, number][] = [[300, passT]];
  for (const nm of linesNm) {
    points.push([nm - halfWidthNm - 4, passT], [nm - halfWidthNm, notchT], [nm + halfWidthNm, notchT]);
    points.push([nm + halfWidthNm + 4, passT]);
  }
  points.push([1000, passT]);
  return { type: 'table', points };
}

/** A widefield stand with one violet LED and a six-position emission wheel: one line excites every dot. */
const VIOLET_WIDEFIELD: InstrumentSpec = {
  version: 1,
  name: 'Histology widefield, violet LED',
  description:
    'Inverted widefield stand with a single 405 nm LED, a longpass main dichroic and a six-position emission ' +
    'wheel in front of a back-illuminated camera. One line excites every quantum dot.',
  lasers: [{ name: 'violet LED', wavelengthNm: 405, powerMw: 20 }],
  dichroics: [{ name: 'main dichroic 425 LP', filter: { type: 'dichroic', edgeNm: 425, passes: 'above' } }],
  excitationFilters: [{ name: 'LED clean-up 405/10', filter: bandpass(405, 10) }],
  filters: [
    { name: '460/50', filter: bandpass(460, 50) },
    { name: '525/20', filter: bandpass(525, 20) },
    { name: '570/20', filter: bandpass(570, 20) },
    { name: '605/20', filter: bandpass(605, 20) },
    { name: '645/20', filter: bandpass(645, 20) },
    { name: '700 LP', filter: { type: 'longpass', edgeNm: 700 } },
  ],
  detectors: [{ name: 'camera', type: 'scmos-bsi' }],
  channels: [
    { id: 'blue', label: 'Blue', filters: ['460/50'], detector: 'camera' },
    { id: 'green', label: 'Green', filters: ['525/20'], detector: 'camera' },
    { id: 'yellow', label: 'Yellow', filters: ['570/20'], detector: 'camera' },
    { id: 'orange', label: 'Orange', filters: ['605/20'], detector: 'camera' },
    { id: 'red', label: 'Red', filters: ['645/20'], detector: 'camera' },
    { id: 'far-red', label: 'Far red', filters: ['700 LP'], detector: 'camera' },
  ],
};

const CONFOCAL_LINES = [405, 488, 561, 640] as const;

/** A four-line point-scanning confocal with a multiband main dichroic and three detectors. */
const FOUR_LINE_CONFOCAL: InstrumentSpec = {
  version: 1,
  name: 'Core confocal, four lines',
  description:
    'Point-scanning confocal with 405, 488, 561 and 640 nm lasers behind one multiband main dichroic, two ' +
    'multialkali photomultipliers and one GaAsP detector. Lines are switched per channel (sequential scanning).',
  lasers: [
    { name: 'violet diode', wavelengthNm: 405, powerMw: 5 },
    { name: 'blue line', wavelengthNm: 488, powerMw: 5 },
    { name: 'yellow-green line', wavelengthNm: 561, powerMw: 5 },
    { name: 'red diode', wavelengthNm: 640, powerMw: 5 },
  ],
  dichroics: [{ name: 'quad-band main dichroic', filter: multibandDichroic(CONFOCAL_LINES) }],
  filters: [
    { name: '450/50', filter: bandpass(450, 50) },
    { name: '525/50', filter: bandpass(525, 50) },
    { name: '605/40', filter: bandpass(605, 40) },
    { name: '660 LP', filter: { type: 'longpass', edgeNm: 660 } },
  ],
  detectors: [
    { name: 'PMT 1', type: 'pmt-multialkali' },
    { name: 'GaAsP 2', type: 'pmt-gaasp' },
    { name: 'PMT 3', type: 'pmt-multialkali' },
  ],
  channels: [
    { id: 'ch1', label: 'Blue (405)', filters: ['450/50'], excitationNm: 405, detector: 'PMT 1' },
    { id: 'ch2', label: 'Green (488)', filters: ['525/50'], excitationNm: 488, detector: 'GaAsP 2' },
    { id: 'ch3', label: 'Orange (561)', filters: ['605/40'], excitationNm: 561, detector: 'GaAsP 2' },
    { id: 'ch4', label: 'Far red (640)', filters: ['660 LP'], excitationNm: 640, detector: 'PMT 3' },
  ],
};

/** A teaching widefield with a near-UV LED and three channels, for a three-dot training panel. */
const UV_TEACHING: InstrumentSpec = {
  version: 1,
  name: 'Teaching widefield, near-UV LED',
  description:
    'Upright teaching microscope with a 365 nm LED, a 400 nm longpass dichroic and three emission filters in ' +
    'front of a monochrome camera.',
  lasers: [{ name: 'near-UV LED', wavelengthNm: 365, powerMw: 30 }],
  dichroics: [{ name: 'main dichroic 400 LP', filter: { type: 'dichroic', edgeNm: 400, passes: 'above' } }],
  excitationFilters: [{ name: 'LED clean-up 365/20', filter: bandpass(365, 20) }],
  filters: [
    { name: '525/40', filter: bandpass(525, 40) },
    { name: '605/40', filter: bandpass(605, 40) },
    { name: '655/40', filter: bandpass(655, 40) },
  ],
  detectors: [{ name: 'camera', type: 'scmos' }],
  channels: [
    { id: 'green', label: 'Green', filters: ['525/40'], detector: 'camera' },
    { id: 'orange', label: 'Orange', filters: ['605/40'], detector: 'camera' },
    { id: 'red', label: 'Red', filters: ['655/40'], detector: 'camera' },
  ],
};

/** The example profiles, in the order they are listed. */
export const EXAMPLE_INSTRUMENTS: readonly InstrumentSpec[] = Object.freeze([
  VIOLET_WIDEFIELD,
  FOUR_LINE_CONFOCAL,
  UV_TEACHING,
]);
