/**
 * <qdp-proposal-summary>: a finished design shown beside the panel being edited, without loading it: each target with
 * its proposed probe and channel (the user's own ones by their names in the panel), the objective (the weakest
 * target's signal-to-noise, proven optimal or best found with the proven ceiling and gap; the worst interference and
 * the limit it was kept under), the predicted unmixing noise with each abundance as the user gave it, and the
 * answer's warnings, all in the form's words. Its two buttons fire `proposal-load` and `proposal-discard` (not
 * bubbling); the design form decides what follows, and moves the focus to the heading with focusHeading().
 */
import { LitElement, css, html } from 'lit';
import { customElement, property } from 'lit/decorators.js';
import {
  SHELL_MATERIALS,
  listDyes,
  listMaterials,
  type DesignResult,
  type PanelSpec,
  type ProbeSpec,
} from '../../spectra/index';
import type { DesignRequest as DesignRequestBody } from '../../worker/schemas';
import { describeChannelExcitation, describeFilter } from '../io/filter-text';
import { answerText, FORM_WORDS } from '../state/design-error';
import { focusRing } from './shared-styles';

const MATERIAL_NAMES = new Map(listMaterials().map((m) => [m.id, m.name]));
const DYE_NAMES = new Map(listDyes().map((d) => [d.id, d.name]));

/** A fraction as a percentage with three significant figures. */
export const percent = (x: number) => `${(100 * x).toPrecision(3)} %`;

/** A clause that stands alone as a sentence: its first letter raised (the answer's reasons start with a word). */
const sentence = (text: string) => text.charAt(0).toUpperCase() + text.slice(1);

/** A figure with three significant figures, or a dash when the answer has none. */
const figure = (x: number | null | undefined) => (typeof x === 'number' && Number.isFinite(x) ? x.toPrecision(3) : '—');

/** A part the user already has, as the lock choices name it: "Orange dot (p4)", or its id. */
const ownName = (id: string, label: string | undefined) => (label && label !== id ? `${label} (${id})` : id);

/** The name the request gives the probe or channel `id` (one of the user's own: a candidate or an owned one). */
function nameIn(request: DesignRequestBody | undefined, list: 'probes' | 'channels', id: string): string | undefined {
  const parts = [...(request?.candidates?.[list] ?? []), ...(request?.owned?.[list] ?? [])];
  const part = parts.find((p) => p.id === id);
  return part ? ownName(id, part.label) : undefined;
}

/**
 * The parts of a probe's description: the user's name for it when it is theirs, then "CdTe" (a dye by its name),
 * "emission peak 694 nm", "shell CdS 0.7 nm".
 */
function probeParts(probe: ProbeSpec, peakNm: number | undefined, own: string | undefined): string[] {
  const name = probe.dye
    ? (DYE_NAMES.get(probe.dye) ?? probe.dye)
    : (MATERIAL_NAMES.get(probe.material) ?? probe.material);
  const peak = peakNm ?? probe.emissionPeakNm;
  const parts = [...(own ? [own] : []), name, ...(peak === undefined ? [] : [`emission peak ${Math.round(peak)} nm`])];
  const shell = probe.shell ?? [];
  if (shell.length > 0) {
    const layers = shell.map((l) => `${SHELL_MATERIALS[l.material]?.name ?? l.material} ${l.thicknessNm} nm`);
    parts.push(`shell ${layers.join(', ')}`);
  }
  return parts;
}

/** A probe's or channel's parts, each kept on one line, wrapping only between them (after `joint`). */
function partsCell(parts: string[], joint = ' ·') {
  return parts.map((part, i) => html`<span class="part">${part}${i < parts.length - 1 ? joint : ''}</span> `);
}

/**
 * A probe's proposed channel: its name (the user's own one's as the panel names it, a microscope's as its profile
 * does), its filters in the trade's notation ("dichroic 425 (passes above) + bandpass 525/20", wrapping between
 * filters), and the lines it is read under when it names them.
 */
function channelCell(panel: PanelSpec, probe: ProbeSpec, request: DesignRequestBody | undefined) {
  const channel = panel.channels.find((c) => c.id === probe.channel);
  if (!channel) return '—';
  const name = nameIn(request, 'channels', channel.id) ?? channel.label;
  const filters = channel.filters.length ? channel.filters.map(describeFilter) : ['no filter'];
  const lines = channel.excitationNm === undefined ? [] : [`read under ${describeChannelExcitation(channel)}`];
  return html`${name ? html`<span class="part">${name} ·</span> ` : ''}${partsCell(filters, ' +')}${
    lines.length ? html`<span class="part">· ${lines[0]}</span>` : ''
  }`;
}

/** A target's abundance as the user gave it: "medium (0.3)" for a word, else the number. */
function abundanceText(probe: ProbeSpec, request: DesignRequestBody | undefined): string {
  const value = probe.abundance ?? 1;
  const given = request?.targets.find((t) => t.name === probe.target)?.abundance;
  return typeof given === 'string' ? `${given} (${value})` : String(value);
}

/**
 * Whether the answer is proven optimal or the best found, with the proven ceiling on the weakest target's
 * signal-to-noise and how far below it the answer may be.
 */
function proofText(r: DesignResult): string {
  const free = r.mode === 'free';
  if (r.exact)
    return free
      ? 'proven best on the grid catalog of dots and bands, then refined in 1 nm steps'
      : `proven best among ${FORM_WORDS.candidates}`;
  const bound = r.stats?.signalToNoiseBound;
  const gap = r.stats?.gap;
  if (typeof bound !== 'number') return 'best found, not proven best; no ceiling proven yet';
  const where = free ? 'on the grid catalog' : `from ${FORM_WORDS.candidates}`;
  const ceiling = `best found, not proven best: no design ${where} can exceed ${bound.toPrecision(3)}`;
  if (typeof gap !== 'number') return ceiling;
  // Free mode's gap is the grid design's, measured before the refinement moved it off the grid.
  return free
    ? `${ceiling}; the search's best grid design was ${percent(gap)} below that ceiling before its 1 nm refinement`
    : `${ceiling}; this one is ${percent(gap)} below that ceiling`;
}

/** How much of the search space the search visited. */
function searchText(stats: NonNullable<DesignResult['stats']>): string {
  return (
    `${stats.nodesVisited.toLocaleString('en')} partial designs examined, of ` +
    `${stats.fullEnumeration.toExponential(1)} possible complete ones.`
  );
}

@customElement('qdp-proposal-summary')
export class ProposalSummary extends LitElement {
  /** The design answer to show (extra fields are ignored). */
  @property({ attribute: false }) result?: DesignResult;
  /** The request it answers: the abundances as given and the names of the user's own probes and channels. */
  @property({ attribute: false }) request?: DesignRequestBody;

  static override styles = [
    focusRing,
    css`
      :host {
        display: block;
        border: 2px dashed #5a6b8c;
        border-radius: 6px;
        padding: 0.4rem 0.7rem;
        margin: 0.6rem 0;
        background: #f7f8fc;
      }
      .verdict {
        font-weight: 600;
      }
      .verdict.bad {
        color: #8b1a1a;
      }
      .search {
        font-size: 0.85rem;
        color: #444;
      }
      h3 {
        margin: 0.2rem 0;
        font-size: 1rem;
      }
      .scroll {
        overflow-x: auto;
      }
      table {
        border-collapse: collapse;
        margin: 0.3rem 0;
      }
      .caption {
        font-weight: 600;
        margin: 0.5rem 0 0;
      }
      .part,
      .assignment td:first-child {
        white-space: nowrap;
      }
      h3:focus {
        outline: none;
      }
      h3:focus-visible {
        outline: 3px solid #1a56db;
      }
      /* A phone stacks each target's row: the target, its probe, then its channel. */
      @media (max-width: 560px) {
        .assignment,
        .assignment tbody,
        .assignment tr,
        .assignment td {
          display: block;
        }
        .assignment tr:first-child {
          display: none;
        }
        .assignment tr {
          margin-bottom: 0.4rem;
        }
        .assignment td {
          padding: 0;
        }
        .assignment td:first-child {
          font-weight: 600;
        }
      }
      td,
      th {
        padding: 0.1rem 0.5rem;
        text-align: left;
        vertical-align: top;
      }
      .noise td:not(:first-child),
      .noise th:not(:first-child) {
        text-align: right;
        white-space: nowrap;
      }
      .warnings {
        margin: 0.3rem 0;
        padding-left: 1.2rem;
      }
      .actions {
        display: flex;
        flex-wrap: wrap;
        gap: 0.5rem;
        align-items: center;
      }
      .actions p {
        margin: 0;
        flex: 1 1 14rem;
      }
    `,
  ];

  private fire(type: 'proposal-load' | 'proposal-discard'): void {
    this.dispatchEvent(new CustomEvent(type));
  }

  /** Moves the focus to the heading, so a keyboard or screen-reader user lands on the answer. */
  async focusHeading(): Promise<void> {
    await this.updateComplete;
    this.renderRoot.querySelector<HTMLElement>('h3')?.focus();
  }

  /** The answer when the search found no panel that meets the constraints: why, and how many targets would work. */
  private noPanel(r: DesignResult) {
    const fewer =
      r.largestUsableTargets === null
        ? ''
        : r.largestUsableTargets > 0
          ? ` A usable panel was found for ${r.largestUsableTargets} targets, keeping the more abundant ones (among ` +
            'equally abundant ones, those listed first): drop a target or loosen a limit.'
          : ' No usable panel was found even for one target.';
    return html`<section aria-labelledby="h-proposal">
      <h3 id="h-proposal" tabindex="-1">No usable panel: your panel is unchanged</h3>
      <p class="verdict bad" role="status">${sentence(answerText(r.verdictReason))}.${fewer}</p>
      <div class="actions">
        <button type="button" @click=${() => this.fire('proposal-discard')}>Discard</button>
      </div>
    </section>`;
  }

  override render() {
    const r = this.result;
    if (!r) return '';
    const o = r.objective;
    const noise = r.noise;
    if (r.panel === null || o === null || noise === null) return this.noPanel(r);
    const pair = o.fromTarget ? ` (${o.fromTarget} into ${o.intoTarget})` : '';
    const ceiling = percent(o.interferenceCeiling);
    const probes = r.panel.probes;
    const panel = r.panel;
    const brightest = Math.max(...noise.photons.map((x, i) => x * (probes[i].abundance ?? 1)));
    const verdict =
      r.verdict === 'usable'
        ? 'Usable: every target reaches the signal-to-noise threshold and no light intrudes above the limit.'
        : `Not usable: ${answerText(r.verdictReason)}.`;
    const request = this.request;
    return html`<section aria-labelledby="h-proposal">
      <h3 id="h-proposal" tabindex="-1">Proposal, not loaded: your panel is unchanged</h3>
      <p class="verdict ${r.verdict === 'usable' ? '' : 'bad'}" role="status">${verdict}</p>
      <p class="objective">
        Weakest target '${o.weakestTarget}' at signal-to-noise ${figure(o.worstSignalToNoise)} after unmixing:
        ${proofText(r)}. Worst interference ${percent(o.worstInterference)}${pair}, kept at or below ${ceiling}.
      </p>
      <p class="search">
        The search raises the weakest target's signal-to-noise on one photon scale, within the interference limit;
        between equals it takes the one with less spillover spreading (${figure(o.totalSpreading)} in all).
      </p>
      ${r.stats ? html`<p class="search">${searchText(r.stats)}</p>` : ''}
      <div class="scroll">
        <p class="caption" id="cap-assignment">Probe and channel for each target</p>
        <table class="assignment" aria-labelledby="cap-assignment">
          <tr>
            <th>target</th>
            <th>probe</th>
            <th>channel</th>
          </tr>
          ${probes.map(
            (p, i) =>
              html`<tr>
                <td>${p.target ?? p.label ?? p.id}</td>
                <td>
                  ${partsCell(probeParts(p, r.evaluation?.probes[i]?.emissionPeakNm, nameIn(request, 'probes', p.id)))}
                </td>
                <td>${channelCell(panel, p, request)}</td>
              </tr>`,
          )}
        </table>
      </div>
      <div class="scroll">
        <p class="caption" id="cap-noise">
          Predicted unmixing noise (the brightest target ${Math.round(brightest)} photons in its channel, every probe on
          that one scale)
        </p>
        <table class="noise" aria-labelledby="cap-noise">
          <tr>
            <th>target</th>
            <th>abundance</th>
            <th>noise SD</th>
            <th>S/N</th>
          </tr>
          ${probes.map(
            (p, i) =>
              html`<tr>
                <td>${p.target ?? p.label ?? p.id}</td>
                <td>${abundanceText(p, request)}</td>
                <td>${figure(noise.sd[i])}</td>
                <td>${figure(noise.signalToNoise[i])}</td>
              </tr>`,
          )}
        </table>
      </div>
      ${
        r.warnings.length
          ? html`<p class="caption" id="cap-warnings">Warnings</p>
              <ul class="warnings" aria-labelledby="cap-warnings">
                ${r.warnings.map((w) => html`<li>${answerText(w)}</li>`)}
              </ul>`
          : ''
      }
      <div class="actions">
        <button type="button" @click=${() => this.fire('proposal-load')}>Load this proposal</button>
        <button type="button" @click=${() => this.fire('proposal-discard')}>Discard</button>
        <p>Loading replaces the panel you are editing; your browser's Back button brings it back.</p>
      </div>
    </section>`;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'qdp-proposal-summary': ProposalSummary;
  }
}
