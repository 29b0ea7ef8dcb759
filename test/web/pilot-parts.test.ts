// The pilot image's plain parts in Chromium: the page-to-channel proposal, the map colour ramp, the reference the page
// unmixes with, the region-means CSV and the <qdp-pilot-image> `.reference` property.
import { afterEach, describe, expect, it } from 'vitest';
import { converter } from 'culori';
import { evaluatePanel, type ChannelSpec } from '../../spectra/index';
import { mapPixels, rampColour } from '../../web/chart/map-colours';
import { regionMeansCsv } from '../../web/io/image-export';
import { modelledReference, referenceByChannel } from '../../web/state/image-reference';
import { passbandCentreNm, proposeMapping } from '../../web/state/page-mapping';
import { demoPanel } from '../../web/state/demo-panel';
import { parseCsv } from './helpers/parse-csv';

afterEach(() => document.body.replaceChildren());

const bandpass = (id: string, label: string, centerNm: number, widthNm = 20): ChannelSpec => ({
  id,
  label,
  filters: [{ type: 'bandpass', centerNm, widthNm }],
});

describe('proposeMapping', () => {
  it('proposeMapping gives page k to channel k when the file has no OME channels', () => {
    expect(proposeMapping([bandpass('a', 'A', 500), bandpass('b', 'B', 600)], 5, null)).toEqual([0, 1]);
  });

  it('proposeMapping matches OME channel names first, then the nearest emission to each passband centre', () => {
    const channels = [bandpass('c1', 'Green', 520), bandpass('c2', 'Red', 660), bandpass('c3', 'Far', 710)];
    const ome = [
      { name: 'DAPI', emissionNm: 455, excitationNm: 405 },
      { name: 'bin 700', emissionNm: 700, excitationNm: null },
      { name: 'bin 525', emissionNm: 525, excitationNm: null },
      { name: 'red', emissionNm: 900, excitationNm: null },
    ];
    // "Red" matches by name (case aside) although 900 nm is far; Green → 525 nm, Far (710) → 700 nm.
    expect(proposeMapping(channels, 4, ome)).toEqual([2, 3, 1]);
  });

  it('passbandCentreNm puts a symmetric 40 nm bandpass within 1 nm of its centre (the detector QE tilts it)', () => {
    expect(Math.abs(passbandCentreNm(bandpass('a', 'A', 550, 40))! - 550)).toBeLessThan(1);
  });
});

describe('rampColour', () => {
  it('rampColour rises in CIELAB lightness from 0 to 1 (culori), so the maps read in grey print', () => {
    const lab = converter('lab');
    const lightness = Array.from({ length: 101 }, (_, k) => {
      const [r, g, b] = rampColour(k / 100);
      return lab({ mode: 'rgb', r: r / 255, g: g / 255, b: b / 255 }).l;
    });
    for (let k = 1; k < lightness.length; k++) expect(lightness[k]).toBeGreaterThanOrEqual(lightness[k - 1]);
    // cividis spans dark blue to light yellow (Nuñez et al. 2018, Fig. 6, as remembered): L* below 20 and above 85.
    expect(lightness[0]).toBeLessThan(20);
    expect(lightness[100]).toBeGreaterThan(85);
  });

  it('mapPixels draws the smallest value darkest, the largest lightest and a missing value mid grey', () => {
    const px = mapPixels(Float32Array.from([2, 5, NaN, 8]), 2, 8);
    expect([...px.subarray(0, 4)]).toEqual([...rampColour(0), 255]);
    expect([...px.subarray(12, 16)]).toEqual([...rampColour(1), 255]);
    expect([...px.subarray(8, 12)]).toEqual([128, 128, 128, 255]);
  });
});

describe('the reference', () => {
  it('modelledReference takes column p from evaluatePanel collected[c][p], in the panel order', () => {
    const panel = demoPanel();
    const { collected } = evaluatePanel(panel);
    const ref = modelledReference(panel);
    expect(ref.channels).toEqual(['c1', 'c2', 'c3', 'c4', 'c5', 'c6']);
    expect(ref.columns.map((c) => c.probe)).toEqual(['p1', 'p2', 'p3', 'p4', 'p5', 'p6']);
    expect(ref.columns[3].values).toEqual(collected.map((row) => row[3]));
  });

  it('referenceByChannel reorders given columns to the panel channels and names a channel it lacks', () => {
    const panel = { ...demoPanel(), channels: demoPanel().channels.slice(0, 2) };
    const given = { channels: ['c2', 'c1'], columns: [{ probe: 'p1', values: [20, 10] }] };
    expect(referenceByChannel(given, panel)).toEqual({ byChannel: [[10], [20]], probes: ['p1'] });
    expect(() => referenceByChannel({ channels: ['c1'], columns: given.columns }, panel)).toThrow(
      "The reference has no values for channel 'Green'.",
    );
  });
});

describe('regionMeansCsv', () => {
  it('regionMeansCsv writes one row per region and guards a formula-like label (OWASP CSV injection advice)', () => {
    const csv = regionMeansCsv(
      ['Blue', 'Green'],
      [{ label: '=cmd', x: 1, y: 2, width: 3, height: 4, mean: [1.5, -2], sd: [0.5, 0.25], n: 12 }],
    );
    expect(parseCsv(csv)).toEqual([
      [
        'region',
        'label',
        'x px',
        'y px',
        'width px',
        'height px',
        'pixels',
        'mean Blue',
        'mean Green',
        'sd Blue',
        'sd Green',
      ],
      ['1', "'=cmd", '1', '2', '3', '4', '12', '1.5', '-2', '0.5', '0.25'],
    ]);
  });
});
