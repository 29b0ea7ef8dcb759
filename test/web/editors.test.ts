import { afterEach, describe, expect, it } from 'vitest';
import { listMaterials, type ChannelSpec, type PanelSpec, type ProbeSpec } from '../../spectra/index';
import '../../web/elements/number-field';
import '../../web/elements/probe-card';
import '../../web/elements/channel-card';
import { moveEdge } from '../../web/state/edge-drag';
import { snapToStock } from '../../web/state/stock-snap';
import { demoPanel } from '../../web/state/demo-panel';

afterEach(() => document.body.replaceChildren());

function typeInto(input: HTMLInputElement, text: string): void {
  input.value = text;
  input.dispatchEvent(new Event('input', { bubbles: true, composed: true }));
}

/** The demo panel with its fourth channel as bandpass 605/20, the size the edge moves below are worked out for. */
function demoWith605(): PanelSpec {
  const panel = demoPanel();
  panel.channels[3] = { ...panel.channels[3], filters: [{ type: 'bandpass', centerNm: 605, widthNm: 20 }] };
  return panel;
}

describe('editors', () => {
  it('fires value-change for a number and keeps non-numeric text, marked invalid, without firing', async () => {
    const el = document.createElement('qdp-number-field');
    el.label = 'Emission peak';
    el.value = 605;
    document.body.appendChild(el);
    await el.updateComplete;
    const seen: (number | undefined)[] = [];
    el.addEventListener('value-change', (e) => seen.push((e as CustomEvent<{ value?: number }>).detail.value));
    const input = el.shadowRoot!.querySelector('input')!;
    typeInto(input, '612');
    typeInto(input, '61x');
    await el.updateComplete;
    expect(seen).toEqual([612]);
    expect(input.value).toBe('61x');
    expect(input.getAttribute('aria-invalid')).toBe('true');
    expect(el.shadowRoot!.textContent).toContain('enter a number');
  });

  it('<qdp-number-field> shows an error from the computation and keeps the typed text', async () => {
    const el = document.createElement('qdp-number-field');
    el.label = 'Emission peak';
    el.value = 605;
    document.body.appendChild(el);
    await el.updateComplete;
    typeInto(el.shadowRoot!.querySelector('input')!, '900');
    el.value = 900;
    el.error = 'emissionPeakNm 900 nm is outside the reachable range 480–650 nm';
    await el.updateComplete;
    expect(el.shadowRoot!.querySelector('input')!.value).toBe('900');
    expect(el.shadowRoot!.querySelector('[role="alert"]')!.textContent).toContain('480–650');
  });

  it('<qdp-probe-card> fires probe-change with the new emission peak and lists every material', async () => {
    const el = document.createElement('qdp-probe-card');
    const probe: ProbeSpec = { id: 'p1', label: 'Orange', material: 'cdse', emissionPeakNm: 605 };
    el.probe = probe;
    el.materials = listMaterials();
    el.prediction = {
      material: 'cdse',
      dye: null,
      diameterNm: 4.9,
      overallDiameterNm: 4.9,
      firstExcitonNm: 590,
      emissionPeakNm: 605,
      fwhmNm: 29,
      relativeBrightness: 0.5,
      measured: false,
      warnings: [],
    };
    document.body.appendChild(el);
    await el.updateComplete;
    const changes: ProbeSpec[] = [];
    el.addEventListener('probe-change', (e) => changes.push((e as CustomEvent<{ probe: ProbeSpec }>).detail.probe));
    const field = el.shadowRoot!.querySelector('qdp-number-field[data-field="emissionPeakNm"]') as HTMLElement & {
      updateComplete: Promise<unknown>;
    };
    await field.updateComplete;
    typeInto(field.shadowRoot!.querySelector('input')!, '615');
    expect(changes).toEqual([{ ...probe, emissionPeakNm: 615 }]);
    expect(el.shadowRoot!.querySelectorAll('select')[0].options.length).toBe(listMaterials().length);
    expect(el.shadowRoot!.textContent).toContain('emission peak 605 nm · FWHM 29 nm');
  });

  it("shows its material's hazard level, notes and cautions beside the probe, never calling it safe", async () => {
    const el = document.createElement('qdp-probe-card');
    el.probe = { id: 'p1', label: 'Orange', material: 'cdse', emissionPeakNm: 605 };
    el.materials = listMaterials();
    document.body.appendChild(el);
    await el.updateComplete;
    const cdse = listMaterials().find((m) => m.id === 'cdse')!;
    const box = el.shadowRoot!.querySelector('details.hazard')!;
    expect(box.querySelector('summary')!.textContent).toContain(`hazard ${cdse.toxicity.level}`);
    const items = [...box.querySelectorAll('li')].map((li) => li.textContent);
    expect(items).toEqual([...cdse.toxicity.notes, ...cdse.toxicity.cautions]);
    expect(box.textContent).toMatch(/local regulations/);
    expect(box.textContent).not.toMatch(/\bsafe\b/i);
  });

  it('<qdp-channel-card> fires channel-change with the new bandpass width', async () => {
    const el = document.createElement('qdp-channel-card');
    const channel: ChannelSpec = {
      id: 'c1',
      label: 'Orange',
      filters: [{ type: 'bandpass', centerNm: 605, widthNm: 20 }],
    };
    el.channel = channel;
    el.lines = [405];
    document.body.appendChild(el);
    await el.updateComplete;
    const changes: ChannelSpec[] = [];
    el.addEventListener('channel-change', (e) =>
      changes.push((e as CustomEvent<{ channel: ChannelSpec }>).detail.channel),
    );
    const field = el.shadowRoot!.querySelector('qdp-number-field[data-field="filters.0.widthNm"]') as HTMLElement & {
      updateComplete: Promise<unknown>;
    };
    await field.updateComplete;
    typeInto(field.shadowRoot!.querySelector('input')!, '30');
    expect(changes[0].filters[0]).toEqual({ type: 'bandpass', centerNm: 605, widthNm: 30 });
  });

  it('with snapStock, a bandpass centre typed as 603 lands on stock 605/20 when the typing is done', async () => {
    for (const snapStock of [true, false]) {
      const el = document.createElement('qdp-channel-card');
      el.channel = { id: 'c1', label: 'Orange', filters: [{ type: 'bandpass', centerNm: 610, widthNm: 20 }] };
      el.lines = [405];
      el.snapStock = snapStock;
      document.body.appendChild(el);
      await el.updateComplete;
      const changes: ChannelSpec[] = [];
      el.addEventListener('channel-change', (e) =>
        changes.push((e as CustomEvent<{ channel: ChannelSpec }>).detail.channel),
      );
      const field = el.shadowRoot!.querySelector('qdp-number-field[data-field="filters.0.centerNm"]') as HTMLElement & {
        updateComplete: Promise<unknown>;
      };
      await field.updateComplete;
      const input = field.shadowRoot!.querySelector('input')!;
      typeInto(input, '603');
      input.dispatchEvent(new Event('change', { bubbles: true }));
      // While typing, the typed number is kept; once done, snapping moves it to the nearest stock size.
      expect(changes[0].filters[0]).toEqual({ type: 'bandpass', centerNm: 603, widthNm: 20 });
      expect(changes.at(-1)!.filters[0]).toEqual({ type: 'bandpass', centerNm: snapStock ? 605 : 603, widthNm: 20 });
      expect(changes.length).toBe(snapStock ? 2 : 1);
      el.remove();
    }
  });

  it('moveEdge(panel, low edge at 590) keeps the upper edge of a 605/20 bandpass and widens it to 25 nm', () => {
    const panel = demoWith605();
    const i = panel.channels.findIndex((c) => c.filters[0].type === 'bandpass' && c.filters[0].centerNm === 605);
    const moved = moveEdge(panel, { channelIndex: i, filterIndex: 0, edge: 'low', wavelengthNm: 590 });
    expect(moved.channels[i].filters[0]).toMatchObject({ centerNm: 602.5, widthNm: 25 });
    expect(panel.channels[i].filters[0]).toMatchObject({ centerNm: 605, widthNm: 20 });
  });

  // Stock sizes (spectra's rule, docs/api.md): centres every 5 nm, widths 10, 20, 25, 30, 40, 50, 60, 75, 100 nm.
  it('snapToStock(bandpass 603/22) is 605/20; a longpass at 563 nm is left as it is', () => {
    expect(snapToStock({ type: 'bandpass', centerNm: 603, widthNm: 22 })).toEqual({
      type: 'bandpass',
      centerNm: 605,
      widthNm: 20,
    });
    expect(snapToStock({ type: 'longpass', edgeNm: 563 })).toEqual({ type: 'longpass', edgeNm: 563 });
  });

  it('moveEdge(605/20, upper edge to 636, snapping) lands on stock 615/40 (custom 615.5/41 without snapping)', () => {
    const panel = demoWith605();
    const i = panel.channels.findIndex((c) => c.filters[0].type === 'bandpass' && c.filters[0].centerNm === 605);
    const h = { channelIndex: i, filterIndex: 0, edge: 'high' as const, wavelengthNm: 636 };
    expect(moveEdge(panel, h, { snapStock: true }).channels[i].filters[0]).toMatchObject({
      centerNm: 615,
      widthNm: 40,
    });
    expect(moveEdge(panel, h).channels[i].filters[0]).toMatchObject({ centerNm: 615.5, widthNm: 41 });
  });

  it('moveEdge(605/20, upper edge +1 nm by key, snapping) steps on to 605/25; by pointer it stays at 605/20', () => {
    const panel = demoWith605();
    const i = panel.channels.findIndex((c) => c.filters[0].type === 'bandpass' && c.filters[0].centerNm === 605);
    const h = { channelIndex: i, filterIndex: 0, edge: 'high' as const, wavelengthNm: 616 };
    // 616 → 605.5/21 snaps back to 605/20; the key step looks on: 618 → 606.5/23 is nearest 605/25.
    const byKey = moveEdge(panel, { ...h, byKey: true }, { snapStock: true }).channels[i].filters[0];
    expect(byKey).toMatchObject({ centerNm: 605, widthNm: 25 });
    const byPointer = moveEdge(panel, h, { snapStock: true }).channels[i].filters[0];
    expect(byPointer).toMatchObject({ centerNm: 605, widthNm: 20 });
  });
});

describe('editors: messages without a field of their own', () => {
  it('lists a message about its label (a field with no number input) in the card as an alert', async () => {
    const el = document.createElement('qdp-probe-card');
    el.probe = { id: 'p1', label: 'Orange', material: 'cdse', emissionPeakNm: 605 };
    el.materials = listMaterials();
    el.errors = { label: 'probes[0].label must be at most 200 characters' };
    document.body.appendChild(el);
    await el.updateComplete;
    const alerts = [...el.shadowRoot!.querySelectorAll('p[role="alert"]')].map((p) => p.textContent);
    expect(alerts).toEqual(['probes[0].label must be at most 200 characters']);
  });

  it('shows a message about its emission peak under that field only, not again in the card', async () => {
    const el = document.createElement('qdp-probe-card');
    el.probe = { id: 'p1', label: 'Orange', material: 'cdse', emissionPeakNm: 2500 };
    el.materials = listMaterials();
    el.errors = { emissionPeakNm: 'probes[0].emissionPeakNm must be between 200 and 2000 nm' };
    document.body.appendChild(el);
    await el.updateComplete;
    const field = el.shadowRoot!.querySelector('qdp-number-field[data-field="emissionPeakNm"]') as HTMLElement & {
      updateComplete: Promise<unknown>;
    };
    await field.updateComplete;
    expect(field.shadowRoot!.querySelector('[role="alert"]')!.textContent).toBe(
      'probes[0].emissionPeakNm must be between 200 and 2000 nm',
    );
    expect(el.shadowRoot!.querySelectorAll('p[role="alert"]')).toHaveLength(0);
  });

  it('<qdp-channel-card> lists a message about its excitation line choice in the card as an alert', async () => {
    const el = document.createElement('qdp-channel-card');
    el.channel = { id: 'c1', label: 'Orange', filters: [{ type: 'bandpass', centerNm: 605, widthNm: 20 }] };
    el.lines = [405];
    el.errors = { excitationNm: "405 nm is not one of the panel's excitation lines" };
    document.body.appendChild(el);
    await el.updateComplete;
    const alerts = [...el.shadowRoot!.querySelectorAll('p[role="alert"]')].map((p) => p.textContent);
    expect(alerts).toEqual(["405 nm is not one of the panel's excitation lines"]);
  });
});

describe('stock filter sizes in the channel card', () => {
  it('a 589/34 bandpass reads "custom size" and its button sets the nearest stock size 590/30', async () => {
    const el = document.createElement('qdp-channel-card');
    el.channel = { id: 'c1', filters: [{ type: 'bandpass', centerNm: 589, widthNm: 34 }] };
    el.lines = [405];
    document.body.appendChild(el);
    await el.updateComplete;
    const changes: ChannelSpec[] = [];
    el.addEventListener('channel-change', (e) =>
      changes.push((e as CustomEvent<{ channel: ChannelSpec }>).detail.channel),
    );
    expect(el.shadowRoot!.textContent).toContain('custom size');
    const button = [...el.shadowRoot!.querySelectorAll('button')].find((b) => b.textContent!.includes('590/30'))!;
    button.click();
    expect(changes[0].filters[0]).toEqual({ type: 'bandpass', centerNm: 590, widthNm: 30 });
  });

  it('a 605/20 bandpass reads "stock size" with no button to change it', async () => {
    const el = document.createElement('qdp-channel-card');
    el.channel = { id: 'c1', filters: [{ type: 'bandpass', centerNm: 605, widthNm: 20 }] };
    el.lines = [405];
    document.body.appendChild(el);
    await el.updateComplete;
    expect(el.shadowRoot!.textContent).toContain('stock size');
    expect(el.shadowRoot!.textContent).not.toContain('Use stock');
  });
});
