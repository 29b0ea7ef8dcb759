import { describe, expect, it } from 'vitest';
import {
  AVOGADRO_PER_MOL,
  HC_EV_NM,
  LEAK_SCALE,
  TYPICAL_SHELLS,
  carrierReach,
  emissionPeakForDiameterNm,
  extinctionAtNm,
  firstExcitonNmForDiameter,
  listMaterials,
  resolveDot,
  type DotInput,
  type ShellLayer,
} from '../../spectra/index';
import { errorOf } from './helpers/errors';

const zns = (t: number): ShellLayer[] => [{ material: 'zns', thicknessNm: t }];
const shiftNm = (material: DotInput['material'], coreNm: number, shell: ShellLayer[]) =>
  firstExcitonNmForDiameter(material, coreNm, { shell }) - firstExcitonNmForDiameter(material, coreNm);

describe('core/shell dots: the red shift', () => {
  it('a probe with shell [] resolves to exactly the numbers of the same probe without a shell field', () => {
    const bare = resolveDot({ material: 'cdse', emissionPeakNm: 605 });
    const empty = resolveDot({ material: 'cdse', emissionPeakNm: 605, shell: [] });
    expect(empty.diameterNm).toBe(bare.diameterNm);
    expect(empty.emission.values).toEqual(bare.emission.values);
    expect(extinctionAtNm(empty, 405)).toBe(extinctionAtNm(bare, 405));
    expect(bare.overallDiameterNm).toBe(bare.diameterNm);
  });

  it(
    'CdSe/ZnS (2 ML, 0.6 nm): the first exciton moves 5–30 nm to the red for a 2.3 nm core and 1–10 nm for a 5.5 ' +
      'nm core, more for smaller cores (Dabbousi et al., J. Phys. Chem. B 1997; magnitudes from memory, unverified)',
    () => {
      const small = shiftNm('cdse', 2.3, zns(0.6));
      const large = shiftNm('cdse', 5.5, zns(0.6));
      expect(small).toBeGreaterThan(5);
      expect(small).toBeLessThan(30);
      expect(large).toBeGreaterThan(1);
      expect(large).toBeLessThan(10);
      expect(shiftNm('cdse', 3, zns(0.6))).toBeLessThan(small);
      expect(shiftNm('cdse', 4, zns(0.6))).toBeGreaterThan(large);
    },
  );

  it(
    'CdSe/ZnS: the shift saturates with thickness (a 2 nm ZnS ' + 'shell moves a 4 nm core under 1.5× a 0.6 nm one)',
    () => {
      const thin = shiftNm('cdse', 4, zns(0.6));
      const thick = shiftNm('cdse', 4, zns(2));
      expect(thick).toBeGreaterThan(thin);
      expect(thick).toBeLessThan(1.5 * thin);
    },
  );

  it(
    'CdSe/CdS (quasi type II): a 2 nm CdS shell moves the emission of a 4 nm core 15–50 nm, over 1.5× what a ZnS ' +
      'shell of the same thickness does (Reiss, Protière, Li, Small 2009, review; from memory, unverified)',
    () => {
      const bare = emissionPeakForDiameterNm('cdse', 4);
      const cds = emissionPeakForDiameterNm('cdse', 4, { shell: [{ material: 'cds', thicknessNm: 2 }] });
      expect(cds - bare).toBeGreaterThan(15);
      expect(cds - bare).toBeLessThan(50);
      expect(cds - bare).toBeGreaterThan(1.5 * shiftNm('cdse', 4, zns(2)));
    },
  );

  it(
    'InP/ZnSe/ZnS: the ZnSe shell moves the emission of a 3 nm InP core 15–60 nm to the red (the electron spreads ' +
      'into ZnSe; InP/ZnSe/ZnS literature, e.g. Won et al., Nature 2019; magnitude from memory, unverified)',
    () => {
      const bare = emissionPeakForDiameterNm('inp', 3);
      const shelled = emissionPeakForDiameterNm('inp', 3, { shell: [...TYPICAL_SHELLS.inp] });
      expect(shelled - bare).toBeGreaterThan(15);
      expect(shelled - bare).toBeLessThan(60);
    },
  );

  it('a silica encapsulation does not move the emission (carriers do not leak into a non-epitaxial layer)', () => {
    for (const edge of [4, 8]) {
      const bare = emissionPeakForDiameterNm('cspbbr3', edge);
      const silica = emissionPeakForDiameterNm('cspbbr3', edge, { shell: [{ material: 'silica', thicknessNm: 5 }] });
      expect(silica).toBe(bare);
    }
  });

  it(
    'the leak into a barrier follows the BenDaniel–Duke deep-well extension (m_shell/m_core)/κ times the stated ' +
      'empirical scale: CdSe/ZnS electron under a 20 nm layer, to 1e-4 nm',
    () => {
      // κ = √(2 m_shell ΔE)/ħ with ħ²/2m₀ = 0.0380998 eV nm² (CODATA 2018); masses and offset as documented (M).
      const kappa = Math.sqrt((0.28 * 0.9) / (0.37603 / Math.PI ** 2));
      const leak = (LEAK_SCALE * (0.28 / 0.13)) / kappa;
      const t = 20;
      const reach = carrierReach('cdse', [{ material: 'zns', thicknessNm: t }]);
      expect(reach.electronNm).toBeCloseTo((t * leak) / (t + leak), 4);
    },
  );

  it('a CdTe/CdS dot warns that a carrier spreads into the shell (type II for the electron)', () => {
    const dot = resolveDot({ material: 'cdte', diameterNm: 3.5, shell: [{ material: 'cds', thicknessNm: 1 }] });
    expect(dot.warnings.join(' ')).toMatch(/no barrier in this shell/);
    const cdseZns = resolveDot({ material: 'cdse', diameterNm: 3.5, shell: zns(1) });
    expect(cdseZns.warnings.join(' ')).not.toMatch(/no barrier in this shell/);
  });

  it('a layer thinner than one monolayer (0.1 nm ZnS) is warned about', () => {
    const dot = resolveDot({ material: 'cdse', diameterNm: 4, shell: zns(0.1) });
    expect(dot.warnings.join(' ')).toMatch(/thinner than one monolayer/);
  });
});

describe('core/shell dots: sizing by the product peak', () => {
  it.each([
    ['cdse', 605],
    ['cdse', 655],
    ['inp', 630],
    ['cdte', 650],
  ] as const)(
    'resolveDot(%s, emissionPeakNm %d, typical shell) peaks there to 1e-6 nm, on a smaller core than the bare one',
    (material, peak) => {
      const shell = TYPICAL_SHELLS[material].map((l) => ({ ...l }));
      const withShell = resolveDot({ material, emissionPeakNm: peak, shell });
      const bare = resolveDot({ material, emissionPeakNm: peak });
      expect(Math.abs(emissionPeakForDiameterNm(material, withShell.diameterNm!, { shell }) - peak)).toBeLessThan(1e-6);
      expect(withShell.diameterNm!).toBeLessThan(bare.diameterNm!);
      const total = shell.reduce((s, l) => s + l.thicknessNm, 0);
      expect(withShell.overallDiameterNm).toBeCloseTo(withShell.coreDiameterNm! + 2 * total, 12);
    },
  );

  it('a peak the core/shell cannot reach is out_of_range naming emissionPeakNm and saying "with this shell"', () => {
    const err = errorOf(() => resolveDot({ material: 'cdse', emissionPeakNm: 450, shell: zns(0.9) }));
    expect(err.code).toBe('out_of_range');
    expect(err.path).toEqual(['emissionPeakNm']);
    expect(err.message).toMatch(/with this shell/);
  });

  it('listMaterials gives every sized material a typical shell and the reach under it (redder than bare)', () => {
    for (const m of listMaterials()) {
      if (m.diameterRangeNm === null) {
        expect(m.typicalShell).toBeNull();
        continue;
      }
      expect(m.typicalShell).not.toBeNull();
      if (m.typicalShell!.length > 0 && m.id !== 'cspbbr3')
        expect(m.typicalShellEmissionRangeNm![1]).toBeGreaterThan(m.emissionRangeNm![1]);
    }
  });
});

describe('core/shell dots: the shell absorbs above its gap', () => {
  // Volume-scaled intrinsic absorption, ε = N_A V μi / (1000 ln 10) (Hens & Moreels, J. Mater. Chem. 2012), written
  // out here with V in cm³; μi of ZnSe 0.5 eV above its 2.7 eV gap = 6.9e4 cm⁻¹ (C, by analogy with Leatherdale et al.
  // 2002 for CdSe; unverified for ZnSe).
  const layerEpsilon = (dInNm: number, dOutNm: number, gapEv: number, nm: number) => {
    const above = HC_EV_NM / nm - gapEv;
    if (above <= 0) return 0;
    const volumeCm3 = (Math.PI / 6) * (dOutNm ** 3 - dInNm ** 3) * 1e-21;
    return (AVOGADRO_PER_MOL * volumeCm3 * 6.9e4 * Math.sqrt(Math.min(above, 1.5) / 0.5)) / (1000 * Math.LN10);
  };

  it('InP/ZnSe: at 405 nm the ZnSe layer adds the volume-scaled ε written out from its formula (to 1e-9)', () => {
    const shell: ShellLayer[] = [{ material: 'znse', thicknessNm: 1.5 }];
    const core = 3;
    const dot = resolveDot({ material: 'inp', diameterNm: core, shell });
    // The layer's part: the dot's ε minus the same absorption model without its shell layers.
    const expected = layerEpsilon(core, core + 3, 2.7, 405);
    const absorption = dot.absorption;
    if (absorption.type !== 'exciton') throw new Error('expected the exciton model');
    const coreOnly = resolveDot({ material: 'inp', diameterNm: core });
    expect(expected).toBeGreaterThan(1e5);
    expect(absorption.shells).toHaveLength(1);
    const withoutShell = { ...absorption, shells: undefined };
    const layer = extinctionAtNm(dot, 405) - extinctionAtNm({ absorption: withoutShell }, 405);
    expect(Math.abs(layer - expected) / expected).toBeLessThan(1e-9);
    expect(extinctionAtNm(dot, 405)).toBeGreaterThan(3 * extinctionAtNm(coreOnly, 405));
  });

  it('ZnS (gap ≈ 3.6 eV, 344 nm; common practice) adds nothing at 405 nm and absorbs at 300 nm', () => {
    const dot = resolveDot({ material: 'cdse', diameterNm: 4, shell: zns(0.9) });
    if (dot.absorption.type !== 'exciton') throw new Error('expected the exciton model');
    const withoutShell = { absorption: { ...dot.absorption, shells: undefined } };
    expect(extinctionAtNm(dot, 405)).toBe(extinctionAtNm(withoutShell, 405));
    expect(extinctionAtNm(dot, 300)).toBeGreaterThan(extinctionAtNm(withoutShell, 300));
  });

  it(
    'CdSe/ZnS at 350 nm keeps the core-volume cross-section of Leatherdale et al. 2002 (5.501e5 · r³ cm², abstract): ' +
      'ZnS is transparent there',
    () => {
      const core = 4;
      const dot = resolveDot({ material: 'cdse', diameterNm: core, shell: zns(0.9) });
      const r = (core / 2) * 1e-7;
      const sigma = 5.501e5 * r ** 3; // cm²
      const epsilon = (sigma * AVOGADRO_PER_MOL) / (1000 * Math.LN10);
      expect(Math.abs(extinctionAtNm(dot, 350) - epsilon) / epsilon).toBeLessThan(0.15);
    },
  );
});

describe('brightness at the common lines, CdSe, InP and CdTe probes with their typical shells', () => {
  const eps = (material: 'cdse' | 'inp' | 'cdte', peak: number, nm: number) =>
    extinctionAtNm(
      resolveDot({ material, emissionPeakNm: peak, shell: TYPICAL_SHELLS[material].map((l) => ({ ...l })) }),
      nm,
    );

  it(
    'at 405 nm a 650 nm InP/ZnSe/ZnS probe is within 10× of a 655 nm CdSe/ZnS probe (the ZnSe shell absorbs violet ' +
      'light; bare cores put them 23× apart) and over 4× its bare core',
    () => {
      const ratio = eps('cdse', 655, 405) / eps('inp', 650, 405);
      expect(ratio).toBeGreaterThan(1);
      expect(ratio).toBeLessThan(10);
      expect(eps('inp', 650, 405)).toBeGreaterThan(
        4 * extinctionAtNm(resolveDot({ material: 'inp', emissionPeakNm: 650 }), 405),
      );
    },
  );

  it(
    'at 488 and 561 nm the larger CdSe core outshines InP/ZnSe/ZnS of the same colour (ZnSe absorbs nothing beyond ' +
      '≈ 460 nm; common practice: InP probes are dim under blue and green lines)',
    () => {
      expect(eps('cdse', 655, 488)).toBeGreaterThan(eps('inp', 650, 488));
      expect(eps('cdse', 655, 561)).toBeGreaterThan(eps('inp', 650, 561));
      expect(eps('cdte', 650, 561)).toBeGreaterThan(eps('inp', 650, 561));
    },
  );
});
