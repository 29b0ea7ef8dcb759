import { describe, expect, it } from 'vitest';
import {
  BULK_PARAMS,
  BOHR_RADIUS_NM,
  HC_EV_NM,
  INP_ALMEIDA_2023,
  emissionPeakForDiameterNm,
  emissionRangeForMaterialNm,
  inpFirstExcitonEv,
  listMaterials,
  resolveDot,
  runDesign,
} from '../../spectra/index';
import { errorOf } from './helpers/errors';

describe('CsPbBr3: empirical size–emission relation', () => {
  it(
    'a 4.0 nm cube emits at 470 nm and an 11.8 nm cube at 512 nm to 0.01 nm (the relation’s anchors: Protesescu et ' +
      'al., Nano Lett. 2015 size series; points from memory, unverified)',
    () => {
      expect(emissionPeakForDiameterNm('cspbbr3', 4)).toBeCloseTo(470, 2);
      expect(emissionPeakForDiameterNm('cspbbr3', 11.8)).toBeCloseTo(512, 2);
    },
  );

  it('the peaks at 5, 8 and 12 nm rise with size and stay within 480–515 nm; 12 nm is within 510–515 nm', () => {
    const [p5, p8, p12] = [5, 8, 12].map((l) => emissionPeakForDiameterNm('cspbbr3', l));
    expect(p5).toBeLessThan(p8);
    expect(p8).toBeLessThan(p12);
    expect(p5).toBeGreaterThan(480);
    expect(p12).toBeGreaterThanOrEqual(510);
    expect(p12).toBeLessThanOrEqual(515);
  });

  it('the reach ends by 520 nm (common practice: large CsPbBr3 nanocrystals emit near 510–520 nm)', () => {
    expect(emissionRangeForMaterialNm('cspbbr3')[1]).toBeLessThanOrEqual(520);
  });

  it(
    'over 9.9–12.5 nm edges the emission lies within 0.04 eV of the 2.391–2.469 eV an independent growth series ' +
      'reports (Energies 2021, 14, 275, abstract: CsPbBr3 NCs of 9.9–12.5 nm)',
    () => {
      for (const l of [9.9, 11, 12.5]) {
        const ev = HC_EV_NM / emissionPeakForDiameterNm('cspbbr3', l);
        expect(ev).toBeGreaterThan(2.391 - 0.04);
        expect(ev).toBeLessThan(2.469 + 0.04);
      }
    },
  );

  it(
    'the listed Bohr radius is εr a₀ / μ of the listed parameters (μ 0.126, εr 7.3 from one source, Yang et al., ACS ' +
      'Energy Lett. 2017, from memory) and gives a Bohr diameter within 1.5 nm of the ≈ 7 nm Protesescu et al. quote',
    () => {
      const p = BULK_PARAMS.cspbbr3;
      expect(p.reducedMassRel).toBeCloseTo(0.126, 6);
      expect(p.dielectricConstant).toBe(7.3);
      expect(p.bohrRadiusNm).toBeCloseTo((7.3 * BOHR_RADIUS_NM) / 0.126, 2);
      expect(Math.abs(2 * p.bohrRadiusNm - 7)).toBeLessThan(1.5);
    },
  );
});

describe('GaAs: illustrative only', () => {
  it('every GaAs result says it is illustrative, and the material record is marked so', () => {
    const dot = resolveDot({ material: 'gaas', diameterNm: 8 });
    expect(dot.warnings.join(' ')).toMatch(/Illustrative only/);
    expect(dot.model).toMatch(/illustrative/);
    expect(listMaterials().find((m) => m.id === 'gaas')!.illustrative).toBe(true);
    expect(
      listMaterials()
        .filter((m) => m.illustrative)
        .map((m) => m.id),
    ).toEqual(['gaas']);
  });

  const request = (allowed?: ('gaas' | 'cdse')[]) => ({
    targets: [
      { name: 'a', abundance: 1 },
      { name: 'b', abundance: 1 },
    ],
    excitation: [{ wavelengthNm: 488 }],
    windowNm: [640, 760] as [number, number],
    ...(allowed ? { allowedMaterials: allowed } : {}),
    options: { nodeBudget: 20000, refine: false },
  });

  it('automatic design without allowedMaterials never proposes GaAs, even in a window GaAs reaches', () => {
    const result = runDesign(request());
    expect(result.panel!.probes.map((p) => p.material)).not.toContain('gaas');
  });

  it('automatic design proposes GaAs when allowedMaterials names it', () => {
    const result = runDesign(request(['gaas']));
    expect(result.panel!.probes.every((p) => p.material === 'gaas')).toBe(true);
  });
});

describe('InP: the Almeida et al. 2023 relation', () => {
  // Almeida et al., Nano Lett. 2023, 23, 8697 (T): E = 1.33 + 9.128 (L/Å)^−0.684 (edge form) and
  // E = 1.33 + 1.219 (V/nm³)^−0.251 with V = L³/(6√2) (volume form, as transcribed).
  const edgeForm = (lNm: number) => 1.33 + 9.128 * (10 * lNm) ** -0.684;
  const volumeForm = (lNm: number) => 1.33 + 1.219 * (lNm ** 3 / (6 * Math.SQRT2)) ** -0.251;

  it('the tool uses the edge-length form, with d = L (1/(π√2))^(1/3) (equal volumes, exact geometry)', () => {
    for (const d of [1.2, 2, 3, 4]) {
      const edge = d / Math.cbrt(1 / (Math.PI * Math.SQRT2));
      expect(inpFirstExcitonEv(d)).toBeCloseTo(edgeForm(edge), 12);
    }
  });

  it(
    'the two transcribed forms differ by about 12 nm at a 1.2 nm core and by at most 6 nm from 2 nm up, as the ' +
      'material warning says',
    () => {
      const apartNm = (d: number) => {
        const edge = d / INP_ALMEIDA_2023.sphereDiameterPerEdge;
        return Math.abs(HC_EV_NM / edgeForm(edge) - HC_EV_NM / volumeForm(edge));
      };
      expect(apartNm(1.2)).toBeGreaterThan(10);
      expect(apartNm(1.2)).toBeLessThan(13);
      for (const d of [2, 2.5, 3, 3.5, 4]) expect(apartNm(d)).toBeLessThanOrEqual(6);
      expect(
        listMaterials()
          .find((m) => m.id === 'inp')!
          .warnings.join(' '),
      ).toMatch(/12 nm.*6 nm/);
    },
  );
});

describe('CdSe: the second published curve (Jasieniak et al. 2009)', () => {
  // Jasieniak, Smith, van Embden, Mulvaney, Califano, J. Phys. Chem. C 2009 (T for the size polynomial, M for the
  // extinction law): d(λ) and ε(E).
  const jasD = (l: number) => 59.60816 - 0.54736 * l + 1.8873e-3 * l ** 2 - 2.85743e-6 * l ** 3 + 1.62974e-9 * l ** 4;
  const jasEps = (e: number) => 155507 + 6.67054e13 * Math.exp(-e / 0.10551);
  const yuEps = (d: number) => 5857 * d ** 2.65; // Yu et al. 2003 (T)

  it(
    'sizingModel jasieniak2009 sizes a CdSe dot by the published ' + 'polynomial (d at its first exciton to 1e-9 nm)',
    () => {
      for (const peak of [520, 560, 600, 640]) {
        const dot = resolveDot({ material: 'cdse', emissionPeakNm: peak, sizingModel: 'jasieniak2009' });
        expect(dot.diameterNm!).toBeCloseTo(jasD(dot.firstExcitonNm!), 9);
        expect(dot.extinctionFirstExciton!).toBeCloseTo(jasEps(HC_EV_NM / dot.firstExcitonNm!), 0);
      }
    },
  );

  it('yu2003 stays the default: no sizingModel gives the same dot as sizingModel yu2003', () => {
    const a = resolveDot({ material: 'cdse', emissionPeakNm: 600 });
    const b = resolveDot({ material: 'cdse', emissionPeakNm: 600, sizingModel: 'yu2003' });
    expect(b.diameterNm).toBe(a.diameterNm);
    expect(b.extinctionFirstExciton).toBe(a.extinctionFirstExciton);
  });

  it(
    'each CdSe result states both curves’ size and extinction at ' + 'its colour, the percentage computed from both',
    () => {
      const dot = resolveDot({ material: 'cdse', emissionPeakNm: 540 });
      const line = dot.warnings.find((w) => w.startsWith('Published CdSe curves disagree'))!;
      expect(line).toBeDefined();
      const lambda = dot.firstExcitonNm!;
      const dJas = jasD(lambda);
      const pct = Math.round((100 * (jasEps(HC_EV_NM / lambda) - yuEps(dot.diameterNm!))) / yuEps(dot.diameterNm!));
      expect(line).toContain(`${dJas.toFixed(2)} nm core`);
      expect(line).toContain(`${pct >= 0 ? '+' : ''}${pct} %`);
      expect(pct).toBeGreaterThan(66); // more than the old warning's "up to ~66 %" for a small dot
    },
  );

  it(
    'sizingModel on a material other than CdSe is not the library’s ' + 'to refuse silently: the API schema refuses it',
    () => {
      // The library follows the material's only law; the schema test in test/worker checks the 400.
      const inp = resolveDot({ material: 'inp', emissionPeakNm: 620, sizingModel: 'jasieniak2009' });
      expect(inp.model).toMatch(/Almeida/);
    },
  );

  it('a CdSe peak outside the Jasieniak reach is out_of_range naming emissionPeakNm', () => {
    const err = errorOf(() => resolveDot({ material: 'cdse', emissionPeakNm: 470, sizingModel: 'jasieniak2009' }));
    expect(err.code).toBe('out_of_range');
    expect(err.path).toEqual(['emissionPeakNm']);
  });
});
