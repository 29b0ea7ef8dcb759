/**
 * <qdp-light-editor>: the excitation lines (wavelength, relative power), the sample background (autofluorescence: off,
 * the generic model or a sample type's preset at a level, or a measured spectrum; water Raman: off or at a level), the
 * scattered excitation light, and the shared light path (<qdp-light-path-editor>). Fires `panel-edit` {panel}.
 */
import { LitElement, css, html } from 'lit';
import { customElement, property } from 'lit/decorators.js';
import { fieldRows, focusRing } from './shared-styles';
import {
  DEFAULT_MIN_BLOCKING_OD,
  DEFAULT_SCATTER_LEVEL,
  WATER_RAMAN_FWHM_CM1,
  WATER_RAMAN_SHIFT_CM1,
  listBackgroundPresets,
  ramanPeakNm,
  type BackgroundPresetId,
  type BackgroundSpec,
  type PanelSpec,
  type SpectrumPoints,
} from '../../spectra/index';
import { messagesBesides } from '../state/error-map';
import { LIGHT_WORDS } from '../state/light-words';
import './light-path-editor';
import './number-field';
import './spectrum-input';

/** The sample-type presets, read once from the library. */
const PRESETS = listBackgroundPresets();

@customElement('qdp-light-editor')
export class LightEditor extends LitElement {
  @property({ attribute: false }) panel?: PanelSpec;
  /**
   * Errors keyed by the panel path joined with dots, e.g. "excitation.0.wavelengthNm"; those about the lines or the
   * background without a field here show together under the editor.
   */
  @property({ attribute: false }) errors: Record<string, string> = {};
  /** The name of the instrument profile the panel is on (its shared light path is then read only). */
  @property() fromInstrument = '';

  static override styles = [
    focusRing,
    fieldRows,
    css`
      :host {
        display: block;
        font-size: 0.9rem;
      }
      label.text {
        display: flex;
        flex-direction: column;
        font-size: 0.85rem;
      }
      select {
        font: inherit;
        max-width: 100%;
      }
      .about {
        font-size: 0.8rem;
        color: #333;
        margin: 0.2rem 0;
        max-width: 60rem;
      }
    `,
  ];

  private edit(panel: PanelSpec): void {
    this.dispatchEvent(new CustomEvent('panel-edit', { detail: { panel }, bubbles: true, composed: true }));
  }

  /** Messages about the lines or the background that no field of this editor shows. */
  private lightMessages(panel: PanelSpec): string[] {
    const shown = panel.excitation.flatMap((_, i) => [`excitation.${i}.wavelengthNm`, `excitation.${i}.powerRel`]);
    const mine = Object.fromEntries(
      Object.entries(this.errors).filter(([key]) => /^(excitation|background|waterRaman)\b/.test(key)),
    );
    return messagesBesides(mine, [...shown, 'background.level', 'background.preset', 'waterRaman.level']);
  }

  private removeLine(p: PanelSpec, i: number) {
    const remove = () => this.edit({ ...p, excitation: p.excitation.filter((_, k) => k !== i) });
    return html`<button type="button" @click=${remove}>Remove line</button>`;
  }

  /** The background's level and what its shape comes from (a sample type, the generic model or a measured spectrum). */
  private backgroundFields(p: PanelSpec, bg: BackgroundSpec) {
    const level = (e: CustomEvent<{ value?: number }>) =>
      e.detail.value !== undefined && this.edit({ ...p, background: { ...bg, level: e.detail.value } });
    const useModel = () => this.edit({ ...p, background: { level: bg.level } });
    return html`<qdp-number-field
        label=${LIGHT_WORDS.backgroundLevel}
        .value=${bg.level}
        .error=${this.errors['background.level'] ?? ''}
        @value-change=${level}
      ></qdp-number-field>
      ${
        bg.points
          ? html`<span>measured spectrum, ${bg.points.length} points</span
              ><button type="button" @click=${useModel}>Use a modelled background instead</button>`
          : this.sampleType(p, bg)
      }`;
  }

  /**
   * How much excitation light the sample scatters towards the detectors, and the blocking (OD) below which a channel
   * is warned about (both optional: empty means the documented defaults, 1e10 and OD 6).
   */
  private leakFields(p: PanelSpec) {
    const set = (key: 'scatterLevel' | 'minBlockingOD') => (e: CustomEvent<{ value?: number }>) => {
      const next = { ...p, [key]: e.detail.value };
      if (e.detail.value === undefined) delete next[key];
      this.edit(next);
    };
    return html`<div class="row">
      <qdp-number-field
        label=${LIGHT_WORDS.scatter}
        .value=${p.scatterLevel}
        optional
        placeholder=${String(DEFAULT_SCATTER_LEVEL)}
        .error=${this.errors['scatterLevel'] ?? ''}
        @value-change=${set('scatterLevel')}
      ></qdp-number-field>
      <qdp-number-field
        label=${LIGHT_WORDS.minBlocking}
        unit="OD"
        .value=${p.minBlockingOD}
        optional
        placeholder=${String(DEFAULT_MIN_BLOCKING_OD)}
        .error=${this.errors['minBlockingOD'] ?? ''}
        @value-change=${set('minBlockingOD')}
      ></qdp-number-field>
    </div>`;
  }

  /**
   * Water Raman under every line: a checkbox, its level when on, and where the band lies under each line (approximate,
   * with its sources).
   */
  private waterRamanFields(p: PanelSpec) {
    const raman = p.waterRaman;
    const toggle = (e: Event) => {
      const next = { ...p };
      if ((e.target as HTMLInputElement).checked) next.waterRaman = { level: 0.1 };
      else delete next.waterRaman;
      this.edit(next);
    };
    const level = (e: CustomEvent<{ value?: number }>) =>
      e.detail.value !== undefined && this.edit({ ...p, waterRaman: { level: e.detail.value } });
    const peaks = p.excitation.map(
      (l) => `${l.wavelengthNm}\u00a0→\u00a0≈\u00a0${Math.round(ramanPeakNm(l.wavelengthNm))}\u00a0nm`,
    );
    return html`<div class="row">
        <label><input type="checkbox" .checked=${!!raman} @change=${toggle} /> ${LIGHT_WORDS.waterRaman}</label>
        ${
          raman
            ? html`<qdp-number-field
                label=${LIGHT_WORDS.waterRamanLevel}
                .value=${raman.level}
                .error=${this.errors['waterRaman.level'] ?? ''}
                @value-change=${level}
              ></qdp-number-field>`
            : ''
        }
      </div>
      ${
        raman
          ? html`<p class="about">
              Approximate: the O–H band of water, about ${WATER_RAMAN_SHIFT_CM1} cm⁻¹ below each line
              (${peaks.join(', ')}), about ${WATER_RAMAN_FWHM_CM1} cm⁻¹ wide, stronger towards the blue by the ν⁴ law
              (Lakowicz, Principles of Fluorescence Spectroscopy, 2006; Walrafen, J. Chem. Phys. 1967). Level 1: as many
              photons under 405 nm as the background's reference probe at abundance 1.
            </p>`
          : ''
      }`;
  }

  /** The sample type whose usual autofluorescence the background models (the generic model when none is chosen). */
  private sampleType(p: PanelSpec, bg: BackgroundSpec) {
    const choose = (e: Event) => {
      const id = (e.target as HTMLSelectElement).value as BackgroundPresetId | '';
      this.edit({ ...p, background: id ? { level: bg.level, preset: id } : { level: bg.level } });
    };
    const error = this.errors['background.preset'];
    return html`<label class="text"
        >${LIGHT_WORDS.sampleType}
        <select @change=${choose}>
          <option value="" ?selected=${!bg.preset}>${LIGHT_WORDS.genericBackground}</option>
          ${PRESETS.presets.map(
            (preset) => html`<option value=${preset.id} ?selected=${preset.id === bg.preset}>${preset.name}</option>`,
          )}
        </select></label
      >${error ? html`<span role="alert">${error}</span>` : ''}`;
  }

  /** What the chosen sample type contains, and the caution every preset carries. */
  private presetAbout(bg: BackgroundSpec) {
    const preset = PRESETS.presets.find((x) => x.id === bg.preset);
    if (!preset || bg.points) return '';
    return html`<p class="about">
        ${preset.description} Bands: ${preset.bands.map((b) => `${b.fluorophore} (≈ ${b.emissionNm} nm)`).join(', ')}.
      </p>
      <p class="about">Approximate: ${PRESETS.caution}</p>`;
  }

  /** Loading a measured background spectrum. */
  private backgroundInput(p: PanelSpec, bg: BackgroundSpec) {
    // A measured spectrum replaces any preset (the API refuses the two together).
    const loaded = (e: CustomEvent<{ points: SpectrumPoints }>) =>
      this.edit({ ...p, background: { level: bg.level, points: e.detail.points } });
    return html`<qdp-spectrum-input
      kind="background"
      label="measured background"
      @spectrum-loaded=${loaded}
    ></qdp-spectrum-input>`;
  }

  override render() {
    const p = this.panel;
    if (!p) return html``;
    const bg = p.background;
    const setLine = (i: number, key: 'wavelengthNm' | 'powerRel') => (e: CustomEvent<{ value?: number }>) =>
      this.edit({
        ...p,
        excitation: p.excitation.map((l, k) =>
          k === i ? { ...l, [key]: e.detail.value ?? (key === 'powerRel' ? 1 : l.wavelengthNm) } : l,
        ),
      });
    return html` ${p.excitation.map(
        (l, i) =>
          html`<div class="row">
            <qdp-number-field
              label=${`Excitation line ${i + 1}`}
              unit="nm"
              .value=${l.wavelengthNm}
              .error=${this.errors[`excitation.${i}.wavelengthNm`] ?? ''}
              @value-change=${setLine(i, 'wavelengthNm')}
            ></qdp-number-field>
            <qdp-number-field
              label=${LIGHT_WORDS.relativePower}
              .value=${l.powerRel}
              optional
              placeholder="1"
              .error=${this.errors[`excitation.${i}.powerRel`] ?? ''}
              @value-change=${setLine(i, 'powerRel')}
            ></qdp-number-field>
            ${p.excitation.length > 1 ? this.removeLine(p, i) : ''}
          </div>`,
      )}
      <button
        type="button"
        @click=${() => this.edit({ ...p, excitation: [...p.excitation, { wavelengthNm: 488, powerRel: 1 }] })}
      >
        Add excitation line
      </button>
      ${this.leakFields(p)}
      <div class="row">
        <label
          ><input
            type="checkbox"
            .checked=${!!bg}
            @change=${(e: Event) => {
              const next = { ...p };
              if ((e.target as HTMLInputElement).checked) next.background = { level: 0.1 };
              else delete next.background;
              this.edit(next);
            }}
          />
          Sample background (autofluorescence)</label
        >
        ${bg ? this.backgroundFields(p, bg) : ''}
      </div>
      ${bg ? this.presetAbout(bg) : ''} ${bg ? this.backgroundInput(p, bg) : ''} ${this.waterRamanFields(p)}
      ${this.lightMessages(p).map((message) => html`<p role="alert">${message}</p>`)}
      <qdp-light-path-editor
        .panel=${p}
        .errors=${this.errors}
        .fromInstrument=${this.fromInstrument}
      ></qdp-light-path-editor>`;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'qdp-light-editor': LightEditor;
  }
}
