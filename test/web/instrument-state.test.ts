// The page's instrument helpers (web/state/instrument.ts): switching a panel onto a profile, the request it sends,
// and a profile made from a panel, checked by the API's own schemas.
import { describe, expect, it } from 'vitest';
import { EXAMPLE_INSTRUMENTS, evaluatePanel, type PanelSpec } from '../../spectra/index';
import { Instrument, Panel, PanelRequest } from '../../worker/schemas';
import { demoPanel } from '../../web/state/demo-panel';
import {
  filterName,
  instrumentChanges,
  profileFromPanel,
  switchInstrument,
  toRequest,
} from '../../web/state/instrument';

const [WIDEFIELD, CONFOCAL] = EXAMPLE_INSTRUMENTS;
const ID = 'A'.repeat(24);

describe('switchInstrument', () => {
  it("takes the profile's lasers, shared path and presets, keeps every probe, drops channel choices it lacks", () => {
    const panel: PanelSpec = {
      ...demoPanel(),
      probes: demoPanel().probes.map((p, i) => ({ ...p, channel: i === 0 ? 'c1' : undefined })),
    };
    const moved = switchInstrument(panel, CONFOCAL);
    expect(moved.excitation.map((l) => l.wavelengthNm)).toEqual([405, 488, 561, 640]);
    expect(moved.channels.map((c) => c.id)).toEqual(['ch1', 'ch2', 'ch3', 'ch4']);
    expect(moved.lightPath?.emissionFilters).toHaveLength(1);
    expect(moved.probes.map((p) => p.id)).toEqual(panel.probes.map((p) => p.id));
    expect(moved.probes.every((p) => p.channel === undefined)).toBe(true);
    expect(Panel.safeParse(moved).success).toBe(true);
  });

  it('gives a request that the API schema takes and that names the profile instead of carrying its light path', () => {
    const moved = switchInstrument(demoPanel(), WIDEFIELD);
    const request = toRequest(moved, { id: ID, spec: WIDEFIELD });
    expect(request.instrument).toBe(ID);
    expect('lightPath' in request).toBe(false);
    expect(PanelRequest.safeParse(request).success).toBe(true);
  });
});

describe('profileFromPanel', () => {
  it('describes the demo microscope as a valid profile: one 405 nm laser at the given mW and six named filters', () => {
    const profile = profileFromPanel(demoPanel(), { name: 'Our widefield', description: '', powersMw: [12] });
    expect(Instrument.safeParse(profile).success).toBe(true);
    expect(profile.lasers).toEqual([{ wavelengthNm: 405, powerMw: 12 }]);
    expect(profile.filters?.map((f) => f.name)).toEqual(['460/40', '515/20', '580/20', '620/20', '660/20', '700 LP']);
    expect(profile.channels?.[3]).toEqual({ id: 'c4', label: 'Orange', filters: ['620/20'], excitationNm: 405 });
  });

  it('a profile made from a panel and switched back onto the panel gives the same figures (powers as set)', () => {
    const panel = demoPanel();
    const profile = profileFromPanel(panel, { name: 'Same', description: '', powersMw: [1] });
    const again = switchInstrument(panel, profile);
    expect(evaluatePanel(again).collected).toEqual(evaluatePanel(panel).collected);
  });
});

describe('filterName and instrumentChanges', () => {
  it('names filters in the trade notation: 605/20, 650 LP, 500 SP', () => {
    expect(filterName({ type: 'bandpass', centerNm: 605, widthNm: 20 })).toBe('605/20');
    expect(filterName({ type: 'longpass', edgeNm: 650 })).toBe('650 LP');
    expect(filterName({ type: 'shortpass', edgeNm: 500 })).toBe('500 SP');
  });

  it('reports the lines, channel counts and each probe before and after a switch from the demo to the confocal', () => {
    const before = demoPanel();
    const after = switchInstrument(before, CONFOCAL);
    const changes = instrumentChanges(
      { name: 'demo', panel: before, evaluation: evaluatePanel(before) },
      { name: CONFOCAL.name, panel: after, evaluation: evaluatePanel(after) },
    );
    expect(changes.linesNm).toEqual({ before: [405], after: [405, 488, 561, 640] });
    expect(changes.channels).toEqual({ before: 6, after: 4 });
    expect(changes.probes).toHaveLength(6);
    expect(changes.probes[0].before.channel).toBe('Blue');
  });
});
