/**
 * <qdp-image-map>: one map of an unmixed pilot image (a probe's abundance or the residual) drawn on a canvas on the
 * cividis ramp (web/chart/map-colours.ts), darkest at the plane's smallest value and lightest at its largest, with a
 * scale bar labelled with both values under it. Pixels that have no value are drawn mid grey.
 */
import { LitElement, css, html, svg, type PropertyValues } from 'lit';
import { customElement, property, query } from 'lit/decorators.js';
import { mapPixels, planeRange, rampColour } from '../chart/map-colours';

/** A value on the scale bar: three significant figures. */
export const scaleText = (v: number) => (Number.isFinite(v) ? Number(v.toPrecision(3)).toString() : '–');

/** Stops of the scale bar's gradient. */
const BAR_STOPS = Array.from({ length: 11 }, (_, k) => k / 10);

@customElement('qdp-image-map')
export class ImageMap extends LitElement {
  /** The values, row by row (width × height). */
  @property({ attribute: false }) plane: Float32Array | null = null;
  @property({ type: Number }) width = 0;
  @property({ type: Number }) height = 0;
  /** The map's name under it, e.g. "Envelope dot". */
  @property() caption = '';
  /** A unique id for the gradient of this map's scale bar. */
  private static count = 0;
  private readonly gradientId = `ramp-${ImageMap.count++}`;

  @query('canvas') private canvas?: HTMLCanvasElement;

  static override styles = css`
    :host {
      display: block;
    }
    figure {
      margin: 0;
    }
    canvas {
      display: block;
      width: 100%;
      height: auto;
      image-rendering: pixelated;
      border: 1px solid #99a;
    }
    figcaption {
      font-size: 0.85rem;
      margin-top: 0.2rem;
      overflow-wrap: anywhere;
    }
    svg {
      display: block;
      width: 100%;
      height: 0.8rem;
    }
    .ends {
      display: flex;
      justify-content: space-between;
      gap: 0.5rem;
      font-size: 0.75rem;
    }
  `;

  override updated(changed: PropertyValues<this>): void {
    if (!changed.has('plane') && !changed.has('width') && !changed.has('height')) return;
    const { plane, canvas, width, height } = this;
    if (!plane || !canvas || plane.length !== width * height || width === 0) return;
    const { min, max } = planeRange(plane);
    canvas.getContext('2d')!.putImageData(new ImageData(mapPixels(plane, min, max), width, height), 0, 0);
  }

  override render() {
    const { min, max } = this.plane ? planeRange(this.plane) : { min: 0, max: 0 };
    const label = `${this.caption}: from ${scaleText(min)} (darkest) to ${scaleText(max)} (lightest)`;
    return html`<figure>
      <canvas width=${this.width} height=${this.height} role="img" aria-label=${label}></canvas>
      <svg viewBox="0 0 200 28" preserveAspectRatio="none" role="img" aria-label="colour scale ${label}">
        <defs>
          <linearGradient id=${this.gradientId}>
            ${BAR_STOPS.map((t) => {
              const [r, g, b] = rampColour(t);
              return svg`<stop offset=${t} stop-color="rgb(${r},${g},${b})"></stop>`;
            })}
          </linearGradient>
        </defs>
        <rect x="0" y="0" width="200" height="28" fill="url(#${this.gradientId})" stroke="#99a"></rect>
      </svg>
      <div class="ends" aria-hidden="true"><span>${scaleText(min)}</span><span>${scaleText(max)}</span></div>
      <figcaption>${this.caption}</figcaption>
    </figure>`;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'qdp-image-map': ImageMap;
  }
}
