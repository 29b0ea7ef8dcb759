// POST /api/v1/panels/design with what the user already owns (locks, owned probes and channels) and with the
// microscope's channels (channelChoices, instrument), on the real Workers runtime with real local KV. The targets and
// dots are invented; the instrument is one of the example profiles every installation serves.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { errorOf, freshPersistDir, postJson, startWorker, type RunningWorker } from './helpers/worker';

let worker: RunningWorker;
beforeAll(async () => {
  worker = await startWorker(freshPersistDir());
});
afterAll(async () => {
  await worker?.dispose();
});

const design = (body: unknown) => postJson(worker, '/api/v1/panels/design', body);

const bandpass = (centerNm: number, widthNm = 20) => ({ type: 'bandpass', centerNm, widthNm });
const peaks = [500, 525, 550, 575, 600, 625, 650, 680];

/** Catalog mode: three targets over eight dots and eight matching 20 nm bandpasses under 405 nm. */
const catalog = () => ({
  targets: [
    { name: 'marker A', abundance: 'high' },
    { name: 'marker B', abundance: 'low' },
    { name: 'marker C', abundance: 'medium' },
  ] as Record<string, unknown>[],
  excitation: [{ wavelengthNm: 405 }],
  candidates: {
    probes: peaks.map((nm, i) => ({ id: `dot${i + 1}`, material: nm < 660 ? 'cdse' : 'cdte', emissionPeakNm: nm })),
    channels: peaks.map((nm, i) => ({ id: `bp${i + 1}`, filters: [bandpass(nm)] })),
  },
});

/** Free mode: two targets under 405 nm with a small node budget. */
const free = () => ({
  targets: [
    { name: 'marker A', abundance: 'high' },
    { name: 'marker B', abundance: 'low' },
  ] as Record<string, unknown>[],
  excitation: [{ wavelengthNm: 405 }],
  options: { nodeBudget: 2000 },
});

const MY_DOT = { id: 'my-605', material: 'cdse', emissionPeakNm: 605, shell: [{ material: 'zns', thicknessNm: 1 }] };
const MY_CHANNEL = { id: 'my-605/20', filters: [bandpass(605)] };

/** The example profile of the violet widefield: its id, its presets and its main dichroic (GET /api/v1/instruments). */
async function violetWidefield() {
  const list = (await (await worker.call('/api/v1/instruments')).json()) as { instruments: { id: string }[] };
  for (const { id } of list.instruments) {
    const spec = (await (await worker.call(`/api/v1/instruments/${id}`)).json()) as {
      name: string;
      dichroics: { filter: unknown }[];
      filters: { name: string; filter: unknown }[];
      channels: { id: string; filters: string[] }[];
    };
    if (spec.name === 'Histology widefield, violet LED') return { id, spec };
  }
  throw new Error('the example violet widefield is not served');
}

type Bad = [string, string, (string | number)[], RegExp, () => unknown];

const bad: Bad[] = [
  [
    'a probe lock naming no candidate (catalog mode)',
    'invalid_input',
    ['targets', 0, 'lock', 'probe'],
    /dot99.*not among the candidate or owned probes/,
    () => ({ ...catalog(), targets: [{ name: 'marker A', abundance: 1, lock: { probe: 'dot99' } }] }),
  ],
  [
    'a channel lock naming no owned channel (free mode)',
    'invalid_input',
    ['targets', 1, 'lock', 'channel'],
    /bp1.*not among the owned channels/,
    () => {
      const r = free();
      r.targets[1] = { ...r.targets[1], lock: { channel: 'bp1' } };
      return { ...r, owned: { channels: [MY_CHANNEL] } };
    },
  ],
  [
    'a probe lock in free mode with no owned probes',
    'invalid_input',
    ['targets', 0, 'lock', 'probe'],
    /my-605.*not among the owned probes/,
    () => ({ ...free(), targets: [{ name: 'marker A', abundance: 1, lock: { probe: 'my-605' } }] }),
  ],
  [
    'two targets locking the same probe',
    'invalid_input',
    ['targets', 2, 'lock', 'probe'],
    /contradictory locks: targets 'marker A' and 'marker C' both lock probe 'dot2'/,
    () => {
      const r = catalog();
      r.targets[0] = { ...r.targets[0], lock: { probe: 'dot2' } };
      r.targets[2] = { ...r.targets[2], lock: { probe: 'dot2' } };
      return r;
    },
  ],
  [
    'two targets locking the same owned channel',
    'invalid_input',
    ['targets', 1, 'lock', 'channel'],
    /contradictory locks: targets 'marker A' and 'marker B' both lock channel 'my-605\/20'/,
    () => {
      const r = free();
      r.targets[0] = { ...r.targets[0], lock: { channel: MY_CHANNEL.id } };
      r.targets[1] = { ...r.targets[1], lock: { channel: MY_CHANNEL.id } };
      return { ...r, owned: { channels: [MY_CHANNEL] } };
    },
  ],
  [
    'an empty lock',
    'invalid_input',
    ['targets', 0, 'lock'],
    /must name a probe or a channel/,
    () => ({ ...catalog(), targets: [{ name: 'marker A', abundance: 1, lock: {} }] }),
  ],
  [
    'a lock with an unknown key',
    'invalid_input',
    ['targets', 0, 'lock', 'dye'],
    /not a known field/,
    () => ({ ...catalog(), targets: [{ name: 'marker A', abundance: 1, lock: { dye: 'x' } }] }),
  ],
  [
    'channelChoices together with candidates',
    'invalid_input',
    ['channelChoices'],
    /must not be given with candidates/,
    () => ({ ...catalog(), channelChoices: [MY_CHANNEL] }),
  ],
  [
    'an instrument together with candidates',
    'invalid_input',
    ['instrument'],
    /must not be given with candidates/,
    () => ({ ...catalog(), instrument: 'A'.repeat(24) }),
  ],
  [
    'an instrument together with channelChoices',
    'invalid_input',
    ['instrument'],
    /must not be given with channelChoices/,
    () => ({ ...free(), instrument: 'A'.repeat(24), channelChoices: [MY_CHANNEL, { id: 'x', filters: [] }] }),
  ],
  [
    'a malformed instrument id',
    'invalid_input',
    ['instrument'],
    /must be an instrument id/,
    () => ({ ...free(), instrument: 'my scope' }),
  ],
  [
    'one id twice in owned probes',
    'duplicate_id',
    ['owned', 'probes', 1, 'id'],
    /'my-605' is used twice in owned probes/,
    () => ({ ...free(), owned: { probes: [MY_DOT, { ...MY_DOT, emissionPeakNm: 625 }] } }),
  ],
  [
    "an owned channel with a candidate channel's id",
    'duplicate_id',
    ['owned', 'channels', 0, 'id'],
    /'bp3' is also a candidate channel's id/,
    () => ({ ...catalog(), owned: { channels: [{ ...MY_CHANNEL, id: 'bp3' }] } }),
  ],
  [
    "an owned probe with a candidate probe's id",
    'duplicate_id',
    ['owned', 'probes', 0, 'id'],
    /'dot1' is also a candidate probe's id/,
    () => ({ ...catalog(), owned: { probes: [{ ...MY_DOT, id: 'dot1' }] } }),
  ],
  [
    'an owned channel with the id of one of channelChoices',
    'duplicate_id',
    ['owned', 'channels', 0, 'id'],
    /also the id of one of channelChoices/,
    () => ({ ...free(), channelChoices: [MY_CHANNEL, { id: 'wide', filters: [] }], owned: { channels: [MY_CHANNEL] } }),
  ],
  [
    'one id twice in channelChoices',
    'duplicate_id',
    ['channelChoices', 1, 'id'],
    /used twice in channelChoices/,
    () => ({ ...free(), channelChoices: [MY_CHANNEL, MY_CHANNEL] }),
  ],
  [
    'fewer channelChoices than targets',
    'invalid_input',
    ['channelChoices'],
    /has 1 channels; 2 targets need at least 2/,
    () => ({ ...free(), channelChoices: [MY_CHANNEL] }),
  ],
  [
    'no excitation and no instrument',
    'invalid_input',
    ['excitation'],
    /needs at least one excitation line \(or an instrument/,
    () => ({ targets: free().targets }),
  ],
  [
    'an unknown instrument id',
    'unknown_instrument',
    ['instrument'],
    /no instrument profile is stored under 'AAAAAAAAAAAAAAAAAAAAAAAA'/,
    () => ({ targets: free().targets, instrument: 'AAAAAAAAAAAAAAAAAAAAAAAA' }),
  ],
];

describe('POST /api/v1/panels/design: locks, owned items, channel choices and instrument refused', () => {
  it.each(bad)('POST /panels/design with %s answers 400 %s at %j', async (_what, code, path, message, body) => {
    const res = await design(body());
    expect(res.status).toBe(400);
    const error = await errorOf(res);
    expect(error?.code).toBe(code);
    expect(error?.path).toEqual(path);
    expect(error?.message).toMatch(message);
  });

  it('POST /panels/design on the violet widefield with a 488 nm line answers 400 naming that line', async () => {
    const { id } = await violetWidefield();
    const res = await design({ targets: free().targets, instrument: id, excitation: [{ wavelengthNm: 488 }] });
    expect(res.status).toBe(400);
    const error = await errorOf(res);
    expect(error?.path).toEqual(['excitation', 0, 'wavelengthNm']);
    expect(error?.message).toContain('405 nm');
  });

  it('POST /panels/design owning all six channels of the violet widefield, one target unlocked, is a 400', async () => {
    const { id, spec } = await violetWidefield();
    const owned = spec.channels.map((c) => ({ id: c.id, filters: [bandpass(600)] }));
    const targets = [
      { name: 'marker A', abundance: 1, lock: { channel: 'green' } },
      { name: 'marker B', abundance: 1 },
    ];
    const res = await design({ targets, instrument: id, owned: { channels: owned } });
    expect(res.status).toBe(400);
    const error = await errorOf(res);
    expect(error?.path).toEqual(['instrument']);
    expect(error?.message).toMatch(
      /every channel of the instrument .* is owned, so none is left to choose for target 'marker B'/,
    );
  });

  it('POST /panels/design of 7 targets on the violet widefield (6 channels) is a 400 naming instrument', async () => {
    const { id } = await violetWidefield();
    const targets = Array.from({ length: 7 }, (_, i) => ({ name: `marker ${i + 1}`, abundance: 1 }));
    const res = await design({ targets, instrument: id });
    expect(res.status).toBe(400);
    const error = await errorOf(res);
    expect(error?.path).toEqual(['instrument']);
    expect(error?.message).toMatch(/offers 6 channels under these lines; 7 targets need at least 7/);
  });
});

// The behaviour below is the spectral library's (spectra/design): choosing among channelChoices and honouring locks.
describe('POST /api/v1/panels/design: proposals on the microscope and around what the user owns', () => {
  it(
    'POST /panels/design on the violet widefield without excitation answers 200 under its 405 nm line, every ' +
      'proposed channel one of its presets behind its main dichroic',
    async () => {
      const { id, spec } = await violetWidefield();
      const res = await design({ targets: free().targets, instrument: id, options: { nodeBudget: 2000 } });
      expect(res.status, await res.clone().text()).toBe(200);
      const body = (await res.json()) as {
        verdict: string;
        panel: { excitation: { wavelengthNm: number }[]; channels: { id: string; filters: unknown[] }[] } | null;
      };
      expect(body.panel, body.verdict).not.toBeNull();
      expect(body.panel!.excitation.map((l) => l.wavelengthNm)).toEqual([405]);
      // Each preset as a panel on the instrument reads it: the main dichroic, then the preset's own filters.
      const filterByName = new Map(spec.filters.map((f) => [f.name, f.filter]));
      const presets = spec.channels.map((c) => ({
        id: c.id,
        filters: [spec.dichroics[0].filter, ...c.filters.map((name) => filterByName.get(name))],
      }));
      expect(body.panel!.channels).toHaveLength(2);
      for (const channel of body.panel!.channels)
        expect(presets).toContainEqual({ id: channel.id, filters: channel.filters });
    },
  );

  it('POST /panels/design (catalog), marker B locked to dot3 and bp3 (not its optimum), gets both', async () => {
    const r = catalog();
    r.targets[1] = { ...r.targets[1], lock: { probe: 'dot3', channel: 'bp3' } };
    const res = await design(r);
    expect(res.status).toBe(200);
    const body = (await res.json()) as { panel: { probes: { id: string; target: string; channel: string }[] } };
    const b = body.panel.probes.find((p) => p.target === 'marker B')!;
    expect([b.id, b.channel]).toEqual(['dot3', 'bp3']);
    // Without the lock the exact optimum gives marker B dot8 in bp8 (the lock is what moves it).
  });

  it('POST /panels/design (free), marker B locked to an owned 605 nm dot: that dot is proposed for it', async () => {
    const r = free();
    r.targets[1] = { ...r.targets[1], lock: { probe: MY_DOT.id } };
    const res = await design({ ...r, owned: { probes: [MY_DOT] } });
    expect(res.status).toBe(200);
    const body = (await res.json()) as { panel: { probes: { id: string; target: string; emissionPeakNm: number }[] } };
    const b = body.panel.probes.find((p) => p.target === 'marker B')!;
    expect(b.id).toBe('my-605');
    expect(b.emissionPeakNm).toBe(605);
  });

  it(
    "POST /panels/design on the violet widefield with marker A locked to an owned channel 'green' (530/30) reads " +
      'marker A there, and no other proposed channel is called green',
    async () => {
      const { id } = await violetWidefield();
      const mine = { id: 'green', filters: [bandpass(530, 30)] };
      const r = free();
      r.targets[0] = { ...r.targets[0], lock: { channel: 'green' } };
      const res = await design({ targets: r.targets, instrument: id, owned: { channels: [mine] }, options: r.options });
      expect(res.status, await res.clone().text()).toBe(200);
      const body = (await res.json()) as {
        panel: { probes: { target: string; channel: string }[]; channels: { id: string; filters: unknown[] }[] };
      };
      expect(body.panel.probes.find((p) => p.target === 'marker A')!.channel).toBe('green');
      const greens = body.panel.channels.filter((c) => c.id === 'green');
      expect(greens).toEqual([mine]);
    },
  );
});
