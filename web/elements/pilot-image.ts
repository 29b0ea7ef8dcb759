/**
 * <qdp-pilot-image>: unmixes a pilot image of a sample in this browser (the image is never sent anywhere). The user
 * loads a multi-page TIFF or OME-TIFF (one grey page per channel or lambda bin) or the demo image, read in a Web
 * Worker (progress, "Stop reading"), checks which page each panel channel reads, picks NNLS or least squares and runs
 * it in another Web Worker (progress, Cancel). It shows one abundance map per probe and the residual, lets the user
 * mark rectangular regions (dragged on the image or typed) labelled "unstained" or a probe, and "Measure controls"
 * fires a bubbling, composed `controls-measured` event with the regions' means, sd and pixel counts per channel.
 * Downloads: the maps as a 32-bit float TIFF, the region means as CSV. A refused file leaves the panel and any image
 * already loaded as they were.
 */
import { LitElement, css, html, nothing, type PropertyValues } from 'lit';
import { customElement, property, state } from 'lit/decorators.js';
import { regionMeans, type ControlsMeasurement, type PanelSpec, type PixelUnmixMethod } from '../../spectra/index';
import { downloadBlob, downloadText } from '../io/download';
import { abundanceTiff, regionMeansCsv, type MeasuredRegion } from '../io/image-export';
import { ImageReadError } from '../io/image-read-error';
import { parseOmeXml } from '../io/ome-xml';
import { checkImageFileSize, type PilotImage } from '../io/tiff-read';
import { modelledReference, referenceByChannel, type ImageReference } from '../state/image-reference';
import { proposeMapping } from '../state/page-mapping';
import type { TiffReadRequest, TiffWorkerMessage } from '../state/tiff-worker';
import type { UnmixRequest, UnmixWorkerMessage } from '../state/unmix-worker';
import { UNSTAINED, type ImageRegion } from './image-regions';
import { focusRing } from './shared-styles';
import './image-map';
import './image-regions';

/** The maps of the last run. */
interface Unmixed {
  method: PixelUnmixMethod;
  probes: string[];
  abundances: Float32Array[];
  residual: Float32Array;
}

/** The words of the two methods. */
export const METHOD_WORDS: Record<PixelUnmixMethod, string> = {
  nnls: 'NNLS (non-negative least squares)',
  leastSquares: 'Least squares (abundances may come out negative)',
};

/** Where the demo image is served (web/public/demo, made by scripts/make-pilot-image.mts). */
export const DEMO_IMAGE_URL = '/demo/pilot-image.ome.tif';

const percentText = (f: number) => `${Math.round(f * 100)} %`;

@customElement('qdp-pilot-image')
export class PilotImageElement extends LitElement {
  /** The panel the image is unmixed for: its channels are the pages read, its probes the maps. */
  @property({ attribute: false }) panel?: PanelSpec;
  /** The panel's reference columns (measured where given); without it the panel's modelled signal is used. */
  @property({ attribute: false }) reference?: ImageReference;
  /** Where "Try the demo image" fetches the demo from. */
  @property({ attribute: false }) demoUrl = DEMO_IMAGE_URL;

  @state() private image: PilotImage | null = null;
  @state() private fileName = '';
  @state() private mapping: number[] = [];
  @state() private loadError = '';
  /** A file being read in the reader worker: a new one ('load') or the loaded one after a cancelled run ('again'). */
  @state() private reading: 'load' | 'again' | null = null;
  @state() private readProgress = 0;
  @state() private readNote = '';
  @state() private method: PixelUnmixMethod = 'nnls';
  @state() private running = false;
  @state() private progress = 0;
  @state() private status = '';
  @state() private result: Unmixed | null = null;
  @state() private regions: ImageRegion[] = [];
  @state() private regionStatus = '';
  /** What the regions are drawn on: the sum of the pages the channels read (kept while a run has the pages). */
  @state() private preview: Float32Array | null = null;

  /** The loaded file: its pages are read from it again after a cancelled run took them away. */
  private file: Blob | null = null;
  private worker: Worker | null = null;
  private reader: Worker | null = null;

  static override styles = [
    focusRing,
    css`
      :host {
        display: block;
      }
      .row {
        display: flex;
        flex-wrap: wrap;
        gap: 0.5rem 1rem;
        align-items: center;
        margin: 0.5rem 0;
      }
      .error {
        color: #a40000;
        font-weight: 600;
      }
      .note {
        font-size: 0.85rem;
        color: #333;
      }
      table {
        border-collapse: collapse;
        font-size: 0.9rem;
      }
      th,
      td {
        text-align: left;
        padding: 0.15rem 0.4rem;
        border-bottom: 1px solid #dde;
      }
      select,
      input,
      button {
        font: inherit;
      }
      .maps {
        display: grid;
        grid-template-columns: repeat(auto-fill, minmax(9rem, 1fr));
        gap: 0.8rem;
        margin: 0.5rem 0;
      }
      progress {
        width: 12rem;
      }
      caption {
        text-align: left;
      }
    `,
  ];

  /** The panel's channels (none without a panel). */
  private get channels() {
    return this.panel?.channels ?? [];
  }

  override willUpdate(changed: PropertyValues): void {
    // A panel with another number of channels gets a fresh proposal for the image already loaded.
    if (changed.has('panel') && this.image && this.mapping.length !== this.channels.length)
      this.mapping = proposeMapping(this.channels, this.image.planes.length, this.image.ome?.channels ?? null);
    const { image } = this;
    // The preview follows the image and the mapping; a running worker holds the pages, so the last one stays.
    if ((changed.has('image') || changed.has('mapping')) && image && image.planes.every((p) => p.length > 0)) {
      const sum = new Float32Array(image.width * image.height);
      for (const page of new Set(this.mapping))
        for (let k = 0; k < sum.length; k++) sum[k] += image.planes[page]?.[k] ?? 0;
      this.preview = sum;
    }
  }

  override disconnectedCallback(): void {
    super.disconnectedCallback();
    this.worker?.terminate();
    this.worker = null;
    this.stopReading();
  }

  /** Takes a decoded image if it fits the panel; otherwise says why and keeps what was loaded before. */
  private accept(image: PilotImage, name: string, file: Blob): void {
    const pages = image.planes.length;
    const channels = this.channels.length;
    if (channels === 0) {
      this.loadError = 'The panel has no channels yet: add the channels the image was taken in, then load it.';
      return;
    }
    if (pages < channels) {
      this.loadError =
        `This image has ${pages} page${pages === 1 ? '' : 's'} but the panel has ${channels} channels: each ` +
        'channel needs its own page. Load an image with one page per channel.';
      return;
    }
    // A run on the image loaded before ends here; its pages are not needed again.
    if (this.running) this.finish();
    this.image = image;
    this.file = file;
    this.fileName = name;
    this.mapping = proposeMapping(this.channels, pages, image.ome?.channels ?? null);
    this.loadError = '';
    this.result = null;
    this.regions = [];
    this.regionStatus = '';
    this.status = '';
  }

  /**
   * Reads a file as a pilot image in the reader worker, with progress, so a large file never freezes the page. A new
   * file that is refused leaves the image loaded before as it was; the loaded file read `again` keeps its page mapping
   * and regions.
   */
  private read(file: Blob, name: string, again = false): void {
    this.stopReading();
    const reader = new Worker(new URL('../state/tiff-worker.ts', import.meta.url), { type: 'module' });
    this.reader = reader;
    this.reading = again ? 'again' : 'load';
    this.readProgress = 0;
    this.readNote = '';
    reader.onmessage = (event: MessageEvent<TiffWorkerMessage>) => {
      const m = event.data;
      if (m.type === 'progress') {
        this.readProgress = m.done / m.total;
        return;
      }
      this.stopReading();
      if (m.type === 'error') {
        if (again) this.dropImage(`The image could not be read again: ${m.message}`);
        else this.loadError = m.message;
      } else if (again && this.image) this.image = { ...this.image, planes: m.image.planes };
      else {
        let image = m.image;
        try {
          image = { ...image, ome: image.omeXml === null ? null : parseOmeXml(image.omeXml, image.planes.length) };
        } catch (err) {
          this.loadError = err instanceof ImageReadError ? err.message : 'The OME-XML of this file could not be read.';
          return;
        }
        this.accept(image, name, file);
      }
    };
    reader.onerror = () => {
      this.stopReading();
      if (again) this.dropImage('The image could not be read again in this browser: load it again.');
      else this.loadError = 'The image could not be read in this browser.';
    };
    const request: TiffReadRequest = { type: 'read', file };
    reader.postMessage(request);
  }

  private stopReading(): void {
    this.reader?.terminate();
    this.reader = null;
    this.reading = null;
  }

  /** "Stop reading": a new file is not loaded; a loaded one whose pages a cancelled run took must be loaded again. */
  private stopReadingByUser(): void {
    const again = this.reading === 'again';
    this.stopReading();
    if (again) this.dropImage('Stopped reading: load the image again to unmix it or measure regions.');
    else
      this.readNote = `Stopped reading: the file was not loaded${this.image ? '; the image loaded before stays' : ''}.`;
  }

  /** Forgets the loaded image (its pages are gone), saying why. */
  private dropImage(message: string): void {
    this.image = null;
    this.file = null;
    this.preview = null;
    this.result = null;
    this.regions = [];
    this.loadError = message;
  }

  private onFile(event: Event): void {
    const input = event.target as HTMLInputElement;
    const file = input.files?.[0];
    input.value = '';
    if (!file) return;
    try {
      checkImageFileSize(file.size);
    } catch (err) {
      this.loadError = (err as Error).message;
      return;
    }
    this.read(file, file.name);
  }

  private async loadDemo(): Promise<void> {
    let file: Blob;
    try {
      const response = await fetch(this.demoUrl);
      if (!response.ok) throw new Error(String(response.status));
      file = await response.blob();
    } catch {
      this.loadError = 'The demo image could not be fetched: check the connection and try again.';
      return;
    }
    this.read(file, 'demo pilot image (invented, made for the demo panel)');
  }

  /** Starts unmixing in a fresh worker; the pages travel to it and back without copies. */
  private run(): void {
    const { image, panel } = this;
    if (!image || !panel || this.running || this.reading) return;
    let reference;
    try {
      reference = referenceByChannel(this.reference ?? modelledReference(panel), panel);
    } catch (err) {
      this.status = `The reference could not be made: ${(err as Error).message}`;
      return;
    }
    const worker = new Worker(new URL('../state/unmix-worker.ts', import.meta.url), { type: 'module' });
    this.worker = worker;
    this.running = true;
    this.progress = 0;
    this.status = 'Unmixing…';
    const method = this.method;
    worker.onmessage = (event: MessageEvent<UnmixWorkerMessage>) => {
      const m = event.data;
      if (m.type === 'progress') {
        this.progress = m.done / m.total;
        return;
      }
      image.planes = m.pages;
      this.finish();
      if (m.type === 'error') this.status = `The image was not unmixed: ${m.message}`;
      else {
        this.result = { method, probes: reference.probes, abundances: m.abundances, residual: m.residual };
        this.status = `Unmixed by ${METHOD_WORDS[method].split(' (')[0]}: ${reference.probes.length} abundance maps.`;
      }
    };
    worker.onerror = () => {
      this.cancel(false);
      this.status = 'The unmixing could not run in this browser.';
    };
    const request: UnmixRequest = {
      type: 'run',
      referenceByChannel: reference.byChannel,
      method,
      width: image.width,
      pages: image.planes,
      pageOfChannel: this.mapping,
    };
    worker.postMessage(
      request,
      image.planes.map((p) => p.buffer),
    );
  }

  private finish(): void {
    this.worker?.terminate();
    this.worker = null;
    this.running = false;
  }

  /** Stops a run at once; the image is read again from its file (in the reader worker), since its pages went away. */
  private cancel(say = true): void {
    if (!this.running) return;
    this.finish();
    if (this.file) this.read(this.file, this.fileName, true);
    if (say) this.status = 'Cancelled: no maps were made.';
  }

  /** Each region's means over the channels' pages, or a sentence saying which region cannot be measured. */
  private measure(): MeasuredRegion[] | string {
    const { image } = this;
    if (!image) return 'Load an image first.';
    if (this.running) return 'Wait for the unmixing to finish, or cancel it.';
    if (this.reading) return 'Wait for the image to be read.';
    if (this.regions.length === 0) return 'Mark at least one region on the image first.';
    const planes = this.mapping.map((page) => image.planes[page]);
    const out: MeasuredRegion[] = [];
    for (const [i, r] of this.regions.entries()) {
      try {
        out.push({ ...r, ...regionMeans(planes, image.width, r) });
      } catch (err) {
        return `Region ${i + 1}: ${(err as Error).message}.`;
      }
    }
    return out;
  }

  private probeName(id: string): string {
    const probe = this.panel?.probes.find((p) => p.id === id);
    return probe?.label ? probe.label : id;
  }

  private regionLabel(label: string): string {
    return label === UNSTAINED ? UNSTAINED : label === '' ? 'not labelled' : this.probeName(label);
  }

  /** Sends the labelled regions as controls: one unstained region and at least one probe, each probe once. */
  private measureControls(): void {
    const measured = this.measure();
    if (typeof measured === 'string') {
      this.regionStatus = measured;
      return;
    }
    const unlabelled = measured.findIndex((r) => r.label === '');
    if (unlabelled >= 0) {
      this.regionStatus = `Region ${unlabelled + 1} has no label: choose "unstained" or a probe for it.`;
      return;
    }
    const unstained = measured.filter((r) => r.label === UNSTAINED);
    const probes = measured.filter((r) => r.label !== UNSTAINED);
    if (unstained.length !== 1) {
      this.regionStatus = `Label exactly one region "unstained" (now ${unstained.length}).`;
      return;
    }
    const twice = probes.find((r, i) => probes.findIndex((q) => q.label === r.label) !== i);
    if (twice) {
      this.regionStatus = `Two regions are labelled "${this.probeName(twice.label)}": keep one region per probe.`;
      return;
    }
    if (probes.length === 0) {
      this.regionStatus = 'Label at least one region with the probe stained in it.';
      return;
    }
    const [blank] = unstained;
    const detail: ControlsMeasurement = {
      channels: this.channels.map((c) => c.id),
      unstained: blank.mean,
      unstainedSd: blank.sd,
      unstainedN: blank.n,
      controls: probes.map((r) => ({ probe: r.label, values: r.mean, sd: r.sd, n: r.n })),
    };
    this.dispatchEvent(new CustomEvent('controls-measured', { detail, bubbles: true, composed: true }));
    this.regionStatus =
      `Measured the unstained region and ${probes.length} control region${probes.length === 1 ? '' : 's'} ` +
      '(mean, sd and pixels per channel).';
  }

  private downloadMeans(): void {
    const measured = this.measure();
    if (typeof measured === 'string') {
      this.regionStatus = measured;
      return;
    }
    const named = measured.map((r) => ({ ...r, label: this.regionLabel(r.label) }));
    const csv = regionMeansCsv(
      this.channels.map((c) => c.label || c.id),
      named,
    );
    downloadText(csv, 'region-means.csv', 'text/csv');
  }

  private downloadMaps(): void {
    const { image, result } = this;
    if (!image || !result) return;
    const how = result.method === 'nnls' ? 'NNLS' : 'least squares';
    const planes = [
      ...result.probes.map((id, p) => ({
        description: `abundance of probe ${id} (${this.probeName(id)}), unmixed by ${how}`,
        plane: result.abundances[p],
      })),
      { description: 'residual: root-mean-square over channels of measured minus fitted', plane: result.residual },
    ];
    const bytes = abundanceTiff(image.width, image.height, planes);
    downloadBlob(new Blob([bytes], { type: 'image/tiff' }), 'abundance-maps.tif');
  }

  private pageName(i: number): string {
    const ome = this.image?.ome?.channels[i];
    if (!ome) return `Page ${i + 1}`;
    const nm = ome.emissionNm === null ? '' : ` · ${Math.round(ome.emissionNm)} nm`;
    return `Page ${i + 1} · ${ome.name}${nm}`;
  }

  private renderMapping() {
    const { image } = this;
    if (!image) return nothing;
    const pages = image.planes.length;
    const more = pages > this.channels.length;
    return html`<table>
        <caption class="note">
          Which page each channel reads${image.ome ? ' (proposed from the OME-TIFF channel names and wavelengths)' : ''}
        </caption>
        <thead>
          <tr>
            <th scope="col">Channel</th>
            <th scope="col">Image page</th>
          </tr>
        </thead>
        <tbody>
          ${this.channels.map(
            (ch, c) =>
              html`<tr>
                <th scope="row">${ch.label || ch.id}</th>
                <td>
                  <select
                    aria-label="Image page for channel ${ch.label || ch.id}"
                    ?disabled=${this.running}
                    @change=${(e: Event) => {
                      const page = Number((e.target as HTMLSelectElement).value);
                      this.mapping = this.mapping.map((p, k) => (k === c ? page : p));
                    }}
                  >
                    ${image.planes.map(
                      (_, i) =>
                        html`<option value=${i} ?selected=${this.mapping[c] === i}>${this.pageName(i)}</option>`,
                    )}
                  </select>
                </td>
              </tr>`,
          )}
        </tbody>
      </table>
      ${
        more
          ? html`<p class="note">
              This image has ${pages} pages and the panel ${this.channels.length} channels: choose the page each channel
              reads; the other pages are not used.
            </p>`
          : nothing
      }`;
  }

  private renderResult() {
    const { result, image } = this;
    if (!result || !image) return nothing;
    return html`<div class="maps">
        ${result.probes.map(
          (id, p) =>
            html`<qdp-image-map
              .plane=${result.abundances[p]}
              .width=${image.width}
              .height=${image.height}
              caption=${this.probeName(id)}
            ></qdp-image-map>`,
        )}
        <qdp-image-map
          .plane=${result.residual}
          .width=${image.width}
          .height=${image.height}
          caption="Residual (root-mean-square over channels)"
        ></qdp-image-map>
      </div>
      <p class="note">
        Abundances are in units of each probe's reference
        column${
          this.reference ? '' : ': here the panel\u2019s modelled signal, approximate (the signal model of this tool)'
        }.
        Colour scale: cividis (Nuñez, Anderton &amp; Renslow, PLoS ONE 2018), approximate; lighter is more, and grey
        print keeps the order.
      </p>
      <div class="row">
        <button type="button" @click=${this.downloadMaps}>Download abundance maps (TIFF)</button>
      </div>`;
  }

  override render() {
    const { image } = this;
    return html`
      <p class="note">
        Load a pilot image of a sample stained with this panel: a multi-page TIFF or OME-TIFF with one grey page per
        channel or lambda bin (8-, 16- or 32-bit; uncompressed, Deflate or PackBits). It is unmixed in this browser and
        is not uploaded.
      </p>
      <div class="row">
        <label>Load a TIFF image <input type="file" accept=".tif,.tiff,image/tiff" @change=${this.onFile} /></label>
        <button type="button" @click=${this.loadDemo}>Try the demo image</button>
      </div>
      ${
        this.reading
          ? html`<div class="row reading">
              <progress max="1" .value=${this.readProgress} aria-label="Reading progress"></progress>
              ${this.reading === 'again' ? 'Reading the image again' : 'Reading the image'}:
              ${percentText(this.readProgress)}
              <button type="button" @click=${this.stopReadingByUser}>Stop reading</button>
            </div>`
          : nothing
      }
      ${this.readNote ? html`<p class="note" role="status">${this.readNote}</p>` : nothing}
      ${this.loadError ? html`<p class="error" role="alert">${this.loadError}</p>` : nothing}
      ${
        image
          ? html`<p class="note loaded">
                Loaded: ${this.fileName}, ${image.width} × ${image.height} pixels, ${image.planes.length} pages,
                ${image.storedAs}.
              </p>
              ${this.renderMapping()}
              <fieldset>
                <legend>Unmixing method</legend>
                ${(Object.keys(METHOD_WORDS) as PixelUnmixMethod[]).map(
                  (m) =>
                    html`<label
                        ><input
                          type="radio"
                          name="method"
                          .checked=${this.method === m}
                          ?disabled=${this.running}
                          @change=${() => (this.method = m)}
                        />
                        ${METHOD_WORDS[m]}</label
                      ><br />`,
                )}
              </fieldset>
              <div class="row">
                <button type="button" ?disabled=${this.running || this.reading !== null} @click=${this.run}>
                  Unmix the image
                </button>
                <button type="button" ?disabled=${!this.running} @click=${() => this.cancel()}>Cancel</button>
                ${
                  this.running
                    ? html`<progress max="1" .value=${this.progress} aria-label="Unmixing progress"></progress>
                        ${percentText(this.progress)}`
                    : nothing
                }
                <output aria-live="polite">${this.status}</output>
              </div>
              <h4>Regions for controls</h4>
              <p class="note">
                Drag on the image to mark a region, or add one and type its position. Label one region "unstained" and
                one per single-stained probe, then measure: each region's mean, sd and pixel count per channel.
              </p>
              <qdp-image-regions
                .preview=${this.preview}
                .width=${image.width}
                .height=${image.height}
                .regions=${this.regions}
                .probes=${this.panel?.probes ?? []}
                @regions-change=${(e: CustomEvent<{ regions: ImageRegion[] }>) => (this.regions = e.detail.regions)}
              ></qdp-image-regions>
              <div class="row">
                <button type="button" @click=${this.measureControls}>Measure controls</button>
                <button type="button" @click=${this.downloadMeans}>Download region means (CSV)</button>
              </div>
              ${this.regionStatus ? html`<p role="status">${this.regionStatus}</p>` : nothing} ${this.renderResult()}`
          : nothing
      }
    `;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'qdp-pilot-image': PilotImageElement;
  }
}
