// Share ids are storage keys: a stored panel must keep its link forever. These fixed vectors pin the canonical text
// (RFC 8785 JSON Canonicalization Scheme) and the id of each panel; the digest is recomputed here with Node's own
// SHA-256 (node:crypto), independently of the worker's code.
import { createHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { canonicalJson, shareIdOf } from '../../worker/share-id';

const vectors: { name: string; panel: unknown; canonical: string; id: string }[] = [
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
    id: 'Xl5JQ6GCmo5RnEMSJ1gwC05h',
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
    id: 'Xl5JQ6GCmo5RnEMSJ1gwC05h',
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
    id: 'PYRabsIAtvdvsGC8KZzkgvXO',
  },
];

describe('share ids', () => {
  it.each(vectors)('canonicalJson($name) is the pinned RFC 8785 text', ({ panel, canonical }) => {
    expect(canonicalJson(panel)).toBe(canonical);
  });

  it.each(vectors)('shareIdOf($name) is the pinned id, the first 18 bytes of SHA-256 in base64url', async (v) => {
    const digest = createHash('sha256').update(v.canonical, 'utf8').digest().subarray(0, 18);
    expect(digest.toString('base64url')).toBe(v.id);
    expect(await shareIdOf(canonicalJson(v.panel))).toBe(v.id);
  });
});
