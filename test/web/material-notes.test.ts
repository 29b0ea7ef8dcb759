import { afterEach, describe, expect, it } from 'vitest';
import { listMaterials } from '../../spectra/index';
import '../../web/elements/material-notes';
import { demoPanel } from '../../web/state/demo-panel';

afterEach(() => document.body.replaceChildren());

async function mount(exclude: ('cadmium' | 'lead')[] = []) {
  const el = document.createElement('qdp-material-notes');
  el.panel = demoPanel();
  el.materials = listMaterials();
  el.exclude = exclude;
  document.body.appendChild(el);
  await el.updateComplete;
  return el;
}

describe('<qdp-material-notes>', () => {
  it("demo panel: 'contains cadmium', each material's hazard level and cautions, local rules cited", async () => {
    const el = await mount();
    const text = el.shadowRoot!.textContent!;
    expect(text).toContain('This panel contains cadmium.');
    const cdse = el.shadowRoot!.querySelector('section[data-material="cdse"]')!;
    expect(cdse.textContent).toMatch(/hazard: (high|moderate|low)/);
    expect(cdse.querySelectorAll('ul li').length).toBeGreaterThan(0);
    expect(text).toContain('local regulations, institutional safety rules and licensed practice');
  });

  it('never calls a probe safe', async () => {
    const el = await mount();
    expect(el.shadowRoot!.textContent!.replace('no probe here is described as safe', '')).not.toMatch(/\bsafe\b/i);
  });

  it('blocks the cadmium probes when cadmium is excluded and fires exclude-change from the checkbox', async () => {
    const el = await mount(['cadmium']);
    expect(el.shadowRoot!.querySelector('.blocked')!.textContent).toContain('Envelope dot contains cadmium');
    const seen: string[][] = [];
    el.addEventListener('exclude-change', (e) => seen.push((e as CustomEvent<{ exclude: string[] }>).detail.exclude));
    const boxes = el.shadowRoot!.querySelectorAll<HTMLInputElement>('input[type="checkbox"]');
    boxes[1].click();
    expect(seen).toEqual([['cadmium', 'lead']]);
  });
});
