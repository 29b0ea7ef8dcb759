/**
 * <qdp-target-lock>: what one design target must use of what the user already has: "Use my probe" and "Use my
 * channel", each a choice among the given probes and channels or none (the design then chooses). A locked id that is
 * no longer offered stays chosen and is marked, so the check names it rather than it vanishing. Fires `lock-change`
 * {lock} (undefined when nothing is locked).
 */
import { LitElement, css, html } from 'lit';
import { customElement, property } from 'lit/decorators.js';
import type { DesignLock } from '../../spectra/index';
import { FORM_WORDS } from '../state/design-error';
import { focusRing } from './shared-styles';

/** A probe or channel the lock may name: its id and the label the panel shows. */
export interface LockOption {
  id: string;
  label?: string;
}

const optionText = (o: LockOption) => (o.label && o.label !== o.id ? `${o.label} (${o.id})` : o.id);

@customElement('qdp-target-lock')
export class TargetLock extends LitElement {
  @property({ attribute: false }) probes: LockOption[] = [];
  @property({ attribute: false }) channels: LockOption[] = [];
  @property({ attribute: false }) lock?: DesignLock;
  /** The target's name, for the choices' accessible names. */
  @property() target = '';

  static override styles = [
    focusRing,
    css`
      :host {
        display: inline-flex;
        flex-wrap: wrap;
        gap: 0.4rem;
      }
      select {
        max-width: 40vw;
      }
    `,
  ];

  private set(kind: keyof DesignLock, id: string): void {
    const { [kind]: _old, ...rest } = this.lock ?? {};
    const next: DesignLock = id ? { ...rest, [kind]: id } : rest;
    const lock = next.probe || next.channel ? next : undefined;
    this.dispatchEvent(new CustomEvent('lock-change', { detail: { lock }, bubbles: true, composed: true }));
  }

  private choice(kind: keyof DesignLock, label: string, options: LockOption[], none: string) {
    const chosen = this.lock?.[kind] ?? '';
    const gone = chosen !== '' && !options.some((o) => o.id === chosen);
    return html`<label
      >${label}
      <select
        aria-label=${`${label} for ${this.target}`}
        @change=${(e: Event) => this.set(kind, (e.target as HTMLSelectElement).value)}
      >
        <option value="" ?selected=${chosen === ''}>${none}</option>
        ${options.map((o) => html`<option value=${o.id} ?selected=${o.id === chosen}>${optionText(o)}</option>`)}
        ${gone ? html`<option value=${chosen} selected>${chosen} (no longer in this panel)</option>` : ''}
      </select></label
    >`;
  }

  override render() {
    return html`${
      this.probes.length || this.lock?.probe
        ? this.choice('probe', FORM_WORDS.lockProbe, this.probes, 'no: design one')
        : ''
    }${
      this.channels.length || this.lock?.channel
        ? this.choice('channel', FORM_WORDS.lockChannel, this.channels, 'no: choose one')
        : ''
    }`;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'qdp-target-lock': TargetLock;
  }
}
