// Share ids are storage keys: a stored panel must keep its link forever. These fixed vectors pin the canonical text
// (RFC 8785 JSON Canonicalization Scheme) of each panel, its id under the local key of local.env, and the id it had
// before ids were keyed (plain SHA-256, still read). The digests are recomputed here with Node's own HMAC and SHA-256
// (node:crypto), independently of the worker's code.
import { createHash, createHmac } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { canonicalJson, shareIdOf, unkeyedShareIdOf } from '../../worker/share-id';
import { localEnvVar } from './helpers/worker';

const LOCAL_KEY = localEnvVar('SHARE_ID_KEY');

const vectors: { name: string; panel: unknown; canonical: string; id: string; unkeyedId: string }[] = [
  {
    name: 'a one-probe panel',
    panel: {
      version: 1,
      excitation: [{ wavelengthNm: 405 }],
      probes: [{ id: 'p1', material: 'cdse', emissionPeakNm: 605 }],
      channels: [{ id: 'c1', filters: [{ type: 'bandpass', centerNm: 605, widthNm: 20 }] }],
    },
    canonical:
      '{"channels":[{"filters":[{"centerNm":605,"type":"bandpass","widthNm":20}],"id":"c1"}],' +
      '"excitation":[{"wavelengthNm":405}],"probes":[{"emissionPeakNm":605,"id":"p1","material":"cdse"}],"version":1}',
    id: 'YzXhY3jNMMmYBAOmmREpQsrF',
    unkeyedId: 'Xl5JQ6GCmo5RnEMSJ1gwC05h',
  },
  {
    name: 'the same panel with its keys in another order',
    panel: {
      channels: [{ filters: [{ widthNm: 20, centerNm: 605, type: 'bandpass' }], id: 'c1' }],
      probes: [{ emissionPeakNm: 605, material: 'cdse', id: 'p1' }],
      excitation: [{ wavelengthNm: 405 }],
      version: 1,
    },
    canonical:
      '{"channels":[{"filters":[{"centerNm":605,"type":"bandpass","widthNm":20}],"id":"c1"}],' +
      '"excitation":[{"wavelengthNm":405}],"probes":[{"emissionPeakNm":605,"id":"p1","material":"cdse"}],"version":1}',
    id: 'YzXhY3jNMMmYBAOmmREpQsrF',
    unkeyedId: 'Xl5JQ6GCmo5RnEMSJ1gwC05h',
  },
  {
    name: 'a panel with non-ASCII text, quotes, a small number and a table',
    panel: {
      title: 'Ünïcode ✓ "quoted" \\ slash',
      excitation: [{ wavelengthNm: 488, powerRel: 0.5 }, { wavelengthNm: 640 }],
      probes: [
        { id: 'é', label: '日本', material: 'carbon', emissionPeakNm: 450.25, quantumYield: 0.1, abundance: 1e-6 },
      ],
      channels: [
        {
          id: 'x',
          filters: [
            {
              type: 'table',
              points: [
                [500, 0],
                [550.5, 0.125],
                [600, 1],
              ],
            },
          ],
          excitationNm: [488, 640],
        },
      ],
      background: { level: 0.3 },
    },
    canonical:
      '{"background":{"level":0.3},"channels":[{"excitationNm":[488,640],"filters":[{"points":[[500,0],[550.5,0.125],' +
      '[600,1]],"type":"table"}],"id":"x"}],"excitation":[{"powerRel":0.5,"wavelengthNm":488},{"wavelengthNm":640}],' +
      '"probes":[{"abundance":0.000001,"emissionPeakNm":450.25,"id":"é","label":"日本","material":"carbon",' +
      '"quantumYield":0.1}],"title":"Ünïcode ✓ \\"quoted\\" \\\\ slash"}',
    id: 'MzleYEHpOrlCNLRKQjtLh8jg',
    unkeyedId: 'PYRabsIAtvdvsGC8KZzkgvXO',
  },
];

describe('share ids', () => {
  it.each(vectors)('canonicalJson($name) is the pinned RFC 8785 text', ({ panel, canonical }) => {
    expect(canonicalJson(panel)).toBe(canonical);
  });

  it.each(vectors)(
    'shareIdOf($name) under the local key is the pinned id, the first 18 bytes of HMAC-SHA-256',
    async (v) => {
      const mac = createHmac('sha256', LOCAL_KEY).update(v.canonical, 'utf8').digest().subarray(0, 18);
      expect(mac.toString('base64url')).toBe(v.id);
      expect(await shareIdOf(canonicalJson(v.panel), LOCAL_KEY)).toBe(v.id);
    },
  );

  it.each(vectors)(
    'the id of $name cannot be computed from the content alone: its plain SHA-256 differs',
    async (v) => {
      const digest = createHash('sha256').update(v.canonical, 'utf8').digest().subarray(0, 18);
      expect(digest.toString('base64url')).toBe(v.unkeyedId);
      expect(await shareIdOf(v.canonical, LOCAL_KEY)).not.toBe(digest.toString('base64url'));
    },
  );

  it.each(vectors)('unkeyedShareIdOf($name) is the pinned id of the scheme before keys (still read)', async (v) => {
    expect(await unkeyedShareIdOf(v.canonical)).toBe(v.unkeyedId);
  });

  it('shareIdOf gives another id under another key (the id depends on the key)', async () => {
    const text = vectors[0].canonical;
    expect(await shareIdOf(text, `${LOCAL_KEY}-other`)).not.toBe(await shareIdOf(text, LOCAL_KEY));
  });
});
