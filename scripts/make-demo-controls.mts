// Writes web/public/demo/controls.csv: invented single-stain controls for the demo panel (web/state/demo-panel.ts),
// made from the panel's predicted signal plus seeded noise, in the format the controls section reads. Usage:
// `npx tsx scripts/make-demo-controls.mts`. Every number here is invented for the demo: an unstained level of 100
// counts per channel (three unstained rows), each control's brightest channel 2000 counts above it, three replicates
// a probe, a 2 % spread of staining between replicates and a read noise of 4 counts per channel. The signal is the
// demo lot's (DEMO_LOT_DEVIATION: the Mito dot gives more in Orange than the model), so the demo shows a flagged entry.
import { writeFileSync } from 'node:fs';
import { createRandom, evaluatePanel } from '../spectra/index';
import { demoLotCollected, demoPanel } from '../web/state/demo-panel';

const UNSTAINED = 100;
const PRIMARY_COUNTS = 2000;
const REPLICATES = 3;
const STAINING_SPREAD = 0.02;
const READ_NOISE = 4;

const panel = demoPanel();
const collected = demoLotCollected(panel, evaluatePanel(panel, { sensitivity: false }).collected);
const rng = createRandom(20261203);
const round = (v: number) => Math.round(v * 10) / 10;
const header = ['sample', ...panel.channels.map((c) => c.label ?? c.id)];
const rows: (string | number)[][] = [header];
for (let k = 0; k < REPLICATES; k++) {
  rows.push(['unstained', ...panel.channels.map(() => round(UNSTAINED + READ_NOISE * rng.normal()))]);
}
panel.probes.forEach((probe, p) => {
  const column = collected.map((row) => row[p]);
  const scale = PRIMARY_COUNTS / Math.max(...column);
  const signal = column.map((v) => v * scale);
  for (let k = 0; k < REPLICATES; k++) {
    const staining = 1 + STAINING_SPREAD * rng.normal();
    rows.push([
      probe.label ?? probe.id,
      ...signal.map((s) => round(UNSTAINED + s * staining + READ_NOISE * rng.normal())),
    ]);
  }
});
const text = `# Invented demo controls for the demo panel (scripts/make-demo-controls.mts); counts per channel\n${rows
  .map((r) => r.join(','))
  .join('\n')}\n`;
writeFileSync(new URL('../web/public/demo/controls.csv', import.meta.url), text);
console.log(text);
