/**
 * <qdp-image-regions>: the loaded pilot image (a preview plane on the map ramp) with rectangular regions on it, each
 * labelled "unstained" or a probe. A region is dragged on the image with a pointer, or added with "Add a region" and
 * typed (x, y, width, height in pixels), so the keyboard reaches everything. Each change fires `regions-change` with
 * the new list; the owner holds the list and hands it back.
 */
import { LitElement, css, html, type PropertyValues } from 'lit';
import { customElement, property, query, state } from 'lit/decorators.js';
import type { ProbeSpec } from '../../spectra/index';
import { mapPixels, planeRange } from '../chart/map-colours';
import { focusRing } from './shared-styles';

/** The label of a region for the unstained sample. */
export const UNSTAINED = 'unstained';

/** A rectangle on the image in pixels and what it shows: UNSTAINED or a probe id ('' until chosen). */
export interface ImageRegion {
  x: number;
  y: number;
  width: number;
  height: number;
  label: string;
}

type Corner = { x: number; y: number };

@customElement('qdp-image-regions')
export class ImageRegions extends LitElement {
  /** What the image shows under the regions, row by row (width × height). */
  @property({ attribute: false }) preview: Float32Array | null = null;
  @property({ type: Number }) width = 0;
  @property({ type: Number }) height = 0;
  @property({ attribute: false }) regions: ImageRegion[] = [];
  /** The probes a region may be labelled with. */
  @property({ attribute: false }) probes: Pick<ProbeSpec, 'id' | 'label'>[] = [];

  @state() private dragging: ImageRegion | null = null;
  private dragStart: Corner | null = null;

  @query('canvas') private canvas?: HTMLCanvasElement;

  static override styles = [
    focusRing,
    css`
      :host {
        display: block;
      }
      .image-area {
        max-width: 24rem;
      }
      canvas {
        display: block;
        width: 100%;
        height: auto;
        image-rendering: pixelated;
        border: 1px solid #99a;
        cursor: crosshair;
        touch-action: none;
      }
      ol {
        list-style: none;
        padding: 0;
        margin: 0.4rem 0;
      }
      li {
        display: flex;
        flex-wrap: wrap;
        gap: 0.3rem 0.6rem;
        align-items: flex-end;
        padding: 0.3rem 0;
        border-bottom: 1px solid #dde;
      }
      .name {
        font-weight: 600;
        min-width: 4.5rem;
      }
      label {
        display: flex;
        flex-direction: column;
        font-size: 0.8rem;
      }
      input,
      select,
      button {
        font: inherit;
      }
      input {
        width: 4rem;
      }
    `,
  ];

  override updated(changed: PropertyValues): void {
    if (changed.has('preview') || changed.has('regions') || changed.has('dragging')) this.draw();
  }

  private change(regions: ImageRegion[]): void {
    // Held here at once too, so a second edit before the owner hands the list back builds on the first.
    this.regions = regions;
    this.dispatchEvent(new CustomEvent('regions-change', { detail: { regions } }));
  }

  /** Pixel coordinates on the image of a pointer event over it. */
  private pixelAt(event: PointerEvent): Corner {
    const box = this.canvas!.getBoundingClientRect();
    const x = Math.floor(((event.clientX - box.left) / box.width) * this.width);
    const y = Math.floor(((event.clientY - box.top) / box.height) * this.height);
    return { x: Math.min(this.width - 1, Math.max(0, x)), y: Math.min(this.height - 1, Math.max(0, y)) };
  }

  private dragRegion(to: Corner): ImageRegion {
    const from = this.dragStart!;
    const x = Math.min(from.x, to.x);
    const y = Math.min(from.y, to.y);
    return { x, y, width: Math.abs(to.x - from.x) + 1, height: Math.abs(to.y - from.y) + 1, label: '' };
  }

  private onPointerDown(event: PointerEvent): void {
    this.canvas!.setPointerCapture?.(event.pointerId);
    this.dragStart = this.pixelAt(event);
    this.dragging = this.dragRegion(this.dragStart);
  }

  private onPointerMove(event: PointerEvent): void {
    if (this.dragStart) this.dragging = this.dragRegion(this.pixelAt(event));
  }

  private onPointerUp(event: PointerEvent): void {
    if (!this.dragStart) return;
    const region = this.dragRegion(this.pixelAt(event));
    this.dragStart = null;
    this.dragging = null;
    this.change([...this.regions, region]);
  }

  /** A region of up to 10 × 10 pixels in the image's centre, for keyboard use: its numbers are then typed. */
  private addRegion(): void {
    const size = Math.max(1, Math.min(10, this.width, this.height));
    const x = Math.floor((this.width - size) / 2);
    const y = Math.floor((this.height - size) / 2);
    this.change([...this.regions, { x, y, width: size, height: size, label: '' }]);
  }

  private setRegion(i: number, change: Partial<ImageRegion>): void {
    this.change(this.regions.map((r, k) => (k === i ? { ...r, ...change } : r)));
  }

  /** The preview on the map ramp, the regions outlined in white and the one being dragged in magenta. */
  private draw(): void {
    const { canvas, preview, width, height } = this;
    if (!canvas || !preview || preview.length !== width * height || width === 0) return;
    const { min, max } = planeRange(preview);
    const ctx = canvas.getContext('2d')!;
    ctx.putImageData(new ImageData(mapPixels(preview, min, max), width, height), 0, 0);
    ctx.lineWidth = Math.max(0.5, width / 200);
    const outline = (r: ImageRegion, colour: string) => {
      ctx.strokeStyle = colour;
      ctx.strokeRect(r.x + 0.5, r.y + 0.5, r.width - 1 || 0.5, r.height - 1 || 0.5);
    };
    this.regions.forEach((r) => outline(r, '#ffffff'));
    if (this.dragging) outline(this.dragging, '#ff00ff');
  }

  private renderRegion(r: ImageRegion, i: number) {
    const number = (key: 'x' | 'y' | 'width' | 'height', label: string) =>
      html`<label
        >${label}
        <input
          type="number"
          min=${key === 'width' || key === 'height' ? 1 : 0}
          step="1"
          aria-label="Region ${i + 1} ${label}"
          .value=${String(r[key])}
          @change=${(e: Event) =>
            this.setRegion(i, { [key]: Math.round(Number((e.target as HTMLInputElement).value)) })}
      /></label>`;
    return html`<li>
      <span class="name">Region ${i + 1}</span>
      ${number('x', 'x px')} ${number('y', 'y px')} ${number('width', 'width px')} ${number('height', 'height px')}
      <label
        >shows
        <select
          aria-label="Region ${i + 1} shows"
          @change=${(e: Event) => this.setRegion(i, { label: (e.target as HTMLSelectElement).value })}
        >
          <option value="" ?selected=${r.label === ''}>choose…</option>
          <option value=${UNSTAINED} ?selected=${r.label === UNSTAINED}>unstained</option>
          ${this.probes.map(
            (p) => html`<option value=${p.id} ?selected=${r.label === p.id}>${p.label || p.id}</option>`,
          )}
        </select></label
      >
      <button
        type="button"
        aria-label="Remove region ${i + 1}"
        @click=${() => this.change(this.regions.filter((_, k) => k !== i))}
      >
        Remove
      </button>
    </li>`;
  }

  override render() {
    return html`<div class="image-area">
        <canvas
          width=${this.width}
          height=${this.height}
          role="img"
          aria-label="The loaded image (sum of the channels' pages) with the regions outlined"
          @pointerdown=${this.onPointerDown}
          @pointermove=${this.onPointerMove}
          @pointerup=${this.onPointerUp}
        ></canvas>
      </div>
      <ol>
        ${this.regions.map((r, i) => this.renderRegion(r, i))}
      </ol>
      <button type="button" @click=${this.addRegion}>Add a region</button>`;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'qdp-image-regions': ImageRegions;
  }
}
