// Measured reference columns in the page: the controls section hands the page a `use-measured-reference` event (its
// documented interface); the page puts the columns into the panel as one undoable step, marks them in the spillover
// table and offers the modelled columns back. The expected spillover is worked by hand: 250 / 1000 = 25 %.
import { afterEach, describe, expect, it } from 'vitest';
import { page, userEvent } from 'vitest/browser';
import '../../web/elements/panel-app';
import { MEASURED_MARK } from '../../web/elements/crosstalk-table';
import { decodeFragment } from '../../web/state/fragment';
import type { PanelSpec } from '../../spectra/index';

type Host = HTMLElement & { updateComplete: Promise<unknown> };

afterEach(() => {
  document.body.replaceChildren();
  history.replaceState(null, '', location.pathname + location.search);
  localStorage.clear();
});

const inner = (root: Element, selector: string) => root.shadowRoot!.querySelector(selector) as Host;

async function openPage(): Promise<Host> {
  const app = document.createElement('qdp-panel-app') as Host;
  document.body.appendChild(app);
  await expect
    .poll(() => inner(app, 'qdp-spectrum-chart')?.shadowRoot?.querySelectorAll('path.curve').length, {
      timeout: 10_000,
    })
    .toBe(6);
  return app;
}

/** The spillover table's header cells and its cell for channel `channel` (label) and probe column `probe` (index). */
function spillover(app: Host, channel: string, probe: number) {
  const table = inner(app, 'qdp-crosstalk-table').shadowRoot!.querySelector(
    'table[aria-label="Spillover by channel"]',
  )!;
  const heads = [...table.querySelectorAll('thead th')].map((th) => th.textContent!.replace(/\s+/g, ' ').trim());
  const row = [...table.querySelectorAll('tbody tr')].find(
    (tr) => tr.querySelector('th')!.textContent!.trim() === channel,
  )!;
  return { heads, cell: row.querySelectorAll('td')[probe].textContent!.trim() };
}

const linked = () => (decodeFragment(location.hash) as { panel: PanelSpec }).panel;

/** The Envelope dot's (p2) control: 1000 in Green, its channel, and 250 in Yellow; nothing elsewhere. */
const envelopeControl = {
  channels: ['c1', 'c2', 'c3', 'c4', 'c5', 'c6'],
  columns: [{ probe: 'p2', values: [0, 1000, 250, 0, 0, 0] }],
};

describe('<qdp-panel-app> measured reference columns', () => {
  it('use-measured-reference puts the column in panel and link; spillover reads 25 %, marked measured', async () => {
    const app = await openPage();
    const before = spillover(app, 'Yellow', 1).cell;
    inner(app, 'main').dispatchEvent(
      new CustomEvent('use-measured-reference', { detail: envelopeControl, bubbles: true, composed: true }),
    );
    await app.updateComplete;
    expect(spillover(app, 'Yellow', 1).cell).toBe('25 %');
    expect(before).not.toBe('25 %');
    expect(spillover(app, 'Yellow', 1).heads[2]).toBe(`Envelope dot ${MEASURED_MARK}`);
    expect(spillover(app, 'Yellow', 1).heads[3]).toBe('Mito dot');
    expect(linked().measuredReference).toEqual(envelopeControl);
    expect(app.shadowRoot!.querySelector('.measured-note')!.textContent).toContain('measured columns of Envelope dot');
  });

  it('"Use the modelled columns" takes the measured column out; Undo brings it back', async () => {
    const app = await openPage();
    const modelled = spillover(app, 'Yellow', 1).cell;
    inner(app, 'main').dispatchEvent(
      new CustomEvent('use-measured-reference', { detail: envelopeControl, bubbles: true, composed: true }),
    );
    await app.updateComplete;
    await userEvent.click(page.elementLocator(app).getByRole('button', { name: 'Use the modelled columns' }));
    expect(spillover(app, 'Yellow', 1).cell).toBe(modelled);
    expect(linked().measuredReference).toBeUndefined();
    await userEvent.click(page.elementLocator(app).getByRole('button', { name: 'Undo' }));
    expect(spillover(app, 'Yellow', 1).cell).toBe('25 %');
  });
});
