// The API's schemas are the one place input is checked (the page uses them too): each bad input below is refused with
// the contract's code and the path of the field, read through issueToError exactly as the API and the page read it.
// The spectral library then sees only checked input (its own tests cover what its models refuse).
import { describe, expect, it } from 'vitest';
import type { z } from 'zod';
import { DesignRequest, DotRequest, Panel, issueToError } from '../../worker/schemas/index';

/** The first issue of a failed parse as the API reports it: [code, path]. */
function firstError(schema: z.ZodType, value: unknown): [string, (string | number)[]] | 'accepted' {
  const parsed = schema.safeParse(value);
  if (parsed.success) return 'accepted';
  const error = issueToError(parsed.error.issues[0]);
  return [error.code, error.path];
}

const points = (...pairs: [number, number][]) => ({ points: pairs });

describe('DotRequest refuses a bad dot with the field that is wrong', () => {
  const cases: [string, unknown, string, (string | number)[]][] = [
    [
      'both diameterNm and emissionPeakNm',
      { material: 'cdse', diameterNm: 4, emissionPeakNm: 600 },
      'invalid_input',
      ['diameterNm'],
    ],
    ['neither diameterNm nor emissionPeakNm', { material: 'cdse' }, 'invalid_input', ['emissionPeakNm']],
    ['a negative diameterNm', { material: 'cdse', diameterNm: -1 }, 'out_of_range', ['diameterNm']],
    ['a string diameterNm', { material: 'cdse', diameterNm: '4' }, 'invalid_input', ['diameterNm']],
    ['an unknown material', { material: 'pbs', emissionPeakNm: 900 }, 'unknown_material', ['material']],
    ['custom without measuredEmission', { material: 'custom' }, 'invalid_input', ['measuredEmission']],
    [
      'custom with a diameter',
      { material: 'custom', diameterNm: 3, measuredEmission: points([500, 1], [510, 2]) },
      'invalid_input',
      ['diameterNm'],
    ],
    ['carbon with a diameter', { material: 'carbon', diameterNm: 3 }, 'invalid_input', ['diameterNm']],
    [
      'a sizeDispersionPct above 30 %',
      { material: 'cdse', diameterNm: 4, sizeDispersionPct: 31 },
      'out_of_range',
      ['sizeDispersionPct'],
    ],
    [
      'a negative sizeDispersionPct',
      { material: 'cdse', diameterNm: 4, sizeDispersionPct: -2 },
      'out_of_range',
      ['sizeDispersionPct'],
    ],
    [
      'a quantumYield above 1',
      { material: 'cdse', diameterNm: 4, quantumYield: 1.5 },
      'out_of_range',
      ['quantumYield'],
    ],
    ['a fwhmNm below 1 nm', { material: 'carbon', emissionPeakNm: 450, fwhmNm: 0 }, 'out_of_range', ['fwhmNm']],
    [
      'a string excitationNm',
      { material: 'cdse', diameterNm: 4, excitationNm: '405' },
      'invalid_input',
      ['excitationNm'],
    ],
    [
      'a descending measured table',
      { material: 'custom', measuredEmission: points([500, 1], [490, 2]) },
      'invalid_table',
      ['measuredEmission', 'points', 1, 0],
    ],
    [
      'a negative measured value',
      { material: 'custom', measuredEmission: points([500, 1], [510, -1]) },
      'invalid_table',
      ['measuredEmission', 'points', 1, 1],
    ],
    [
      'a one-point extinction table',
      { material: 'cdse', diameterNm: 4, extinction: { points: [[500, 1]] } },
      'invalid_table',
      ['extinction', 'points'],
    ],
    [
      'a grid of more than 4,001 points',
      { material: 'cdse', diameterNm: 4, grid: { startNm: 300, endNm: 1000, stepNm: 0.1 } },
      'out_of_range',
      ['grid', 'stepNm'],
    ],
  ];
  it.each(cases)('DotRequest refuses %s with the code and path of the field', (_what, body, code, path) => {
    expect(firstError(DotRequest, body)).toEqual([code, path]);
  });

  it('DotRequest accepts a dot by emission peak with every optional field in range', () => {
    const dot = { material: 'cdse', emissionPeakNm: 605, sizeDispersionPct: 30, quantumYield: 1, excitationNm: 405 };
    expect(firstError(DotRequest, dot)).toBe('accepted');
  });
});

describe('Panel refuses a bad panel with the field that is wrong', () => {
  const base = () => ({
    version: 1,
    excitation: [{ wavelengthNm: 405 }, { wavelengthNm: 488 }],
    probes: [
      { id: 'p1', material: 'cdse', emissionPeakNm: 525 },
      { id: 'p2', material: 'cdse', emissionPeakNm: 605, channel: 'c2' },
    ],
    channels: [
      { id: 'c1', filters: [{ type: 'bandpass', centerNm: 525, widthNm: 20 }] },
      { id: 'c2', filters: [{ type: 'bandpass', centerNm: 605, widthNm: 20 }], excitationNm: 405 },
    ],
  });
  type P = ReturnType<typeof base> & Record<string, unknown>;
  const cases: [string, (p: P) => void, string, (string | number)[]][] = [
    [
      'a bandpass of width 0',
      (p) => ((p.channels[0].filters[0] as { widthNm: number }).widthNm = 0),
      'out_of_range',
      ['channels', 0, 'filters', 0, 'widthNm'],
    ],
    [
      'a peak transmission of 0',
      (p) => Object.assign(p.channels[0].filters[0], { peakTransmission: 0 }),
      'invalid_input',
      ['channels', 0, 'filters', 0, 'peakTransmission'],
    ],
    [
      'an unknown filter type',
      (p) => ((p.channels[0].filters[0] as { type: string }).type = 'notch'),
      'unknown_filter_type',
      ['channels', 0, 'filters', 0, 'type'],
    ],
    [
      'an unknown detector',
      (p) => Object.assign(p.channels[0], { detector: 'film' }),
      'unknown_detector',
      ['channels', 0, 'detector'],
    ],
    [
      'a probe naming no channel of the panel',
      (p) => (p.probes[1].channel = 'nowhere'),
      'unknown_channel',
      ['probes', 1, 'channel'],
    ],
    [
      'a channel naming a line the panel does not have',
      (p) => (p.channels[1].excitationNm = 561),
      'invalid_input',
      ['channels', 1, 'excitationNm'],
    ],
    ['a channel id used twice', (p) => (p.channels[1].id = 'c1'), 'duplicate_id', ['channels', 1, 'id']],
    [
      'a negative abundance',
      (p) => Object.assign(p.probes[0], { abundance: -1 }),
      'out_of_range',
      ['probes', 0, 'abundance'],
    ],
    [
      'a line at NaN nm',
      (p) => (p.excitation[1].wavelengthNm = Number.NaN),
      'invalid_input',
      ['excitation', 1, 'wavelengthNm'],
    ],
    ['no probes', (p) => (p.probes = []), 'invalid_input', ['probes']],
    [
      '17 probes',
      (p) =>
        (p.probes = Array.from({ length: 17 }, (_, i) => ({ id: `x${i}`, material: 'cdse', emissionPeakNm: 600 }))),
      'invalid_input',
      ['probes'],
    ],
    [
      'a table filter with a repeated wavelength',
      (p) =>
        (p.channels[0].filters = [
          {
            type: 'table',
            points: [
              [500, 0.2],
              [500, 0.3],
            ],
          },
        ] as never),
      'invalid_table',
      ['channels', 0, 'filters', 0, 'points', 1, 0],
    ],
    ['a negative background level', (p) => (p.background = { level: -1 }), 'out_of_range', ['background', 'level']],
    [
      'a background preset that is not a preset id',
      (p) => (p.background = { level: 1, preset: 'paraffin' }),
      'invalid_input',
      ['background', 'preset'],
    ],
    [
      'a background preset together with measured points',
      (p) =>
        (p.background = {
          level: 1,
          preset: 'frozen-tissue',
          points: [
            [500, 1],
            [600, 1],
          ],
        }),
      'invalid_input',
      ['background', 'preset'],
    ],
  ];
  it.each(cases)('Panel refuses %s with the code and path of the field', (_what, breakIt, code, path) => {
    const panel = base() as P;
    breakIt(panel);
    expect(firstError(Panel, panel)).toEqual([code, path]);
  });

  it('Panel accepts the unbroken panel', () => {
    expect(firstError(Panel, base())).toBe('accepted');
  });

  it('Panel accepts a background with each preset id and no points', () => {
    for (const preset of ['ffpe-tissue', 'frozen-tissue', 'cultured-cells']) {
      expect(firstError(Panel, { ...base(), background: { level: 0.5, preset } }), preset).toBe('accepted');
    }
  });
});

describe('DesignRequest refuses a bad request with the field that is wrong', () => {
  const base = {
    targets: [
      { name: 'A', abundance: 'high' },
      { name: 'B', abundance: 0.2 },
    ],
    excitation: [{ wavelengthNm: 405 }],
  };
  const candidates = {
    probes: [{ id: 'p1', material: 'cdse', emissionPeakNm: 560 }],
    channels: [
      { id: 'c1', filters: [{ type: 'bandpass', centerNm: 560, widthNm: 20 }] },
      { id: 'c2', filters: [] },
    ],
  };
  const cases: [string, Record<string, unknown>, string, (string | number)[]][] = [
    [
      'a target named twice',
      {
        targets: [
          { name: 'A', abundance: 1 },
          { name: 'A', abundance: 1 },
        ],
      },
      'invalid_input',
      ['targets', 1, 'name'],
    ],
    [
      'an abundance word it does not know',
      { targets: [{ name: 'A', abundance: 'some' }] },
      'invalid_input',
      ['targets', 0, 'abundance'],
    ],
    ['an exclusion word it does not know', { exclude: ['mercury'] }, 'invalid_input', ['exclude', 0]],
    ['an empty window', { windowNm: [600, 500] }, 'invalid_input', ['windowNm']],
    [
      'a width outside the default 20–60 nm range',
      { options: { bandwidthsNm: [10] } },
      'invalid_input',
      ['options', 'bandwidthsNm'],
    ],
    [
      'a width range the wrong way round',
      { options: { bandwidthRangeNm: [60, 20] } },
      'invalid_input',
      ['options', 'bandwidthRangeNm'],
    ],
    [
      'photons for 3 targets when there are 2',
      { options: { photons: [1, 2, 3] } },
      'invalid_input',
      ['options', 'photons'],
    ],
    [
      'a node budget above the limit',
      { options: { nodeBudget: 5_000_001 } },
      'out_of_range',
      ['options', 'nodeBudget'],
    ],
    ['fewer candidate probes than targets', { candidates }, 'invalid_input', ['candidates', 'probes']],
  ];
  it.each(cases)('DesignRequest refuses %s with the code and path of the field', (_what, change, code, path) => {
    expect(firstError(DesignRequest, { ...base, ...change })).toEqual([code, path]);
  });

  it('DesignRequest accepts a free-mode request with widths inside its own range', () => {
    expect(firstError(DesignRequest, { ...base, options: { bandwidthsNm: [10], bandwidthRangeNm: [10, 30] } })).toBe(
      'accepted',
    );
  });
});
