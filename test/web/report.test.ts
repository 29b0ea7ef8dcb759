import { describe, expect, it } from 'vitest';
import { listDetectors, listMaterials, type PanelSpec } from '../../spectra/index';
import { reportChannelRows, reportHazards, reportLink, reportProbeRows, reportSettings } from '../../web/state/report';

const MATERIALS = listMaterials();
const DETECTORS = listDetectors();

/** A small panel: a CdSe/ZnS dot and a bare InP dot, two lines, two channels, every setting set by hand. */
function smallPanel(): PanelSpec {
  return {
    title: 'Two targets',
    excitation: [{ wavelengthNm: 405 }, { wavelengthNm: 488, powerRel: 0.5 }],
    probes: [
      {
        id: 'p1',
        label: 'Green',
        material: 'cdse',
        emissionPeakNm: 525,
        shell: [{ material: 'zns', thicknessNm: 0.9 }],
        quantumYield: 0.5,
        target: 'actin',
        abundance: 2,
      },
      { id: 'p2', material: 'inp', emissionPeakNm: 620, fwhmNm: 50 },
    ],
    channels: [
      { id: 'c1', label: 'G', filters: [{ type: 'bandpass', centerNm: 525, widthNm: 40 }], excitationNm: 405 },
      {
        id: 'c2',
        filters: [
          { type: 'longpass', edgeNm: 600 },
          { type: 'bandpass', centerNm: 620, widthNm: 20 },
        ],
        detector: 'pmt-gaasp',
      },
    ],
    background: { level: 0.1, preset: 'ffpe-tissue' },
    waterRaman: { level: 0.2 },
    scatterLevel: 1e8,
    exclude: ['lead'],
    lightPath: { emissionFilters: [{ type: 'longpass', edgeNm: 420 }] },
  };
}

describe('report rows', () => {
  it('probe rows: label or id, target, core / shell by name, resolved peak, FWHM and QY rounded, abundance', () => {
    const resolved = [{ emissionPeakNm: 525.04, fwhmNm: 30.26, quantumYield: 0.5 }, undefined];
    expect(reportProbeRows(smallPanel(), resolved, MATERIALS)).toEqual([
      {
        label: 'Green',
        target: 'actin',
        material: 'CdSe / ZnS 0.9 nm',
        emissionPeakNm: 525,
        fwhmNm: 30.3,
        quantumYield: 0.5,
        abundance: 2,
      },
      // No evaluation for this probe: its own fields, and no quantum yield it did not state.
      { label: 'p2', target: '', material: 'InP', emissionPeakNm: 620, fwhmNm: 50, quantumYield: null, abundance: 1 },
    ]);
  });

  it('a dye probe is named by its dye', () => {
    const panel: PanelSpec = { ...smallPanel(), probes: [{ id: 'd', label: 'Nuclei', material: 'dye', dye: 'dapi' }] };
    expect(reportProbeRows(panel, [], MATERIALS)[0].material).toBe('DAPI (4′,6-diamidino-2-phenylindole)');
  });

  it('channel rows: label or id, filters as ordered ("bandpass 525/40"), the lines on while read', () => {
    expect(reportChannelRows(smallPanel())).toEqual([
      { label: 'G', filters: 'bandpass 525/40', excitation: '405 nm' },
      { label: 'c2', filters: 'longpass 600 + bandpass 620/20', excitation: 'all lines' },
    ]);
  });
});

describe('report settings', () => {
  it('lists lines and powers, background, water Raman, scatter, blocking, shared path, exclusions, detectors', () => {
    expect(reportSettings(smallPanel(), { detectors: DETECTORS, instrumentName: 'Confocal 2' })).toEqual([
      { term: 'Instrument profile', value: 'Confocal 2' },
      { term: 'Excitation lines', value: '405 nm (relative power 1); 488 nm (relative power 0.5)' },
      { term: 'Sample background', value: 'sample type: FFPE tissue section; background level 0.1' },
      { term: 'Water Raman', value: 'level 0.2' },
      { term: 'Scattered excitation light', value: '1e8' },
      { term: 'Warn when a channel blocks a line by less than', value: 'OD 6 (default)' },
      { term: 'shared emission path (in every channel)', value: 'longpass 420' },
      { term: 'Excluded materials', value: 'lead-free' },
      { term: 'Detector', value: 'Ideal detector (QE 1) (G); Photomultiplier, GaAsP photocathode (c2)' },
    ]);
  });

  it('a bare panel: no instrument line, background and water Raman off, defaults named, one detector', () => {
    const panel: PanelSpec = {
      excitation: [{ wavelengthNm: 561 }],
      probes: [],
      channels: [{ id: 'c1', filters: [] }],
    };
    expect(reportSettings(panel, { detectors: DETECTORS })).toEqual([
      { term: 'Excitation lines', value: '561 nm (relative power 1)' },
      { term: 'Sample background', value: 'off' },
      { term: 'Water Raman', value: 'off' },
      { term: 'Scattered excitation light', value: '1e10 (default)' },
      { term: 'Warn when a channel blocks a line by less than', value: 'OD 6 (default)' },
      { term: 'Excluded materials', value: 'none' },
      { term: 'Detector', value: 'Ideal detector (QE 1)' },
    ]);
  });
});

describe('report hazards and link', () => {
  it('a block per core and shell material with its probes; each caution once, then laser and general ones', () => {
    const { hazards, cautions } = reportHazards(smallPanel(), MATERIALS);
    expect(hazards.map((h) => [h.name, h.level, h.probes])).toEqual([
      ['CdSe', 'high', ['Green']],
      ['ZnS shell', 'moderate', ['Green']],
      ['InP', 'moderate', ['p2']],
    ]);
    expect(hazards[0].notes.join(' ')).toContain('IARC Group 1');
    expect(new Set(cautions).size).toBe(cautions.length);
    expect(cautions.at(-2)).toContain('laser safety rules');
    expect(cautions.at(-1)).toContain('local regulations, institutional safety rules and licensed practice');
    expect(cautions.join(' ').replace('no probe here is described as safe', '')).not.toMatch(/\bsafe\b/i);
  });

  it("links the shared copy's /p/<id> when shared, else the page's address with its fragment", () => {
    const at = { href: 'https://lab.example/#v1.abc', origin: 'https://lab.example' };
    expect(reportLink(at, 'Xy_12')).toBe('https://lab.example/p/Xy_12');
    expect(reportLink(at, '')).toBe('https://lab.example/#v1.abc');
  });
});
