/**
 * <qdp-spectrum-chart>: every probe's emission in its wavelength colour, channel passbands shaded, excitation lines
 * marked, sample background filled, filter edges draggable, and a readout of every value under the pointer.
 */
import { LitElement, css, html, svg, type PropertyValues } from 'lit';
import { customElement, property, state } from 'lit/decorators.js';
import { axisBottom, axisLeft, axisRight } from 'd3-axis';
import { select } from 'd3-selection';
import { chartGeometry, MARGIN, type ChartGeometry } from '../chart/geometry';
import type { SampledSpectrum } from '../../spectra/index';
import type { ChartCurve, ChartHandle, ChartPassband, EdgeDragDetail } from '../chart/types';
import { isNearInfrared, wavelengthToCss } from '../chart/color';
import { WidthController } from '../chart/resize-controller';
import { chartReadout } from '../chart/readout';

const HEIGHT_PX = 300;
/** Top and bottom of the plot area, px. */
const TOP = MARGIN.top;
const BOTTOM = HEIGHT_PX - MARGIN.bottom;

/** The legend's mark for a near-infrared curve, and the note that explains it. */
const NIR_MARK = html` <strong>NIR</strong>`;
const NIR_NOTE = html`<p class="readout">
  NIR: near-infrared emission (700 nm and beyond) is nearly invisible to the eye, so it is drawn as a dashed dark-grey
  line rather than in a colour.
</p>`;

/** What a handle's slider is called after its channel's name. */
const EDGE_NAMES = { edge: 'edge', low: 'lower edge', high: 'upper edge' } as const;

@customElement('qdp-spectrum-chart')
export class SpectrumChart extends LitElement {
  /** Emission curves, already scaled as they should be compared. */
  @property({ attribute: false }) curves: ChartCurve[] = [];
  /** Channel transmissions (0–1) with their draggable edges. */
  @property({ attribute: false }) passbands: ChartPassband[] = [];
  /** Excitation lines, nm. */
  @property({ attribute: false }) excitationNm: number[] = [];
  /** Sample autofluorescence on the emission scale, or undefined when off. */
  @property({ attribute: false }) background?: SampledSpectrum;
  /** Wavelength range shown, nm. */
  @property({ attribute: false }) domainNm: [number, number] = [380, 800];
  /** What the emission axis means, e.g. "relative emission (scaled by brightness)". */
  @property() yLabel = 'relative emission';

  @state() private hoverNm: number | null = null;
  private geometry?: ChartGeometry;
  private readonly width = new WidthController(this, 800);
  private drag?: ChartHandle;

  static override styles = css`
    :host {
      display: block;
    }
    svg {
      display: block;
      width: 100%;
      height: ${HEIGHT_PX}px;
      touch-action: none;
      font:
        11px system-ui,
        sans-serif;
    }
    .handle {
      cursor: ew-resize;
    }
    .handle:focus-visible,
    .plot:focus-visible {
      outline: 3px solid #1a56db;
      outline-offset: 1px;
    }
    .handle:focus-visible rect {
      fill: #1a56db;
      fill-opacity: 0.25;
    }
    .readout {
      min-height: 2.6em;
      font-size: 0.85rem;
      color: #222;
      margin: 0.3rem 0 0;
    }
    .legend {
      display: flex;
      flex-wrap: wrap;
      gap: 0.25rem 1rem;
      list-style: none;
      padding: 0;
      margin: 0.4rem 0 0;
      font-size: 0.85rem;
    }
    .legend svg {
      display: inline-block;
      width: 28px;
      height: 10px;
      vertical-align: middle;
    }
  `;

  protected override willUpdate(changed: PropertyValues<this>): void {
    // Paths are rebuilt only when the data or the size changed, not on every pointer move.
    const w = this.width.widthPx;
    if (
      !this.geometry ||
      changed.has('curves') ||
      changed.has('passbands') ||
      changed.has('background') ||
      changed.has('domainNm') ||
      this.geometry.x.range()[1] !== Math.max(MARGIN.left + 10, w - MARGIN.right)
    ) {
      this.geometry = chartGeometry(this.curves, this.passbands, this.background, this.domainNm, w, HEIGHT_PX);
    }
  }

  protected override updated(): void {
    const g = this.geometry!;
    const root = this.renderRoot;
    const narrow = this.width.widthPx < 500;
    select(root.querySelector('g.x-axis') as SVGGElement).call(axisBottom(g.x).ticks(narrow ? 5 : 10));
    select(root.querySelector('g.y-axis') as SVGGElement).call(axisLeft(g.yEmission).ticks(5, '~g'));
    select(root.querySelector('g.t-axis') as SVGGElement).call(axisRight(g.yTransmission).ticks(5, '.0%'));
  }

  private pointerNm(e: PointerEvent): number {
    const svgEl = this.renderRoot.querySelector('svg')!;
    const rect = svgEl.getBoundingClientRect();
    const px = ((e.clientX - rect.left) * this.width.widthPx) / Math.max(1, rect.width);
    const [lo, hi] = this.domainNm;
    return Math.min(hi, Math.max(lo, Math.round(this.geometry!.x.invert(px))));
  }

  private emitDrag(handle: ChartHandle, wavelengthNm: number, done: boolean): void {
    const detail: EdgeDragDetail = { ...handle, wavelengthNm, done };
    this.dispatchEvent(new CustomEvent('edge-drag', { detail, bubbles: true, composed: true }));
  }

  private onMove = (e: PointerEvent) => {
    const nm = this.pointerNm(e);
    this.hoverNm = nm;
    if (this.drag) this.emitDrag(this.drag, nm, false);
  };

  private onUp = (e: PointerEvent) => {
    if (this.drag) this.emitDrag(this.drag, this.pointerNm(e), true);
    this.drag = undefined;
  };

  private startDrag(e: PointerEvent, h: ChartHandle): void {
    e.preventDefault();
    this.drag = h;
    this.renderRoot.querySelector('svg')!.setPointerCapture?.(e.pointerId);
  }

  private handleKey(e: KeyboardEvent, h: ChartHandle): void {
    const step = e.shiftKey ? 5 : 1;
    if (e.key !== 'ArrowLeft' && e.key !== 'ArrowRight') return;
    e.preventDefault();
    this.emitDrag(h, h.wavelengthNm + (e.key === 'ArrowRight' ? step : -step), true);
  }

  private plotKey(e: KeyboardEvent): void {
    if (e.key !== 'ArrowLeft' && e.key !== 'ArrowRight') return;
    e.preventDefault();
    const start = this.hoverNm ?? Math.round((this.domainNm[0] + this.domainNm[1]) / 2);
    this.hoverNm = Math.min(
      this.domainNm[1],
      Math.max(this.domainNm[0], start + (e.key === 'ArrowRight' ? 1 : -1) * (e.shiftKey ? 10 : 1)),
    );
  }

  /** Each channel's passband, shaded, and its name where names fit. */
  private passbandLayer(g: ChartGeometry, labelBands: boolean) {
    return this.passbands.map(
      (p, i) => svg`<path class="passband" data-channel=${p.id} d=${g.passbandPaths[i]} fill="#8a94a6"
          fill-opacity="0.16" stroke="#5b6475" stroke-width="1" stroke-dasharray="3 2"></path>
        ${labelBands ? this.bandName(g, p) : ''}`,
    );
  }

  /** A channel's name above the middle of its editable edges (none without edges: a measured table). */
  private bandName(g: ChartGeometry, p: ChartPassband) {
    if (!p.handles.length) return '';
    const middleNm = (p.handles[0].wavelengthNm + p.handles[p.handles.length - 1].wavelengthNm) / 2;
    return svg`<text x=${g.x(middleNm)} y=${TOP + 10} text-anchor="middle" fill="#3b4252" font-size="10"
      >${p.label}</text>`;
  }

  /** The sample background, filled, when it is on. */
  private backgroundLayer(g: ChartGeometry) {
    if (!this.background) return '';
    return svg`<path class="background" d=${g.backgroundPath} fill="#b08d57" fill-opacity="0.22" stroke="#8a6a35"
      stroke-width="1"></path>`;
  }

  /** Each excitation line in its own colour, labelled. */
  private excitationLayer(g: ChartGeometry) {
    return this.excitationNm.map(
      (nm) => svg`<line class="excitation" x1=${g.x(nm)} x2=${g.x(nm)} y1=${TOP} y2=${BOTTOM}
          stroke=${wavelengthToCss(nm)} stroke-width="2.5"></line>
        <text x=${g.x(nm) + 3} y=${BOTTOM - 4} fill="#3b2b6b" font-size="10">ex ${nm}</text>`,
    );
  }

  /** Each probe's emission over a dark halo, in its wavelength colour (near-infrared: dashed grey). */
  private curveLayer(g: ChartGeometry) {
    return this.curves.map(
      (c, i) => svg`<path d=${g.curvePaths[i]} fill="none" stroke="#222" stroke-opacity="0.45"
          stroke-width="3.5"></path>
        <path class="curve" data-probe=${c.id} d=${g.curvePaths[i]} fill="none" stroke=${wavelengthToCss(c.peakNm)}
          stroke-width="2" stroke-dasharray=${isNearInfrared(c.peakNm) ? '6 3' : 'none'}></path>`,
    );
  }

  /** The dashed line at the readout's wavelength. */
  private hoverLine(g: ChartGeometry) {
    if (this.hoverNm === null) return '';
    const x = g.x(this.hoverNm);
    return svg`<line x1=${x} x2=${x} y1=${TOP} y2=${BOTTOM} stroke="#111" stroke-width="1"
      stroke-dasharray="2 2"></line>`;
  }

  /** The draggable filter edges: sliders for the keyboard, a wide invisible grip for the pointer. */
  private handleLayer(g: ChartGeometry) {
    const [minNm, maxNm] = this.domainNm;
    return this.passbands.flatMap((p) =>
      p.handles.map((h) => {
        const x = g.x(h.wavelengthNm);
        return svg`<g class="handle" tabindex="0" role="slider" aria-label=${`${p.label}: ${EDGE_NAMES[h.edge]}`}
            aria-valuenow=${h.wavelengthNm} aria-valuemin=${minNm} aria-valuemax=${maxNm} data-channel=${p.id}
            data-edge=${h.edge} @pointerdown=${(e: PointerEvent) => this.startDrag(e, h)}
            @keydown=${(e: KeyboardEvent) => this.handleKey(e, h)}>
          <rect x=${x - 7} y=${TOP} width="14" height=${BOTTOM - TOP} fill="#000" fill-opacity="0"></rect>
          <line x1=${x} x2=${x} y1=${TOP} y2=${BOTTOM} stroke="#5b6475" stroke-width="1.5"></line>
          <rect x=${x - 4} y=${TOP + 16} width="8" height="16" rx="2" fill="#5b6475"></rect></g>`;
      }),
    );
  }

  override render() {
    const g = this.geometry!;
    const w = this.width.widthPx;
    // Band names only where they fit: up to 8 bands on a chart at least 600 px wide.
    const labelBands = this.passbands.length <= 8 && w >= 600;
    return html`
      <svg
        xmlns="http://www.w3.org/2000/svg"
        viewBox="0 0 ${w} ${HEIGHT_PX}"
        width=${w}
        height=${HEIGHT_PX}
        role="group"
        aria-label="Emission spectra, passbands and excitation lines"
        @pointermove=${this.onMove}
        @pointerup=${this.onUp}
        @pointercancel=${this.onUp}
        @pointerleave=${() => !this.drag && (this.hoverNm = null)}
      >
        <rect x="0" y="0" width=${w} height=${HEIGHT_PX} fill="#ffffff"></rect>
        <rect
          class="plot"
          tabindex="0"
          aria-label="Plot area: arrow keys move the readout"
          x=${MARGIN.left}
          y=${TOP}
          width=${Math.max(0, w - MARGIN.left - MARGIN.right)}
          height=${BOTTOM - TOP}
          fill="#fafafa"
          @keydown=${this.plotKey}
        ></rect>
        ${this.passbandLayer(g, labelBands)} ${this.backgroundLayer(g)} ${this.excitationLayer(g)} ${this.curveLayer(g)}
        ${this.hoverLine(g)} ${this.handleLayer(g)}
        <g class="x-axis" transform="translate(0,${BOTTOM})"></g>
        <g class="y-axis" transform="translate(${MARGIN.left},0)"></g>
        <g class="t-axis" transform="translate(${w - MARGIN.right},0)"></g>
        <text
          x=${(MARGIN.left + w - MARGIN.right) / 2}
          y=${HEIGHT_PX - 6}
          text-anchor="middle"
          fill="#222"
          font-size="11"
        >
          wavelength (nm)
        </text>
        <text
          transform="translate(12,${(TOP + BOTTOM) / 2}) rotate(-90)"
          text-anchor="middle"
          fill="#222"
          font-size="11"
        >
          ${this.yLabel}
        </text>
        <text
          transform="translate(${w - 6},${(TOP + BOTTOM) / 2}) rotate(90)"
          text-anchor="middle"
          fill="#222"
          font-size="11"
        >
          passband transmission
        </text>
      </svg>
      <p class="readout" role="status" aria-live="polite">
        ${chartReadout(this.hoverNm, this.curves, this.passbands, this.background)}
      </p>
      <ul class="legend" aria-label="Legend">
        ${this.curves.map(
          (c) =>
            html`<li>
              <svg viewBox="0 0 28 10" aria-hidden="true">
                <line
                  x1="0"
                  x2="28"
                  y1="5"
                  y2="5"
                  stroke=${wavelengthToCss(c.peakNm)}
                  stroke-width="3"
                  stroke-dasharray=${isNearInfrared(c.peakNm) ? '6 3' : 'none'}
                ></line>
              </svg>
              ${c.label} (${Math.round(c.peakNm)} nm)${isNearInfrared(c.peakNm) ? NIR_MARK : ''}
            </li>`,
        )}
        ${
          this.background
            ? html`<li>
                <svg viewBox="0 0 28 10" aria-hidden="true">
                  <rect width="28" height="10" fill="#b08d57" fill-opacity="0.4"></rect>
                </svg>
                sample background
              </li>`
            : ''
        }
      </ul>
      ${this.curves.some((c) => isNearInfrared(c.peakNm)) ? NIR_NOTE : ''}
    `;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'qdp-spectrum-chart': SpectrumChart;
  }
}
