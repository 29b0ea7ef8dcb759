// <qdp-pilot-image> in real Chromium, unmixing in its real Web Worker: the demo image against the true abundances it
// was made from, refusals that keep the panel and the loaded image, cancel, control regions and the downloads.
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { Matrix, pseudoInverse } from 'ml-matrix';
import UTIF from 'utif2';
import { evaluatePanel } from '../../spectra/index';
import '../../web/elements/pilot-image';
import type { ControlsMeasurement } from '../../spectra/index';
import type { PilotImageElement } from '../../web/elements/pilot-image';
import type { ImageMap } from '../../web/elements/image-map';
import { writeTiff } from '../../web/io/tiff-write';
import { DEMO_LOT_DEVIATION, demoLotCollected, demoPanel } from '../../web/state/demo-panel';
import { greyEntries, handTiff } from './helpers/hand-tiff';
import { parseCsv } from './helpers/parse-csv';

const DEMO = '/web/public/demo/pilot-image.ome.tif';
const TRUTH = '/web/public/demo/pilot-image-truth.tif';

interface Download {
  filename: string;
  blob: Promise<Blob>;
}
let downloads: Download[] = [];
const catchDownload = (e: Event) => {
  const a = e.target;
  if (!(a instanceof HTMLAnchorElement) || !a.download) return;
  e.preventDefault();
  downloads.push({ filename: a.download, blob: fetch(a.href).then((r) => r.blob()) });
};
beforeEach(() => {
  downloads = [];
  document.addEventListener('click', catchDownload, true);
});
afterEach(() => {
  document.removeEventListener('click', catchDownload, true);
  document.body.replaceChildren();
});

async function mount(): Promise<PilotImageElement> {
  const el = document.createElement('qdp-pilot-image');
  el.panel = demoPanel();
  el.demoUrl = DEMO;
  document.body.appendChild(el);
  await el.updateComplete;
  return el;
}

const root = (el: PilotImageElement) => el.shadowRoot!;
const button = (el: PilotImageElement, label: string) =>
  [...root(el).querySelectorAll('button')].find((b) => b.textContent!.trim() === label)!;
/** The shadow root of the regions part, where the image, the region fields and "Add a region" are. */
const regionsRoot = (el: PilotImageElement) => root(el).querySelector('qdp-image-regions')!.shadowRoot!;
const text = (el: PilotImageElement) => root(el).textContent!.replace(/\s+/g, ' ');
const maps = (el: PilotImageElement) => [...root(el).querySelectorAll<ImageMap>('qdp-image-map')];
/** The demo sample's matrix [channel][probe], the image's own: the model with the demo lot's one deviation. */
const sampleMatrix = () => demoLotCollected(demoPanel(), evaluatePanel(demoPanel()).collected);
/** `matrix` as the element's measured reference (panel channel and probe ids, one column per probe). */
const asReference = (matrix: number[][]) => ({
  channels: matrix.map((_, c) => `c${c + 1}`),
  columns: matrix[0].map((_, p) => ({ probe: `p${p + 1}`, values: matrix.map((row) => row[p]) })),
});

async function until(check: () => boolean, timeoutMs = 30_000): Promise<void> {
  const start = performance.now();
  while (!check()) {
    if (performance.now() - start > timeoutMs) throw new Error('timed out');
    await new Promise((r) => setTimeout(r, 20));
  }
}

async function loadDemo(el: PilotImageElement): Promise<void> {
  button(el, 'Try the demo image').click();
  await until(() => !!root(el).querySelector('.loaded'));
}

/** Loads bytes through the page's file input, as a user choosing a file does. */
async function loadFile(el: PilotImageElement, bytes: Uint8Array, name = 'pilot.tif'): Promise<void> {
  const input = root(el).querySelector<HTMLInputElement>('input[type=file]')!;
  const transfer = new DataTransfer();
  transfer.items.add(new File([Uint8Array.from(bytes)], name, { type: 'image/tiff' }));
  input.files = transfer.files;
  input.dispatchEvent(new Event('change'));
  // The file is read in the reader worker: wait until the page has stopped reading it.
  await el.updateComplete;
  await until(() => !root(el).querySelector('.reading'));
  await el.updateComplete;
}

async function chooseAndRun(el: PilotImageElement, method: 'Least squares' | 'NNLS'): Promise<void> {
  const radio = [...root(el).querySelectorAll('label')]
    .find((l) => l.textContent!.trim().startsWith(method))!
    .querySelector('input')!;
  radio.click();
  await el.updateComplete;
  button(el, 'Unmix the image').click();
}

/** Every page of a TIFF as utif2 decodes it (the reference reader), 16-bit as integers, 32-bit as floats. */
async function utifPages(url: string | Blob): Promise<{ planes: Float32Array[]; ifds: UTIF.IFD[] }> {
  const buffer = await (typeof url === 'string' ? (await fetch(url)).arrayBuffer() : url.arrayBuffer());
  const ifds = UTIF.decode(buffer);
  const planes = ifds.map((ifd) => {
    UTIF.decodeImage(buffer, ifd);
    const bytes = ifd.data.slice();
    return (ifd.t258 as number[])[0] === 16
      ? Float32Array.from(new Uint16Array(bytes.buffer))
      : new Float32Array(bytes.buffer);
  });
  return { planes, ifds };
}

describe('<qdp-pilot-image>', () => {
  it('loads the demo OME-TIFF and proposes page k for channel k from its channel names', async () => {
    const el = await mount();
    await loadDemo(el);
    expect(text(el)).toContain('80 × 80 pixels, 6 pages, 16-bit unsigned');
    const selects = [
      ...root(el).querySelectorAll('select[aria-label^="Image page for channel"]'),
    ] as unknown as HTMLSelectElement[];
    expect(selects.map((s) => s.value)).toEqual(['0', '1', '2', '3', '4', '5']);
    expect(selects[1].selectedOptions[0].textContent).toBe('Page 2 · Green · 515 nm');
  });

  it('unmixes the demo by least squares with its own matrix into maps within Poisson noise of the truth', async () => {
    const el = await mount();
    el.reference = asReference(sampleMatrix());
    await loadDemo(el);
    await chooseAndRun(el, 'Least squares');
    await until(() => maps(el).length === 7);
    const truth = (await utifPages(TRUTH)).planes;
    // Least squares â = M⁺y has covariance M⁺ diag(E[y]) M⁺ᵀ for Poisson counts (var = mean; common practice);
    // M is the matrix the script made the image with (the model plus the demo lot's deviation), M⁺ comes from
    // ml-matrix, and E[y] = M · truth (the demo keeps every channel at tens of counts or more, where Poisson noise is
    // close to normal).
    const collected = sampleMatrix();
    const P = pseudoInverse(new Matrix(collected));
    let squares = 0;
    let worst = 0;
    let count = 0;
    for (let k = 0; k < truth[0].length; k++) {
      const y = collected.map((row) => row.reduce((sum, m, p) => sum + m * truth[p][k], 0));
      for (let p = 0; p < truth.length; p++) {
        let variance = 0;
        for (let c = 0; c < y.length; c++) variance += P.get(p, c) ** 2 * y[c];
        const z = (maps(el)[p].plane![k] - truth[p][k]) / Math.sqrt(variance);
        squares += z * z;
        worst = Math.max(worst, Math.abs(z));
        count++;
      }
    }
    const rmsZ = Math.sqrt(squares / count);
    // Standardised errors: RMS near 1 and none beyond 6 sd over 38 400 values (normal tails: P(|z| > 6) ≈ 2e-9).
    expect(count).toBe(6 * 80 * 80);
    expect(rmsZ).toBeGreaterThan(0.9);
    expect(rmsZ).toBeLessThan(1.1);
    expect(worst).toBeLessThan(6);
  });

  it('refuses bad files in words, keeping the panel and the loaded demo', async () => {
    const el = await mount();
    const panel = el.panel;
    const before = JSON.stringify(panel);
    await loadDemo(el);
    const demoText = root(el).querySelector('.loaded')!.textContent;
    const page = {
      width: 4,
      height: 4,
      bitsPerSample: 16 as const,
      sampleFormat: 'uint' as const,
      data: new Array(16),
    };
    const six = writeTiff(Array.from({ length: 6 }, () => ({ ...page, data: page.data.fill(3) })));
    const big = { entries: greyEntries(8192, 8192, 8), strips: [new Uint8Array(2)] };
    const cases: [Uint8Array, RegExp][] = [
      [new TextEncoder().encode('not an image'), /^This file is not a TIFF image/],
      [handTiff([big, big]), /would need about 2048 MiB to unmix; the page allows 1024 MiB/],
      [writeTiff([page, { ...page, bitsPerSample: 8 }]), /^Page 2 holds 8-bit values but page 1 16-bit/],
      [six.subarray(0, six.length - 40), /^The file ends early: it may be truncated/],
      [
        handTiff([{ entries: greyEntries(4, 4, 8, { compression: 5 }), strips: [new Uint8Array(16)] }]),
        /^Page 1 is compressed with LZW, which the page does not read/,
      ],
      [
        writeTiff([page, page].map((p) => ({ ...p, data: new Array(16).fill(1) }))),
        /^This image has 2 pages but the panel has 6 channels: each channel needs its own page/,
      ],
    ];
    for (const [bytes, message] of cases) {
      await loadFile(el, bytes);
      expect(root(el).querySelector('[role=alert]')!.textContent).toMatch(message);
      expect(root(el).querySelector('.loaded')!.textContent).toBe(demoText);
      expect(el.panel).toBe(panel);
      expect(JSON.stringify(el.panel)).toBe(before);
    }
  });

  it('offers the page mapping for a 9-page image and keeps the page the user chose for a channel', async () => {
    const el = await mount();
    const blank = { width: 2, height: 2, bitsPerSample: 8 as const, sampleFormat: 'uint' as const };
    await loadFile(el, writeTiff(Array.from({ length: 9 }, (_, i) => ({ ...blank, data: [i, i, i, i] }))));
    expect(text(el)).toContain('This image has 9 pages and the panel 6 channels: choose the page each channel reads');
    const select = root(el).querySelector(
      'select[aria-label="Image page for channel Blue"]',
    ) as unknown as HTMLSelectElement;
    select.value = '8';
    select.dispatchEvent(new Event('change'));
    await el.updateComplete;
    expect(select.value).toBe('8');
  });

  it('unmixes with the given .reference columns, not the modelled ones: doubled columns halve the maps', async () => {
    const el = await mount();
    const collected = sampleMatrix();
    // Given in another channel order, which the page puts back in the panel's order.
    const order = [5, 4, 3, 2, 1, 0];
    el.reference = {
      channels: order.map((c) => `c${c + 1}`),
      columns: ['p1', 'p2', 'p3', 'p4', 'p5', 'p6'].map((probe, p) => ({
        probe,
        values: order.map((c) => 2 * collected[c][p]),
      })),
    };
    await loadDemo(el);
    await chooseAndRun(el, 'Least squares');
    await until(() => maps(el).length === 7);
    const truth = (await utifPages(TRUTH)).planes;
    const sum = (plane: ArrayLike<number>) => Array.from(plane).reduce((a, b) => a + b, 0);
    // Least squares is linear: M' = 2M gives â' = â / 2 (hand-worked), so each map's total is half the truth's.
    truth.forEach((plane, p) => expect(sum(maps(el)[p].plane!) / sum(plane)).toBeCloseTo(0.5, 1));
    expect(text(el)).not.toContain('modelled signal');
  });

  it("shows phantom Actin dot at the Mito dot's spots with the modelled columns, none with the lot's", async () => {
    const truth = (await utifPages(TRUTH)).planes;
    const [mito, actin] = [truth[2], truth[3]];
    const mitoTop = Math.max(...mito);
    const actinTop = Math.max(...actin);
    /** Mean of (Actin map − truth) over the Mito dot's spots (above half its top), as a fraction of Actin's top. */
    const phantomActin = async (reference?: ReturnType<typeof asReference>) => {
      const el = await mount();
      if (reference) el.reference = reference;
      await loadDemo(el);
      await chooseAndRun(el, 'Least squares');
      await until(() => maps(el).length === 7);
      const map = maps(el)[3].plane!;
      let sum = 0;
      let n = 0;
      mito.forEach((v, k) => v > mitoTop / 2 && ((sum += map[k] - actin[k]), n++));
      el.remove();
      return sum / n / actinTop;
    };
    expect(DEMO_LOT_DEVIATION).toMatchObject({ probe: 'p3', channel: 'c4' });
    // Worked by hand: at a spot (Mito map ~0.75) the lot adds 0.15 × 1,500 × 0.75 ≈ 170 counts in Orange, the Actin
    // dot's brightest channel (1,500 counts per map unit), so about 0.11 map units against Actin's top of 0.6: ~19 %.
    // The model has no column for that light, so least squares gives most of it to the Actin dot.
    const modelled = await phantomActin();
    expect(modelled).toBeGreaterThan(0.12);
    expect(modelled).toBeLessThan(0.26);
    expect(Math.abs(await phantomActin(asReference(sampleMatrix())))).toBeLessThan(0.01);
  });

  it('says why a reference of two equal columns cannot unmix, keeping the image for a good run', async () => {
    const el = await mount();
    const collected = evaluatePanel(demoPanel()).collected;
    const column = (p: number) => collected.map((row) => row[p]);
    const channels = ['c1', 'c2', 'c3', 'c4', 'c5', 'c6'];
    // Two probes with the same column: no unmixing can tell them apart (rank-deficient reference, hand-worked).
    el.reference = { channels, columns: [0, 0, 2].map((p, i) => ({ probe: `p${i + 1}`, values: column(p) })) };
    await loadDemo(el);
    await chooseAndRun(el, 'Least squares');
    await until(() => root(el).querySelector('output')!.textContent!.startsWith('The image was not unmixed: '));
    expect(maps(el)).toHaveLength(0);
    el.reference = { channels, columns: [0, 1, 2].map((p, i) => ({ probe: `p${i + 1}`, values: column(p) })) };
    await el.updateComplete;
    button(el, 'Unmix the image').click();
    await until(() => maps(el).length === 4);
    expect(maps(el)[0].plane).toHaveLength(80 * 80);
    expect(text(el)).toContain('80 × 80 pixels, 6 pages');
  });

  it('cancel stops a run at once: no maps, the image stays loaded and can be unmixed again', async () => {
    const el = await mount();
    const size = 1024;
    const data = Array.from({ length: size * size }, (_, k) => (k * 7919) % 4000);
    const pages = Array.from({ length: 6 }, (_, c) => ({
      width: size,
      height: size,
      bitsPerSample: 16 as const,
      sampleFormat: 'uint' as const,
      data: data.map((v) => (v + c * 500) % 65535),
    }));
    await loadFile(el, writeTiff(pages), 'large.tif');
    await until(() => !!root(el).querySelector('.loaded'));
    await chooseAndRun(el, 'NNLS');
    await until(() => !!root(el).querySelector('progress'));
    button(el, 'Cancel').click();
    await el.updateComplete;
    expect(root(el).querySelector('output')!.textContent).toBe('Cancelled: no maps were made.');
    // The pages went to the unmixing worker: the file is read again, in the reader worker, before a new run.
    await until(() => !root(el).querySelector('.reading'));
    await el.updateComplete;
    expect(maps(el)).toHaveLength(0);
    expect(text(el)).toContain('1024 × 1024 pixels, 6 pages');
    expect(button(el, 'Unmix the image').disabled).toBe(false);
  });

  it('reads a large file off the page with progress; "Stop reading" keeps the image loaded before', async () => {
    const el = await mount();
    await loadDemo(el);
    const size = 2048;
    const data = new Uint16Array(size * size).map((_, k) => k % 4000);
    const page = { width: size, height: size, bitsPerSample: 16 as const, sampleFormat: 'uint' as const, data };
    const input = root(el).querySelector<HTMLInputElement>('input[type=file]')!;
    const transfer = new DataTransfer();
    transfer.items.add(new File([writeTiff(Array.from({ length: 8 }, () => page))], 'big.tif'));
    input.files = transfer.files;
    input.dispatchEvent(new Event('change'));
    await el.updateComplete;
    // While the worker reads, the page answers: the progress bar and the stop button are there at once.
    expect(root(el).querySelector('progress[aria-label="Reading progress"]')).not.toBeNull();
    expect(button(el, 'Unmix the image').disabled).toBe(true);
    button(el, 'Stop reading').click();
    await el.updateComplete;
    expect(root(el).querySelector('.reading')).toBeNull();
    expect(text(el)).toContain('Stopped reading: the file was not loaded; the image loaded before stays.');
    expect(text(el)).toContain('80 × 80 pixels, 6 pages');
    expect(button(el, 'Unmix the image').disabled).toBe(false);
  });

  it('measures labelled regions as controls, and downloads the maps as float TIFF and the means as CSV', async () => {
    const el = await mount();
    await loadDemo(el);
    // One region typed with the keyboard controls (unstained, top-left corner with no cell), one dragged (nucleus).
    [...regionsRoot(el).querySelectorAll('button')].find((b) => b.textContent!.trim() === 'Add a region')!.click();
    await el.updateComplete;
    await root(el).querySelector('qdp-image-regions')!.updateComplete;
    const field = (label: string) => regionsRoot(el).querySelector<HTMLInputElement>(`input[aria-label="${label}"]`)!;
    for (const [name, value] of [
      ['x', '0'],
      ['y', '0'],
      ['width', '4'],
      ['height', '3'],
    ]) {
      field(`Region 1 ${name} px`).value = value;
      field(`Region 1 ${name} px`).dispatchEvent(new Event('change'));
    }
    const canvas = regionsRoot(el).querySelector('canvas')!;
    const box = canvas.getBoundingClientRect();
    const at = (x: number, y: number) => ({
      clientX: box.left + ((x + 0.5) / 80) * box.width,
      clientY: box.top + ((y + 0.5) / 80) * box.height,
      pointerId: 1,
      bubbles: true,
    });
    canvas.dispatchEvent(new PointerEvent('pointerdown', at(21, 19)));
    canvas.dispatchEvent(new PointerEvent('pointermove', at(23, 22)));
    canvas.dispatchEvent(new PointerEvent('pointerup', at(25, 23)));
    await el.updateComplete;
    const label = (i: number, value: string) => {
      const s = regionsRoot(el).querySelector(`select[aria-label="Region ${i} shows"]`) as unknown as HTMLSelectElement;
      s.value = value;
      s.dispatchEvent(new Event('change'));
    };
    await root(el).querySelector('qdp-image-regions')!.updateComplete;
    label(1, 'unstained');
    await el.updateComplete;
    await root(el).querySelector('qdp-image-regions')!.updateComplete;
    label(2, 'p1');
    await el.updateComplete;
    let measured: ControlsMeasurement | null = null;
    document.body.addEventListener('controls-measured', (e) => (measured = (e as CustomEvent).detail));
    button(el, 'Measure controls').click();
    await el.updateComplete;
    // The means recomputed here from utif2's decode of the demo file: rectangle (21, 19)–(25, 23), 5 × 5 pixels.
    const image = (await utifPages(DEMO)).planes;
    const rect = (plane: Float32Array, x0: number, y0: number, w: number, h: number) => {
      const v: number[] = [];
      for (let y = y0; y < y0 + h; y++) for (let x = x0; x < x0 + w; x++) v.push(plane[y * 80 + x]);
      const mean = v.reduce((a, b) => a + b, 0) / v.length;
      return { mean, sd: Math.sqrt(v.reduce((a, b) => a + (b - mean) ** 2, 0) / (v.length - 1)) };
    };
    expect(measured).not.toBeNull();
    const m = measured! as ControlsMeasurement;
    expect(m.channels).toEqual(['c1', 'c2', 'c3', 'c4', 'c5', 'c6']);
    expect(m.unstained).toEqual(image.map((p) => rect(p, 0, 0, 4, 3).mean));
    expect(m.unstainedN).toBe(12);
    expect(m.controls).toHaveLength(1);
    expect(m.controls[0].probe).toBe('p1');
    expect(m.controls[0].n).toBe(25);
    m.controls[0].values.forEach((v, c) => expect(v).toBeCloseTo(rect(image[c], 21, 19, 5, 5).mean, 9));
    m.controls[0].sd!.forEach((v, c) => expect(v).toBeCloseTo(rect(image[c], 21, 19, 5, 5).sd, 9));

    button(el, 'Download region means (CSV)').click();
    expect(downloads[0].filename).toBe('region-means.csv');
    const rows = parseCsv(await (await downloads[0].blob).text());
    expect(rows[0].slice(0, 8)).toEqual([
      'region',
      'label',
      'x px',
      'y px',
      'width px',
      'height px',
      'pixels',
      'mean Blue',
    ]);
    expect(rows[1].slice(0, 7)).toEqual(['1', 'unstained', '0', '0', '4', '3', '12']);
    expect(rows[2].slice(0, 7)).toEqual(['2', 'Nuclear stain', '21', '19', '5', '5', '25']);
    expect(Number(rows[2][7])).toBeCloseTo(rect(image[0], 21, 19, 5, 5).mean, 9);

    await chooseAndRun(el, 'NNLS');
    await until(() => maps(el).length === 7);
    button(el, 'Download abundance maps (TIFF)').click();
    expect(downloads[1].filename).toBe('abundance-maps.tif');
    const back = await utifPages(await downloads[1].blob);
    expect(back.ifds.map((d) => d.t270)).toEqual([
      ['abundance of probe p1 (Nuclear stain), unmixed by NNLS'],
      ['abundance of probe p2 (Envelope dot), unmixed by NNLS'],
      ['abundance of probe p3 (Mito dot), unmixed by NNLS'],
      ['abundance of probe p4 (Actin dot), unmixed by NNLS'],
      ['abundance of probe p5 (Vessel dot), unmixed by NNLS'],
      ['abundance of probe p6 (Membrane dot), unmixed by NNLS'],
      ['residual: root-mean-square over channels of measured minus fitted'],
    ]);
    back.planes.forEach((plane, i) => {
      const shown = maps(el)[i].plane!;
      expect(new Uint32Array(plane.buffer)).toEqual(new Uint32Array(shown.buffer, shown.byteOffset, shown.length));
    });
    // NNLS (Lawson & Hanson 1974): no abundance below zero.
    expect(back.planes.slice(0, 6).every((p) => p.every((v) => v >= 0))).toBe(true);
  });
});
