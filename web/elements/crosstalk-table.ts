/**
 * <qdp-crosstalk-table>: probe-to-probe crosstalk and channel spillover as tables with their values written out
 * and a one-hue lightness ramp (readable in greyscale and by colour-blind users), the worst pair in words, each
 * target's unmixing noise gain, the condition number, the ±5 nm lot-shift sensitivity and the warnings.
 */
import { LOT_SHIFT_NM } from '../../spectra/index';
import { gain, times } from '../chart/verdict';
import { LitElement, css, html, unsafeCSS } from 'lit';
import { customElement, property } from 'lit/decorators.js';
import { formatFraction, shadeLightness, shadeOf, SHADES, type CrosstalkView } from '../chart/crosstalk-view';

// Cells get a class per ramp step: the page's CSP (style-src 'self') blocks style attributes.
const shadeRules = Array.from({ length: SHADES }, (_, k) => {
  const l = shadeLightness(k);
  return `td.s${k} { background: hsl(212 55% ${l.toFixed(1)}%); color: ${l < 55 ? '#fff' : '#111'}; }`;
}).join('\n');
/** The shade ramp's cell rules, for every table that shows these matrices. */
export const shadeStyles = unsafeCSS(shadeRules);
const cellClass = (v: number | null, below = false) => `s${below ? 0 : shadeOf(v)}`;

const sig2 = (v: number) => Number(v.toPrecision(2)).toString();

/** One target's shot-noise reading, or '' when there is none. */
function shotLine(v: CrosstalkView, j: number): string {
  const s = v.shotNoise;
  const sd = s?.relativeSd[j];
  if (!s || sd === null || sd === undefined) return '';
  const f = s.factor[j];
  const alone = f === null || f === undefined ? '' : `, ${gain(f)} the SD it would have alone`;
  const budget = `${s.photons.toLocaleString('en-US')} photons for the brightest target`;
  return ` With shot noise (${budget}): SD ${sig2(sd)} of its signal${alone}.`;
}

/** Said above the numbers while they belong to an earlier, valid version of the panel. */
const STALE_NOTE = html`<p class="stale" role="status">
  These numbers are from the last valid panel; fix the marked field to update them.
</p>`;

/** The cell of light from probe t into probe u's channel ("own" on the diagonal). */
function interferenceCell(v: CrosstalkView, t: number, u: number) {
  if (t === u) return html`<td class="self">own</td>`;
  const value = v.interference[t]?.[u];
  return html`<td class=${cellClass(value ?? null)}>${formatFraction(value)}</td>`;
}

/** Said while the lot-to-lot check waits for the edits to pause. */
export const LOT_SHIFT_PENDING = `Lot-to-lot shift (±${LOT_SHIFT_NM} nm peak moves): checking once you pause typing…`;

/** Said instead of a condition number when the channels cannot separate the probes. */
const NO_CONDITION = '— (the channels cannot separate every probe)';

/** The spillover table's last column when the background is on. */
const SB_HEADER = html`<th scope="col">signal / background</th>`;

/** A factor written without its × ("41", "3.2"): a condition number, a signal-to-background ratio; or a dash. */
const bareFactor = (value: number | null | undefined) => times(value ?? null).replace('×', '');

/** The headings and captions of the matrices (the section and the printed report say them alike). */
export const MATRIX_WORDS = {
  crosstalk: 'Crosstalk between probes',
  crosstalkAbout:
    "Row: whose light; column: the probe whose primary channel it lands in, relative to that probe's own signal there.",
  noise: 'Unmixing noise',
  spillover: 'Spillover into each channel',
  spilloverAbout:
    'Each probe\'s light in a channel relative to its primary channel (the cell that reads "primary"). ' +
    '"< 0.1 %": below the model\'s resolution, not a measured zero.',
} as const;

/** The crosstalk table: rows whose light, columns the probe whose primary channel it lands in. */
export function crosstalkMatrix(v: CrosstalkView) {
  return html`<table aria-label="Crosstalk between probes">
    <thead>
      <tr>
        <th scope="col">light from ↓ / into →</th>
        ${v.probes.map((p) => html`<th scope="col">${p.label}</th>`)}
      </tr>
    </thead>
    <tbody>
      ${v.probes.map(
        (from, t) =>
          html`<tr>
            <th scope="row">${from.label}</th>
            ${v.probes.map((_, u) => interferenceCell(v, t, u))}
          </tr>`,
      )}
    </tbody>
  </table>`;
}

/** Said after a probe whose reference column comes from its single-stain control, not from the model. */
export const MEASURED_MARK = 'measured';

const measuredMark = (p: { measured?: boolean }) =>
  p.measured ? html` <span class="measured" title="column from its single-stain control">${MEASURED_MARK}</span>` : '';

/** The spillover table: each probe's light in each channel relative to its primary channel (reading "primary"). */
export function spilloverMatrix(v: CrosstalkView) {
  const many = v.channels.length > 12;
  return html`<table class=${many ? 'many' : ''} aria-label="Spillover by channel">
    <thead>
      <tr>
        <th scope="col">channel</th>
        ${v.probes.map((p) => html`<th scope="col">${p.label}${measuredMark(p)}</th>`)}${
          v.signalToBackground ? SB_HEADER : ''
        }
      </tr>
    </thead>
    <tbody>
      ${v.channels.map(
        (c, ci) =>
          html`<tr>
            <th scope="row">${c.label}</th>
            ${v.probes.map((_, p) => {
              const primary = v.primaryChannel[p] === ci;
              const below = v.belowResolution[ci]?.[p] ?? false;
              if (primary) return html`<td class="self">primary</td>`;
              return html`<td class=${cellClass(v.spillover[ci]?.[p] ?? null, below)}>
                ${below ? '< 0.1 %' : formatFraction(v.spillover[ci]?.[p])}
              </td>`;
            })}
            ${v.signalToBackground ? html`<td>${bareFactor(v.signalToBackground[ci])}</td>` : ''}
          </tr>`,
      )}
    </tbody>
  </table>`;
}

/** Each target's unmixing noise, one item per probe. */
export function noiseList(v: CrosstalkView) {
  return html`<ul>
    ${v.probes.map(
      (p, j) =>
        html`<li>
          ${p.label}:
          ${
            v.noiseAmplification[j] === null
              ? 'cannot be unmixed from the others with these channels (see warnings).'
              : `this target's noise grows about ${gain(v.noiseAmplification[j])} after unmixing.`
          }<span class="shot">${shotLine(v, j)}</span>
        </li>`,
    )}
  </ul>`;
}

@customElement('qdp-crosstalk-table')
export class CrosstalkTable extends LitElement {
  /** The numbers to show; nothing is drawn until the first evaluation. */
  @property({ attribute: false }) view?: CrosstalkView;
  /** True while the shown numbers belong to an earlier, valid version of the panel (the current one has an error). */
  @property({ type: Boolean }) stale = false;

  static override styles = [
    shadeStyles,
    css`
      :host {
        display: block;
        font-size: 0.9rem;
      }
      .scroll {
        overflow: auto;
        max-width: 100%;
        max-height: 28rem;
        border: 1px solid #ccd;
      }
      table {
        border-collapse: collapse;
      }
      th,
      td {
        padding: 0.25rem 0.45rem;
        border: 1px solid #dde;
        text-align: right;
        white-space: nowrap;
      }
      th {
        background: #f3f4f8;
        font-weight: 600;
        position: sticky;
        top: 0;
      }
      th[scope='row'] {
        text-align: left;
        position: sticky;
        left: 0;
      }
      td.self {
        color: #666;
        background: #fff;
      }
      .many td,
      .many th {
        padding: 0.1rem 0.3rem;
        font-size: 0.8rem;
      }
      .worst {
        font-weight: 600;
      }
      .measured {
        display: block;
        font-weight: normal;
        font-size: 0.75rem;
        font-style: italic;
      }
      .stale {
        color: #8a4b00;
      }
      ul {
        padding-left: 1.2rem;
      }
      h3 {
        font-size: 1rem;
        margin: 1rem 0 0.4rem;
      }
    `,
  ];

  override render() {
    const v = this.view;
    if (!v) {
      // No figures yet: either the panel is still missing parts, or its first state was refused (a kept, invalid one).
      return this.stale
        ? html`<p class="stale">No figures yet: fix the input marked above and the crosstalk appears.</p>`
        : html`<p>Add probes and channels to see crosstalk.</p>`;
    }
    const label = (id: string) => v.probes.find((p) => p.id === id)?.label ?? id;
    return html`
      ${this.stale ? STALE_NOTE : ''}
      <p class="worst">
        ${
          v.worst?.from && v.worst.into && v.worst.interference !== null
            ? html`Worst pair: ${label(v.worst.from)} adds ${formatFraction(v.worst.interference)} of
              ${label(v.worst.into)}'s own signal in ${label(v.worst.into)}'s channel.`
            : 'No pair of probes could be compared yet.'
        }
      </p>
      <h3>${MATRIX_WORDS.crosstalk}</h3>
      <p>${MATRIX_WORDS.crosstalkAbout}</p>
      <div class="scroll">${crosstalkMatrix(v)}</div>
      <h3>${MATRIX_WORDS.noise}</h3>
      ${noiseList(v)}
      ${
        v.shotNoise
          ? html`<p class="shot-note">
              The first figure assumes equal noise in every channel whatever its light, so light from a much brighter
              neighbour costs little there (the neighbour's own channel measures it well) and it can stay near 1× where
              the crosstalk table shows a large percentage. The second counts photons: each channel's shot noise grows
              with all the light it collects${v.shotNoise.withBackground ? ' (background included)' : ''}, so a dim
              target beside a bright neighbour suffers most. "Alone" is the same target as the only probe, read in its
              own channel. The photon budget is nominal: the SDs scale as 1/√photons, the factors do not.
            </p>`
          : ''
      }
      <p>
        Condition number ${v.conditionNumber === null ? NO_CONDITION : bareFactor(v.conditionNumber)}: the worst-case
        bound; a relative error in the measurements can grow by up to this factor in the unmixed amounts.
      </p>
      ${
        v.lotShift
          ? html`<p class="lot">
              Lot-to-lot shift (±${v.lotShift.shiftNm} nm): the worst crosstalk is
              ${formatFraction(v.lotShift.baseline)} now and can reach ${formatFraction(v.lotShift.worst)} if
              ${label(v.lotShift.shiftedProbe)} comes ${Math.abs(v.lotShift.signedShiftNm)} nm
              ${v.lotShift.signedShiftNm > 0 ? 'redder' : 'bluer'} (${label(v.lotShift.from)} into
              ${label(v.lotShift.into)}).
            </p>`
          : v.lotShiftPending
            ? html`<p class="lot">${LOT_SHIFT_PENDING}</p>`
            : ''
      }
      <h3>${MATRIX_WORDS.spillover}</h3>
      <p>${MATRIX_WORDS.spilloverAbout}</p>
      <div class="scroll">${spilloverMatrix(v)}</div>
      ${
        v.warnings.length
          ? html`<h3>Warnings</h3>
              <ul class="warnings">
                ${v.warnings.map((w) => html`<li>${w}</li>`)}
              </ul>`
          : ''
      }
    `;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'qdp-crosstalk-table': CrosstalkTable;
  }
}
