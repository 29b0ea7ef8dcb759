// Undo and Redo on the whole page in headless Chromium: the header's buttons and the keyboard shortcuts, driven by
// keystrokes and clicks, then what the fields, the link and the buttons show.
import { afterEach, describe, expect, it } from 'vitest';
import { page, userEvent } from 'vitest/browser';
import '../../web/elements/panel-app';
import { decodeFragment } from '../../web/state/fragment';
import { openRow } from './helpers/page-rows';

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

const headerButton = (app: Host, name: string) =>
  [...app.shadowRoot!.querySelectorAll('header button')].find((b) => b.textContent!.trim() === name) as
    HTMLButtonElement | undefined;

/** The demo's orange channel (620/20, labelled "Orange"), its card. */
const orangeCard = (app: Host) =>
  inner(app, 'qdp-channel-list').shadowRoot!.querySelectorAll('qdp-channel-card')[3] as Host;

/** The text the orange channel's "Centre (nm)" input shows. */
const orangeCentreText = (app: Host) =>
  inner(orangeCard(app), 'qdp-number-field[data-field="filters.0.centerNm"]').shadowRoot!.querySelector('input')!.value;

/** The orange channel's centre in the link. */
const linkedCentre = () =>
  (decodeFragment(location.hash) as { panel: { channels: { filters: { centerNm: number }[] }[] } }).panel.channels[3]
    .filters[0].centerNm;

/** Empties the orange channel's centre and types `keys` into it key by key. */
async function typeOrangeCentre(app: Host, keys: string): Promise<void> {
  await openRow(app, 'qdp-channel-list', 3);
  const input = page.elementLocator(orangeCard(app)).getByLabelText('Centre (nm)');
  await userEvent.clear(input);
  await userEvent.type(input, keys);
}

/** The panel title the header shows. */
const titleOf = (app: Host) => (app.shadowRoot!.querySelector('header input[type="text"]') as HTMLInputElement).value;

/** A small valid panel: one dot, one bandpass channel. */
const SMALL = {
  version: 1,
  excitation: [{ wavelengthNm: 405 }],
  probes: [{ id: 'p1', material: 'cdse', emissionPeakNm: 605 }],
  channels: [{ id: 'c1', filters: [{ type: 'bandpass', centerNm: 605, widthNm: 20 }] }],
};

/** Chooses `file` in the header's "Open panel JSON" input, as the file dialog does. */
function chooseFile(app: Host, file: File): void {
  const input = app.shadowRoot!.querySelector('header input[type="file"]') as HTMLInputElement;
  const files = new DataTransfer();
  files.items.add(file);
  input.files = files.files;
  input.dispatchEvent(new Event('change', { bubbles: true }));
}

describe('undo and redo on the page', () => {
  it('on the opened demo both Undo and Redo are disabled', async () => {
    const app = await openPage();
    expect(headerButton(app, 'Undo')!.disabled).toBe(true);
    expect(headerButton(app, 'Redo')!.disabled).toBe(true);
  });

  it(
    'typing 630 as the orange centre is one step: one click on Undo brings back 620 in the field and the link, ' +
      'and Redo brings 630 back',
    async () => {
      const app = await openPage();
      await typeOrangeCentre(app, '630');
      await expect.poll(() => linkedCentre()).toBe(630);
      await userEvent.click(headerButton(app, 'Undo')!);
      await expect.poll(() => orangeCentreText(app)).toBe('620');
      expect(linkedCentre()).toBe(620);
      expect(headerButton(app, 'Undo')!.disabled).toBe(true);
      expect(headerButton(app, 'Redo')!.disabled).toBe(false);
      await userEvent.click(headerButton(app, 'Redo')!);
      await expect.poll(() => orangeCentreText(app)).toBe('630');
      expect(linkedCentre()).toBe(630);
      expect(headerButton(app, 'Redo')!.disabled).toBe(true);
    },
  );

  it('Ctrl+Z outside a text box undoes the typed centre and Ctrl+Shift+Z redoes it', async () => {
    const app = await openPage();
    await typeOrangeCentre(app, '630');
    await expect.poll(() => linkedCentre()).toBe(630);
    await userEvent.click(headerButton(app, 'Undo')!);
    await userEvent.click(headerButton(app, 'Redo')!);
    // Focus is on the Redo button now, not in a text box.
    await userEvent.keyboard('{Control>}z{/Control}');
    await expect.poll(() => orangeCentreText(app)).toBe('620');
    await userEvent.keyboard('{Control>}{Shift>}z{/Shift}{/Control}');
    await expect.poll(() => orangeCentreText(app)).toBe('630');
  });

  it('Cmd+Z (macOS) outside a text box undoes the typed centre', async () => {
    const app = await openPage();
    await typeOrangeCentre(app, '630');
    await expect.poll(() => linkedCentre()).toBe(630);
    headerButton(app, 'Undo')!.focus();
    await userEvent.keyboard('{Meta>}z{/Meta}');
    await expect.poll(() => orangeCentreText(app)).toBe('620');
  });

  it('Ctrl+Z inside the panel title box is left to the box: after "New panel" the panel stays new', async () => {
    const app = await openPage();
    await userEvent.click(headerButton(app, 'New panel')!);
    const title = page.elementLocator(app).getByLabelText('Panel title');
    await expect.poll(() => (title.element() as HTMLInputElement).value).toBe('Untitled panel');
    await userEvent.click(title);
    await userEvent.keyboard('{Control>}z{/Control}');
    await new Promise((r) => setTimeout(r, 300));
    expect((title.element() as HTMLInputElement).value).toBe('Untitled panel');
    expect(inner(app, 'qdp-channel-list').shadowRoot!.querySelectorAll('qdp-channel-card').length).toBe(0);
    expect(headerButton(app, 'Undo')!.disabled).toBe(false);
  });

  it('"New panel" is one step: Undo brings back the demo\'s title and its six channels', async () => {
    const app = await openPage();
    await userEvent.click(headerButton(app, 'New panel')!);
    await expect
      .poll(() => inner(app, 'qdp-channel-list').shadowRoot!.querySelectorAll('qdp-channel-card').length)
      .toBe(0);
    await userEvent.click(headerButton(app, 'Undo')!);
    await expect
      .poll(() => inner(app, 'qdp-channel-list').shadowRoot!.querySelectorAll('qdp-channel-card').length)
      .toBe(6);
    expect((app.shadowRoot!.querySelector('header input[type="text"]') as HTMLInputElement).value).toContain('Demo');
  });
  it('an opened panel file is one step: Undo brings back the demo', async () => {
    const app = await openPage();
    const file = new File([JSON.stringify({ ...SMALL, title: 'From a file' })], 'small.json', {
      type: 'application/json',
    });
    chooseFile(app, file);
    await expect.poll(() => titleOf(app)).toBe('From a file');
    await userEvent.click(headerButton(app, 'Undo')!);
    await expect.poll(() => titleOf(app)).toContain('Demo');
  });

  it('a loaded proposal is one step: Undo brings back the demo', async () => {
    const app = await openPage();
    const panel = { ...SMALL, title: 'Proposed' };
    inner(app, 'main').dispatchEvent(new CustomEvent('panel-proposed', { detail: { panel }, bubbles: true }));
    await expect.poll(() => titleOf(app)).toBe('Proposed');
    await userEvent.click(headerButton(app, 'Undo')!);
    await expect.poll(() => titleOf(app)).toContain('Demo');
  });

  it('"Open the demo panel" after "New panel" is one step: Undo brings back the new panel', async () => {
    const app = await openPage();
    await userEvent.click(headerButton(app, 'New panel')!);
    await expect.poll(() => titleOf(app)).toBe('Untitled panel');
    await userEvent.click(headerButton(app, 'Open the demo panel')!);
    await expect.poll(() => titleOf(app)).toContain('Demo');
    await userEvent.click(headerButton(app, 'Undo')!);
    await expect.poll(() => titleOf(app)).toBe('Untitled panel');
  });
});
