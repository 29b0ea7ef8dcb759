/**
 * Styles that several elements share. Each element's shadow root needs its own copy, so an element lists the ones it
 * uses before its own: `static override styles = [focusRing, css`…`]`.
 */
import { css } from 'lit';

/** The keyboard focus ring of every control. */
export const focusRing = css`
  :focus-visible {
    outline: 3px solid #1a56db;
    outline-offset: 1px;
  }
`;

/** A list of cards, one above the other. */
export const cardList = css`
  :host {
    display: block;
  }
  .cards {
    display: grid;
    grid-template-columns: minmax(0, 1fr);
    gap: 0.6rem;
  }
`;

/** A card in a list of cards (a probe, a channel). */
export const cardFrame = css`
  :host {
    display: block;
    border: 1px solid #ccd;
    border-radius: 6px;
    padding: 0.5rem 0.7rem;
    background: #fff;
  }
`;

/** Rows of labelled fields that wrap on narrow screens. */
export const fieldRows = css`
  .row {
    display: flex;
    flex-wrap: wrap;
    gap: 0.5rem 0.8rem;
    align-items: flex-end;
    margin: 0.3rem 0;
  }
`;

/** Text fields and menus with their labels above them. */
export const textFields = css`
  label.text {
    display: flex;
    flex-direction: column;
    font-size: 0.85rem;
    min-width: 0;
    max-width: 100%;
  }
  input[type='text'],
  select {
    font: inherit;
    padding: 0.2rem 0.3rem;
    border: 1px solid #889;
    border-radius: 3px;
    max-width: 100%;
  }
`;

/** A table-like editor of compact rows: the column headings above the rows, aligned by `--row-columns`. */
export const rowTable = css`
  .columns {
    display: grid;
    grid-template-columns: var(--row-columns, 1fr);
    gap: 0 0.6rem;
    padding: 0 0.4rem 0.2rem;
    font-size: 0.78rem;
    color: #4a5066;
    text-transform: uppercase;
    letter-spacing: 0.03em;
    border-bottom: 1px solid #9aa3c0;
  }
  .columns span:first-child {
    padding-left: 1em;
  }
  @media (max-width: 640px) {
    .columns {
      display: none;
    }
  }
`;
