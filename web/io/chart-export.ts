/**
 * The spectra chart as a standalone SVG document to file or print: the panel's title above the plot, the plot with its
 * axis labels, and a legend of the shown layers (each probe's name with its line colour and dash) below it. One font
 * family, set on the root; no drag handles, hover line, tab stops, page style or template comment markers.
 */
import { render } from 'lit';
import { CHART_FONT_FAMILY, type LegendEntry } from '../chart/looks';
import { legendSwatch, SWATCH_PX } from '../chart/swatch';

const SVG_NS = 'http://www.w3.org/2000/svg';

/** Layout of the exported chart's title and legend, px. */
export const EXPORT_LAYOUT = {
  titleHeight: 30,
  titleSize: 15,
  legendTop: 8,
  legendRow: 18,
  legendColumn: 230,
  legendSize: 11,
  side: 12,
} as const;

/** What the export adds to the chart: the title and the legend's entries (hidden ones are left out). */
export interface ChartExportOptions {
  title: string;
  /** False leaves the title out of the picture (it still names the image): the printed report heads it already. */
  showTitle?: boolean;
  legend: readonly LegendEntry[];
}

/** The exported document and its size. */
export interface ExportedChart {
  text: string;
  widthPx: number;
  heightPx: number;
}

function el<K extends keyof SVGElementTagNameMap>(name: K, attrs: Record<string, string | number>) {
  const node = document.createElementNS(SVG_NS, name);
  for (const [k, v] of Object.entries(attrs)) node.setAttribute(k, String(v));
  return node;
}

/** Removes every comment node under `root` (Lit's part markers among them). */
function stripComments(root: Node): void {
  const walker = document.createTreeWalker(root, NodeFilter.SHOW_COMMENT);
  const found: Node[] = [];
  while (walker.nextNode()) found.push(walker.currentNode);
  for (const c of found) c.parentNode?.removeChild(c);
}

/** The legend as an SVG group: shown entries in columns of EXPORT_LAYOUT.legendColumn, wrapped to `widthPx`. */
function legendGroup(entries: readonly LegendEntry[], widthPx: number): { group: SVGGElement; heightPx: number } {
  const L = EXPORT_LAYOUT;
  const columns = Math.max(1, Math.floor((widthPx - 2 * L.side) / L.legendColumn));
  const group = el('g', { class: 'legend', 'font-size': L.legendSize, fill: '#222' });
  entries.forEach((e, i) => {
    const x = L.side + (i % columns) * L.legendColumn;
    const y = Math.floor(i / columns) * L.legendRow;
    const item = el('g', { transform: `translate(${x},${y})`, 'data-key': e.key });
    const mark = el('g', { transform: `translate(0,${(L.legendRow - SWATCH_PX.height) / 2 - 4})` });
    render(legendSwatch(e), mark);
    const label = el('text', { x: SWATCH_PX.width + 6, y: L.legendRow / 2 + 1 });
    label.textContent = e.nir ? `${e.label} NIR` : e.label;
    item.appendChild(mark);
    item.appendChild(label);
    group.appendChild(item);
  });
  return { group, heightPx: Math.ceil(entries.length / columns) * L.legendRow };
}

/**
 * A standalone SVG document of the chart's inline <svg> with the title above and the legend below. The page's chart
 * is left as it is; its copy is changed.
 */
export function chartSvgExport(svg: SVGSVGElement, options: ChartExportOptions): ExportedChart {
  const L = EXPORT_LAYOUT;
  const widthPx = svg.width.baseVal.value;
  const plotHeightPx = svg.height.baseVal.value;
  const copy = svg.cloneNode(true) as SVGSVGElement;
  copy.querySelectorAll('.handle, .hover').forEach((n) => n.remove());
  for (const n of [copy, ...copy.querySelectorAll('*')]) {
    for (const a of ['style', 'tabindex', 'font-family', 'role']) n.removeAttribute(a);
  }
  const titleHeight = options.showTitle === false ? 0 : L.titleHeight;
  const plot = el('g', { class: 'chart', transform: `translate(0,${titleHeight})` });
  while (copy.firstChild) plot.appendChild(copy.firstChild);
  const title = el('text', { x: L.side, y: L.titleHeight - 10, 'font-size': L.titleSize, 'font-weight': 600 });
  title.setAttribute('fill', '#111');
  title.textContent = options.title;
  const legend = legendGroup(
    options.legend.filter((e) => !e.hidden),
    widthPx,
  );
  const legendTop = titleHeight + plotHeightPx + L.legendTop;
  legend.group.setAttribute('transform', `translate(0,${legendTop})`);
  const heightPx = legendTop + legend.heightPx + L.legendTop;
  const paper = el('rect', { x: 0, y: 0, width: widthPx, height: heightPx, fill: '#ffffff' });
  for (const part of [paper, ...(titleHeight ? [title] : []), plot, legend.group]) copy.appendChild(part);
  stripComments(copy);
  copy.setAttribute('xmlns', SVG_NS);
  copy.setAttribute('width', String(widthPx));
  copy.setAttribute('height', String(heightPx));
  copy.setAttribute('viewBox', `0 0 ${widthPx} ${heightPx}`);
  copy.setAttribute('font-family', CHART_FONT_FAMILY);
  copy.setAttribute('font-size', '11');
  copy.setAttribute('aria-label', `${options.title}: emission spectra, passbands and excitation lines`);
  const text = '<?xml version="1.0" encoding="UTF-8"?>\n' + new XMLSerializer().serializeToString(copy);
  return { text, widthPx, heightPx };
}
