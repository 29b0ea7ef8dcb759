import { describe, expect, it } from 'vitest';
import { MATERIAL_IDS, emissionRangeForMaterialNm, listMaterials } from '../../spectra/index';

const material = (id: string) => listMaterials().find((m) => m.id === id)!;
const text = (m: ReturnType<typeof material>) => [...m.toxicity.notes, ...m.toxicity.cautions, ...m.warnings].join(' ');

// IUPAC standard atomic weights (abridged, 2021; values from memory, unverified): mass fractions of the hazardous
// metal.
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

  it('listMaterials() gives sources for every material but custom, and the sizing model of every sized one', () => {
    for (const m of listMaterials()) {
      if (m.id !== 'custom') expect(m.sources.length).toBeGreaterThan(0);
      if (m.diameterRangeNm)
        expect(m.sizingModel).toMatch(/Yu–Qu–Guo–Peng 2003|Almeida et al\. 2023|Brus 1984|empirical CsPbBr3/);
    }
    expect(material('inp').sizeMeaning).toMatch(/equivalent-sphere diameter/);
    expect(material('cspbbr3').sizeMeaning).toMatch(/cube edge/);
  });

  it(
    'listMaterials() has null size fields for carbon, custom and dye, and null emission ranges for custom and ' + 'dye',
    () => {
      expect([
        material('carbon').diameterRangeNm,
        material('custom').diameterRangeNm,
        material('dye').diameterRangeNm,
        material('custom').emissionRangeNm,
        material('dye').emissionRangeNm,
      ]).toEqual([null, null, null, null, null]);
      expect(material('carbon').emissionRangeNm).not.toBeNull();
    },
  );

  it.each(['cdse', 'cdte', 'cds'])('material(%s) is high, cadmium IARC Group 1', (id) => {
    const m = material(id);
    expect(m.toxicity.level).toBe('high');
    expect(text(m)).toMatch(/Cadmium.*IARC Group 1/);
  });

  it('material(cspbbr3) notes lead IARC Group 2A and warns that it is unstable in water unless encapsulated', () => {
    const m = material('cspbbr3');
    expect(text(m)).toMatch(/lead.*IARC Group 2A/i);
    expect(m.warnings.join(' ')).toMatch(/Unstable in water.*unless encapsulated/);
  });

  it('material(inp) notes IARC Group 2A and material(gaas) IARC Group 1', () => {
    expect(text(material('inp'))).toMatch(/Indium phosphide: IARC Group 2A/);
    expect(text(material('gaas'))).toMatch(/Gallium arsenide: IARC Group 1/);
  });

  it('material(carbon) is rated low with "low, not proven"', () => {
    const m = material('carbon');
    expect(m.toxicity.level).toBe('low');
    expect(text(m)).toContain('low, not proven');
  });

  it("material(custom) defers to the supplier's safety data sheet", () => {
    expect(material('custom').toxicity.cautions.join(' ')).toMatch(/supplier's safety data sheet/);
  });

  it(
    'listMaterials() cautions all defer to local regulations, institutional rules and licensed practice, and ' +
      'nothing is called safe',
    () => {
      for (const m of listMaterials()) {
        expect(m.toxicity.cautions.join(' ')).toMatch(/local regulations.*institution.*licensed practice/);
        expect(text(m)).not.toMatch(/\bsafe\b/i);
      }
    },
  );

  it.each([
    ['cdse', 'Cd', W.Cd / (W.Cd + W.Se)],
    ['cdte', 'Cd', W.Cd / (W.Cd + W.Te)],
    ['cds', 'Cd', W.Cd / (W.Cd + W.S)],
    ['cspbbr3', 'Pb', W.Pb / (W.Cs + W.Pb + 3 * W.Br)],
  ] as const)(
    'material(%s) states the %s mass fraction computed from IUPAC atomic weights to 0.1 percent',
    (id, _el, fraction) => {
      expect(text(material(id))).toContain(`${(100 * fraction).toFixed(1)} %`);
    },
  );
});
