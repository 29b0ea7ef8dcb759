/**
 * Page layout: from 1000 px the editors on the left and the results on the right, the results column held in view
 * (it scrolls on its own) while the editors scroll; below 1000 px (phones at 390 px) one of the two at a time, the
 * results first, with a switch between them.
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
    /* The file picker reads as a button: the native input is hidden from sight, not from the keyboard. */
    label.file {
      font: inherit;
      padding: 0.25rem 0.6rem;
      border: 1px solid #556;
      border-radius: 4px;
      background: #fff;
      cursor: pointer;
      position: relative;
    }
    label.file:focus-within {
      outline: 3px solid #1a56db;
      outline-offset: 1px;
    }
    label.file input {
      position: absolute;
      inset: 0;
      opacity: 0;
      width: 100%;
      cursor: pointer;
    }
    @media (max-width: 640px) {
      h1 span {
        display: none;
      }
      header .row > label:first-child {
        flex: 1 0 100%;
        display: flex;
        gap: 0.4rem;
        align-items: center;
      }
      header .row > label:first-child input {
        flex: 1;
      }
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
    .views {
      display: flex;
      gap: 0.4rem;
      padding: 0.6rem 1rem 0;
    }
    .views button[aria-pressed='true'] {
      background: #1b1f29;
      color: #fff;
    }
    main.view-results .edit,
    main.view-edit .results {
      display: none;
    }
    @media (min-width: 1000px) {
      main {
        grid-template-columns: minmax(360px, 0.9fr) minmax(0, 1.1fr);
        align-items: start;
      }
      .views {
        display: none;
      }
      main.view-results .edit,
      main.view-edit .results {
        display: block;
      }
      .results {
        position: sticky;
        top: 0;
        max-height: 100vh;
        overflow-y: auto;
        padding-right: 0.2rem;
      }
    }
    /* On a phone the verdict and the plot come first, the curve-height choice after them. */
    @media (max-width: 640px) {
      section[aria-labelledby='h-spectra'] {
        display: flex;
        flex-direction: column;
      }
      section[aria-labelledby='h-spectra'] qdp-height-toggle {
        order: 1;
      }
    }
    details.fold > summary {
      cursor: pointer;
      display: flex;
      flex-wrap: wrap;
      align-items: baseline;
      gap: 0 0.6rem;
    }
    details.fold > summary::-webkit-details-marker {
      display: none;
    }
    details.fold > summary::before {
      content: '▸';
      color: #556;
    }
    details.fold[open] > summary::before {
      content: '▾';
    }
    details.fold > summary h2 {
      display: inline;
      margin: 0;
    }
    details.fold > summary span {
      font-size: 0.88rem;
      color: #3a4055;
    }
    details.fold[open] > summary {
      margin-bottom: 0.5rem;
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
