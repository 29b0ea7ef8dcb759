// Autofluorescence presets by sample type: each band's positions against the source it cites (status marks as in
// docs/science.md: P seen in the paper or its abstract, M from memory), the presets' shared scale, the claims about
// sample types that a source supports, and the default model (no preset) left as docs/science.md section 12 gives it.
import { describe, expect, it } from 'vitest';
import { Matrix } from 'ml-matrix';
import { fcnnlsVector } from 'ml-fcnnls';
import {
  AUTOFLUORESCENCE_BANDS,
  BACKGROUND_PRESET_IDS,
  BACKGROUND_REFERENCE_BRIGHTNESS,
  DEFAULT_GRID,
  SpectraError,
  evaluatePanel,
  listBackgroundPresets,
  presetAutofluorescence,
} from '../../spectra/index';
import type { BackgroundPresetId, BackgroundSpec, PanelSpec } from '../../spectra/index';

const GRID = DEFAULT_GRID;
const nmAt = (i: number) => GRID.startNm + i * GRID.stepNm;
/** Photons (grid sum × step) between two wavelengths, inclusive. */
const between = (y: number[], fromNm: number, toNm: number) =>
  y.reduce((s, v, i) => (nmAt(i) >= fromNm && nmAt(i) <= toNm ? s + v * GRID.stepNm : s), 0);
const peakNm = (y: number[]) => nmAt(y.indexOf(Math.max(...y)));
const listing = listBackgroundPresets();
const presetOf = (id: BackgroundPresetId) => listing.presets.find((p) => p.id === id)!;

/**
 * What each cited source gives for a band: the range the strongest excitation band's peak must lie in, the range the
 * emission peak must lie in, the source and its status mark. Typed from the sources, not from the code.
 */
const SOURCE_RANGES: Record<
  string,
  { exNm: [number, number]; emNm: [number, number]; source: string; status: string }
> = {
  collagen: {
    exNm: [280, 350],
    emNm: [370, 440],
    source: 'Dysli et al., Prog. Retin. Eye Res. 2017, Table 1',
    status: 'P',
  },
  elastin: {
    exNm: [300, 370],
    emNm: [420, 460],
    source: 'Dysli et al., Prog. Retin. Eye Res. 2017, Table 1',
    status: 'P',
  },
  'NAD(P)H': {
    exNm: [300, 380],
    emNm: [450, 500],
    source: 'Dysli et al., Prog. Retin. Eye Res. 2017, Table 1',
    status: 'P',
  },
  flavins: {
    exNm: [420, 500],
    emNm: [520, 570],
    source: 'Dysli et al., Prog. Retin. Eye Res. 2017, Table 1 (FAD)',
    status: 'P',
  },
  // Emission "540 nm" (the table) to yellow (Eldred et al., Science 1982: yellow under UV); yellow is 570–590 nm
  // (common practice).
  lipofuscin: {
    exNm: [340, 500],
    emNm: [540, 590],
    source: 'Dysli et al. 2017, Table 1; Eldred et al. 1982',
    status: 'P',
  },
  // Hematoporphyrin in water: emission 625 and 675 nm; the strongest excitation, the Soret band near 400 nm, is from
  // memory (the source lists the Q bands 505, 540, 570, 620 nm).
  porphyrins: {
    exNm: [390, 410],
    emNm: [625, 625],
    source: 'Srivastava, Anand, Carper, Appl. Spectrosc. 1973',
    status: 'P',
  },
  'porphyrins (second band)': {
    exNm: [390, 410],
    emNm: [675, 675],
    source: 'Srivastava, Anand, Carper, Appl. Spectrosc. 1973',
    status: 'P',
  },
  // "Pale green" under "violet-blue" excitation; violet-blue is 400–490 nm and green 495–570 nm (common practice).
  'formaldehyde fixation products': {
    exNm: [400, 490],
    emNm: [495, 570],
    source: 'del Castillo et al., Basic Appl. Histochem. 1989',
    status: 'P',
  },
};

const bandRows = listing.presets.flatMap((p) => p.bands.map((b) => [p.id, b.fluorophore, b] as const));

describe('listBackgroundPresets: band positions against their sources', () => {
  it('listBackgroundPresets lists ffpe-tissue, frozen-tissue and cultured-cells, each with bands and a basis', () => {
    expect(listing.presets.map((p) => p.id)).toEqual([...BACKGROUND_PRESET_IDS]);
    expect([...BACKGROUND_PRESET_IDS].sort()).toEqual(['cultured-cells', 'ffpe-tissue', 'frozen-tissue']);
    for (const p of listing.presets) {
      expect(p.name.length, p.id).toBeGreaterThan(3);
      expect(p.description.length, p.id).toBeGreaterThan(40);
      expect(p.bands.length, p.id).toBeGreaterThan(0);
      expect(p.basis.length, p.id).toBeGreaterThan(0);
    }
  });

  it.each(bandRows)(
    '%s, %s: strongest excitation and emission peak lie in the ranges of the cited source',
    (_id, name, band) => {
      const ranges = SOURCE_RANGES[name];
      expect(ranges, `no source range in this test for band "${name}"`).toBeDefined();
      const strongest = band.excitation.reduce((a, b) => (b.weight > a.weight ? b : a));
      expect(strongest.peakNm, ranges.source).toBeGreaterThanOrEqual(ranges.exNm[0]);
      expect(strongest.peakNm, ranges.source).toBeLessThanOrEqual(ranges.exNm[1]);
      expect(band.emissionNm, ranges.source).toBeGreaterThanOrEqual(ranges.emNm[0]);
      expect(band.emissionNm, ranges.source).toBeLessThanOrEqual(ranges.emNm[1]);
      // The listing tells clients the same status as this test's source table.
      expect(band.source.status).toBe(ranges.status);
    },
  );

  // Croce et al., Proc. SPIE 1996, 2926 (P, abstract): cultured fibroblasts under 366 nm emit flavin light beyond
  // 510 nm, so flavins have a near-UV excitation band.
  it('the flavin band of every preset is also excited in the near UV (a band peaking within 350–390 nm)', () => {
    for (const [id, name, band] of bandRows) {
      if (name !== 'flavins') continue;
      expect(
        band.excitation.some((e) => e.peakNm >= 350 && e.peakNm <= 390),
        id,
      ).toBe(true);
    }
  });

  // Srivastava, Anand, Carper, Appl. Spectrosc. 1973, 27, 444 (P, abstract): Q-band excitation at 505, 540, 570, 620.
  it('the porphyrin bands are excited at the four Q bands 505, 540, 570 and 620 nm besides the Soret band', () => {
    for (const [, name, band] of bandRows) {
      if (!name.startsWith('porphyrins')) continue;
      expect(band.excitation.map((e) => e.peakNm).filter((nm) => nm > 450)).toEqual([505, 540, 570, 620]);
    }
  });

  it('listBackgroundPresets marks every source P, T or M, explains the marks and carries the caution', () => {
    const statuses = listing.presets.flatMap((p) => [...p.basis, ...p.bands.map((b) => b.source)].map((c) => c.status));
    expect(new Set(statuses)).toEqual(new Set(['P', 'M']));
    expect(Object.keys(listing.statusMarks).sort()).toEqual(['M', 'P', 'T']);
    expect(listing.statusMarks.M).toMatch(/from memory, unverified/);
    expect(listing.caution).toMatch(/orders of magnitude/);
    expect(listing.caution).toMatch(/measured background spectrum/);
    expect(listing.level).toMatch(/405 nm/);
  });
});

describe('presetAutofluorescence: the presets share one scale', () => {
  const FWHM_TO_SIGMA = 1 / (2 * Math.sqrt(2 * Math.LN2));
  type Band = (typeof bandRows)[number][2];
  const excitationWeight = (b: Band, lineNm: number) =>
    b.excitation.reduce(
      (s, e) => s + e.weight * Math.exp(-0.5 * ((lineNm - e.peakNm) / (e.fwhmNm * FWHM_TO_SIGMA)) ** 2),
      0,
    );
  // The level convention (docs/science.md section 12): fresh-frozen tissue's bands sum to 1 under 405 nm.
  const frozenTotal = presetOf('frozen-tissue').bands.reduce((s, b) => s + b.brightness * excitationWeight(b, 405), 0);

  // Each preset's output is fitted back into its listed bands (unit-area Gaussians cut at the line) with ml-fcnnls;
  // every fitted amount must be brightness × excitation weight / (frozen tissue's total under 405 nm), recomputed
  // here from the listing alone.
  it.each(BACKGROUND_PRESET_IDS.flatMap((id) => [355, 405, 488].map((lineNm) => [id, lineNm] as const)))(
    'presetAutofluorescence(%s, %s nm) is its listed bands, each brightness × excitation / frozen total at 405 nm',
    (id, lineNm) => {
      const y = presetAutofluorescence(id, lineNm, GRID);
      const bands = presetOf(id).bands;
      const nm = Array.from({ length: GRID.count }, (_, i) => nmAt(i));
      const columns = bands.map((b) => {
        const sigma = b.emissionFwhmNm * FWHM_TO_SIGMA;
        return nm.map((x) =>
          x <= lineNm ? 0 : Math.exp(-0.5 * ((x - b.emissionNm) / sigma) ** 2) / (sigma * Math.sqrt(2 * Math.PI)),
        );
      });
      const design = new Matrix(nm.map((_, i) => columns.map((col) => col[i])));
      const fitted = fcnnlsVector(design, y).K.to1DArray();
      const expected = bands.map((b) => (b.brightness * excitationWeight(b, lineNm)) / frozenTotal);
      const largest = Math.max(...expected);
      fitted.forEach((a, k) => expect(Math.abs(a - expected[k]) / largest, bands[k].fluorophore).toBeLessThan(1e-6));
    },
  );

  it('presetAutofluorescence refuses an id that is not a preset, naming background.preset', () => {
    const call = () => presetAutofluorescence('paraffin' as BackgroundPresetId, 488, GRID);
    expect(call).toThrow(SpectraError);
    expect(call).toThrow(/unknown background preset "paraffin"/);
    try {
      call();
    } catch (e) {
      expect((e as SpectraError).path).toEqual(['background', 'preset']);
      expect((e as SpectraError).code).toBe('invalid_input');
    }
  });
});

/** A one-probe panel whose channels are an open one and a 525/50 bandpass (ideal edges), with a given background. */
const panelWith = (background: BackgroundSpec, lineNm: number): PanelSpec => ({
  excitation: [{ wavelengthNm: lineNm }],
  probes: [{ id: 'q605', material: 'cdse', emissionPeakNm: 605 }],
  channels: [
    { id: 'open', filters: [] },
    {
      id: 'g525',
      filters: [{ type: 'bandpass', centerNm: 525, widthNm: 50, edgeWidthNm: 0, peakTransmission: 1, blockingOD: 12 }],
    },
  ],
  background,
});
const collected = (background: BackgroundSpec, lineNm: number) =>
  evaluatePanel(panelWith(background, lineNm), { sensitivity: false }).backgroundCollected!;

describe('sample types as the sources describe them', () => {
  // Croce et al., Proc. SPIE 1996, 2926 (P, abstract): cultured fibroblasts under 366 nm emit mainly NAD(P)H at
  // 440–480 nm, with flavins and lipopigments beyond 510 nm.
  it('cultured-cells under 366 nm peaks within 440–480 nm and sends over a tenth of its light beyond 510 nm', () => {
    const y = presetAutofluorescence('cultured-cells', 366, GRID);
    expect(peakNm(y)).toBeGreaterThanOrEqual(440);
    expect(peakNm(y)).toBeLessThanOrEqual(480);
    expect(between(y, 511, 1000) / between(y, 300, 1000)).toBeGreaterThan(0.1);
  });

  // Aubin, J. Histochem. Cytochem. 1979 (P, abstract): cultured cells' autofluorescence is NADH and flavins; Croce
  // et al. 1996 (P, abstract) add lipopigments. No extracellular matrix, no fixation product.
  it('cultured-cells is made of NAD(P)H, flavins and lipofuscin only', () => {
    expect(
      presetOf('cultured-cells')
        .bands.map((b) => b.fluorophore)
        .sort(),
    ).toEqual(['NAD(P)H', 'flavins', 'lipofuscin']);
  });

  // del Castillo et al., Basic Appl. Histochem. 1989 (P, abstract): after aldehyde fixation the strongest
  // autofluorescence, pale green, comes under violet-blue excitation.
  it('ffpe-tissue emits the most green (495–570 nm) under a violet-blue line of 340–640 nm lines', () => {
    const lines = [340, 355, 366, 405, 440, 488, 532, 561, 640];
    const green = lines.map((l) => between(presetAutofluorescence('ffpe-tissue', l, GRID), 495, 570));
    expect([405, 440, 488]).toContain(lines[green.indexOf(Math.max(...green))]);
  });

  // del Castillo et al. 1989 (P, abstract): aldehyde-fixed tissue autofluoresces more than alcohol-fixed tissue;
  // Photochem. Photobiol. 2007, 83, 450 (P, abstract): formalin-fixed tissue more than in vivo. How much more is ours.
  it.each([355, 405, 488, 561])(
    'at one level ffpe-tissue collects more than frozen-tissue in both channels under %s nm',
    (l) => {
      const [ffpe, frozen] = [
        collected({ level: 1, preset: 'ffpe-tissue' }, l),
        collected({ level: 1, preset: 'frozen-tissue' }, l),
      ];
      expect(ffpe[0]).toBeGreaterThan(frozen[0]);
      expect(ffpe[1]).toBeGreaterThan(frozen[1]);
    },
  );

  // Davis et al., J. Histochem. Cytochem. 2014 (P, abstract): FFPE autofluorescence troubles fluorescein-range labels;
  // Aubin 1979 (P, abstract): cultured cells have only NADH and flavins. The size of the gap is ours.
  it('at one level ffpe-tissue collects more background than cultured-cells in a 525/50 channel under 488 nm', () => {
    const ffpe = collected({ level: 1, preset: 'ffpe-tissue' }, 488)[1];
    const cells = collected({ level: 1, preset: 'cultured-cells' }, 488)[1];
    expect(ffpe).toBeGreaterThan(2 * cells);
  });
});

describe('a background without a preset is the default model, unchanged', () => {
  // docs/science.md section 12: the default's total area is ≈ 0.99 under 405 nm, 0.45 under 488 nm, 0.006 under 640 nm
  // (C). An open channel collects level × 1e5 × that area.
  it.each([
    [405, 0.99, 0.005],
    [488, 0.45, 0.005],
    [640, 0.006, 0.0005],
  ])(
    'evaluatePanel with {level: 1} and no preset collects 1e5 × %s nm area ≈ %s in an open channel',
    (l, area, tol) => {
      expect(Math.abs(collected({ level: 1 }, l)[0] / BACKGROUND_REFERENCE_BRIGHTNESS - area)).toBeLessThan(tol);
    },
  );

  // The table of docs/science.md section 12, typed here: emission / FWHM, excitation peaks, brightness.
  it('AUTOFLUORESCENCE_BANDS is still the table of docs/science.md section 12', () => {
    expect(
      AUTOFLUORESCENCE_BANDS.map((b) => [b.emissionNm, b.emissionFwhmNm, b.excitation.map((e) => e[0]), b.brightness]),
    ).toEqual([
      [400, 80, [330], 0.8],
      [460, 110, [340], 1],
      [530, 100, [450, 370], 0.6],
      [590, 180, [360], 0.5],
      [635, 30, [405, 505, 630], 0.15],
      [700, 30, [405, 505, 630], 0.05],
    ]);
  });

  it('a preset changes the background: ffpe-tissue and the default differ under 488 nm at one level', () => {
    expect(collected({ level: 1, preset: 'ffpe-tissue' }, 488)[1]).not.toBeCloseTo(collected({ level: 1 }, 488)[1], 0);
  });
});
