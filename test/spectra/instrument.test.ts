// Resolving a panel against an instrument profile (spectra/light/instrument.ts): pure data, no storage.
import { describe, expect, it } from 'vitest';
import {
  EXAMPLE_INSTRUMENTS,
  evaluatePanel,
  instrumentChoices,
  resolveOnInstrument,
  SpectraError,
  type InstrumentSpec,
  type ProbeSpec,
} from '../../spectra/index';

const PROFILE: InstrumentSpec = {
  version: 1,
  name: 'bench stand',
  lasers: [
    { wavelengthNm: 405, powerMw: 20 },
    { wavelengthNm: 561, powerMw: 2 },
  ],
  dichroics: [{ name: 'LP 420', filter: { type: 'longpass', edgeNm: 420 } }],
  filters: [{ name: '605/20', filter: { type: 'bandpass', centerNm: 605, widthNm: 20 } }],
  detectors: [{ name: 'cam', type: 'scmos' }],
  channels: [{ id: 'o', filters: ['605/20'], detector: 'cam', excitationNm: 405 }],
};
const PROBES: ProbeSpec[] = [{ id: 'p', material: 'cdse', emissionPeakNm: 605 }];

function errorOf(run: () => unknown): SpectraError {
  try {
    run();
  } catch (e) {
    if (e instanceof SpectraError) return e;
  }
  throw new Error('expected a SpectraError');
}

describe('resolveOnInstrument', () => {
  it('writes out every laser at its mW, the dichroic in front of every channel, and the presets by name', () => {
    const panel = resolveOnInstrument({ instrument: 'x'.repeat(24), probes: PROBES }, PROFILE);
    expect(panel.excitation).toEqual([
      { wavelengthNm: 405, powerRel: 20 },
      { wavelengthNm: 561, powerRel: 2 },
    ]);
    expect(panel.lightPath).toEqual({ emissionFilters: [{ type: 'longpass', edgeNm: 420 }] });
    expect(panel.channels).toEqual([
      { id: 'o', filters: [{ type: 'bandpass', centerNm: 605, widthNm: 20 }], excitationNm: 405, detector: 'scmos' },
    ]);
    expect('instrument' in panel).toBe(false);
  });

  it("keeps the panel's own channels and lines, a line without powerRel taking the laser's mW", () => {
    const own = [{ id: 'mine', filters: [{ type: 'longpass' as const, edgeNm: 650 }] }];
    const panel = resolveOnInstrument(
      { instrument: 'x'.repeat(24), probes: PROBES, channels: own, excitation: [{ wavelengthNm: 561 }] },
      PROFILE,
    );
    expect(panel.channels).toBe(own);
    expect(panel.excitation).toEqual([{ wavelengthNm: 561, powerRel: 2 }]);
  });

  it('refuses a line the instrument lacks, naming excitation[i].wavelengthNm and listing its lines', () => {
    const e = errorOf(() =>
      resolveOnInstrument({ instrument: 'x'.repeat(24), probes: PROBES, excitation: [{ wavelengthNm: 488 }] }, PROFILE),
    );
    expect(e.path).toEqual(['excitation', 0, 'wavelengthNm']);
    expect(e.message).toContain('405, 561 nm');
  });

  it('refuses a light path of its own next to an instrument, naming lightPath', () => {
    const e = errorOf(() =>
      resolveOnInstrument({ instrument: 'x'.repeat(24), probes: PROBES, lightPath: { emissionFilters: [] } }, PROFILE),
    );
    expect(e.path).toEqual(['lightPath']);
  });

  it('every example profile resolves into a panel that evaluates with finite collected light in every channel', () => {
    for (const instrument of EXAMPLE_INSTRUMENTS) {
      const panel = resolveOnInstrument({ instrument: 'x'.repeat(24), probes: PROBES }, instrument);
      const evaluation = evaluatePanel(panel);
      expect(evaluation.collected).toHaveLength(instrument.channels!.length);
      for (const row of evaluation.collected) expect(Number.isFinite(row[0]), instrument.name).toBe(true);
    }
  });
});

describe('instrumentChoices', () => {
  /** Two lasers, a clean-up filter passing 0.8 at 405 nm, a longpass dichroic, and presets under 405, 561 or both. */
  const STAND: InstrumentSpec = {
    version: 1,
    name: 'two-line stand',
    lasers: [
      { wavelengthNm: 405, powerMw: 20 },
      { wavelengthNm: 561, powerMw: 2 },
    ],
    dichroics: [{ name: 'LP 420', filter: { type: 'longpass', edgeNm: 420 } }],
    excitationFilters: [
      { name: 'clean-up', filter: { type: 'bandpass', centerNm: 405, widthNm: 20, peakTransmission: 0.8 } },
    ],
    filters: [
      { name: '525/20', filter: { type: 'bandpass', centerNm: 525, widthNm: 20 } },
      { name: '605/20', filter: { type: 'bandpass', centerNm: 605, widthNm: 20 } },
    ],
    channels: [
      { id: 'g', filters: ['525/20'], excitationNm: 405 },
      { id: 'o', filters: ['605/20'], excitationNm: 561 },
      { id: 'both', filters: ['605/20'], excitationNm: [405, 561] },
    ],
  };
  const LP420 = { type: 'longpass', edgeNm: 420 };
  const BP525 = { type: 'bandpass', centerNm: 525, widthNm: 20 };
  const BP605 = { type: 'bandpass', centerNm: 605, widthNm: 20 };

  it('gives every laser and every preset with the dichroic in front of its own filters', () => {
    const { excitation, channels } = instrumentChoices(STAND);
    expect(excitation.map((l) => l.wavelengthNm)).toEqual([405, 561]);
    expect(channels).toEqual([
      { id: 'g', filters: [LP420, BP525], excitationNm: 405 },
      { id: 'o', filters: [LP420, BP605], excitationNm: 561 },
      { id: 'both', filters: [LP420, BP605], excitationNm: [405, 561] },
    ]);
  });

  it("takes each line's power through the clean-up filter: 20 mW × 0.8 at 405 nm", () => {
    const { excitation } = instrumentChoices(STAND, [{ wavelengthNm: 405 }]);
    expect(excitation).toHaveLength(1);
    // The clean-up bandpass is flat at its peak transmission 0.8 around its centre, 405 nm.
    expect(excitation[0].powerRel).toBeCloseTo(16, 9);
  });

  it('under 405 nm alone: drops the preset read under 561 nm only, keeps 405 nm of the one under both', () => {
    const { channels } = instrumentChoices(STAND, [{ wavelengthNm: 405 }]);
    expect(channels.map((c) => [c.id, c.excitationNm])).toEqual([
      ['g', 405],
      ['both', 405],
    ]);
  });

  it('refuses a line the instrument lacks at excitation[i].wavelengthNm', () => {
    const e = errorOf(() => instrumentChoices(STAND, [{ wavelengthNm: 405 }, { wavelengthNm: 488 }]));
    expect(e.path).toEqual(['excitation', 1, 'wavelengthNm']);
  });

  it('refuses a profile without channel presets, naming instrument', () => {
    const e = errorOf(() => instrumentChoices({ ...STAND, channels: [] }));
    expect(e.path).toEqual(['instrument']);
    expect(e.message).toContain('no channel presets');
  });

  it('refuses lines under which no preset is read, naming excitation', () => {
    const stand: InstrumentSpec = { ...STAND, channels: [{ id: 'o', filters: ['605/20'], excitationNm: 561 }] };
    const e = errorOf(() => instrumentChoices(stand, [{ wavelengthNm: 405 }]));
    expect(e.path).toEqual(['excitation']);
  });
});
