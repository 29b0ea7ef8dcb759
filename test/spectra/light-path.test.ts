import { describe, expect, it } from 'vitest';
import {
  DEFAULT_GRID,
  SpectraError,
  evaluatePanel,
  filterTransmission,
  panelSpectra,
  seriesTransmission,
  type PanelSpec,
} from '../../spectra/index';

const base: PanelSpec = {
  excitation: [{ wavelengthNm: 405 }, { wavelengthNm: 488, powerRel: 0.5 }],
  probes: [
    { id: 'g', material: 'cdse', emissionPeakNm: 525 },
    { id: 'r', material: 'cdse', emissionPeakNm: 625 },
  ],
  channels: [
    { id: 'c1', filters: [{ type: 'bandpass', centerNm: 525, widthNm: 30 }] },
    { id: 'c2', filters: [{ type: 'bandpass', centerNm: 625, widthNm: 30 }] },
  ],
};
const dichroic = { type: 'dichroic' as const, edgeNm: 500, passes: 'above' as const };
const cleanup = { type: 'shortpass' as const, edgeNm: 450 };

describe('the shared light path', () => {
  it('a shared dichroic and clean-up filter evaluate exactly as the same panel with them written out', () => {
    const withPath = evaluatePanel(
      { ...base, lightPath: { emissionFilters: [dichroic], excitationFilters: [cleanup] } },
      { sensitivity: false },
    );
    // Written out by hand: the dichroic in front of each channel's own filters, each line's power times the clean-up
    // filter's transmission at the line.
    const tAt = (nm: number) => filterTransmission(cleanup, { startNm: nm, stepNm: 1, count: 1 })[0];
    const written = evaluatePanel(
      {
        ...base,
        excitation: base.excitation.map((l) => ({ ...l, powerRel: (l.powerRel ?? 1) * tAt(l.wavelengthNm) })),
        channels: base.channels.map((c) => ({ ...c, filters: [dichroic, ...c.filters] })),
      },
      { sensitivity: false },
    );
    expect(withPath.collected).toEqual(written.collected);
    expect(withPath.lineLeak).toEqual(written.lineLeak);
  });

  it('a 450 nm shortpass clean-up filter removes the 488 nm line: the red probe collects 405 nm light only', () => {
    const open = evaluatePanel(base, { sensitivity: false });
    const only405 = evaluatePanel({ ...base, excitation: [base.excitation[0]] }, { sensitivity: false });
    const cleaned = evaluatePanel({ ...base, lightPath: { excitationFilters: [cleanup] } }, { sensitivity: false });
    expect(open.collected[1][1]).toBeGreaterThan(only405.collected[1][1] * 1.01);
    // Shortpass at 450 nm, OD 6: 488 nm is blocked to 1e-6; 405 nm passes at the 0.95 peak transmission.
    expect(cleaned.collected[1][1] / (0.95 * only405.collected[1][1])).toBeCloseTo(1, 4);
  });

  it('the chart draws each channel as its detector sees it, shared dichroic included (none at 470 nm)', () => {
    const spectra = panelSpectra({ ...base, lightPath: { emissionFilters: [dichroic] } });
    const at = (nm: number) => spectra.channels[0].values[nm - spectra.startNm];
    expect(at(470)).toBeLessThan(0.02);
  });

  it('a model error in a shared filter names lightPath.emissionFilters.0, not a channel', () => {
    const bad = { type: 'bandpass' as const, centerNm: 600, widthNm: 2, edgeWidthNm: 10 };
    let error: unknown;
    try {
      evaluatePanel({ ...base, lightPath: { emissionFilters: [bad] } }, { sensitivity: false });
    } catch (e) {
      error = e;
    }
    expect(error).toBeInstanceOf(SpectraError);
    expect((error as SpectraError).path.slice(0, 3)).toEqual(['lightPath', 'emissionFilters', 0]);
  });

  it("seriesTransmission([dichroic 500, shortpass 450]) multiplies each filter's transmission point by point", () => {
    const t = seriesTransmission([dichroic, cleanup], DEFAULT_GRID);
    const a = filterTransmission(dichroic, DEFAULT_GRID);
    const b = filterTransmission(cleanup, DEFAULT_GRID);
    expect(t).toHaveLength(DEFAULT_GRID.count);
    for (const nm of [400, 470, 500, 525, 800]) expect(t[nm - 300]).toBeCloseTo(a[nm - 300] * b[nm - 300], 12);
    // At 600 nm the dichroic passes and the shortpass blocks (OD 6): the series blocks.
    expect(a[300]).toBeGreaterThan(0.9);
    expect(t[300]).toBeLessThan(1e-5);
  });

  it('seriesTransmission([]) is 1 at every grid point; an error in filter 1 names that index after the path', () => {
    expect(seriesTransmission([], DEFAULT_GRID).every((v) => v === 1)).toBe(true);
    const bad = { type: 'bandpass' as const, centerNm: 600, widthNm: 2, edgeWidthNm: 10 };
    let error: unknown;
    try {
      seriesTransmission([dichroic, bad], DEFAULT_GRID, ['lightPath', 'emissionFilters']);
    } catch (e) {
      error = e;
    }
    expect(error).toBeInstanceOf(SpectraError);
    expect((error as SpectraError).path.slice(0, 3)).toEqual(['lightPath', 'emissionFilters', 1]);
  });
});
