// <qdp-controls-section> in headless Chromium, driven as a user drives it: a controls CSV chosen in the file input,
// the measured and predicted tables with the flagged entry, each download read back from its blob URL and parsed,
// the "use as reference" event, and bad files with their messages (the loaded controls kept). The demo button is
// driven on the served page (test/e2e/controls.test.ts), which serves the demo file.
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { evaluatePanel, type PanelSpec } from '../../spectra/index';
import '../../web/elements/controls-section';
import { demoPanel } from '../../web/state/demo-panel';
import { parseCsv } from './helpers/parse-csv';

type Download = { filename: string; text: Promise<string> };
let downloads: Download[] = [];

function catchDownload(e: MouseEvent): void {
  const a = e.target;
  if (!(a instanceof HTMLAnchorElement) || !a.download) return;
  e.preventDefault();
  downloads.push({ filename: a.download, text: fetch(a.href).then((r) => r.text()) });
}

beforeEach(() => {
  downloads = [];
  document.addEventListener('click', catchDownload, true);
});
afterEach(() => {
  document.removeEventListener('click', catchDownload, true);
  document.body.replaceChildren();
});

const panel = demoPanel();
const evaluation = evaluatePanel(panel, { sensitivity: false });
const UNSTAINED = 100;

/**
 * A noise-free controls CSV from the model: each probe's column scaled to 1000 counts in its brightest channel, over
 * an unstained level of 100; Mito dot (p3) raised in Orange (c4) by `extra` of its primary signal.
 */
function modelCsv(extra = 0.15): string {
  const lines = [`sample,${panel.channels.map((c) => c.label).join(',')}`];
  lines.push(`unstained,${panel.channels.map(() => UNSTAINED).join(',')}`);
  panel.probes.forEach((probe, p) => {
    const column = evaluation.collected.map((row) => row[p]);
    const scale = 1000 / Math.max(...column);
    const values = column.map((v, c) => UNSTAINED + v * scale + (probe.id === 'p3' && c === 3 ? extra * 1000 : 0));
    lines.push(`${probe.label},${values.join(',')}`);
  });
  return lines.join('\n');
}

async function mount(p: PanelSpec = panel) {
  const el = document.createElement('qdp-controls-section');
  el.panel = p;
  el.evaluation = evaluation;
  document.body.appendChild(el);
  await el.updateComplete;
  return el;
}

/** Chooses a file in the element's file input, as a user does, and waits until the element has shown the result. */
async function chooseFile(el: HTMLElementTagNameMap['qdp-controls-section'], text: string, name = 'controls.csv') {
  const input = el.shadowRoot!.querySelector<HTMLInputElement>('input[type="file"]')!;
  const transfer = new DataTransfer();
  transfer.items.add(new File([text], name, { type: 'text/csv' }));
  input.files = transfer.files;
  input.dispatchEvent(new Event('change'));
  await expect.poll(() => el.shadowRoot!.querySelector('table, .error')).not.toBeNull();
  await new Promise((r) => setTimeout(r, 50));
  await el.updateComplete;
}

const button = (el: HTMLElement, start: string) =>
  [...el.shadowRoot!.querySelectorAll('button')].find((b) => b.textContent!.trim().startsWith(start))!;
const errorText = (el: HTMLElement) => el.shadowRoot!.querySelector('.error')?.textContent?.trim() ?? '';

describe('<qdp-controls-section>', () => {
  it('a controls CSV chosen by the user shows measured beside predicted and flags Mito dot in Orange', async () => {
    const el = await mount();
    await chooseFile(el, modelCsv());
    const tables = el.shadowRoot!.querySelectorAll('table');
    expect(tables).toHaveLength(2);
    const flagged = [...el.shadowRoot!.querySelectorAll('td.flag')];
    expect(flagged).toHaveLength(1);
    expect(flagged[0].textContent).toContain('▲');
    // Expected from the model (evaluatePanel) plus the 15 points added by hand.
    const predicted = evaluation.spillover[3][2]!;
    const sentences = [...el.shadowRoot!.querySelectorAll('.sentences li')].map((li) => li.textContent!.trim());
    expect(sentences).toHaveLength(1);
    expect(sentences[0]).toMatch(
      new RegExp(`^Mito dot spills ${((predicted + 0.15) * 100).toFixed(1)} % into Orange; predicted `),
    );
    expect(sentences[0]).toMatch(/: 15\.0 points above$/);
  });

  it('both tables read "primary" in each probe\'s primary channel, one cell per column', async () => {
    const el = await mount();
    await chooseFile(el, modelCsv());
    for (const table of el.shadowRoot!.querySelectorAll('table')) {
      const rows = [...table.querySelectorAll('tr')].slice(1).map((tr) => [...tr.querySelectorAll('td')]);
      // Demo panel: probe p (0-based) has its primary channel at row p (channels c1..c6 assigned in order).
      const primaryRows = rows[0].map((_, p) => rows.findIndex((cells) => cells[p].textContent!.trim() === 'primary'));
      expect(primaryRows).toEqual([0, 1, 2, 3, 4, 5]);
    }
  });

  it('each download parses back: measured CSV, FCS $SPILLOVER text, an unmixing matrix that inverts it', async () => {
    const el = await mount();
    await chooseFile(el, modelCsv());
    button(el, 'Measured spillover').click();
    button(el, 'FCS $SPILLOVER, measured').click();
    button(el, 'Unmixing matrix').click();
    expect(downloads.map((d) => d.filename)).toEqual([
      'measured-spillover.csv',
      'measured-spillover-fcs.txt',
      'unmixing-matrix.csv',
    ]);
    const [csv, fcs, unmixing] = await Promise.all(downloads.map((d) => d.text));
    const rows = parseCsv(csv);
    expect(rows[0].slice(1)).toEqual(panel.probes.map((p) => p.label));
    expect(rows[4][0]).toBe('Orange');
    expect(Number(rows[4][3])).toBeCloseTo(evaluation.spillover[3][2]! + 0.15, 5);
    // FCS 3.1 $SPILLOVER (Spidlen et al. 2010): n, n names, n² values row by row; row i = probe i.
    const parts = fcs.trim().split(',');
    const n = Number(parts[0]);
    expect(n).toBe(6);
    expect(parts).toHaveLength(1 + n + n * n);
    const names = parts.slice(1, 1 + n);
    const mitoRow = parts.slice(1 + n + 2 * n, 1 + n + 3 * n).map(Number);
    expect(mitoRow[names.indexOf('c4')]).toBeCloseTo(evaluation.spillover[3][2]! + 0.15, 9);
    // The unmixing matrix U (probes × channels) times the measured spillover S (channels × probes) is the identity
    // (a left inverse: Penrose's first condition for full column rank, common practice).
    const u = parseCsv(unmixing)
      .slice(1)
      .map((r) => r.slice(1).map(Number));
    const s = rows.slice(1, 7).map((r) => r.slice(1).map(Number));
    u.forEach((row, i) =>
      s[0].forEach((_, j) => {
        const sum = row.reduce((a, v, c) => a + v * s[c][j], 0);
        expect(Math.abs(sum - (i === j ? 1 : 0))).toBeLessThan(1e-4);
      }),
    );
  });

  it('"Use the measured columns" dispatches use-measured-reference with the unstained-subtracted columns', async () => {
    const el = await mount();
    await chooseFile(el, modelCsv(0));
    let detail: { channels: string[]; columns: { probe: string; values: number[] }[] } | undefined;
    document.addEventListener('use-measured-reference', (e) => (detail = (e as CustomEvent).detail), { once: true });
    button(el, 'Use the measured columns').click();
    expect(detail?.channels).toEqual(panel.channels.map((c) => c.id));
    expect(detail?.columns.map((c) => c.probe)).toEqual(panel.probes.map((p) => p.id));
    const mito = evaluation.collected.map((row) => row[2]);
    const scale = 1000 / Math.max(...mito);
    detail!.columns[2].values.forEach((v, c) => expect(v).toBeCloseTo(mito[c] * scale, 6));
  });

  it('.measured set from outside is shown with its source, and the predicted downloads parse back', async () => {
    const el = await mount();
    const csv = modelCsv(0).split('\n').slice(1);
    el.measured = {
      channels: panel.channels.map((c) => c.id),
      unstained: csv[0].split(',').slice(1).map(Number),
      controls: csv
        .slice(1)
        .map((line, p) => ({ probe: panel.probes[p].id, values: line.split(',').slice(1).map(Number) })),
    };
    await expect.poll(() => el.shadowRoot!.querySelector('table')).not.toBeNull();
    expect(el.shadowRoot!.textContent).toContain('Showing measured regions: 6 controls, 6 rows.');
    expect(el.shadowRoot!.querySelectorAll('td.flag')).toHaveLength(0);
    button(el, 'Predicted spillover').click();
    const fcsButton = button(el, 'FCS $SPILLOVER, predicted');
    fcsButton.click();
    const [csvText, fcs] = await Promise.all(downloads.map((d) => d.text));
    // Rows channels, columns probes, as evaluatePanel's spillover[c][p].
    const rows = parseCsv(csvText);
    expect(Number(rows[4][3])).toBeCloseTo(evaluation.spillover[3][2]!, 5);
    const parts = fcs.trim().split(',');
    expect(parts).toHaveLength(1 + 6 + 36);
  });

  it('.measured with a missing value or an unknown probe names the control, probe and channel in words', async () => {
    const el = await mount();
    const values = panel.channels.map(() => 500);
    el.measured = { channels: panel.channels.map((c) => c.id), unstained: values.map(() => 100), controls: [] };
    el.measured = {
      channels: panel.channels.map((c) => c.id),
      unstained: values.map(() => 100),
      controls: [{ probe: 'p1', values: [900, 300, Number.NaN, 100, 100, 100] }],
    };
    await expect.poll(() => errorText(el)).toBe('Control 1 of Nuclear stain, channel Yellow: Must be a finite number.');
    el.measured = {
      channels: panel.channels.map((c) => c.id),
      unstained: values.map(() => 100),
      controls: [{ probe: 'blue', values }],
    };
    await expect.poll(() => errorText(el)).toBe('Control 1: Probe blue is not a probe of the panel.');
  });

  it.each([
    [
      'a probe name the panel lacks',
      (t: string) => t.replace('Actin dot', 'Blue dot'),
      /^controls\.csv: Line 6: "Blue dot" is not a probe of this panel/,
    ],
    [
      'an empty cell',
      (t: string) => t.replace(/\nMito dot,[^,]*,/, '\nMito dot,,'),
      /Line 5, channel "Blue": "" is not a number; give the channel's mean/,
    ],
    ['no unstained row', (t: string) => t.replace(/\nunstained,[^\n]*/, ''), /has no row named "unstained"/],
    [
      'a column that is not a channel',
      (t: string) => t.replace('Far red', 'Infrared'),
      /column "Infrared" is not a channel of this panel/,
    ],
    [
      'a control far under the unstained',
      (t: string) => t.replace(/\nEnvelope dot,[^,]*,/, '\nEnvelope dot,0,'),
      /^Line 4: The control of Envelope dot \(p2\) in channel Blue \(c1\) is below the unstained sample by/,
    ],
  ])('a CSV with %s says what to fix and keeps the controls loaded before', async (_, edit, message) => {
    const el = await mount();
    await chooseFile(el, modelCsv());
    await chooseFile(el, edit(modelCsv()));
    expect(errorText(el)).toMatch(message);
    expect(el.shadowRoot!.querySelectorAll('td.flag')).toHaveLength(1);
  });
});
