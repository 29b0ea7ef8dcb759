// <qdp-design-form> in real Chromium with its real Web Worker running the design search.
import { afterEach, describe, expect, it } from 'vitest';
import { page, userEvent } from 'vitest/browser';
import '../../web/elements/design-form';
import type { DesignForm } from '../../web/elements/design-form';

afterEach(() => document.body.replaceChildren());

async function mount(options: Record<string, unknown> = {}): Promise<DesignForm> {
  const el = document.createElement('qdp-design-form');
  el.options = options;
  document.body.appendChild(el);
  await el.updateComplete;
  return el;
}

const button = (el: DesignForm, label: string) =>
  [...el.shadowRoot!.querySelectorAll('button')].find((b) => b.textContent!.trim() === label)!;

/** Waits until `check` holds, polling (the worker answers asynchronously). */
async function until(check: () => boolean, timeoutMs = 30_000): Promise<void> {
  const start = performance.now();
  while (!check()) {
    if (performance.now() - start > timeoutMs) throw new Error('timed out');
    await new Promise((r) => setTimeout(r, 20));
  }
}

describe('<qdp-design-form>', () => {
  it('renders targets, excitation, exclusions, materials and the window', async () => {
    const el = await mount();
    const text = el.shadowRoot!.textContent!;
    expect(el.shadowRoot!.querySelectorAll('input[aria-label="target name"]')).toHaveLength(2);
    for (const label of ['cadmium-free', 'lead-free', 'arsenic-free', 'Window, nm', 'Excitation lines'])
      expect(text).toContain(label);
    expect(text).toContain('local regulations, institutional safety rules and licensed practice');
    expect(text).not.toMatch(/\bsafe\b/i);
  });

  it('Propose runs the search in a worker, shows progress, then fires panel-proposed with the result', async () => {
    const el = await mount({ nodeBudget: 3000 });
    const stages: string[] = [];
    const events: CustomEvent[] = [];
    document.body.addEventListener('panel-proposed', (e) => events.push(e as CustomEvent));
    const output = el.shadowRoot!.querySelector('output')!;
    const watch = setInterval(() => stages.push(output.textContent!), 5);
    button(el, 'Propose').click();
    await until(() => events.length === 1);
    clearInterval(watch);
    const { panel, evaluation, objective, exact, stats } = events[0].detail;
    expect(events[0].bubbles && events[0].composed).toBe(true);
    expect(panel.probes).toHaveLength(2);
    expect(evaluation.worst.interference).toBeCloseTo(objective.worstInterference, 12);
    expect(typeof exact).toBe('boolean');
    expect(stats.nodesVisited).toBeGreaterThan(0);
    expect(stages.some((s) => /candidates|search|refine/.test(s))).toBe(true);
    await el.updateComplete;
    expect(el.shadowRoot!.querySelector('.objective')!.textContent).toContain('Worst interference');
    expect(el.shadowRoot!.querySelectorAll('.result tr')).toHaveLength(3);
  });

  it('a sample (scatterLevel 1e8, waterRaman 0.2) goes with the request and stays in the proposed panel', async () => {
    const el = await mount({ nodeBudget: 3000 });
    el.sample = { scatterLevel: 1e8, waterRaman: { level: 0.2 } };
    const events: CustomEvent[] = [];
    document.body.addEventListener('panel-proposed', (e) => events.push(e as CustomEvent));
    button(el, 'Propose').click();
    await until(() => events.length === 1);
    expect(events[0].detail.panel.scatterLevel).toBe(1e8);
    expect(events[0].detail.panel.waterRaman).toEqual({ level: 0.2 });
    expect(events[0].detail.evaluation.waterRamanCollected).toHaveLength(2);
  });

  it('Cancel terminates a long search: no panel-proposed event and the status says cancelled', async () => {
    const el = await mount({ nodeBudget: 5_000_000, peakStepNm: 5, bandStepNm: 5 });
    for (let i = 0; i < 6; i++) button(el, 'Add target').click();
    await el.updateComplete;
    let proposed = 0;
    document.body.addEventListener('panel-proposed', () => proposed++);
    button(el, 'Propose').click();
    await until(() => /search/.test(el.shadowRoot!.querySelector('output')!.textContent!));
    button(el, 'Cancel').click();
    await el.updateComplete;
    expect(el.shadowRoot!.querySelector('output')!.textContent).toContain('cancelled');
    await new Promise((r) => setTimeout(r, 500));
    await el.updateComplete;
    // A live worker would keep posting progress and overwrite the status.
    expect(el.shadowRoot!.querySelector('output')!.textContent).toContain('cancelled');
    expect(proposed).toBe(0);
    expect(button(el, 'Propose').disabled).toBe(false);
  });

  it(
    "Propose after typing 'plenty' as target 1's abundance " +
      "shows the API's message for that field and starts nothing",
    async () => {
      const el = await mount();
      let proposed = 0;
      document.body.addEventListener('panel-proposed', () => proposed++);
      const abundance = page.elementLocator(el).getByLabelText('abundance').first();
      await userEvent.clear(abundance);
      await userEvent.type(abundance, 'plenty');
      await userEvent.click(button(el, 'Propose'));
      await until(() => el.shadowRoot!.querySelector('.error') !== null);
      expect(el.shadowRoot!.querySelector('.error')!.textContent).toBe(
        'targets[0].abundance must be a number greater than 0 or one of high, medium, low',
      );
      expect(button(el, 'Cancel').disabled).toBe(true);
      expect(button(el, 'Propose').disabled).toBe(false);
      await new Promise((r) => setTimeout(r, 300));
      expect(proposed).toBe(0);
    },
  );

  it('Propose with an excitation line that is not a number shows an error and starts nothing', async () => {
    const el = await mount();
    const field = el.shadowRoot!.querySelector<HTMLInputElement>('input[aria-label="excitation lines"]')!;
    field.value = 'blue';
    field.dispatchEvent(new Event('input'));
    button(el, 'Propose').click();
    await el.updateComplete;
    expect(el.shadowRoot!.querySelector('.error')!.textContent).toContain('excitation lines must be numbers');
    expect(button(el, 'Cancel').disabled).toBe(true);
  });
});
