import { describe, expect, it } from 'vitest';
import {
  MATERIAL_IDS,
  SpectraError,
  emissionRangeForMaterialNm,
  getMaterial,
  listMaterials,
} from '../../spectra/index';

function catchError(fn: () => unknown): SpectraError {
  try {
    fn();
  } catch (err) {
    if (err instanceof SpectraError) return err;
    throw err;
  }
  throw new Error('expected a SpectraError');
}
const text = (m: ReturnType<typeof getMaterial>) =>
  [...m.toxicity.notes, ...m.toxicity.cautions, ...m.warnings].join(' ');

// IUPAC standard atomic weights (abridged, 2021; values from memory, unverified): mass fractions of the hazardous metal.
const W = { Cd: 112.414, Se: 78.971, Te: 127.6, S: 32.06, Cs: 132.905, Pb: 207.2, Br: 79.904 };

describe('listMaterials', () => {
  it('listMaterials() lists every contract material id once, in order', () => {
    expect(listMaterials().map((m) => m.id)).toEqual([...MATERIAL_IDS]);
  });

  it('listMaterials() is plain data: a JSON round trip returns an equal value', () => {
    const list = listMaterials();
    expect(JSON.parse(JSON.stringify(list))).toEqual(list);
  });

  it('listMaterials() returns copies: changing one does not change the next call', () => {
    listMaterials()[0].name = 'changed';
    expect(listMaterials()[0].name).toBe('CdSe');
  });

  it("listMaterials() emissionRangeNm of sized materials is the size law's reach (computed, 0.1 nm)", () => {
    for (const m of listMaterials().filter((x) => x.diameterRangeNm)) {
      const [lo, hi] = emissionRangeForMaterialNm(m.id);
      expect(m.emissionRangeNm![0]).toBeCloseTo(lo, 1);
      expect(m.emissionRangeNm![1]).toBeCloseTo(hi, 1);
    }
  });

  it('listMaterials() gives sources for every material but custom, and names the sizing model of every sized one', () => {
    for (const m of listMaterials()) {
      if (m.id !== 'custom') expect(m.sources.length).toBeGreaterThan(0);
      if (m.diameterRangeNm) expect(m.sizingModel).toMatch(/Yu–Qu–Guo–Peng 2003|Almeida et al\. 2023|Brus 1984/);
    }
    expect(getMaterial('inp').sizeMeaning).toMatch(/equivalent-sphere diameter/);
    expect(getMaterial('cspbbr3').sizeMeaning).toMatch(/cube edge/);
  });

  it('listMaterials() has null size fields for carbon and custom, and null emission range only for custom', () => {
    expect([
      getMaterial('carbon').diameterRangeNm,
      getMaterial('custom').diameterRangeNm,
      getMaterial('custom').emissionRangeNm,
    ]).toEqual([null, null, null]);
    expect(getMaterial('carbon').emissionRangeNm).not.toBeNull();
  });

  it('getMaterial(pbs) throws unknown_material naming material', () => {
    const err = catchError(() => getMaterial('pbs'));
    expect([err.code, err.path]).toEqual(['unknown_material', ['material']]);
  });
});

describe('toxicity notes (IARC Monographs; always defer to local rules)', () => {
  it.each(['cdse', 'cdte', 'cds'])('getMaterial(%s) is high, cadmium IARC Group 1', (id) => {
    const m = getMaterial(id);
    expect(m.toxicity.level).toBe('high');
    expect(text(m)).toMatch(/Cadmium.*IARC Group 1/);
  });

  it('getMaterial(cspbbr3) notes lead IARC Group 2A and warns that it is unstable in water unless encapsulated', () => {
    const m = getMaterial('cspbbr3');
    expect(text(m)).toMatch(/lead.*IARC Group 2A/i);
    expect(m.warnings.join(' ')).toMatch(/Unstable in water.*unless encapsulated/);
  });

  it('getMaterial(inp) notes IARC Group 2A and getMaterial(gaas) IARC Group 1', () => {
    expect(text(getMaterial('inp'))).toMatch(/Indium phosphide: IARC Group 2A/);
    expect(text(getMaterial('gaas'))).toMatch(/Gallium arsenide: IARC Group 1/);
  });

  it('getMaterial(carbon) is rated low with "low, not proven"', () => {
    const m = getMaterial('carbon');
    expect(m.toxicity.level).toBe('low');
    expect(text(m)).toContain('low, not proven');
  });

  it("getMaterial(custom) defers to the supplier's safety data sheet", () => {
    expect(getMaterial('custom').toxicity.cautions.join(' ')).toMatch(/supplier's safety data sheet/);
  });

  it('listMaterials() cautions all defer to local regulations, institutional rules and licensed practice, and nothing is called safe', () => {
    for (const m of listMaterials()) {
      expect(m.toxicity.cautions.join(' ')).toMatch(/local regulations.*institution.*licensed practice/);
      expect(text(m)).not.toMatch(/\bsafe\b/i);
    }
  });

  it.each([
    ['cdse', 'Cd', W.Cd / (W.Cd + W.Se)],
    ['cdte', 'Cd', W.Cd / (W.Cd + W.Te)],
    ['cds', 'Cd', W.Cd / (W.Cd + W.S)],
    ['cspbbr3', 'Pb', W.Pb / (W.Cs + W.Pb + 3 * W.Br)],
  ] as const)(
    'getMaterial(%s) states the %s mass fraction computed from IUPAC atomic weights to 0.1 percent',
    (id, _el, fraction) => {
      expect(text(getMaterial(id))).toContain(`${(100 * fraction).toFixed(1)} %`);
    },
  );
});
