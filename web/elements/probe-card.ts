/**
 * <qdp-probe-card>: edit one probe (material, emission peak or core diameter, size dispersion, quantum yield, target,
 * abundance, assigned channel, measured emission), read what the model predicts for it and its material's hazard
 * notes and cautions (collapsed, beside the probe). Fires `probe-change`
 * {index, probe} and `probe-remove` {index}.
 */
import { LitElement, css, html } from 'lit';
import { customElement, property } from 'lit/decorators.js';
import { hazardNotes } from './hazard-notes';
import { cardFrame, fieldRows, focusRing, textFields } from './shared-styles';
import type { Material, ProbeSpec, SpectrumPoints } from '../../spectra/index';
import type { ProbePrediction } from '../state/compute';
import { messagesBesides } from '../state/error-map';
import { fmt, percent } from '../state/row-summary';
import './number-field';
import './spectrum-input';
import './shell-editor';
import { SHELL_MATERIALS, listDyes, type ShellLayer } from '../../spectra/index';
import './dye-picker';

/** The part of a material the probe editor needs. */
export type ProbeCardMaterial = Pick<
  Material,
  | 'id'
  | 'name'
  | 'emissionRangeNm'
  | 'diameterRangeNm'
  | 'typicalQuantumYield'
  | 'typicalSizeDispersionPct'
  | 'typicalFwhmNm'
  | 'typicalShell'
  | 'typicalShellEmissionRangeNm'
  | 'sizingModels'
  | 'toxicity'
>;

/** How the page names each published sizing curve a probe may choose. */
const SIZING_CURVE_NAMES: Record<string, string> = {
  yu2003: 'Yu et al. 2003 (default)',
  jasieniak2009: 'Jasieniak et al. 2009',
};

/** The model's prediction for the probe as one line of text. */
function predictionText(pr: ProbePrediction): string {
  const overall =
    pr.overallDiameterNm !== null && pr.overallDiameterNm !== pr.diameterNm
      ? `, with shell ${fmt(pr.overallDiameterNm, 2)} nm`
      : '';
  const parts = [
    ...(pr.diameterNm === null ? [] : [`core ${fmt(pr.diameterNm, 2)} nm${overall}`]),
    ...(pr.firstExcitonNm === null ? [] : [`first exciton ${fmt(pr.firstExcitonNm)} nm`]),
    `emission peak ${fmt(pr.emissionPeakNm)} nm`,
    `FWHM ${fmt(pr.fwhmNm)} nm`,
    `relative brightness ${percent(pr.relativeBrightness)}${pr.measured ? ' · measured emission' : ''}`,
  ];
  return `Predicted: ${parts.join(' · ')}`;
}

/** Shown instead of the prediction while it belongs to an earlier state of the probe. */
const NOT_UPDATED = 'Not updated: the prediction returns once the fields above are valid.';

/** The probe's fields the card edits as numbers. */
type NumberKey =
  | 'emissionPeakNm'
  | 'diameterNm'
  | 'sizeDispersionPct'
  | 'quantumYield'
  | 'abundance'
  | 'fwhmNm'
  | 'absorptionPeakNm'
  | 'extinctionPeak';

/** The dye library, read once (a dye probe's hazard is its dye's, not the generic record's). */
const DYES = listDyes();

@customElement('qdp-probe-card')
export class ProbeCard extends LitElement {
  @property({ attribute: false }) probe!: ProbeSpec;
  @property({ type: Number }) index = 0;
  @property({ attribute: false }) materials: ProbeCardMaterial[] = [];
  @property({ attribute: false }) channels: { id: string; label?: string }[] = [];
  @property({ attribute: false }) prediction?: ProbePrediction;
  /** Errors keyed by the probe's field name ('' for the probe as a whole); those without a field show together. */
  @property({ attribute: false }) errors: Record<string, string> = {};
  /** Why this probe is excluded (empty when it is not); the border follows it through the reflected `excluded`. */
  @property({ attribute: false }) blocked = '';
  @property({ type: Boolean, reflect: true }) excluded = false;

  static override styles = [
    focusRing,
    cardFrame,
    fieldRows,
    textFields,
    css`
      :host([excluded]) {
        border: 2px solid #8b1a1a;
      }
      .pred {
        font-size: 0.85rem;
        color: #222;
        background: #f3f4f8;
        padding: 0.3rem 0.5rem;
        border-radius: 4px;
      }
      .hazard {
        font-size: 0.8rem;
      }
      details.hazard ul {
        color: #222;
        margin: 0.2rem 0;
        padding-left: 1.2rem;
      }
      .high {
        color: #8b1a1a;
      }
      .moderate {
        color: #7a4a00;
      }
      .low {
        color: #2f4f2f;
      }
      .bad {
        color: #8b1a1a;
        font-weight: 600;
      }
      header {
        display: flex;
        justify-content: space-between;
        align-items: center;
        gap: 0.5rem;
      }
    `,
  ];

  /** Moves the keyboard focus to the first field (the label), once the card has drawn. */
  async focusFirst(): Promise<void> {
    await this.updateComplete;
    this.renderRoot.querySelector<HTMLElement>('input, select')?.focus();
  }

  private change(patch: Partial<ProbeSpec>): void {
    const probe: ProbeSpec = { ...this.probe, ...patch };
    for (const k of Object.keys(probe) as (keyof ProbeSpec)[]) if (probe[k] === undefined) delete probe[k];
    this.dispatchEvent(
      new CustomEvent('probe-change', { detail: { index: this.index, probe }, bubbles: true, composed: true }),
    );
  }

  private num(label: string, key: NumberKey, unit: string, optional: boolean, placeholder = '') {
    return html`<qdp-number-field
      .label=${label}
      .unit=${unit}
      .value=${this.probe[key]}
      ?optional=${optional}
      .placeholder=${placeholder}
      .error=${this.errors[key] ?? ''}
      data-field=${key}
      @value-change=${(e: CustomEvent<{ value?: number }>) => this.change({ [key]: e.detail.value })}
    ></qdp-number-field>`;
  }

  private setMaterial(id: string): void {
    const m = this.materials.find((x) => x.id === id);
    if (!m) return;
    // A new material comes with its own usual shell (none for materials without a size law); fields that only one
    // kind of probe takes go when the probe changes kind.
    // The quantum yield, width and size dispersion were the old material's: the new one starts from its own typical
    // values.
    const patch: Partial<ProbeSpec> = {
      material: m.id,
      shell: m.typicalShell && m.typicalShell.length > 0 ? m.typicalShell.map((l) => ({ ...l })) : undefined,
      sizingModel: undefined,
      dye: undefined,
      quantumYield: undefined,
      fwhmNm: undefined,
      sizeDispersionPct: undefined,
    };
    if (m.id !== 'custom') Object.assign(patch, { absorptionPeakNm: undefined, extinctionPeak: undefined });
    if (m.id === 'custom') Object.assign(patch, { emissionPeakNm: undefined, diameterNm: undefined });
    if (m.id === 'dye') {
      Object.assign(patch, {
        dye: this.probe.dye ?? DYES[0].id,
        emissionPeakNm: undefined,
        diameterNm: undefined,
        sizeDispersionPct: undefined,
      });
      this.change(patch);
      return;
    }
    // Keep the emission peak when the new material can reach it under its typical shell; otherwise move it to the
    // middle of that range.
    const reach = m.typicalShellEmissionRangeNm ?? m.emissionRangeNm;
    if (reach && m.id !== 'custom') {
      const [lo, hi] = reach;
      const peak = this.probe.emissionPeakNm;
      if (this.probe.diameterNm === undefined && (peak === undefined || peak < lo || peak > hi))
        patch.emissionPeakNm = Math.round((lo + hi) / 2);
      if (this.probe.diameterNm !== undefined && m.diameterRangeNm) {
        const [dlo, dhi] = m.diameterRangeNm;
        if (this.probe.diameterNm < dlo || this.probe.diameterNm > dhi)
          patch.diameterNm = Number(((dlo + dhi) / 2).toFixed(1));
      }
    }
    this.change(patch);
  }

  private fireRemove(): void {
    this.dispatchEvent(
      new CustomEvent('probe-remove', { detail: { index: this.index }, bubbles: true, composed: true }),
    );
  }

  /** Switches between giving the size by emission peak and by core diameter, starting from the predicted value. */
  private sizeBy(choice: string): void {
    const pr = this.prediction;
    if (choice === 'diameter')
      this.change({ diameterNm: Number(fmt(pr?.diameterNm ?? 4, 2)) || 4, emissionPeakNm: undefined });
    else this.change({ emissionPeakNm: Math.round(pr?.emissionPeakNm ?? 605), diameterNm: undefined });
  }

  /** The "Size given by" choice of a sized material. */
  private sizeChoice(byDiameter: boolean) {
    return html`<label class="text"
      >Size given by
      <select @change=${(e: Event) => this.sizeBy((e.target as HTMLSelectElement).value)}>
        <option value="peak" ?selected=${!byDiameter}>emission peak</option>
        <option value="diameter" ?selected=${byDiameter}>core diameter</option>
      </select></label
    >`;
  }

  /** The number fields that set the dot's size and shape. */
  private sizeFields(sizeKey: NumberKey | null, sized: boolean, m: ProbeCardMaterial | undefined) {
    const hint = (v: number | null | undefined) => String(v ?? '');
    const material = this.probe.material;
    const widthGiven = material === 'carbon' || material === 'dye';
    // A dye probe's defaults are its dye's, not the generic record's.
    const dye = material === 'dye' ? DYES.find((d) => d.id === this.probe.dye) : undefined;
    const fwhmHint = dye ? dye.emissionFwhmNm.value : m?.typicalFwhmNm;
    const qyHint = dye ? dye.quantumYield.value : m?.typicalQuantumYield;
    return html`${sizeKey === 'diameterNm' ? this.num('Core diameter', 'diameterNm', 'nm', false) : ''}
    ${sizeKey === 'emissionPeakNm' ? this.num('Emission peak', 'emissionPeakNm', 'nm', false) : ''}
    ${sized ? this.num('Size dispersion σ/d', 'sizeDispersionPct', '%', true, hint(m?.typicalSizeDispersionPct)) : ''}
    ${widthGiven ? this.num('FWHM', 'fwhmNm', 'nm', true, hint(fwhmHint)) : ''}
    ${material === 'custom' ? this.num('Absorption peak', 'absorptionPeakNm', 'nm', true, 'from emission') : ''}
    ${material === 'custom' ? this.num('Peak ε', 'extinctionPeak', 'M⁻¹ cm⁻¹', true, '1e5') : ''}
    ${this.num('Quantum yield', 'quantumYield', '0–1', true, hint(qyHint))}`;
  }

  /** The choice of published sizing curve, for materials that have more than one (CdSe). */
  private sizingCurveChoice(m: ProbeCardMaterial | undefined) {
    if (!m || m.sizingModels.length < 2) return '';
    const current = this.probe.sizingModel ?? m.sizingModels[0];
    return html`<label class="text"
      >Sizing curve
      <select
        @change=${(e: Event) => {
          const value = (e.target as HTMLSelectElement).value;
          this.change({ sizingModel: value === m.sizingModels[0] ? undefined : (value as ProbeSpec['sizingModel']) });
        }}
      >
        ${m.sizingModels.map(
          (id) => html`<option value=${id} ?selected=${id === current}>${SIZING_CURVE_NAMES[id] ?? id}</option>`,
        )}
      </select></label
    >`;
  }

  /** The channel choice: automatic, or one of the panel's channels. */
  private channelChoice() {
    const p = this.probe;
    return html`<label class="text"
      >Channel
      <select @change=${(e: Event) => this.change({ channel: (e.target as HTMLSelectElement).value || undefined })}>
        <option value="" ?selected=${!p.channel}>automatic (most light)</option>
        ${this.channels.map(
          (c) => html`<option value=${c.id} ?selected=${c.id === p.channel}>${c.label || c.id}</option>`,
        )}
      </select></label
    >`;
  }

  /** Loading a measured emission, and going back to the model's curve once one is loaded. */
  private measuredEmissionRow() {
    const loaded = (e: CustomEvent<{ points: SpectrumPoints }>) =>
      this.change({ measuredEmission: { points: e.detail.points } });
    return html`<div class="row">
      <qdp-spectrum-input kind="emission" label="measured emission" @spectrum-loaded=${loaded}></qdp-spectrum-input>
      ${
        this.probe.measuredEmission
          ? html`<button type="button" @click=${() => this.change({ measuredEmission: undefined })}>
              Use the model's curve again
            </button>`
          : ''
      }
    </div>`;
  }

  /** The shell editor of a sized dot, with the errors that name a shell layer. */
  private shellEditor(m: ProbeCardMaterial) {
    const errors: Record<string, string> = {};
    for (const [key, message] of Object.entries(this.errors))
      if (key === 'shell') errors[''] = message;
      else if (key.startsWith('shell.')) errors[key.slice('shell.'.length)] = message;
    return html`<qdp-shell-editor
      .shell=${this.probe.shell ?? []}
      .typical=${m.typicalShell ?? []}
      .errors=${errors}
      @shell-change=${(e: CustomEvent<{ shell: ShellLayer[] }>) => {
        e.stopPropagation();
        this.change({ shell: e.detail.shell.length > 0 ? e.detail.shell : undefined });
      }}
    ></qdp-shell-editor>`;
  }

  /** The dye of a dye probe, chosen from the library, with any error about it. */
  private dyeChoice() {
    const error = this.errors['dye'];
    return html`<qdp-dye-picker
        .selected=${this.probe.dye ?? ''}
        @dye-choose=${(e: CustomEvent<{ id: string }>) => {
          e.stopPropagation();
          this.change({ dye: e.detail.id });
        }}
      ></qdp-dye-picker
      >${error ? html`<p class="bad" role="alert">${error}</p>` : ''}`;
  }

  /** The probe's hazard notes: its dye's for a dye probe, its material's otherwise. */
  private hazard(m: ProbeCardMaterial | undefined) {
    const dye = this.probe.material === 'dye' ? DYES.find((d) => d.id === this.probe.dye) : undefined;
    const name = dye?.name ?? m?.name;
    const toxicity = dye?.toxicity ?? m?.toxicity;
    if (!name || !toxicity) return '';
    return html`<details class="hazard ${toxicity.level}">
      <summary>${name}: hazard ${toxicity.level}; notes and cautions</summary>
      ${hazardNotes(toxicity)}
    </details>`;
  }

  /** Hazard notes of the shell materials, one collapsed block per material (a shell adds its own hazards). */
  private shellHazards() {
    const ids = [...new Set((this.probe.shell ?? []).map((l) => l.material))];
    return ids.map((id) => {
      const s = SHELL_MATERIALS[id];
      return html`<details class="hazard ${s.toxicity.level}">
        <summary>Shell ${s.name}: hazard ${s.toxicity.level}; notes and cautions</summary>
        ${hazardNotes(s.toxicity)}
      </details>`;
    });
  }

  override render() {
    const p = this.probe;
    const m = this.materials.find((x) => x.id === p.material);
    const byDiameter = p.diameterNm !== undefined;
    // Sized materials have a size law, hence a diameter range; carbon dots and custom probes have none.
    const sized = !!m?.diameterRangeNm;
    // A custom probe takes its measured emission, a sized one its peak or diameter, a carbon dot its peak.
    const sizeKey: NumberKey | null =
      p.material === 'custom' || p.material === 'dye' ? null : byDiameter && sized ? 'diameterNm' : 'emissionPeakNm';
    const shown: string[] = ['abundance', 'quantumYield'];
    if (sizeKey) shown.push(sizeKey);
    if (sized) shown.push('sizeDispersionPct');
    if (p.material === 'carbon' || p.material === 'dye') shown.push('fwhmNm');
    if (p.material === 'custom') shown.push('absorptionPeakNm', 'extinctionPeak');
    if (p.material === 'dye') shown.push('dye');
    if (sized) shown.push(...Object.keys(this.errors).filter((k) => k === 'shell' || k.startsWith('shell.')));
    const pr = this.prediction;
    // A prediction made for another material or dye, or while a field of this probe is refused, is out of date.
    const stale =
      !pr || pr.material !== p.material || (pr.dye ?? null) !== (p.dye ?? null) || Object.keys(this.errors).length > 0;
    return html` <header>
        <strong>${p.label || p.id}</strong>
        <button type="button" aria-label=${`Remove probe ${p.label || p.id}`} @click=${this.fireRemove}>Remove</button>
      </header>
      ${this.blocked ? html`<p class="bad" role="alert">Blocked: ${this.blocked}.</p>` : ''}
      <div class="row">
        <label class="text"
          >Label
          <input
            type="text"
            .value=${p.label ?? ''}
            @change=${(e: Event) => this.change({ label: (e.target as HTMLInputElement).value })}
        /></label>
        <label class="text"
          >Target
          <input
            type="text"
            .value=${p.target ?? ''}
            placeholder="e.g. membrane marker"
            @change=${(e: Event) => this.change({ target: (e.target as HTMLInputElement).value })}
        /></label>
        ${this.num('Relative abundance', 'abundance', '', true, '1')}
      </div>
      <div class="row">
        <label class="text"
          >Material
          <select @change=${(e: Event) => this.setMaterial((e.target as HTMLSelectElement).value)}>
            ${this.materials.map(
              (x) => html`<option value=${x.id} ?selected=${x.id === p.material}>${x.name}</option>`,
            )}
          </select></label
        >
        ${sized ? this.sizeChoice(byDiameter) : ''} ${this.sizeFields(sizeKey, sized, m)} ${this.sizingCurveChoice(m)}
        ${this.channelChoice()}
      </div>
      ${sized ? this.shellEditor(m!) : ''} ${p.material === 'dye' ? this.dyeChoice() : ''} ${this.hazard(m)}
      ${this.shellHazards()}
      ${messagesBesides(this.errors, shown).map((message) => html`<p class="bad" role="alert">${message}</p>`)}
      <p class="pred" aria-label="Predicted properties">
        ${!pr ? 'No prediction yet.' : stale ? NOT_UPDATED : predictionText(pr)}
      </p>
      ${
        pr?.warnings.length && !stale
          ? html`<ul class="hazard">
              ${pr.warnings.map((w) => html`<li>${w}</li>`)}
            </ul>`
          : ''
      }
      ${this.measuredEmissionRow()}`;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'qdp-probe-card': ProbeCard;
  }
}
