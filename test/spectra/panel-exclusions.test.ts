// A panel's stated exclusions (cadmium, lead, arsenic by element: Cd, Pb, As, as the user's institutional rule or lab
// policy): the evaluation names every probe whose core or shell is in an excluded class.
import { describe, expect, it } from 'vitest';
import { evaluatePanel, type PanelSpec } from '../../spectra/index';

const panel = (exclude?: PanelSpec['exclude']): PanelSpec => ({
  version: 1,
  excitation: [{ wavelengthNm: 405 }],
  probes: [
    { id: 'p1', label: 'membrane', material: 'cdse', emissionPeakNm: 605 },
    // InP core with a CdS shell: cadmium through the shell.
    { id: 'p2', material: 'inp', emissionPeakNm: 650, shell: [{ material: 'cds', thicknessNm: 0.7 }] },
    { id: 'p3', material: 'inp', emissionPeakNm: 700, shell: [{ material: 'zns', thicknessNm: 0.9 }] },
  ],
  channels: [
    { id: 'c1', filters: [{ type: 'bandpass', centerNm: 605, widthNm: 20 }] },
    { id: 'c2', filters: [{ type: 'bandpass', centerNm: 650, widthNm: 20 }] },
    { id: 'c3', filters: [{ type: 'bandpass', centerNm: 700, widthNm: 20 }] },
  ],
  ...(exclude ? { exclude } : {}),
});

const excludedWarnings = (p: PanelSpec) => evaluatePanel(p).warnings.filter((w) => w.includes('this panel excludes'));

describe('panel exclusions', () => {
  it('a cadmium-free panel names the CdSe core and the InP core with a CdS shell, not the InP/ZnS probe', () => {
    expect(excludedWarnings(panel(['cadmium']))).toEqual([
      'probe membrane (p1) contains cadmium, which this panel excludes',
      'probe p2 contains cadmium, which this panel excludes',
    ]);
  });

  it('a panel excluding lead and arsenic only, or stating nothing, names no probe', () => {
    expect(excludedWarnings(panel(['lead', 'arsenic']))).toEqual([]);
    expect(excludedWarnings(panel())).toEqual([]);
  });
});
