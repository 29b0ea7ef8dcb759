/**
 * <qdp-spectrum-chart>: every probe's emission as a soft filled area under an outline whose (colour, dash) pair is
 * given out in order of peak (curve-looks.ts) and named at its peak; each channel as a window in the detection strip
 * under the plot, with its transmission as a thin tinted line; the shared light path as its own lines, excitation
 * lines marked, the sample background filled, the near-infrared stretch tinted, filter edges draggable from the strip,
 * and a readout of every value under the pointer. The reader picks a linear or log scale and a range (following the
 * panel by default), and hides or shows each layer; those choices are kept by layer id across recomputations.
 */
import { LitElement, css, html, svg, unsafeCSS, type PropertyValues } from 'lit';
import { customElement, property, state } from 'lit/decorators.js';
import { chartGeometry, MARGIN, type ChartGeometry } from '../chart/geometry';
import type { SampledSpectrum } from '../../spectra/index';
import type { ChartCurve, ChartHandle, ChartPassband, ChartSharedPath, EdgeDragDetail } from '../chart/types';
import { isNearInfrared, NIR_START_NM } from '../chart/nir';
import { curveLooks, type CurveLook } from '../chart/curve-looks';
import { axisTicks, type AxisTick } from '../chart/axis-ticks';
import { detectionWindows, laneCount, MAX_LANES, type DetectionWindow } from '../chart/detection-strip';
import { estimateTextWidthPx, placePeakLabels, type LabelRequest } from '../chart/peak-labels';
import { WidthController } from '../chart/resize-controller';
import { chartReadout } from '../chart/readout';
import { autoRangeNm } from '../chart/auto-range';
import {
  BACKGROUND_LOOK,
  CHANNEL_LOOK,
  CHART_FONT_FAMILY,
  CURVE_LOOK,
  EXCITATION_LOOK,
  layerKey,
  NIR_LOOK,
  SHARED_LOOK,
  type LegendEntry,
} from '../chart/looks';
import './chart-controls';
import './chart-legend';

/** Top and bottom of the plot area, px (the detection strip and the wavelength axis follow below it). */
const TOP = MARGIN.top;
const BOTTOM = 250;
/** The detection strip: gap above it and height of one lane, px. */
const STRIP_GAP_PX = 6;
const LANE_PX = 17;
/** Font sizes of the chart's small text, px. */
const LABEL_FONT_PX = 10;
/** Least room between two windows in one lane, px, and room kept for the grips inside a window (our conventions). */
const STRIP_GAP_BETWEEN_PX = 6;
const GRIP_ROOM_PX = 2;

/** The chart's height with `lanes` lanes in the strip, px: the plot, the strip, then the wavelength axis. */
const heightWithLanesPx = (lanes: number) => BOTTOM + STRIP_GAP_PX + lanes * LANE_PX + MARGIN.bottom;

// One class per lane count sets the svg's height: the page's CSP (style-src 'self') blocks style attributes.
const laneHeightRules = Array.from(
  { length: MAX_LANES },
  (_, k) => `svg.lanes-${k + 1} { height: ${heightWithLanesPx(k + 1)}px; }`,
).join('\n');

/** The note that explains the legend's NIR mark. */
const NIR_NOTE = html`<p class="readout">
  NIR: near-infrared emission (${NIR_START_NM} nm and beyond) is nearly invisible to the eye; the tinted stretch of the
  axis marks it, and its curves' colours are labels like every other curve's, not the colour of the light.
</p>`;

/** Said once under the legend when the panel has a shared emission path. */
const SHARED_NOTE = html`<p class="readout">
  Each channel's line already includes the shared emission path; its own line shows which cuts come from it.
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
  /** Each probe's (colour, dash) by id, given out over every curve, hidden or not, so hiding one changes no other. */
  private looks = new Map<string, CurveLook>();
  /** The shown channels' windows in the detection strip. */
  private windows: DetectionWindow[] = [];
  private readonly width = new WidthController(this, 800);
  private drag?: ChartHandle;

  static override styles = css`
    :host {
      display: flex;
      flex-direction: column;
    }
    /* On a phone the plot comes first and its controls follow it. */
    @media (max-width: 640px) {
      qdp-chart-controls {
        order: 1;
      }
    }
    svg {
      display: block;
      width: 100%;
      touch-action: none;
      font-size: 11px;
      font-family: ${unsafeCSS(CHART_FONT_FAMILY)};
    }
    ${unsafeCSS(laneHeightRules)}
    .handle {
      cursor: ew-resize;
    }
    .handle:focus-visible,
    .plot:focus-visible {
      outline: 3px solid #1a56db;
      outline-offset: 1px;
    }
    .handle:focus-visible rect.grip {
      fill: #1a56db;
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

  /** The look of a probe's curve (the first palette entry for an id not seen yet). */
  private lookOf(id: string): CurveLook {
    return this.looks.get(id) ?? curveLooks([0])[0];
  }

  /** Top of the wavelength axis, below the detection strip, px. */
  private get axisTopPx(): number {
    return BOTTOM + STRIP_GAP_PX + laneCount(this.windows) * LANE_PX;
  }

  private get heightPx(): number {
    return heightWithLanesPx(laneCount(this.windows));
  }

  protected override willUpdate(changed: PropertyValues<this>): void {
    if (changed.has('curves')) {
      const looks = curveLooks(this.curves.map((c) => c.peakNm));
      this.looks = new Map(this.curves.map((c, i) => [c.id, looks[i]]));
    }
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
      this.geometry = chartGeometry(layers, this.domainNm, w, BOTTOM + MARGIN.bottom, this.log);
      const nmPerPx = (this.domainNm[1] - this.domainNm[0]) / Math.max(1, this.plotRightPx(w) - MARGIN.left);
      this.windows = detectionWindows(v.passbands, STRIP_GAP_BETWEEN_PX * nmPerPx);
    }
  }

  private plotRightPx(w: number): number {
    return Math.max(MARGIN.left + 10, w - MARGIN.right);
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

  /** A tap or press reads the chart where it lands (a finger has no hover); a handle's own press starts its drag. */
  private onDown = (e: PointerEvent) => {
    if (!this.drag) this.hoverNm = this.pointerNm(e);
  };

  /** A mouse leaving clears the reading; a lifted finger leaves it in place to be read. */
  private onLeave = (e: PointerEvent) => {
    if (!this.drag && e.pointerType === 'mouse') this.hoverNm = null;
  };

  private onMove = (e: PointerEvent) => {
    const nm = this.pointerNm(e);
    this.hoverNm = nm;
    if (this.drag) this.emitDrag(this.drag, nm, false);
  };

  private onUp = (e: PointerEvent) => {
    if (this.drag) this.emitDrag(this.drag, this.pointerNm(e), true);
    this.drag = undefined;
  };

  /** True when the pointer is in the detection strip under the plot (SVG units from the top, as drawn). */
  private inStrip(e: PointerEvent): boolean {
    const svgEl = this.renderRoot.querySelector('svg')!;
    const rect = svgEl.getBoundingClientRect();
    const heightPx = svgEl.viewBox.baseVal?.height || rect.height;
    return ((e.clientY - rect.top) * heightPx) / Math.max(1, rect.height) >= BOTTOM;
  }

  /**
   * A press on an edge starts its drag. A finger on an edge's guide inside the plot reads the chart instead (on a
   * phone the guides cover much of the plot); fingers drag edges by their grips in the strip.
   */
  private startDrag(e: PointerEvent, h: ChartHandle): void {
    if (e.pointerType === 'touch' && !this.inStrip(e)) return;
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

  /** The near-infrared stretch of the plot, tinted and marked, when the range reaches it. */
  private nirLayer(g: ChartGeometry) {
    if (this.domainNm[1] <= NIR_START_NM) return '';
    const x0 = g.x(Math.max(NIR_START_NM, this.domainNm[0]));
    const x1 = this.plotRightPx(this.width.widthPx);
    return svg`<rect class="nir" x=${x0} y=${TOP} width=${x1 - x0} height=${BOTTOM - TOP} fill=${NIR_LOOK.fill}></rect>
      <text x=${x1 - 4} y=${BOTTOM - 4} text-anchor="end" fill=${NIR_LOOK.text} font-size=${LABEL_FONT_PX}>NIR</text>`;
  }

  /** Light horizontal rules at the emission axis's labelled ticks. */
  private gridLayer(ticks: AxisTick[]) {
    const right = this.plotRightPx(this.width.widthPx);
    return ticks
      .filter((t) => t.label !== '')
      .map((t) => svg`<line class="grid" x1=${MARGIN.left} x2=${right} y1=${t.px} y2=${t.px} stroke="#e6e9ef"></line>`);
  }

  /** Each channel's transmission, a thin tinted line on the transmission axis. */
  private passbandLayer(g: ChartGeometry, passbands: ChartPassband[]) {
    return passbands.map(
      (p, i) => svg`<path class="passband" data-channel=${p.id} d=${g.passbandPaths[i]} fill="none"
        stroke=${CHANNEL_LOOK.stroke} stroke-opacity=${CHANNEL_LOOK.lineOpacity} stroke-width="1.2"></path>`,
    );
  }

  /** The detection strip: each shown channel's window in its lane, named where the name fits. */
  private stripLayer(g: ChartGeometry) {
    const laneTop = (lane: number) => BOTTOM + STRIP_GAP_PX + lane * LANE_PX;
    return this.windows.map((win) => {
      const x0 = g.x(Math.max(win.loNm, this.domainNm[0]));
      const x1 = g.x(Math.min(win.hiNm, this.domainNm[1]));
      if (!(x1 > x0)) return '';
      const fits = estimateTextWidthPx(win.label, LABEL_FONT_PX) + 2 * GRIP_ROOM_PX <= x1 - x0;
      return svg`<g class="window" data-channel=${win.id}>
        <rect x=${x0} y=${laneTop(win.lane) + 1} width=${x1 - x0} height=${LANE_PX - 3} rx="4"
          fill=${CHANNEL_LOOK.fill} fill-opacity=${CHANNEL_LOOK.fillOpacity} stroke=${CHANNEL_LOOK.stroke}></rect>
        ${
          fits
            ? svg`<text x=${(x0 + x1) / 2} y=${laneTop(win.lane) + LANE_PX - 5} text-anchor="middle"
          fill=${CHANNEL_LOOK.text} font-size=${LABEL_FONT_PX}>${win.label}</text>`
            : ''
        }</g>`;
    });
  }

  /** Each part of the shared light path, a line on the transmission axis. */
  private sharedLayer(g: ChartGeometry, shared: ChartSharedPath[]) {
    return shared.map((s, i) => {
      const look = SHARED_LOOK[s.id];
      return svg`<path class="shared" data-part=${s.id} d=${g.sharedPaths[i]} fill="none" stroke=${look.stroke}
        stroke-width=${look.width} stroke-dasharray=${look.dash} stroke-linecap="round"></path>`;
    });
  }

  /** The sample background, filled, when it is on. */
  private backgroundLayer(g: ChartGeometry, background: SampledSpectrum | undefined) {
    if (!background) return '';
    return svg`<path class="background" d=${g.backgroundPath} fill=${BACKGROUND_LOOK.fill}
      fill-opacity=${BACKGROUND_LOOK.fillOpacity} stroke=${BACKGROUND_LOOK.stroke} stroke-width="1"></path>`;
  }

  /** Each excitation line: a thin dark line from a small marker on the top of the plot, labelled. */
  private excitationLayer(g: ChartGeometry) {
    const L = EXCITATION_LOOK;
    return this.excitationNm.map((nm) => {
      const x = g.x(nm);
      return svg`<line class="excitation" x1=${x} x2=${x} y1=${TOP} y2=${BOTTOM} stroke=${L.stroke}
          stroke-width=${L.width}></line>
        <path d="M${x - 4},${TOP} L${x + 4},${TOP} L${x},${TOP + 6} Z" fill=${L.stroke}></path>
        <text x=${x + 3} y=${BOTTOM - 4} fill=${L.text} font-size=${LABEL_FONT_PX}>ex ${nm}</text>`;
    });
  }

  /** Each probe's emission: a soft fill, a white underline that parts crossing curves, and its outline. */
  private curveLayer(g: ChartGeometry, curves: ChartCurve[]) {
    return curves.map((c, i) => {
      const look = this.lookOf(c.id);
      return svg`<path d=${g.curveAreas[i]} fill=${look.stroke} fill-opacity=${CURVE_LOOK.fillOpacity}></path>
        <path d=${g.curvePaths[i]} fill="none" stroke="#fff" stroke-width=${CURVE_LOOK.width + 2}></path>
        <path class="curve" data-probe=${c.id} d=${g.curvePaths[i]} fill="none" stroke=${look.stroke}
          stroke-width=${CURVE_LOOK.width} stroke-dasharray=${look.dash}></path>`;
    });
  }

  /** Each shown curve's name at its peak, where the greedy placement finds room. */
  private peakLabelLayer(g: ChartGeometry, curves: ChartCurve[]) {
    const requests: LabelRequest[] = [];
    for (const c of curves) {
      if (!(c.peakNm >= this.domainNm[0] && c.peakNm <= this.domainNm[1])) continue;
      const value = c.spectrum.values[Math.round((c.peakNm - c.spectrum.startNm) / c.spectrum.stepNm)];
      if (!(value > 0)) continue;
      const widthPx = estimateTextWidthPx(c.label, LABEL_FONT_PX) + 4;
      requests.push({ id: c.id, text: c.label, peakXPx: g.x(c.peakNm), peakYPx: g.yEmission(value), widthPx });
    }
    const area = { left: MARGIN.left, right: this.plotRightPx(this.width.widthPx), top: TOP, bottom: BOTTOM };
    return placePeakLabels(requests, { ...area, lineHeightPx: LABEL_FONT_PX + 3 }).map(
      (l) => svg`<text class="peak-label" data-probe=${l.id} x=${l.xPx} y=${l.yPx - 2} text-anchor="middle"
        fill=${this.lookOf(l.id).stroke} font-size=${LABEL_FONT_PX} font-weight="600" stroke="#fff"
        stroke-width="3" paint-order="stroke">${l.text}</text>`,
    );
  }

  /** The dashed line at the readout's wavelength. */
  private hoverLine(g: ChartGeometry) {
    if (this.hoverNm === null) return '';
    const x = g.x(this.hoverNm);
    return svg`<line class="hover" x1=${x} x2=${x} y1=${TOP} y2=${this.axisTopPx} stroke="#111" stroke-width="1"
      stroke-dasharray="2 2"></line>`;
  }

  /**
   * The draggable filter edges: sliders for the keyboard; for the pointer, a grip on the window's edge in the strip,
   * a faint guide up through the plot and a wide invisible hit area over both.
   */
  private handleLayer(g: ChartGeometry, passbands: ChartPassband[]) {
    const [minNm, maxNm] = this.domainNm;
    const laneOf = new Map(this.windows.map((w) => [w.id, w.lane]));
    return passbands.flatMap((p) =>
      p.handles.map((h) => {
        const x = g.x(h.wavelengthNm);
        const gripTop = BOTTOM + STRIP_GAP_PX + (laneOf.get(p.id) ?? 0) * LANE_PX;
        return svg`<g class="handle" tabindex="0" role="slider" aria-label=${`${p.label}: ${EDGE_NAMES[h.edge]}`}
            aria-valuenow=${h.wavelengthNm} aria-valuemin=${minNm} aria-valuemax=${maxNm} data-channel=${p.id}
            data-edge=${h.edge} @pointerdown=${(e: PointerEvent) => this.startDrag(e, h)}
            @keydown=${(e: KeyboardEvent) => this.handleKey(e, h)}>
          <rect x=${x - 7} y=${TOP} width="14" height=${gripTop + LANE_PX - TOP} fill="#000" fill-opacity="0"></rect>
          <line x1=${x} x2=${x} y1=${TOP} y2=${gripTop} stroke=${CHANNEL_LOOK.stroke} stroke-opacity="0.35"
            stroke-dasharray="1 3"></line>
          <rect class="grip" x=${x - 2} y=${gripTop} width="4" height=${LANE_PX - 1} rx="1.5"
            fill=${CHANNEL_LOOK.stroke}></rect></g>`;
      }),
    );
  }

  /** The wavelength axis under the strip, and the tick labels of both value axes, drawn from plain tick data. */
  private axesLayer(g: ChartGeometry, emissionTicks: AxisTick[]) {
    const w = this.width.widthPx;
    const xTicks = axisTicks(g.x, w < 500 ? 5 : 10);
    const tTicks = axisTicks(g.yTransmission, 5, this.log ? '~%' : '.0%');
    const tick = (t: AxisTick, x: number, y: number, anchor: string) =>
      svg`<g class="tick"><text x=${x} y=${y} text-anchor=${anchor} fill="#333" font-size=${LABEL_FONT_PX}
        >${t.label}</text></g>`;
    return svg`<g class="x-axis" transform="translate(0,${this.axisTopPx})">
        <line x1=${MARGIN.left} x2=${this.plotRightPx(w)} stroke="#333"></line>
        ${xTicks.map(
          (t) => svg`<g class="tick" transform="translate(${t.px},0)"><line y2="5" stroke="#333"></line>
            <text y="16" text-anchor="middle" fill="#333" font-size=${LABEL_FONT_PX}>${t.label}</text></g>`,
        )}</g>
      <g class="y-axis">${emissionTicks.map((t) => tick(t, MARGIN.left - 5, t.px + 3, 'end'))}</g>
      <g class="t-axis">${tTicks.map((t) => tick(t, this.plotRightPx(w) + 5, t.px + 3, 'start'))}</g>`;
  }

  /** The legend's lines: every layer, shown or hidden (the exported chart draws the shown ones). */
  legendEntries(): LegendEntry[] {
    const hidden = (key: string) => this.hiddenKeys.has(key);
    return [
      ...this.curves.map((c) => ({
        key: layerKey.probe(c.id),
        label: `${c.label} (${Math.round(c.peakNm)} nm)`,
        mark: 'curve' as const,
        stroke: this.lookOf(c.id).stroke,
        dash: this.lookOf(c.id).dash,
        nir: isNearInfrared(c.peakNm),
        hidden: hidden(layerKey.probe(c.id)),
      })),
      ...this.passbands.map((p) => ({
        key: layerKey.channel(p.id),
        label: `${p.label} channel`,
        mark: 'band' as const,
        stroke: CHANNEL_LOOK.stroke,
        dash: 'none',
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
    const h = this.heightPx;
    const v = this.visible;
    const right = this.plotRightPx(w);
    const emissionTicks = axisTicks(g.yEmission, 5, '~g');
    return html`
      <qdp-chart-controls
        .rangeNm=${this.domainNm}
        ?follow=${this.rangeNm === null}
        ?log=${this.log}
        @chart-view=${this.onView}
      ></qdp-chart-controls>
      <svg
        class="lanes-${laneCount(this.windows)}"
        xmlns="http://www.w3.org/2000/svg"
        viewBox="0 0 ${w} ${h}"
        width=${w}
        height=${h}
        role="group"
        aria-label="Emission spectra, detection windows and excitation lines"
        @pointerdown=${this.onDown}
        @pointermove=${this.onMove}
        @pointerup=${this.onUp}
        @pointercancel=${this.onUp}
        @pointerleave=${this.onLeave}
      >
        <rect x="0" y="0" width=${w} height=${h} fill="#ffffff"></rect>
        <rect
          class="plot"
          tabindex="0"
          aria-label="Plot area: arrow keys move the readout"
          x=${MARGIN.left}
          y=${TOP}
          width=${Math.max(0, right - MARGIN.left)}
          height=${BOTTOM - TOP}
          fill="#ffffff"
          @keydown=${this.plotKey}
        ></rect>
        ${this.nirLayer(g)} ${this.gridLayer(emissionTicks)} ${this.backgroundLayer(g, v.background)}
        ${this.passbandLayer(g, v.passbands)} ${this.sharedLayer(g, v.shared)} ${this.excitationLayer(g)}
        ${this.curveLayer(g, v.curves)} ${this.peakLabelLayer(g, v.curves)}
        <line x1=${MARGIN.left} x2=${right} y1=${BOTTOM} y2=${BOTTOM} stroke="#9aa3b2"></line>
        ${this.stripLayer(g)} ${this.hoverLine(g)} ${this.handleLayer(g, v.passbands)}
        ${this.axesLayer(g, emissionTicks)}
        <text x=${(MARGIN.left + right) / 2} y=${h - 6} text-anchor="middle" fill="#222" font-size="11">
          wavelength (nm)
        </text>
        <text
          class="y-label"
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
