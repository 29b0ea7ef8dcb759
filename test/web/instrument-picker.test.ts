// Component tests in headless Chromium for the instrument picker. The test page has no qdpanel API behind it, so the
// example list takes its real "could not be listed" path, and pasting a link is what remains.
import { afterEach, describe, expect, it } from 'vitest';
import { EXAMPLE_INSTRUMENTS } from '../../spectra/index';
import { instrumentIdOf } from '../../web/elements/instrument-picker';
import '../../web/elements/instrument-picker';

afterEach(() => document.body.replaceChildren());

async function mount(setup: (el: HTMLElementTagNameMap['qdp-instrument-picker']) => void = () => {}) {
  const el = document.createElement('qdp-instrument-picker');
  setup(el);
  document.body.appendChild(el);
  await el.updateComplete;
  return el;
}

const ID = 'Ab-_0123456789abcdefghij';

describe('instrumentIdOf', () => {
  it('reads the id from a full link, a path, or a bare id, and refuses anything else', () => {
    expect(instrumentIdOf(`https://example.org/i/${ID}`)).toBe(ID);
    expect(instrumentIdOf(`  /i/${ID}/ `)).toBe(ID);
    expect(instrumentIdOf(ID)).toBe(ID);
    expect(instrumentIdOf(`https://example.org/p/${ID}x`)).toBeNull();
    expect(instrumentIdOf('/i/short')).toBeNull();
    expect(instrumentIdOf('')).toBeNull();
  });
});

describe('<qdp-instrument-picker>', () => {
  it('a pasted link fires instrument-switch with its id; a bad one explains a link and keeps the text', async () => {
    const el = await mount();
    const seen: string[] = [];
    el.addEventListener('instrument-switch', (e) => seen.push((e as CustomEvent<{ id: string }>).detail.id));
    const input = el.shadowRoot!.querySelector('input[type="text"]') as HTMLInputElement;
    const button = [...el.shadowRoot!.querySelectorAll('button')].find((b) => b.textContent?.includes('Switch'))!;
    input.value = 'not a link';
    input.dispatchEvent(new Event('input'));
    button.click();
    await el.updateComplete;
    expect(seen).toEqual([]);
    expect(el.shadowRoot!.querySelector('[role="alert"]')?.textContent).toContain('Paste an instrument link');
    expect(input.value).toBe('not a link');
    input.value = `http://host/i/${ID}`;
    input.dispatchEvent(new Event('input'));
    button.click();
    expect(seen).toEqual([ID]);
  });

  it('names the attached profile with its description and a link to /i/<id>', async () => {
    const spec = EXAMPLE_INSTRUMENTS[1];
    const el = await mount((e) => (e.attached = { id: ID, spec }));
    const text = el.shadowRoot!.textContent ?? '';
    expect(text).toContain(spec.name);
    expect(text).toContain(spec.description!);
    expect(el.shadowRoot!.querySelector('a')?.getAttribute('href')).toBe(`${location.origin}/i/${ID}`);
  });
});
