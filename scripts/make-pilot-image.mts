/**
 * Builds the demo pilot image: an invented 80 × 80 pixel field of four cells for the demo panel
 * (web/state/demo-panel.ts), one 16-bit page per channel as an OME-TIFF, and beside it the true abundances (32-bit
 * float, one page per probe).
 * Each pixel's expected counts are the panel's own modelled collected signal (evaluatePanel's `collected`,
 * [channel][probe]) with the demo lot's one deviation (DEMO_LOT_DEVIATION, the same the demo controls carry), times the
 * true abundances; the counts are then drawn from a Poisson distribution with a seeded
 * generator (spectra/core/random.ts), so the file is the same on every run.
 *
 * Run: npx tsx scripts/make-pilot-image.mts  →  web/public/demo/pilot-image.ome.tif and pilot-image-truth.tif
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import { createRandom, evaluatePanel } from '../spectra/index.ts';
import { demoLotCollected, demoPanel } from '../web/state/demo-panel.ts';
import { passbandCentreNm } from '../web/state/page-mapping.ts';
import { writeTiff } from '../web/io/tiff-write.ts';

const SIZE = 80;
const SEED = 20261203;
/** Expected counts of a probe in its brightest channel at abundance map value 1 (an invented, well-exposed level). */
const PEAK_COUNTS = 1500;

const panel = demoPanel();
const collected = demoLotCollected(panel, evaluatePanel(panel).collected);
const channels = panel.channels.length;
const probes = panel.probes.length;

/** Four invented cells: centre, radius (px) and nucleus offset. */
const CELLS = [
  { x: 22, y: 22, r: 15, nx: 2, ny: -1 },
  { x: 57, y: 20, r: 13, nx: -2, ny: 2 },
  { x: 25, y: 58, r: 14, nx: 1, ny: 1 },
  { x: 58, y: 56, r: 16, nx: -1, ny: -2 },
];

/** Smooth step from 1 inside to 0 outside over about one pixel. */
const inside = (d: number, edge: number) => 1 / (1 + Math.exp((d - edge) / 0.6));
/** A ring of the given radius and half-width. */
const ring = (d: number, radius: number, half: number) => Math.exp(-(((d - radius) / half) ** 2));

/**
 * Every probe's level off its target (non-specific binding, invented): it keeps each channel at tens of counts or more
 * everywhere, where Poisson noise is close to normal.
 */
const FLOOR = 0.03;

/** The invented abundance maps, FLOOR–1, one per probe in the demo panel's order. */
function maps(x: number, y: number): number[] {
  const a = new Array<number>(probes).fill(0);
  for (const c of CELLS) {
    const d = Math.hypot(x - c.x, y - c.y);
    const dn = Math.hypot(x - c.x - c.nx, y - c.y - c.ny);
    const nucleus = 0.45 * c.r;
    a[0] = Math.max(a[0], inside(dn, nucleus)); // nuclear stain fills the nucleus
    a[1] = Math.max(a[1], ring(dn, nucleus, 1.2)); // envelope: the nucleus's rim
    // Mitochondria: small spots in the cytoplasm at fixed angles.
    for (let k = 0; k < 7; k++) {
      const angle = (k * 2 * Math.PI) / 7 + c.r;
      const rr = nucleus + 0.45 * (c.r - nucleus) + 1.5 * Math.sin(k * 1.7);
      a[2] = Math.max(
        a[2],
        Math.exp(-(Math.hypot(x - c.x - rr * Math.cos(angle), y - c.y - rr * Math.sin(angle)) ** 2) / 2),
      );
    }
    // Cytoskeleton: faint fibres across the cytoplasm.
    const fibre = Math.abs(Math.sin((x - c.x) * 0.9 + (y - c.y) * 0.4));
    a[3] = Math.max(a[3], d < c.r - 1.5 && dn > nucleus + 1.5 ? 0.6 * Math.exp(-((fibre / 0.25) ** 2)) : 0);
    a[5] = Math.max(a[5], ring(d, c.r, 1)); // membrane: the cell's edge
  }
  // A vessel wall: one sparse curved band across the field.
  const band = y - (40 + 12 * Math.sin(x / 14));
  a[4] = 0.8 * Math.exp(-((band / 1.5) ** 2)) * (x > 8 && x < 72 ? 1 : 0);
  return a.map((v) => Math.max(FLOOR, v));
}

// Each probe's scale: PEAK_COUNTS in its brightest channel at map value 1.
const scale = panel.probes.map((_, p) => PEAK_COUNTS / Math.max(...collected.map((row) => row[p])));
const pixels = SIZE * SIZE;
const truth = panel.probes.map(() => new Float32Array(pixels));
for (let y = 0; y < SIZE; y++)
  for (let x = 0; x < SIZE; x++) maps(x, y).forEach((v, p) => (truth[p][y * SIZE + x] = v * scale[p]));

const random = createRandom(SEED);
const counts = Array.from({ length: channels }, () => new Uint16Array(pixels));
for (let k = 0; k < pixels; k++)
  for (let c = 0; c < channels; c++) {
    let mean = 0;
    for (let p = 0; p < probes; p++) mean += collected[c][p] * truth[p][k];
    counts[c][k] = Math.min(65535, random.poisson(mean));
  }

// OME-XML (OME Data Model, schema 2016-06, as remembered): one channel per page, named as the panel's channels, with
// the passband centre as emission wavelength.
const omeChannels = panel.channels
  .map((ch, c) => {
    const centre = passbandCentreNm(ch);
    const emission = centre === null ? '' : ` EmissionWavelength="${centre.toFixed(0)}" EmissionWavelengthUnit="nm"`;
    const excitation = ch.excitationNm
      ? ` ExcitationWavelength="${ch.excitationNm}" ExcitationWavelengthUnit="nm"`
      : '';
    return `<Channel ID="Channel:0:${c}" Name="${ch.label ?? ch.id}" SamplesPerPixel="1"${emission}${excitation}/>`;
  })
  .join('');
const tiffData = panel.channels.map(
  (_, c) => `<TiffData FirstC="${c}" FirstZ="0" FirstT="0" IFD="${c}" PlaneCount="1"/>`,
);
const ome =
  '<?xml version="1.0" encoding="UTF-8"?>' +
  '<OME xmlns="http://www.openmicroscopy.org/Schemas/OME/2016-06">' +
  '<Image ID="Image:0" Name="Invented demo pilot image"><Pixels ID="Pixels:0" DimensionOrder="XYCZT" Type="uint16" ' +
  `SizeX="${SIZE}" SizeY="${SIZE}" SizeC="${channels}" SizeZ="1" SizeT="1" BigEndian="false">` +
  omeChannels +
  tiffData.join('') +
  '</Pixels></Image></OME>';

const image = writeTiff(
  counts.map((data, c) => ({
    width: SIZE,
    height: SIZE,
    bitsPerSample: 16,
    sampleFormat: 'uint',
    data,
    ...(c === 0 ? { description: ome } : {}),
  })),
);
const truthFile = writeTiff(
  truth.map((data, p) => ({
    width: SIZE,
    height: SIZE,
    bitsPerSample: 32,
    sampleFormat: 'float',
    data,
    description: `true abundance of ${panel.probes[p].id} in units of its reference column`,
  })),
);
const dir = new URL('../web/public/demo/', import.meta.url);
mkdirSync(dir, { recursive: true });
writeFileSync(new URL('pilot-image.ome.tif', dir), image);
writeFileSync(new URL('pilot-image-truth.tif', dir), truthFile);
console.log(`pilot-image.ome.tif ${image.length} bytes, pilot-image-truth.tif ${truthFile.length} bytes`);
