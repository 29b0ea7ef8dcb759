/**
 * <qdp-spectrum-chart>: every probe's emission in its wavelength colour, channel passbands shaded, the shared light
 * path as its own lines, excitation lines marked, sample background filled, filter edges draggable, and a readout of
 * every value under the pointer. The reader picks a linear or log scale and a range (following the panel by default),
 * and hides or shows each layer; those choices are kept by layer id across recomputations of the panel.
 */
import { LitElement, css, html, svg, unsafeCSS, type PropertyValues } from 'lit';
import { customElement, property, state } from 'lit/decorators.js';
import { axisBottom, axisLeft, axisRight } from 'd3-axis';
import { select } from 'd3-selection';
import { chartGeometry, MARGIN, type ChartGeometry } from '../chart/geometry';
import type { SampledSpectrum } from '../../spectra/index';
import type { ChartCurve, ChartHandle, ChartPassband, ChartSharedPath, EdgeDragDetail } from '../chart/types';
import { isNearInfrared, wavelengthToCss } from '../chart/color';
import { WidthController } from '../chart/resize-controller';
import { chartReadout } from '../chart/readout';
import { autoRangeNm } from '../chart/auto-range';
import { BACKGROUND_LOOK, BAND_LOOK, CHART_FONT_FAMILY, layerKey, SHARED_LOOK, type LegendEntry } from '../chart/looks';
import './chart-controls';
import './chart-legend';

const HEIGHT_PX = 300;
/** Top and bottom of the plot area, px. */
const TOP = MARGIN.top;
const BOTTOM = HEIGHT_PX - MARGIN.bottom;

/** The note that explains the legend's NIR mark. */
const NIR_NOTE = html`<p class="readout">
  NIR: near-infrared emission (700 nm and beyond) is nearly invisible to the eye, so it is drawn as a dashed dark-grey
  line rather than in a colour.
</p>`;

/** Said once under the legend when the panel has a shared emission path. */
const SHARED_NOTE = html`<p class="readout">
  Each channel's shading already includes the shared emission path; its own line shows which cuts come from it.
</p>`;

/** What a handle's slider is called after its channel's name. */
const EDGE_NAMES = { edge: 'edge', low: 'lower edge', high: 'upper edge' } as const;

@customElement('qdp-spectrum-chart')
export class SpectrumChart extends LitElement {
  /** Emission curves, already scaled as they should be compared. */
  @property({ attribute: false }) curves: ChartCurve[] = [];
  /** Channel transmissions (0–1) with their draggable edges. */
  @property({ attribute: false }) passbands: ChartPassband[] = [];
  /** The shared light path's parts on their own (transmission 0–1); empty without a light path. */
  @property({ attribute: false }) shared: ChartSharedPath[] = [];
  /** Excitation lines, nm. */
  @property({ attribute: false }) excitationNm: number[] = [];
  /** Sample autofluorescence on the emission scale, or undefined when off. */
  @property({ attribute: false }) background?: SampledSpectrum;
  /** What the emission axis means, e.g. "relative emission (scaled by brightness)". */
  @property() yLabel = 'relative emission';

  @state() private hoverNm: number | null = null;
  /** A range set by hand, nm, or null while the range follows the panel. */
  @state() private rangeNm: [number, number] | null = null;
  @state() private log = false;
  /** Keys (looks.ts layerKey) of the layers the reader hid. */
  @state() private hiddenKeys: ReadonlySet<string> = new Set();
  /** The range shown, nm. */
  private domainNm: [number, number] = [380, 800];
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
      font-size: 11px;
      font-family: ${unsafeCSS(CHART_FONT_FAMILY)};
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
  `;

  /** The layers the reader has not hidden. */
  private shown<T extends { id: string }>(items: readonly T[], key: (id: string) => string): T[] {
    return items.filter((item) => !this.hiddenKeys.has(key(item.id)));
  }

  private get visible() {
    return {
      curves: this.shown(this.curves, layerKey.probe),
      passbands: this.shown(this.passbands, layerKey.channel),
      shared: this.shown(this.shared, layerKey.shared),
      background: this.hiddenKeys.has(layerKey.background) ? undefined : this.background,
    };
  }

  protected override willUpdate(changed: PropertyValues<this>): void {
    // Paths are rebuilt only when the data, the view or the size changed, not on every pointer move.
    const w = this.width.widthPx;
    const dataChanged = ['curves', 'passbands', 'shared', 'background', 'excitationNm'].some((k) =>
      changed.has(k as keyof SpectrumChart),
    );
    const viewChanged = ['rangeNm', 'log', 'hiddenKeys'].some((k) => changed.has(k as keyof SpectrumChart));
    if (!this.geometry || dataChanged || viewChanged || this.geometry.x.range()[1] !== this.plotRightPx(w)) {
      // The automatic range follows every layer, hidden or not, so hiding one does not move the axis.
      this.domainNm = this.rangeNm ?? autoRangeNm(this.curves, this.passbands, this.excitationNm);
      const v = this.visible;
      const layers = {
        curves: v.curves.map((c) => c.spectrum),
        passbands: v.passbands.map((p) => p.transmission),
        shared: v.shared.map((p) => p.transmission),
        background: v.background,
      };
      this.geometry = chartGeometry(layers, this.domainNm, w, HEIGHT_PX, this.log);
    }
  }

  private plotRightPx(w: number): number {
    return Math.max(MARGIN.left + 10, w - MARGIN.right);
  }

  protected override updated(): void {
    const g = this.geometry!;
    const root = this.renderRoot;
    const narrow = this.width.widthPx < 500;
    select(root.querySelector('g.x-axis') as SVGGElement).call(axisBottom(g.x).ticks(narrow ? 5 : 10));
    select(root.querySelector('g.y-axis') as SVGGElement).call(axisLeft(g.yEmission).ticks(5, '~g'));
    select(root.querySelector('g.t-axis') as SVGGElement).call(
      axisRight(g.yTransmission).ticks(5, this.log ? '~%' : '.0%'),
    );
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
    const detail: EdgeDragDetail = {
      ...h,
      wavelengthNm: h.wavelengthNm + (e.key === 'ArrowRight' ? step : -step),
      done: true,
      byKey: true,
    };
    this.dispatchEvent(new CustomEvent('edge-drag', { detail, bubbles: true, composed: true }));
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
  private passbandLayer(g: ChartGeometry, passbands: ChartPassband[], labelBands: boolean) {
    return passbands.map(
      (p, i) => svg`<path class="passband" data-channel=${p.id} d=${g.passbandPaths[i]} fill=${BAND_LOOK.fill}
          fill-opacity=${BAND_LOOK.fillOpacity} stroke=${BAND_LOOK.stroke} stroke-width="1"
          stroke-dasharray=${BAND_LOOK.dash}></path>
        ${labelBands ? this.bandName(g, p) : ''}`,
    );
  }

  /** Each part of the shared light path, a line on the transmission axis. */
  private sharedLayer(g: ChartGeometry, shared: ChartSharedPath[]) {
    return shared.map((s, i) => {
      const look = SHARED_LOOK[s.id];
      return svg`<path class="shared" data-part=${s.id} d=${g.sharedPaths[i]} fill="none" stroke=${look.stroke}
        stroke-width=${look.width} stroke-dasharray=${look.dash} stroke-linecap="round"></path>`;
    });
  }

  /** A channel's name above the middle of its editable edges (none without edges: a measured table). */
  private bandName(g: ChartGeometry, p: ChartPassband) {
    if (!p.handles.length) return '';
    const middleNm = (p.handles[0].wavelengthNm + p.handles[p.handles.length - 1].wavelengthNm) / 2;
    return svg`<text x=${g.x(middleNm)} y=${TOP + 10} text-anchor="middle" fill="#3b4252" font-size="10"
      >${p.label}</text>`;
  }

  /** The sample background, filled, when it is on. */
  private backgroundLayer(g: ChartGeometry, background: SampledSpectrum | undefined) {
    if (!background) return '';
    return svg`<path class="background" d=${g.backgroundPath} fill=${BACKGROUND_LOOK.fill}
      fill-opacity=${BACKGROUND_LOOK.fillOpacity} stroke=${BACKGROUND_LOOK.stroke} stroke-width="1"></path>`;
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
  private curveLayer(g: ChartGeometry, curves: ChartCurve[]) {
    return curves.map(
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
    return svg`<line class="hover" x1=${x} x2=${x} y1=${TOP} y2=${BOTTOM} stroke="#111" stroke-width="1"
      stroke-dasharray="2 2"></line>`;
  }

  /** The draggable filter edges: sliders for the keyboard, a wide invisible grip for the pointer. */
  private handleLayer(g: ChartGeometry, passbands: ChartPassband[]) {
    const [minNm, maxNm] = this.domainNm;
    return passbands.flatMap((p) =>
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

  /** The legend's lines: every layer, shown or hidden (the exported chart draws the shown ones). */
  legendEntries(): LegendEntry[] {
    const hidden = (key: string) => this.hiddenKeys.has(key);
    return [
      ...this.curves.map((c) => ({
        key: layerKey.probe(c.id),
        label: `${c.label} (${Math.round(c.peakNm)} nm)`,
        mark: 'curve' as const,
        stroke: wavelengthToCss(c.peakNm),
        dash: isNearInfrared(c.peakNm) ? '6 3' : 'none',
        nir: isNearInfrared(c.peakNm),
        hidden: hidden(layerKey.probe(c.id)),
      })),
      ...this.passbands.map((p) => ({
        key: layerKey.channel(p.id),
        label: `${p.label} channel`,
        mark: 'band' as const,
        stroke: BAND_LOOK.stroke,
        dash: BAND_LOOK.dash,
        hidden: hidden(layerKey.channel(p.id)),
      })),
      ...this.shared.map((s) => ({
        key: layerKey.shared(s.id),
        label: s.label,
        mark: 'shared' as const,
        stroke: SHARED_LOOK[s.id].stroke,
        dash: SHARED_LOOK[s.id].dash,
        hidden: hidden(layerKey.shared(s.id)),
      })),
      ...(this.background
        ? [
            {
              key: layerKey.background,
              label: 'sample background',
              mark: 'background' as const,
              stroke: BACKGROUND_LOOK.stroke,
              dash: 'none',
              hidden: hidden(layerKey.background),
            },
          ]
        : []),
    ];
  }

  private onView(e: CustomEvent<{ log: boolean } | { rangeNm: [number, number] | null }>): void {
    if ('log' in e.detail) this.log = e.detail.log;
    else this.rangeNm = e.detail.rangeNm;
  }

  private onVisibility(e: CustomEvent<{ key: string; shown: boolean }>): void {
    const next = new Set(this.hiddenKeys);
    if (e.detail.shown) next.delete(e.detail.key);
    else next.add(e.detail.key);
    this.hiddenKeys = next;
  }

  override render() {
    const g = this.geometry!;
    const w = this.width.widthPx;
    const v = this.visible;
    // Band names only where they fit: up to 8 bands on a chart at least 600 px wide.
    const labelBands = v.passbands.length <= 8 && w >= 600;
    return html`
      <qdp-chart-controls
        .rangeNm=${this.domainNm}
        ?follow=${this.rangeNm === null}
        ?log=${this.log}
        @chart-view=${this.onView}
      ></qdp-chart-controls>
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
        ${this.passbandLayer(g, v.passbands, labelBands)} ${this.backgroundLayer(g, v.background)}
        ${this.sharedLayer(g, v.shared)} ${this.excitationLayer(g)} ${this.curveLayer(g, v.curves)} ${this.hoverLine(g)}
        ${this.handleLayer(g, v.passbands)}
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
        ${chartReadout(this.hoverNm, v.curves, v.passbands, v.background, v.shared)}
      </p>
      <qdp-chart-legend .entries=${this.legendEntries()} @layer-visibility=${this.onVisibility}></qdp-chart-legend>
      ${this.curves.some((c) => isNearInfrared(c.peakNm)) ? NIR_NOTE : ''}
      ${this.shared.some((s) => s.id === 'emission') ? SHARED_NOTE : ''}
    `;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'qdp-spectrum-chart': SpectrumChart;
  }
}
