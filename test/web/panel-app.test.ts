// The whole page in headless Chromium, driven as a user drives it: keystrokes into its inputs and clicks on its
// buttons (vitest's userEvent, through Playwright), then what the page shows.
import { afterEach, describe, expect, it } from 'vitest';
import { page, userEvent } from 'vitest/browser';
import '../../web/elements/panel-app';
import { decodeFragment, encodeFragment } from '../../web/state/fragment';
import { openRow } from './helpers/page-rows';
import { fileTooLarge, MAX_STATE_BYTES } from '../../web/state/state-size';
import { DRAFT_NOT_HERE } from '../../web/state/fragment';

type Host = HTMLElement & { updateComplete: Promise<unknown> };

afterEach(() => {
  document.body.replaceChildren();
  history.replaceState(null, '', location.pathname + location.search);
  // Each test is a new visitor: the page would restore the last state kept in this browser on a bare address.
  localStorage.clear();
});

/** The first element matching `selector` inside `root`'s shadow root. */
const inner = (root: Element, selector: string) => root.shadowRoot!.querySelector(selector) as Host;

/** The page's text in one line, as a reader sees it. */
const text = (el: Element) => (el.shadowRoot ?? el).textContent!.replace(/\s+/g, ' ').trim();

/** Opens the page and waits until the demo panel's six emission curves are drawn. */
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

/** The emission-peak field of probe `index` (its <qdp-number-field>), to read what it shows. */
function peakField(app: Host, index: number): Host {
  const card = inner(app, 'qdp-probe-list').shadowRoot!.querySelectorAll('qdp-probe-card')[index];
  return inner(card, 'qdp-number-field[data-field="emissionPeakNm"]');
}

/** Empties probe `index`'s "Emission peak (nm)" input, found by its label, and types `keys` into it key by key. */
async function typePeak(app: Host, index: number, keys: string): Promise<void> {
  await openRow(app, 'qdp-probe-list', index);
  const card = inner(app, 'qdp-probe-list').shadowRoot!.querySelectorAll('qdp-probe-card')[index];
  const input = page.elementLocator(card).getByLabelText('Emission peak (nm)');
  await userEvent.clear(input);
  await userEvent.type(input, keys);
}

const crosstalkTable = (app: Host) => inner(app, 'qdp-crosstalk-table').shadowRoot!.querySelector('table')!;
const staleNote = (app: Host) => inner(app, 'qdp-crosstalk-table').shadowRoot!.querySelector('.stale');
const fieldMessage = (field: Host) => field.shadowRoot!.querySelector('[role="alert"]')?.textContent ?? '';
const headerAlert = (app: Host) => app.shadowRoot!.querySelector('header [role="alert"]')?.textContent ?? '';
const linkedPeak = (index: number) =>
  (decodeFragment(location.hash) as { panel: { probes: { emissionPeakNm?: number }[] } }).panel.probes[index]
    .emissionPeakNm;

describe('<qdp-panel-app>', () => {
  it('opens on the demo panel: six curves, a worst pair in the crosstalk section, cadmium in the notes', async () => {
    const app = await openPage();
    expect(text(inner(app, 'qdp-crosstalk-table').shadowRoot!.querySelector('p.worst')!)).toMatch(
      /^Worst pair: .+ adds [\d.]+ % of .+'s own signal/,
    );
    expect(text(inner(app, 'qdp-material-notes').shadowRoot!.querySelector('p.summary')!)).toBe(
      'This panel contains cadmium.',
    );
  });

  it(
    "typing 990 nm as the CdSe Envelope dot's peak keeps 990 in the field and the link, " +
      "shows the size law's reach under the field and leaves the last numbers, marked stale",
    async () => {
      const app = await openPage();
      const before = crosstalkTable(app).textContent;
      const field = peakField(app, 1);
      await typePeak(app, 1, '990');
      // The model's refusal names the peaks the CdSe size law reaches (two wavelengths in nm).
      await expect
        .poll(() => fieldMessage(field))
        .toMatch(/^Probe 'Envelope dot': an emission peak of 990 nm is out of reach .+ \d{3}–\d{3} nm/);
      expect(field.shadowRoot!.querySelector('input')!.value).toBe('990');
      expect(headerAlert(app)).toBe(`Not updated: ${fieldMessage(field)}`);
      expect(staleNote(app)).not.toBeNull();
      expect(crosstalkTable(app).textContent).toBe(before);
      expect(linkedPeak(1)).toBe(990);
    },
  );

  it(
    "typing 2500 nm as a peak shows the API's range in the user's words, naming the probe by its label, " +
      'under the field and in the header, keeps 2500 in the field and the link, ' +
      'and leaves the last numbers, marked stale',
    async () => {
      const app = await openPage();
      const before = crosstalkTable(app).textContent;
      const field = peakField(app, 1);
      await typePeak(app, 1, '2500');
      const words = "Probe 'Envelope dot': an emission peak of 2500 nm is outside 200–2000 nm";
      await expect.poll(() => fieldMessage(field)).toBe(words);
      expect(field.shadowRoot!.querySelector('input')!.value).toBe('2500');
      expect(headerAlert(app)).toBe(`Not updated: ${words}`);
      expect(staleNote(app)).not.toBeNull();
      expect(crosstalkTable(app).textContent).toBe(before);
      expect(linkedPeak(1)).toBe(2500);
    },
  );

  it(
    'typing 540 nm after a refused 2500 nm clears both messages ' +
      'and the stale mark and changes the crosstalk numbers',
    async () => {
      const app = await openPage();
      const before = crosstalkTable(app).textContent;
      const field = peakField(app, 1);
      await typePeak(app, 1, '2500');
      await expect.poll(() => staleNote(app)).not.toBeNull();
      await typePeak(app, 1, '540');
      await expect.poll(() => staleNote(app)).toBeNull();
      expect(fieldMessage(field)).toBe('');
      expect(headerAlert(app)).toBe('');
      expect(crosstalkTable(app).textContent).not.toBe(before);
      expect(linkedPeak(1)).toBe(540);
    },
  );

  it("clicking 'New panel' keeps sharing and export off until the panel has a probe and a channel", async () => {
    const app = await openPage();
    await userEvent.click(page.elementLocator(app).getByRole('button', { name: 'New panel' }));
    await expect.poll(() => app.shadowRoot!.querySelector('.first-steps')).not.toBeNull();
    const actions = inner(app, 'qdp-panel-actions');
    await actions.updateComplete;
    expect(text(actions)).toContain('Sharing, the ordering sheet, the matrices and the panel file are off');
    expect(text(actions)).toContain('the panel needs a probe and a channel first.');
  });
});

describe('<qdp-panel-app> exclusions', () => {
  it('ticking lead-free writes exclude into the linked panel; a panel stating exclude ticks its class', async () => {
    const app = await openPage();
    const notes = inner(app, 'qdp-material-notes');
    await userEvent.click(page.elementLocator(notes).getByLabelText(/lead/i));
    await expect
      .poll(() => (decodeFragment(location.hash) as { panel: { exclude?: string[] } }).panel.exclude)
      .toEqual(['lead']);
    // A fresh page on a link whose panel states lead-free but whose view options say nothing (as a shared or saved
    // panel brings it) shows lead-free ticked.
    const linked = decodeFragment(location.hash) as { panel: Record<string, unknown> };
    document.body.replaceChildren();
    history.replaceState(null, '', `#${encodeFragment({ panel: linked.panel as never, view: { exclude: [] } })}`);
    const again = await openPage();
    const box = page.elementLocator(inner(again, 'qdp-material-notes')).getByLabelText(/lead/i);
    await expect.element(box).toBeChecked();
  });
});

describe('<qdp-panel-app> new panel', () => {
  it('"New panel" says to add a probe and a channel, no refusal; then only the channel after a probe', async () => {
    const app = await openPage();
    await userEvent.click(page.elementLocator(app).getByRole('button', { name: 'New panel' }));
    await expect.poll(() => app.shadowRoot!.querySelector('.first-steps')?.textContent ?? '').toContain('add a probe');
    expect(app.shadowRoot!.querySelector('.first-steps')!.textContent).toContain('a channel');
    expect(headerAlert(app)).toBe('');
    await userEvent.click(page.elementLocator(app).getByRole('button', { name: 'Edit the panel' }));
    await userEvent.click(page.elementLocator(inner(app, 'qdp-probe-list')).getByRole('button', { name: 'Add probe' }));
    await expect
      .poll(() => app.shadowRoot!.querySelector('.first-steps')?.textContent ?? '')
      .toMatch(/^To start, add a channel/);
  });
});

describe('<qdp-panel-app> lot-to-lot check after a pause', () => {
  it(
    'a typed peak redraws at once with the lot-to-lot line saying it waits for a pause, and the figure follows ' +
      'once typing stops',
    async () => {
      const app = await openPage();
      const lot = () =>
        inner(app, 'qdp-crosstalk-table').shadowRoot!.querySelector('p.lot')?.textContent?.replace(/\s+/g, ' ') ?? '';
      await expect.poll(lot).toMatch(/^ ?Lot-to-lot shift \(±5 nm\): the worst crosstalk is .+ can reach/);
      const before = crosstalkTable(app).textContent;
      await typePeak(app, 1, '520');
      // The lot line as it read when the new numbers first showed.
      let atRedraw = '';
      await expect
        .poll(() => {
          atRedraw = lot();
          return crosstalkTable(app).textContent;
        })
        .not.toBe(before);
      expect(atRedraw).toContain('checking once you pause typing');
      await expect.poll(lot).toMatch(/can reach/);
    },
  );
});

describe('<qdp-panel-app> refusals in the user’s words', () => {
  it("a 5000 nm centre on the demo's third channel: the channel named, the value and range, no numbers", async () => {
    const app = await openPage();
    await openRow(app, 'qdp-channel-list', 2);
    const card = inner(app, 'qdp-channel-list').shadowRoot!.querySelectorAll('qdp-channel-card')[2];
    const input = page
      .elementLocator(card)
      .getByLabelText(/^Centre/)
      .first();
    await userEvent.clear(input);
    await userEvent.type(input, '5000');
    await expect
      .poll(() => headerAlert(app))
      .toBe("Not updated: Channel 'Yellow': a centre of 5000 nm is outside 200–2000 nm");
    expect(staleNote(app)).not.toBeNull();
  });
});

describe('reading a panel file', () => {
  it('a file one byte over the largest state is refused by its size with the notice, and the demo stays', async () => {
    const app = await openPage();
    const file = new File([new Uint8Array(MAX_STATE_BYTES + 1)], 'huge.json', { type: 'application/json' });
    const input = app.shadowRoot!.querySelector('header input[type="file"]') as HTMLInputElement;
    const files = new DataTransfer();
    files.items.add(file);
    input.files = files.files;
    input.dispatchEvent(new Event('change', { bubbles: true }));
    await expect.poll(() => text(app)).toContain(fileTooLarge('huge.json'));
    expect((app.shadowRoot!.querySelector('header input[type="text"]') as HTMLInputElement).value).toContain('Demo');
  });
});

describe('an address naming a panel kept in another browser', () => {
  it('#d1.<id> of an entry this browser lacks says where the panel is and shows the demo', async () => {
    history.replaceState(null, '', '#d1.no-such-entry');
    const app = await openPage();
    await expect.poll(() => text(app)).toContain(DRAFT_NOT_HERE);
    expect((app.shadowRoot!.querySelector('header input[type="text"]') as HTMLInputElement).value).toContain('Demo');
  });
});
