/**
 * Page layout: editors and results side by side from 1000 px, stacked below (phones at 390 px).
 */
import { css } from 'lit';
import { focusRing } from './shared-styles';

/** Styles of <qdp-panel-app>. */
export const appStyles = [
  focusRing,
  css`
    :host {
      display: block;
      font:
        15px/1.4 system-ui,
        sans-serif;
      color: #1b1f29;
    }
    header {
      padding: 0.6rem 1rem;
      background: #eef0f5;
      border-bottom: 1px solid #ccd;
    }
    h1 {
      font-size: 1.25rem;
      margin: 0 0 0.4rem;
    }
    h1 span {
      font-weight: 400;
      font-size: 0.95rem;
      color: #444;
    }
    h2 {
      font-size: 1.05rem;
      margin: 0 0 0.5rem;
    }
    .row {
      display: flex;
      flex-wrap: wrap;
      gap: 0.5rem 0.8rem;
      align-items: flex-end;
    }
    label {
      font-size: 0.9rem;
    }
    /* Undo and Redo stay side by side when the row wraps on a phone. */
    .undo {
      display: flex;
      gap: 0.5rem;
    }
    input[type='text'] {
      font: inherit;
      padding: 0.2rem 0.3rem;
      border: 1px solid #889;
      border-radius: 3px;
    }
    button {
      font: inherit;
      padding: 0.25rem 0.6rem;
      border: 1px solid #556;
      border-radius: 4px;
      background: #fff;
      cursor: pointer;
    }
    button:disabled {
      opacity: 0.5;
      cursor: not-allowed;
    }
    main {
      display: grid;
      grid-template-columns: minmax(0, 1fr);
      gap: 1rem;
      padding: 1rem;
    }
    @media (min-width: 1000px) {
      main {
        grid-template-columns: minmax(360px, 0.85fr) minmax(0, 1.15fr);
      }
    }
    section {
      background: #f8f9fb;
      border: 1px solid #dde;
      border-radius: 8px;
      padding: 0.7rem;
      margin-bottom: 1rem;
    }
    .edit[inert] {
      opacity: 0.75;
    }
    .notice {
      color: #333;
    }
    .shared {
      background: #fff8e0;
      padding: 0.3rem 0.5rem;
      border-radius: 4px;
    }
    .error {
      color: #8b1a1a;
      font-weight: 600;
    }
    /* The report preview sits under the page; printed, the report is all there is. */
    qdp-panel-report {
      padding: 0 1rem 1rem;
    }
    @media print {
      header,
      main {
        display: none;
      }
      qdp-panel-report {
        padding: 0;
      }
    }
  `,
];
