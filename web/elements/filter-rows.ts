/**
 * The editing rows of a list of filters, shared by every element that edits filters (a channel's own, the shared light
 * path's): per filter its kind, the numbers that place it, its stock size (bandpasses), a measured table's input and a
 * remove button. Template pieces rendered inside the host element's shadow root, so the host keeps its own error keys
 * and fields (`data-field` is the error key of each number).
 */
import { css, html } from 'lit';
import {
  FILTER_TYPES,
  isStockBandpass,
  nearestStockBandpass,
  type FilterSpec,
  type FilterType,
  type SpectrumPoints,
} from '../../spectra/index';
import { describeFilter } from '../io/filter-text';
import { snapToStock } from '../state/stock-snap';
import './number-field';
import './spectrum-input';

/** Every filter kind; a channel's own list offers all but the dichroic, which it edits by its edge like a longpass. */
export const ALL_FILTER_KINDS: readonly FilterType[] = FILTER_TYPES;
export const CHANNEL_FILTER_KINDS: readonly FilterType[] = FILTER_TYPES.filter((t) => t !== 'dichroic');

/** A new filter of a kind, placed near `nearNm` so switching kind keeps it where it was. */
export function filterOfKind(kind: FilterType, nearNm: number): FilterSpec {
  if (kind === 'bandpass') return { type: 'bandpass', centerNm: nearNm, widthNm: 20 };
  if (kind === 'dichroic') return { type: 'dichroic', edgeNm: nearNm, passes: 'above' };
  if (kind === 'table')
    return {
      type: 'table',
      points: [
        [nearNm - 10, 0],
        [nearNm - 9, 0.9],
        [nearNm + 9, 0.9],
        [nearNm + 10, 0],
      ],
    };
  return { type: kind, edgeNm: nearNm };
}

const centreOf = (f: FilterSpec) =>
  'centerNm' in f
    ? f.centerNm
    : 'edgeNm' in f
      ? f.edgeNm
      : f.points.length
        ? f.points[Math.floor(f.points.length / 2)][0]
        : 600;

/** Styles of the filter rows; the host lists them with its own. */
export const filterRowStyles = css`
  .stock {
    font-size: 0.8rem;
    color: #333;
    align-self: center;
  }
  .filter {
    border-left: 3px solid #8a94a6;
    padding-left: 0.5rem;
    margin: 0.3rem 0;
  }
  .bad {
    color: #8b1a1a;
  }
`;

/** What the rows edit and how they report a change. */
export interface FilterRowsInput {
  filters: readonly FilterSpec[];
  /** Error key prefix, e.g. "filters" or "lightPath.emissionFilters": keys are `${prefix}.${j}.${field}`. */
  prefix: string;
  errors: Record<string, string>;
  /** The kinds offered in each filter's menu. */
  kinds: readonly FilterType[];
  /** Name of a filter in labels, e.g. "Filter" or "Shared filter" (numbered from 1). */
  noun: string;
  /** Whether a filter may be removed (a channel keeps at least one). */
  removable: boolean;
  /** Replaces filter j, or removes it (null). */
  set: (j: number, filter: FilterSpec | null) => void;
  /** When true, a bandpass centre or width typed in lands on the nearest stock size once the typing is done. */
  snapStock?: boolean;
}

/** The error keys the rows show in place: each filter's number fields and the filter as a whole. */
export function filterRowKeys(filters: readonly FilterSpec[], prefix: string): string[] {
  return filters.flatMap((f, j) => {
    const keys = f.type === 'bandpass' ? ['centerNm', 'widthNm'] : f.type === 'table' ? [] : ['edgeNm'];
    return [`${prefix}.${j}`, ...keys.map((k) => `${prefix}.${j}.${k}`)];
  });
}

function num(r: FilterRowsInput, j: number, f: FilterSpec, key: 'centerNm' | 'widthNm' | 'edgeNm', label: string) {
  const typed = (e: CustomEvent<{ value?: number }>) =>
    e.detail.value !== undefined && r.set(j, { ...f, [key]: e.detail.value } as FilterSpec);
  const done = (e: CustomEvent<{ value: number }>) => {
    if (r.snapStock && f.type === 'bandpass') r.set(j, snapToStock({ ...f, [key]: e.detail.value }));
  };
  const field = `${r.prefix}.${j}.${key}`;
  return html`<qdp-number-field
    .label=${label}
    unit="nm"
    .value=${(f as Record<string, unknown>)[key] as number}
    data-field=${field}
    .error=${r.errors[field] ?? ''}
    @value-change=${typed}
    @value-commit=${done}
  ></qdp-number-field>`;
}

/** The filter's kind; choosing another puts a new filter of that kind where this one was. */
function kindChoice(r: FilterRowsInput, f: FilterSpec, j: number) {
  const kind = r.kinds.includes(f.type) ? f.type : 'longpass';
  const chosen = (e: Event) => r.set(j, filterOfKind((e.target as HTMLSelectElement).value as FilterType, centreOf(f)));
  return html`<label class="text"
    >${r.noun} ${j + 1}
    <select @change=${chosen}>
      ${r.kinds.map(
        (k) => html`<option value=${k} ?selected=${k === kind}>${k === 'table' ? 'measured table' : k}</option>`,
      )}
    </select></label
  >`;
}

/** Whether a bandpass is a stock size, and the nearest stock size when it is not. */
function stockSize(r: FilterRowsInput, f: Extract<FilterSpec, { type: 'bandpass' }>, j: number) {
  if (isStockBandpass(f.centerNm, f.widthNm)) return html`<span class="stock">stock size</span>`;
  const near = nearestStockBandpass(f.centerNm, f.widthNm);
  return html`<span class="stock"
    >custom size
    <button type="button" @click=${() => r.set(j, { ...f, ...near })}>
      Use stock ${near.centerNm}/${near.widthNm}
    </button></span
  >`;
}

/** Which side of a dichroic reaches the detectors. */
function passesChoice(r: FilterRowsInput, f: Extract<FilterSpec, { type: 'dichroic' }>, j: number) {
  const chosen = (e: Event) => r.set(j, { ...f, passes: (e.target as HTMLSelectElement).value as 'above' | 'below' });
  return html`<label class="text"
    >Passes to the detectors
    <select @change=${chosen}>
      <option value="above" ?selected=${f.passes === 'above'}>above the edge</option>
      <option value="below" ?selected=${f.passes === 'below'}>below the edge</option>
    </select></label
  >`;
}

/** The numbers that place a filter: a bandpass's centre and width, an edge filter's edge, a table's summary. */
function filterFields(r: FilterRowsInput, f: FilterSpec, j: number) {
  if (f.type === 'bandpass')
    return html`${num(r, j, f, 'centerNm', 'Centre')}${num(r, j, f, 'widthNm', 'Width (FWHM)')} ${stockSize(r, f, j)}`;
  if (f.type === 'table') return html`<span>${describeFilter(f)}</span>`;
  if (f.type === 'dichroic' && r.kinds.includes('dichroic'))
    return html`${num(r, j, f, 'edgeNm', 'Edge')}${passesChoice(r, f, j)}`;
  return num(r, j, f, 'edgeNm', 'Edge');
}

function filterRow(r: FilterRowsInput, f: FilterSpec, j: number) {
  const loaded = (e: CustomEvent<{ points: SpectrumPoints }>) => r.set(j, { type: 'table', points: e.detail.points });
  const message = r.errors[`${r.prefix}.${j}`];
  return html`<div class="filter" aria-label=${`${r.noun} ${j + 1}: ${describeFilter(f)}`}>
    <div class="row">
      ${kindChoice(r, f, j)} ${filterFields(r, f, j)}
      ${r.removable ? html`<button type="button" @click=${() => r.set(j, null)}>Remove filter</button>` : ''}
    </div>
    ${
      f.type === 'table'
        ? html`<qdp-spectrum-input
            kind="transmission"
            label="filter transmission"
            @spectrum-loaded=${loaded}
          ></qdp-spectrum-input>`
        : ''
    }
    ${message ? html`<p class="bad" role="alert">${message}</p>` : ''}
  </div>`;
}

/** One editing row per filter. */
export function filterRows(r: FilterRowsInput) {
  return r.filters.map((f, j) => filterRow(r, f, j));
}

/** The list with filter j replaced by `filter`, or without it (null). */
export function withFilter(filters: readonly FilterSpec[], j: number, filter: FilterSpec | null): FilterSpec[] {
  return filter === null ? filters.filter((_, k) => k !== j) : filters.map((f, k) => (k === j ? filter : f));
}
