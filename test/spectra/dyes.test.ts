// The dye library against the values of its published sources, dye probes and custom probes through resolveDot, and
// the modelled absorption band of custom probes.
import { describe, expect, it } from 'vitest';
import {
  DYE_IDS,
  VALUE_STATUSES,
  evaluatePanel,
  extinctionAtNm,
  listDyes,
  listMaterials,
  resolveDot,
  type DotInput,
  type SpectraError,
} from '../../spectra/index';
import { errorOf } from './helpers/errors';

/**
 * Absorption and emission peak (nm), ε at the absorption peak (M⁻¹ cm⁻¹) and QY, written from each source, with the
 * status of the four numbers: P seen in the paper or its abstract, T secondary copies agree (paper not read), M from
 * memory, unverified.
 */
const PUBLISHED: [string, number, number, number, number, string][] = [
  // Kapuscinski, Biotech. Histochem. 1995 (bound to dsDNA): peaks T; ε, QY M.
  ['dapi', 358, 461, 27000, 0.6, 'T T M M'],
  // Lakowicz, Principles of Fluorescence Spectroscopy, 3rd ed. 2006 (bound to dsDNA): all M.
  ['ethoxyphenyl-bisbenzimide', 350, 461, 45000, 0.4, 'M M M M'],
  // Lakowicz 2006 (bound to dsDNA): all M.
  ['propidium-iodide', 535, 617, 5900, 0.15, 'M M M M'],
  // 0.1 M NaOH. Absorption and ε: Sjöback, Nygren, Kubista, Spectrochim. Acta A 1995 (M); emission 515 nm: Martin,
  // Lindqvist, J. Lumin. 1975, abstract (P); QY 0.925: Magde, Wong, Seybold, Photochem. Photobiol. 2002 (M).
  ['fluorescein', 490, 515, 76900, 0.925, 'M P M M'],
  // Ethanol. Kubin, Fletcher, J. Lumin. 1982; QY also Magde et al. 2002: all M.
  ['rhodamine-6g', 530, 552, 116000, 0.95, 'M M M M'],
  // Protein conjugate, Lakowicz 2006: all M.
  ['tetramethylrhodamine', 555, 580, 85000, 0.3, 'M M M M'],
  // Markova et al., Dyes Pigm. 2013, abstract (P): 649–653 nm, 668–672 nm, 240,000–256,000, 0.28–0.32 (values
  // inside these ranges).
  ['indodicarbocyanine', 650, 670, 250000, 0.3, 'P P P P'],
  // Cormack, Valdivia, Falkow, Gene 1996; Patterson et al., Biophys. J. 1997: all M.
  ['egfp', 488, 507, 56000, 0.6, 'M M M M'],
  // Shaner et al., Nat. Biotechnol. 2004: peaks T, ε and QY M.
  ['mcherry', 587, 610, 72000, 0.22, 'T T M M'],
  // Goedhart et al., Nat. Commun. 2012: all M.
  ['mturquoise2', 434, 474, 30000, 0.93, 'M M M M'],
  // Nagai et al., Nat. Biotechnol. 2002: all M.
  ['venus', 515, 528, 92200, 0.57, 'M M M M'],
  // Shcherbo et al., Biochem. J. 2009: all M.
  ['mkate2', 588, 633, 62500, 0.4, 'M M M M'],
  // Merzlyak et al., Nat. Methods 2007: all M.
  ['tagrfp', 555, 584, 100000, 0.48, 'M M M M'],
];

const dye = (id: string) => listDyes().find((d) => d.id === id)!;
const hazardText = (id: string) => [...dye(id).toxicity.notes, ...dye(id).toxicity.cautions].join(' ');

describe('the dye library against its sources', () => {
  it(
    'the sulfonated indodicarbocyanine lies inside the ranges the Markova et al. 2013 abstract gives (P): absorption ' +
      '649–653 nm, emission 668–672 nm, ε 240,000–256,000, QY 0.28–0.32',
    () => {
      const d = dye('indodicarbocyanine');
      const inside = (v: number, lo: number, hi: number) =>
        expect(v >= lo && v <= hi, `${v} in ${lo}–${hi}`).toBe(true);
      inside(d.absorptionPeakNm.value, 649, 653);
      inside(d.emissionPeakNm.value, 668, 672);
      inside(d.extinctionPeak.value, 240000, 256000);
      inside(d.quantumYield.value, 0.28, 0.32);
    },
  );

  it('listDyes() holds at least 12 dyes, every one of them in the table of published values', () => {
    expect(DYE_IDS.length).toBeGreaterThanOrEqual(12);
    expect([...DYE_IDS].sort()).toEqual(PUBLISHED.map((row) => row[0]).sort());
  });

  it.each(PUBLISHED)(
    'listDyes() %s: absorption %s nm, emission %s nm, ε %s, QY %s as published, with status marks %s',
    (id, absNm, emNm, epsilon, qy, marks) => {
      const d = dye(id);
      expect([d.absorptionPeakNm.value, d.emissionPeakNm.value, d.extinctionPeak.value, d.quantumYield.value]).toEqual([
        absNm,
        emNm,
        epsilon,
        qy,
      ]);
      const statuses = [d.absorptionPeakNm, d.emissionPeakNm, d.extinctionPeak, d.quantumYield].map((v) => v.status);
      expect(statuses.join(' ')).toBe(marks);
    },
  );

  it(
    'listDyes() gives every number a source and a status mark, and every M number says "from memory, ' + 'unverified"',
    () => {
      for (const d of listDyes()) {
        const numbers = [
          d.absorptionPeakNm,
          d.emissionPeakNm,
          d.extinctionPeak,
          d.quantumYield,
          d.absorptionFwhmNm,
          d.emissionFwhmNm,
          d.absorptionAsymmetry,
          d.emissionAsymmetry,
        ];
        for (const n of numbers) {
          expect(VALUE_STATUSES, d.id).toContain(n.status);
          expect(n.source.length, d.id).toBeGreaterThan(5);
          if (n.status === 'M') expect(n.source, d.id).toContain('from memory, unverified');
        }
        expect(d.conditions.length, d.id).toBeGreaterThan(3);
      }
    },
  );

  it('listDyes() is plain data: a JSON round trip returns an equal value, and changing a copy changes nothing', () => {
    const list = listDyes();
    expect(JSON.parse(JSON.stringify(list))).toEqual(list);
    list[0].name = 'changed';
    expect(listDyes()[0].name).not.toBe('changed');
  });
});

describe('the dye library: hazards', () => {
  it.each(['dapi', 'ethoxyphenyl-bisbenzimide', 'propidium-iodide'])(
    'dye(%s), a DNA-binding stain, is rated high and noted as a mutagen or suspected mutagen',
    (id) => {
      expect(dye(id).kind).toBe('nuclear-counterstain');
      expect(dye(id).toxicity.level).toBe('high');
      expect(hazardText(id)).toMatch(/mutagens or suspected mutagens/);
    },
  );

  it(
    'listDyes() cautions all defer to local regulations, institutional rules and licensed practice; none ' +
      'says safe',
    () => {
      for (const d of listDyes()) {
        expect(d.toxicity.cautions.join(' '), d.id).toMatch(/local regulations.*institution.*licensed practice/);
        expect(hazardText(d.id), d.id).not.toMatch(/\bsafe\b/i);
      }
    },
  );

  it("listMaterials() material 'dye' is rated at the highest level of its dyes and points to GET /api/v1/dyes", () => {
    const order = ['low', 'moderate', 'high'];
    const highest = order[Math.max(...listDyes().map((d) => order.indexOf(d.toxicity.level)))];
    const material = listMaterials().find((m) => m.id === 'dye')!;
    expect(material.toxicity.level).toBe(highest);
    expect([...material.warnings, ...material.sources].join(' ')).toContain('GET /api/v1/dyes');
  });
});

describe('resolveDot: dye probes', () => {
  it.each(PUBLISHED)(
    'resolveDot(dye %s) peaks where the record says, with its QY and ε at the absorption peak',
    (id, absNm, emNm, epsilon, qy) => {
      const dot = resolveDot({ material: 'dye', dye: id, excitationNm: absNm });
      expect(dot.emissionPeakNm).toBe(emNm);
      expect(dot.quantumYield).toBe(qy);
      expect(dot.extinctionAtExcitation).toBeCloseTo(epsilon, 6);
      // The sampled maximum sits on the grid point nearest the peak.
      const v = dot.emission.values;
      const top = v.indexOf(Math.max(...v));
      expect(dot.emission.startNm + top * dot.emission.stepNm).toBe(emNm);
      expect(v.reduce((a, b) => a + b, 0) * dot.emission.stepNm).toBeCloseTo(1, 12);
    },
  );

  it("resolveDot(dye) emission is the record's FWHM wide at half maximum on a 0.05 nm grid (to 0.05 nm)", () => {
    for (const d of listDyes()) {
      const grid = { startNm: 300, stepNm: 0.05, count: 14001 };
      const dot = resolveDot({ material: 'dye', dye: d.id }, { grid });
      const v = dot.emission.values;
      const half = Math.max(...v) / 2;
      const above = v.map((x, i) => [x, i] as const).filter(([x]) => x >= half);
      const widthNm = (above[above.length - 1][1] - above[0][1]) * grid.stepNm;
      expect(Math.abs(widthNm - d.emissionFwhmNm.value), d.id).toBeLessThanOrEqual(0.05 + 1e-9);
    }
  });

  it('resolveDot(dye egfp) takes fwhmNm and quantumYield from the probe over the record', () => {
    const dot = resolveDot({ material: 'dye', dye: 'egfp', fwhmNm: 60, quantumYield: 0.3 });
    expect([dot.fwhmNm, dot.quantumYield]).toEqual([60, 0.3]);
  });

  it('resolveDot(dye mcherry) with a measured emission and extinction uses both instead of the record', () => {
    const points: [number, number][] = [];
    for (let nm = 600; nm <= 700; nm += 1) points.push([nm, Math.exp(-0.5 * ((nm - 650) / 10) ** 2)]);
    const dot = resolveDot({
      material: 'dye',
      dye: 'mcherry',
      measuredEmission: { points },
      extinction: {
        points: [
          [300, 1234],
          [1000, 1234],
        ],
      },
    });
    expect(dot.emissionPeakNm).toBeCloseTo(650, 1);
    expect(extinctionAtNm(dot, 405)).toBe(1234);
    expect(dot.measured).toEqual({ emission: true, extinction: true });
  });

  it('resolveDot(dye) warns about the conditions of its values and about numbers from memory', () => {
    expect(resolveDot({ material: 'dye', dye: 'fluorescein' }).warnings.join(' ')).toMatch(/0\.1 M NaOH.*from memory/);
  });

  it.each<[string, DotInput, string, (string | number)[]]>([
    ['no dye', { material: 'dye' }, 'invalid_input', ['dye']],
    ['an unknown dye', { material: 'dye', dye: 'no-such-dye' }, 'unknown_dye', ['dye']],
  ])('resolveDot(dye) with %s throws a SpectraError naming the field', (_what, input, code, path) => {
    const err: SpectraError = errorOf(() => resolveDot(input));
    expect([err.code, err.path]).toEqual([code, path]);
  });
});

describe('resolveDot: the absorption band of custom probes', () => {
  // A measured emission: a Gaussian in wavelength at 670 nm, 30 nm FWHM.
  const points: [number, number][] = [];
  for (let nm = 560; nm <= 780; nm += 0.5) points.push([nm, Math.exp(-4 * Math.LN2 * ((nm - 670) / 30) ** 2)]);
  const custom = (extra: Partial<DotInput> = {}) =>
    resolveDot({ material: 'custom', measuredEmission: { points }, quantumYield: 0.5, ...extra });

  it(
    'a 405 nm line excites a custom probe absorbing at 650 nm at the 5 % blue-side floor of its peak, under a tenth ' +
      'of what a 640 nm line does (common practice: red dyes are weakly excited by violet light)',
    () => {
      const dot = custom({ absorptionPeakNm: 650, extinctionPeak: 2e5 });
      expect(extinctionAtNm(dot, 650)).toBeCloseTo(2e5, 6);
      expect(extinctionAtNm(dot, 405)).toBeCloseTo(0.05 * 2e5, 6);
      expect(extinctionAtNm(dot, 405) / extinctionAtNm(dot, 640)).toBeLessThan(0.1);
      const channel = { id: 'c', filters: [{ type: 'bandpass' as const, centerNm: 680, widthNm: 30 }] };
      const probe = { id: 'p', material: 'custom' as const, measuredEmission: { points }, absorptionPeakNm: 650 };
      const under = (nm: number) =>
        evaluatePanel({
          excitation: [{ wavelengthNm: nm }],
          probes: [{ ...probe, extinctionPeak: 2e5 }],
          channels: [channel],
        }).collected[0][0]!;
      expect(under(405) / under(640)).toBeLessThan(0.1);
    },
  );

  it(
    'a custom probe without absorptionPeakNm absorbs most 800 cm⁻¹ above its emission peak (the nominal Stokes ' +
      'shift), with the nominal peak ε of 1e5, and warns',
    () => {
      const dot = custom();
      const expectedPeakNm = 1e7 / (1e7 / 670 + 800); // the stated rule (C): 635.9 nm
      let best = 600;
      for (let nm = 600; nm <= 660; nm += 0.01) if (extinctionAtNm(dot, nm) > extinctionAtNm(dot, best)) best = nm;
      expect(best).toBeCloseTo(expectedPeakNm, 1);
      expect(extinctionAtNm(dot, expectedPeakNm)).toBeCloseTo(1e5, 3);
      expect(dot.warnings.join(' ')).toMatch(/nominal Stokes shift of 800 cm⁻¹ .* nominal peak ε of 1e\+5/);
    },
  );

  it(
    'a custom probe absorbs over a band as wide in wavenumber as its emission (the mirror-image rule), ' + 'within 1 %',
    () => {
      const dot = custom({ absorptionPeakNm: 640 });
      // The emission's half-maximum wavelengths are 670 ± 15 nm, so its width in wavenumber is:
      const emissionWidthPerCm = 1e7 / 655 - 1e7 / 685;
      const f = (nm: number) => extinctionAtNm(dot, nm) - 0.5e5;
      const solve = (a: number, b: number) => {
        for (let i = 0; i < 100; i++) {
          const m = 0.5 * (a + b);
          if (Math.sign(f(m)) === Math.sign(f(a))) a = m;
          else b = m;
        }
        return a;
      };
      const absorptionWidthPerCm = 1e7 / solve(560, 640) - 1e7 / solve(640, 720);
      expect(Math.abs(absorptionWidthPerCm / emissionWidthPerCm - 1)).toBeLessThan(0.01);
    },
  );

  it('a custom probe with a measured extinction uses it: ε at 405 nm is the table value', () => {
    const flat = {
      points: [
        [300, 1e5],
        [1000, 1e5],
      ] as [number, number][],
    };
    expect(extinctionAtNm(custom({ extinction: flat }), 405)).toBe(1e5);
  });
});
