// Bad panels at every panel route: each is a 4xx in the contract's error shape naming the field (real workerd).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { examplePanel } from './helpers/panels';
import { freshPersistDir, postJson, startWorker, type RunningWorker } from './helpers/worker';

type Panel = ReturnType<typeof examplePanel> & Record<string, any>;
type Case = [name: string, change: (p: Panel) => unknown, code: string, path: (string | number)[]];

const probe = (p: Panel, i = 0) => (p.probes as any[])[i];
const channel = (p: Panel, i = 0) => (p.channels as any[])[i];
const set = (f: (p: Panel) => void) => (p: Panel) => (f(p), p);

// Each case changes the valid example panel in one way and names the error the API must give.
const CASES: Case[] = [
  ['a string version', set((p) => (p.version = '1')), 'invalid_input', ['version']],
  ['version 2', set((p) => (p.version = 2)), 'invalid_input', ['version']],
  ['probes not an array', set((p) => (p.probes = { p1: {} })), 'invalid_input', ['probes']],
  ['no channels', set((p) => delete p.channels), 'invalid_input', ['channels']],
  ['no probes', set((p) => (p.probes = [])), 'invalid_input', ['probes']],
  ['a probe without id', set((p) => delete probe(p).id), 'invalid_input', ['probes', 0, 'id']],
  [
    'a string wavelength',
    set((p) => (p.excitation = [{ wavelengthNm: '405' }])),
    'invalid_input',
    ['excitation', 0, 'wavelengthNm'],
  ],
  [
    'a wavelength of 5000 nm',
    set((p) => (probe(p).emissionPeakNm = 5000)),
    'out_of_range',
    ['probes', 0, 'emissionPeakNm'],
  ],
  [
    'a negative wavelength',
    set((p) => (channel(p).filters[0].centerNm = -605)),
    'out_of_range',
    ['channels', 0, 'filters', 0, 'centerNm'],
  ],
  ['a 100 nm diameter', set((p) => (probe(p, 1).diameterNm = 100)), 'out_of_range', ['probes', 1, 'diameterNm']],
  ['a quantum yield of 1.5', set((p) => (probe(p).quantumYield = 1.5)), 'out_of_range', ['probes', 0, 'quantumYield']],
  ['an abundance of 0', set((p) => (probe(p).abundance = 0)), 'out_of_range', ['probes', 0, 'abundance']],
  [
    'a peak transmission of 2',
    set((p) => (channel(p, 1).filters[0].peakTransmission = 2)),
    'out_of_range',
    ['channels', 1, 'filters', 0, 'peakTransmission'],
  ],
  [
    '17 probes',
    set(
      (p) =>
        (p.probes = Array.from({ length: 17 }, (_, i) => ({ id: `p${i}`, material: 'cdse', emissionPeakNm: 600 }))),
    ),
    'invalid_input',
    ['probes'],
  ],
  [
    '65 channels',
    set((p) => (p.channels = Array.from({ length: 65 }, (_, i) => ({ id: `c${i}`, filters: [] })))),
    'invalid_input',
    ['channels'],
  ],
  [
    'a 1,001-point table',
    set((p) => (channel(p, 1).filters[2].points = Array.from({ length: 1001 }, (_, i) => [400 + i * 0.5, 0.5]))),
    'invalid_table',
    ['channels', 1, 'filters', 2, 'points'],
  ],
  [
    'a table out of order',
    set((p) => (channel(p, 1).filters[2].points[1][0] = 450)),
    'invalid_table',
    ['channels', 1, 'filters', 2, 'points', 1, 0],
  ],
  [
    'a transmission above 1 in a table',
    set((p) => (channel(p, 1).filters[2].points[1][1] = 90)),
    'invalid_table',
    ['channels', 1, 'filters', 2, 'points', 1, 1],
  ],
  [
    'a table row of three numbers',
    set((p) => (channel(p, 1).filters[2].points[0] = [500, 0.1, 3])),
    'invalid_table',
    ['channels', 1, 'filters', 2, 'points', 0],
  ],
  [
    'an unknown material',
    set((p) => (probe(p).material = 'unobtainium')),
    'unknown_material',
    ['probes', 0, 'material'],
  ],
  [
    'an unknown filter type',
    set((p) => (channel(p).filters[0].type = 'notch')),
    'unknown_filter_type',
    ['channels', 0, 'filters', 0, 'type'],
  ],
  [
    'an unknown detector',
    set((p) => (channel(p).detector = 'eyeball')),
    'unknown_detector',
    ['channels', 0, 'detector'],
  ],
  ['an unknown key at the top', set((p) => (p.owner = 'x')), 'invalid_input', ['owner']],
  ['an unknown key in a probe', set((p) => (probe(p).colour = 'red')), 'invalid_input', ['probes', 0, 'colour']],
  [
    'an unknown key in a filter',
    set((p) => (channel(p).filters[0].od = 6)),
    'invalid_input',
    ['channels', 0, 'filters', 0, 'od'],
  ],
  ['both diameter and peak', set((p) => (probe(p).diameterNm = 4)), 'invalid_input', ['probes', 0, 'diameterNm']],
  [
    'neither diameter nor peak',
    set((p) => delete probe(p).emissionPeakNm),
    'invalid_input',
    ['probes', 0, 'emissionPeakNm'],
  ],
  [
    'a custom probe without measured emission',
    set((p) => (probe(p, 1).material = 'custom')),
    'invalid_input',
    ['probes', 1, 'measuredEmission'],
  ],
  ['a duplicate probe id', set((p) => (probe(p, 1).id = 'p1')), 'duplicate_id', ['probes', 1, 'id']],
  ['a duplicate channel id', set((p) => (channel(p, 1).id = 'c1')), 'duplicate_id', ['channels', 1, 'id']],
  ['a probe naming no channel', set((p) => (probe(p).channel = 'c9')), 'unknown_channel', ['probes', 0, 'channel']],
  [
    'a channel naming no line',
    set((p) => (channel(p).excitationNm = [405, 488])),
    'invalid_input',
    ['channels', 0, 'excitationNm', 1],
  ],
  ['a 201-character title', set((p) => (p.title = 'x'.repeat(201))), 'invalid_input', ['title']],
  ['a 65-character id', set((p) => (probe(p).id = 'p'.repeat(65))), 'invalid_input', ['probes', 0, 'id']],
  ['an array body', () => [examplePanel()], 'invalid_input', []],
  ['a null body', () => null, 'invalid_input', []],
];

// Bodies sent as raw text: JSON that parses to non-finite numbers, or does not parse at all.
const RAW: [name: string, text: string, code: string, path: (string | number)[]][] = [
  [
    '1e999 as a wavelength',
    JSON.stringify(examplePanel()).replace('"wavelengthNm":405', '"wavelengthNm":1e999'),
    'invalid_input',
    ['excitation', 0, 'wavelengthNm'],
  ],
  [
    '-1e999 as an abundance',
    JSON.stringify(examplePanel()).replace('"abundance":1', '"abundance":-1e999'),
    'invalid_input',
    ['probes', 0, 'abundance'],
  ],
  ['a NaN literal', JSON.stringify(examplePanel()).replace('"abundance":1', '"abundance":NaN'), 'invalid_json', []],
  ['a truncated body', JSON.stringify(examplePanel()).slice(0, 50), 'invalid_json', []],
  ['an empty body', '', 'invalid_json', []],
  ['a trailing comma', '{"version":1,}', 'invalid_json', []],
];

const ROUTES = ['/api/v1/panels', '/api/v1/panels/evaluate'];
let worker: RunningWorker;

beforeAll(async () => {
  worker = await startWorker(freshPersistDir());
});
afterAll(async () => {
  await worker?.dispose();
});

describe.each(ROUTES)('POST %s with a bad panel', (route) => {
  it.each(CASES)(`POST ${route} with %s is a 400 naming the field`, async (_name, change, code, path) => {
    const res = await postJson(worker, route, change(examplePanel() as Panel));
    const body = (await res.json()) as { error: { code: string; message: string; path: unknown[] } };
    expect(res.status).toBe(400);
    expect(body.error.code).toBe(code);
    expect(body.error.path).toEqual(path);
    expect(body.error.message.length).toBeGreaterThan(5);
  });

  it.each(RAW)(`POST ${route} with %s is a 400 naming the field`, async (_name, text, code, path) => {
    const res = await postJson(worker, route, text, true);
    const body = (await res.json()) as { error: { code: string; path: unknown[] } };
    expect(res.status).toBe(400);
    expect(body.error.code).toBe(code);
    expect(body.error.path).toEqual(path);
  });
});
