// The design form's request (web/state/design-request.ts) and its resolution on a microscope (web/state/checks.ts):
// locks become lock ids plus the locked parts as `owned`, checked and resolved by the API's own schema.
import { describe, expect, it } from 'vitest';
import { EXAMPLE_INSTRUMENTS, type PanelSpec } from '../../spectra/index';
import { checkDesignRequest, designForSearch } from '../../web/state/checks';
import { demoPanel } from '../../web/state/demo-panel';
import { designParts, designRequest, type DesignInput } from '../../web/state/design-request';

const WIDEFIELD = EXAMPLE_INSTRUMENTS[0];
const ID = 'A'.repeat(24);

/** The demo panel's Actin dot p4 and green channel c2 as written in demo-panel.ts. */
const P4 = {
  id: 'p4',
  label: 'Actin dot',
  material: 'cdse',
  emissionPeakNm: 620,
  shell: [{ material: 'zns', thicknessNm: 0.9 }],
  sizeDispersionPct: 5,
  quantumYield: 0.5,
  target: 'cytoskeleton marker',
  abundance: 1,
};
const C2 = { id: 'c2', label: 'Green', filters: [{ type: 'bandpass', centerNm: 515, widthNm: 20 }], excitationNm: 405 };

function input(extra: Partial<DesignInput> = {}): DesignInput {
  return {
    targets: [
      { name: 'CD-a', abundance: 'high', lock: { probe: 'p4' } },
      { name: 'CD-b', abundance: 'low', lock: { channel: 'c2' } },
      { name: 'CD-c', abundance: 0.3 },
    ],
    excitation: [{ wavelengthNm: 405 }],
    owned: designParts(demoPanel()),
    free: { exclude: [], allowedMaterials: ['cdse', 'inp'], windowNm: [450, 750] },
    options: { nodeBudget: 500 },
    sample: {},
    ...extra,
  };
}

describe('designRequest', () => {
  it('free mode: sends only the locked probe p4 and channel c2 as owned, and their ids as the locks', () => {
    const body = designRequest(input());
    expect(body.owned).toEqual({ probes: [P4], channels: [C2] });
    expect(body.targets).toEqual([
      { name: 'CD-a', abundance: 'high', lock: { probe: 'p4' } },
      { name: 'CD-b', abundance: 'low', lock: { channel: 'c2' } },
      { name: 'CD-c', abundance: 0.3 },
    ]);
    expect(body.candidates).toBeUndefined();
    expect(checkDesignRequest(body)).toBeUndefined();
  });

  it('free mode without any lock sends no owned parts and no lock keys', () => {
    const body = designRequest(input({ targets: [{ name: 'CD-a', abundance: 1, lock: {} }] }));
    expect('owned' in body).toBe(false);
    expect(body.targets).toEqual([{ name: 'CD-a', abundance: 1 }]);
  });

  it('catalog mode: the locks name candidates and nothing is sent as owned', () => {
    const parts = designParts(demoPanel());
    const body = designRequest(input({ candidates: parts }));
    expect(body.candidates).toBe(parts);
    expect('owned' in body).toBe(false);
    expect(body.targets[0].lock).toEqual({ probe: 'p4' });
    expect(checkDesignRequest(body)).toBeUndefined();
  });

  it('on a microscope: names its profile and leaves the lines out when none are typed', () => {
    const body = designRequest(input({ instrument: ID, excitation: undefined }));
    expect(body.instrument).toBe(ID);
    expect('excitation' in body).toBe(false);
    expect(checkDesignRequest(body)).toBeUndefined();
  });

  it('two targets locked to the same probe are refused at the second with both names', () => {
    const targets = [
      { name: 'CD-a', abundance: 1, lock: { probe: 'p4' } },
      { name: 'CD-b', abundance: 1, lock: { probe: 'p4' } },
    ];
    const problem = checkDesignRequest(designRequest(input({ targets })));
    expect(problem?.path).toEqual(['targets', 1, 'lock', 'probe']);
    expect(problem?.message).toContain("contradictory locks: targets 'CD-a' and 'CD-b' both lock probe 'p4'");
  });
});

describe('designParts', () => {
  it("puts the panel's shared dichroic in front of each channel's filters and drops each probe's channel", () => {
    const dichroic = { type: 'dichroic' as const, edgeNm: 425, passes: 'above' as const };
    const panel: PanelSpec = {
      ...demoPanel(),
      lightPath: { emissionFilters: [dichroic] },
      probes: demoPanel().probes.map((p) => ({ ...p, channel: 'c1' })),
    };
    const parts = designParts(panel);
    expect(parts.channels[1]).toEqual({ ...C2, filters: [dichroic, ...C2.filters] });
    expect(parts.probes[3]).toEqual(P4);
  });
});

describe('designForSearch on the example violet widefield', () => {
  it('gives its 405 nm line and six channel presets, each behind its 425 nm main dichroic, as channelChoices', () => {
    const body = designRequest(
      input({ targets: [{ name: 'CD-a', abundance: 1 }], instrument: ID, excitation: undefined }),
    );
    const r = designForSearch(body, WIDEFIELD);
    if (!r.ok) throw new Error(r.error.message);
    expect(r.request.excitation.map((l) => l.wavelengthNm)).toEqual([405]);
    const choices = r.request.channelChoices!;
    expect(choices.map((c) => c.id)).toEqual(['blue', 'green', 'yellow', 'orange', 'red', 'far-red']);
    for (const c of choices) expect(c.filters[0]).toEqual({ type: 'dichroic', edgeNm: 425, passes: 'above' });
    expect('instrument' in r.request).toBe(false);
  });

  it("a locked channel with the id 'green' takes the place of the microscope's green among the choices", () => {
    const mine = { id: 'green', filters: [{ type: 'bandpass' as const, centerNm: 530, widthNm: 30 }] };
    const body = designRequest(
      input({
        targets: [{ name: 'CD-a', abundance: 1, lock: { channel: 'green' } }],
        owned: { probes: [], channels: [mine] },
        instrument: ID,
        excitation: undefined,
      }),
    );
    const r = designForSearch(body, WIDEFIELD);
    if (!r.ok) throw new Error(r.error.message);
    expect(r.request.channelChoices!.map((c) => c.id)).toEqual(['blue', 'yellow', 'orange', 'red', 'far-red']);
    expect(r.request.owned?.channels).toEqual([mine]);
  });

  it("a 488 nm line is refused at excitation[0].wavelengthNm, listing the microscope's 405 nm", () => {
    const body = designRequest(input({ instrument: ID, excitation: [{ wavelengthNm: 488 }] }));
    const r = designForSearch(body, WIDEFIELD);
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.error.path).toEqual(['excitation', 0, 'wavelengthNm']);
    expect(r.error.message).toContain('(it has 405 nm)');
  });
});
