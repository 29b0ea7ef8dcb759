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

/** The choice of no lock: the search then designs or picks the part. */
const NONE = 'the search chooses';

const optionText = (o: LockOption) => (o.label && o.label !== o.id ? `${o.label} (${o.id})` : o.id);

@customElement('qdp-target-lock')
export class TargetLock extends LitElement {
  @property({ attribute: false }) probes: LockOption[] = [];
  @property({ attribute: false }) channels: LockOption[] = [];
  @property({ attribute: false }) lock?: DesignLock;
  /** The target's name, for the choices' accessible names. */
  @property() target = '';

  /** focus() moves to the first choice (the form sends the focus here when a lock is refused). */
  static override shadowRootOptions = { ...LitElement.shadowRootOptions, delegatesFocus: true };

  static override styles = [
    focusRing,
    css`
      /* The two choices one above the other, their menus lined up and narrowing on a phone. */
      :host {
        display: grid;
        grid-template-columns: max-content minmax(0, max-content);
        gap: 0.2rem 0.4rem;
        align-items: center;
      }
      label {
        display: contents;
      }
      select {
        max-width: 100%;
        font: inherit;
      }
    `,
  ];

  private set(kind: keyof DesignLock, id: string): void {
    const { [kind]: _old, ...rest } = this.lock ?? {};
    const next: DesignLock = id ? { ...rest, [kind]: id } : rest;
    const lock = next.probe || next.channel ? next : undefined;
    this.dispatchEvent(new CustomEvent('lock-change', { detail: { lock }, bubbles: true, composed: true }));
  }

  private choice(kind: keyof DesignLock, label: string, options: LockOption[]) {
    const chosen = this.lock?.[kind] ?? '';
    const gone = chosen !== '' && !options.some((o) => o.id === chosen);
    return html`<label
      >${label}
      <select
        aria-label=${`${label} for ${this.target}`}
        @change=${(e: Event) => this.set(kind, (e.target as HTMLSelectElement).value)}
      >
        <option value="" ?selected=${chosen === ''}>${NONE}</option>
        ${options.map((o) => html`<option value=${o.id} ?selected=${o.id === chosen}>${optionText(o)}</option>`)}
        ${gone ? html`<option value=${chosen} selected>${chosen} (no longer in this panel)</option>` : ''}
      </select></label
    >`;
  }

  override render() {
    return html`${
      this.probes.length || this.lock?.probe ? this.choice('probe', FORM_WORDS.lockProbe, this.probes) : ''
    }${
      this.channels.length || this.lock?.channel ? this.choice('channel', FORM_WORDS.lockChannel, this.channels) : ''
    }`;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'qdp-target-lock': TargetLock;
  }
}
