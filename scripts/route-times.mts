// Wall time of requests to the API on local workerd, sequential, median and range of 5 after one warm-up each, as
// table rows for docs/api.md ("Work per request"). Usage: `npx tsx scripts/route-times.mts after` (`before` leaves
// out the requests the earlier API did not take); PORT picks the port (default: a free one).
import { unstable_startWorker } from 'wrangler';
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
process.env.CLOUDFLARE_CF_FETCH_ENABLED = 'false';
process.env.WRANGLER_SEND_METRICS = 'false';
const worker = await unstable_startWorker({
  config: new URL('../wrangler.toml', import.meta.url).pathname,
  dev: {
    server: { hostname: '127.0.0.1', port: Number(process.env.PORT ?? 0) },
    inspector: false,
    persist: mkdtempSync(join(tmpdir(), 'qb-kv-')),
    logLevel: 'warn',
    watch: false,
  },
});
await worker.ready;
const url = await worker.url;
const words = ['high', 'low', 'medium'];
const targets = (n: number) => Array.from({ length: n }, (_, i) => ({ name: `t${i}`, abundance: words[i % 3] }));
const probes16 = Array.from({ length: 16 }, (_, i) =>
  i < 8
    ? { id: `dot${i + 1}`, material: 'cdse', emissionPeakNm: 480 + i * 20 }
    : { id: `dot${i + 1}`, material: 'cdte', emissionPeakNm: 640 + (i - 8) * 12 },
);
const channels64 = Array.from({ length: 64 }, (_, i) => ({
  id: `bp${i + 1}`,
  filters: [{ type: 'bandpass', centerNm: 470 + i * 4, widthNm: 20 }],
}));
const panel = { version: 1, excitation: [{ wavelengthNm: 405 }], probes: probes16, channels: channels64 };
const cases: [string, string, unknown][] = [
  ['resolve', '/api/v1/dots/resolve', { material: 'cdse', emissionPeakNm: 605, excitationNm: 405 }],
  ['evaluate 16 × 64', '/api/v1/panels/evaluate', panel],
  ...(process.argv[2] === 'after'
    ? [
        ['evaluate 16 × 64, sensitivity false', '/api/v1/panels/evaluate', { ...panel, sensitivity: false }] as [
          string,
          string,
          unknown,
        ],
      ]
    : []),
  [
    'catalog design 16 × 64, default budget',
    '/api/v1/panels/design',
    {
      targets: targets(16),
      excitation: [{ wavelengthNm: 405 }],
      candidates: { probes: probes16, channels: channels64 },
    },
  ],
  [
    'free design 6 targets, default',
    '/api/v1/panels/design',
    { targets: targets(6), excitation: [{ wavelengthNm: 405 }] },
  ],
  ...(process.argv[2] === 'after'
    ? [
        [
          'former pinning request (6 targets, 1 nm steps, 5M nodes, floor 0)',
          '/api/v1/panels/design',
          {
            targets: targets(6),
            excitation: [{ wavelengthNm: 405 }],
            options: { peakStepNm: 1, bandStepNm: 1, nodeBudget: 5000000, minSignalFraction: 0 },
          },
        ] as [string, string, unknown],
        [
          '12 free targets, 5 nm steps, 5M nodes',
          '/api/v1/panels/design',
          {
            targets: targets(12),
            excitation: [{ wavelengthNm: 405 }],
            options: { peakStepNm: 5, bandStepNm: 5, nodeBudget: 5000000 },
          },
        ] as [string, string, unknown],
      ]
    : []),
];
for (const [name, path, body] of cases) {
  const ms: number[] = [];
  let status = 0;
  for (let k = 0; k < 6; k++) {
    const t0 = performance.now();
    const res = await fetch(new URL(path, url), {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify(body),
    });
    await res.arrayBuffer();
    status = res.status;
    if (k > 0) ms.push(performance.now() - t0);
  }
  ms.sort((a, b) => a - b);
  console.log(`| ${name} | ${status} | ${Math.round(ms[2])} | ${Math.round(ms[0])}–${Math.round(ms[4])} |`);
}
await worker.dispose();
