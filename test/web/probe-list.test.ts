// Component tests in headless Chromium for the probe list: one card per probe, "Add probe", the probe limit, and the
// per-probe errors, predictions and exclusion reasons it hands to each card.
import { afterEach, describe, expect, it } from 'vitest';
import { listMaterials, type PanelSpec, type ProbeSpec } from '../../spectra/index';
import '../../web/elements/probe-list';
import { demoPanel } from '../../web/state/demo-panel';

afterEach(() => document.body.replaceChildren());

type Card = HTMLElement & {
  updateComplete: Promise<unknown>;
  probe: ProbeSpec;
  index: number;
  blocked: string;
  errors: Record<string, string>;
};

/** A small invented panel with `n` CdSe probes, peaks 20 nm apart from 520 nm. */
function panelWithProbes(n: number): PanelSpec {
  const probes: ProbeSpec[] = Array.from({ length: n }, (_, i) => ({
    id: `p${i + 1}`,
    label: `Dot ${i + 1}`,
    material: 'cdse',
    emissionPeakNm: 520 + 20 * i,
  }));
  return {
    version: 1,
    excitation: [{ wavelengthNm: 405 }],
    probes,
    channels: [{ id: 'c1', label: 'Wide', filters: [{ type: 'longpass', edgeNm: 500 }] }],
  };
}

async function mount(panel: PanelSpec, setup: (el: HTMLElementTagNameMap['qdp-probe-list']) => void = () => {}) {
  const el = document.createElement('qdp-probe-list');
  el.panel = panel;
  el.materials = listMaterials();
  setup(el);
  document.body.appendChild(el);
  await el.updateComplete;
  return el;
}

type Row = HTMLElement & { updateComplete: Promise<unknown>; open: boolean; attention: string };
const rows = (el: HTMLElement) => [...el.shadowRoot!.querySelectorAll('qdp-editor-row')] as Row[];
const cards = (el: HTMLElement) => [...el.shadowRoot!.querySelectorAll('qdp-probe-card')] as Card[];
const addButton = (el: HTMLElement) =>
  [...el.shadowRoot!.querySelectorAll('button')].find((b) => b.textContent!.trim() === 'Add probe')!;

describe('<qdp-probe-list>', () => {
  it('<qdp-probe-list> renders one card per probe of the demo panel, in order, each with its own index', async () => {
    const panel = demoPanel();
    const el = await mount(panel);
    const shown = cards(el);
    expect(shown.map((c) => c.probe.id)).toEqual(panel.probes.map((p) => p.id));
    expect(shown.map((c) => c.index)).toEqual(panel.probes.map((_, i) => i));
  });

  it('<qdp-probe-list> renders nothing, not even "Add probe", until it has a panel', async () => {
    const el = document.createElement('qdp-probe-list');
    document.body.appendChild(el);
    await el.updateComplete;
    expect(el.shadowRoot!.querySelectorAll('qdp-probe-card, button')).toHaveLength(0);
  });

  it('<qdp-probe-list> re-renders when given a panel with one probe fewer', async () => {
    const el = await mount(panelWithProbes(3));
    expect(cards(el)).toHaveLength(3);
    const next = panelWithProbes(3);
    next.probes.splice(1, 1);
    el.panel = next;
    await el.updateComplete;
    expect(cards(el).map((c) => c.probe.label)).toEqual(['Dot 1', 'Dot 3']);
    expect(cards(el).map((c) => c.index)).toEqual([0, 1]);
  });

  it('<qdp-probe-list> "Add probe" fires one bubbling, composed probe-add that reaches the document', async () => {
    const el = await mount(panelWithProbes(2));
    const seen: Event[] = [];
    document.addEventListener('probe-add', (e) => seen.push(e), { once: true });
    addButton(el).click();
    expect(seen).toHaveLength(1);
    expect(seen[0].composed).toBe(true);
  });

  it("lets a card's probe-remove bubble out with that card's index, read by its keyboard label", async () => {
    const el = await mount(panelWithProbes(3));
    const removed: number[] = [];
    el.addEventListener('probe-remove', (e) => removed.push((e as CustomEvent<{ index: number }>).detail.index));
    const card = cards(el)[2];
    await card.updateComplete;
    const remove = card.shadowRoot!.querySelector('button[aria-label="Remove probe Dot 3"]') as HTMLButtonElement;
    expect(remove).not.toBeNull();
    remove.click();
    expect(removed).toEqual([2]);
  });

  it('<qdp-probe-list> with maxProbes reached disables "Add probe" and says how many a panel holds', async () => {
    const el = await mount(panelWithProbes(4), (l) => (l.maxProbes = 4));
    expect(addButton(el).disabled).toBe(true);
    expect(el.shadowRoot!.textContent).toContain('A panel holds at most 4 probes.');
    el.maxProbes = 5;
    await el.updateComplete;
    expect(addButton(el).disabled).toBe(false);
    expect(el.shadowRoot!.textContent).not.toContain('at most');
  });

  it('<qdp-probe-list> by default allows 16 probes (api-v1) and no more', async () => {
    const el = await mount(panelWithProbes(15));
    expect(addButton(el).disabled).toBe(false);
    el.panel = panelWithProbes(16);
    await el.updateComplete;
    expect(addButton(el).disabled).toBe(true);
  });

  it("<qdp-probe-list> marks only the excluded probe's card as blocked", async () => {
    const el = await mount(
      panelWithProbes(3),
      (l) => (l.blocked = new Map([['p2', 'cadmium is excluded in this lab']])),
    );
    expect(cards(el).map((c) => c.hasAttribute('excluded'))).toEqual([false, true, false]);
    await cards(el)[0].updateComplete;
    expect(cards(el)[0].shadowRoot!.querySelector('[role="alert"]')).toBeNull();
  });

  // The reason is a property only and the border follows a separate reflected `excluded` flag, so no attribute write
  // can overwrite the reason (it once did: the card showed its border but no "Blocked: …" alert).
  it("<qdp-probe-list> shows the excluded probe's reason inside its card as an alert", async () => {
    const el = await mount(
      panelWithProbes(3),
      (l) => (l.blocked = new Map([['p2', 'cadmium is excluded in this lab']])),
    );
    const card = cards(el)[1];
    await card.updateComplete;
    expect(card.blocked).toBe('cadmium is excluded in this lab');
    expect(card.shadowRoot!.querySelector('[role="alert"]')?.textContent).toContain('cadmium is excluded in this lab');
  });

  it(
    '<qdp-probe-list> hands each card its own errors and prediction by probe index; a card with an error marks its ' +
      'prediction not updated',
    async () => {
      const el = await mount(panelWithProbes(2), (l) => {
        l.errors = { 1: { emissionPeakNm: 'emissionPeakNm 990 nm is out of range' } };
        l.predictions = [
          undefined,
          {
            material: 'cdse',
            dye: null,
            diameterNm: 5.1,
            overallDiameterNm: 5.1,
            firstExcitonNm: 528,
            emissionPeakNm: 540,
            fwhmNm: 30,
            relativeBrightness: 0.8,
            measured: false,
            warnings: [],
          },
        ];
      });
      const [first, second] = cards(el);
      expect(first.errors).toEqual({});
      expect(second.errors).toEqual({ emissionPeakNm: 'emissionPeakNm 990 nm is out of range' });
      await Promise.all([first.updateComplete, second.updateComplete]);
      expect(first.shadowRoot!.querySelector('[aria-label="Predicted properties"]')!.textContent).toContain(
        'No prediction yet.',
      );
      const secondText = second.shadowRoot!.querySelector('[aria-label="Predicted properties"]')!.textContent;
      expect(secondText).toContain('Not updated');
      expect(secondText).not.toContain('emission peak 540 nm');
      second.errors = {};
      await second.updateComplete;
      expect(second.shadowRoot!.querySelector('[aria-label="Predicted properties"]')!.textContent).toContain(
        'emission peak 540 nm',
      );
    },
  );

  it(
    'shows each probe as one closed row (label, CdSe/ZnS, peak, FWHM, "auto" channel, brightness); ' +
      'pressing the row opens its card and pressing it again closes it',
    async () => {
      const panel = panelWithProbes(2);
      panel.probes[0].shell = [{ material: 'zns', thicknessNm: 0.9 }];
      const el = await mount(panel, (l) => {
        l.predictions = [
          {
            material: 'cdse',
            dye: null,
            diameterNm: 4,
            overallDiameterNm: 5.8,
            firstExcitonNm: 510,
            emissionPeakNm: 521.4,
            fwhmNm: 29.6,
            relativeBrightness: 0.456,
            measured: false,
            warnings: [],
          },
        ];
      });
      const row = rows(el)[0];
      await row.updateComplete;
      const head = row.shadowRoot!.querySelector('button')!;
      const cells = [...head.querySelectorAll('span')].map((s) => s.textContent);
      expect(cells).toEqual(['Dot 1', 'CdSe/ZnS', '521 nm', '30 nm', 'auto', '46 %']);
      expect(head.getAttribute('aria-expanded')).toBe('false');
      expect(row.shadowRoot!.querySelector('.body')!.hasAttribute('hidden')).toBe(true);
      head.click();
      await row.updateComplete;
      expect(head.getAttribute('aria-expanded')).toBe('true');
      expect(row.shadowRoot!.querySelector('.body')!.hasAttribute('hidden')).toBe(false);
      head.click();
      await row.updateComplete;
      expect(row.shadowRoot!.querySelector('.body')!.hasAttribute('hidden')).toBe(true);
    },
  );

  it('after "Add probe" the new row opens and its label field takes the keyboard focus', async () => {
    const el = await mount(panelWithProbes(2));
    el.addEventListener('probe-add', () => (el.panel = panelWithProbes(3)));
    addButton(el).click();
    await el.updateComplete;
    await expect.poll(() => rows(el)[2]?.open).toBe(true);
    expect(rows(el).map((r) => r.open)).toEqual([false, false, true]);
    const card = cards(el)[2];
    await expect.poll(() => card.shadowRoot!.activeElement?.closest('label')?.textContent?.trim()).toBe('Label');
  });

  it('a row whose probe holds an error is open, says to fix the marked field; a new panel takes no focus', async () => {
    const el = await mount(panelWithProbes(2), (l) => (l.errors = { 0: { emissionPeakNm: 'too far' } }));
    el.panel = panelWithProbes(3);
    await el.updateComplete;
    expect(rows(el).map((r) => r.open)).toEqual([true, false, false]);
    expect(rows(el)[0].attention).toBe('Fix the marked field below.');
    expect(document.activeElement).toBe(document.body);
  });
});
