// Component tests in headless Chromium for the excitation/background editor and the measured-spectrum input.
import { afterEach, describe, expect, it } from 'vitest';
import type { PanelSpec, SpectrumPoints } from '../../spectra/index';
import '../../web/elements/light-editor';
import '../../web/elements/spectrum-input';
import { demoPanel } from '../../web/state/demo-panel';

afterEach(() => document.body.replaceChildren());

type Updating = HTMLElement & { updateComplete: Promise<unknown> };

async function mountEditor(panel: PanelSpec) {
  const el = document.createElement('qdp-light-editor');
  el.panel = panel;
  document.body.appendChild(el);
  await el.updateComplete;
  const edits: PanelSpec[] = [];
  el.addEventListener('panel-edit', (e) => edits.push((e as CustomEvent<{ panel: PanelSpec }>).detail.panel));
  return { el, edits };
}

function paste(input: Updating, text: string): void {
  const area = input.shadowRoot!.querySelector('textarea')!;
  area.value = text;
  area.dispatchEvent(new Event('input', { bubbles: true, composed: true }));
  input.shadowRoot!.querySelector('button')!.click();
}

describe('<qdp-light-editor>', () => {
  it('typing 1e8 as the scattered excitation light sets scatterLevel; emptying it restores the default', async () => {
    const { el, edits } = await mountEditor(demoPanel());
    const field = [...el.shadowRoot!.querySelectorAll('qdp-number-field')].find(
      (f) => (f as unknown as { label: string }).label === 'Scattered excitation light',
    ) as Updating;
    await field.updateComplete;
    const input = field.shadowRoot!.querySelector('input')!;
    expect(input.placeholder).toBe('10000000000');
    input.value = '1e8';
    input.dispatchEvent(new Event('input', { bubbles: true, composed: true }));
    expect(edits.at(-1)!.scatterLevel).toBe(1e8);
    input.value = '';
    input.dispatchEvent(new Event('input', { bubbles: true, composed: true }));
    expect(edits.at(-1)).not.toHaveProperty('scatterLevel');
  });

  it(
    'choosing the FFPE sample type sets background.preset, keeps ' + 'the level and shows the preset’s caution',
    async () => {
      const panel = { ...demoPanel(), background: { level: 0.3 } };
      const { el, edits } = await mountEditor(panel);
      const label = [...el.shadowRoot!.querySelectorAll('label')].find((l) => l.textContent!.includes('Sample type'))!;
      const select = label.querySelector('select')!;
      expect(select.options[0].textContent).toBe('generic tissue (default model)');
      select.value = 'ffpe-tissue';
      select.dispatchEvent(new Event('change'));
      expect(edits.at(-1)!.background).toEqual({ level: 0.3, preset: 'ffpe-tissue' });
      el.panel = edits.at(-1)!;
      await el.updateComplete;
      expect(el.shadowRoot!.textContent).toMatch(/Approximate: .*orders of magnitude/);
      select.value = '';
      select.dispatchEvent(new Event('change'));
      expect(edits.at(-1)!.background).toEqual({ level: 0.3 });
    },
  );

  it('a measured background hides the sample-type choice (the two cannot be combined)', async () => {
    const panel = {
      ...demoPanel(),
      background: {
        level: 1,
        points: [
          [400, 1],
          [600, 0],
        ] as SpectrumPoints,
      },
    };
    const { el } = await mountEditor(panel);
    expect(el.shadowRoot!.textContent).not.toContain('Sample type');
    expect(el.shadowRoot!.textContent).toContain('measured spectrum, 2 points');
  });

  it('<qdp-light-editor> turns the sample background on at level 0.1 and off again through its checkbox', async () => {
    const { background: _bg, ...withoutBackground } = demoPanel();
    const { el, edits } = await mountEditor(withoutBackground);
    const box = el.shadowRoot!.querySelector('input[type="checkbox"]') as HTMLInputElement;
    expect(box.checked).toBe(false);
    box.click();
    expect(edits.at(-1)?.background).toEqual({ level: 0.1 });
    el.panel = edits.at(-1)!;
    await el.updateComplete;
    (el.shadowRoot!.querySelector('input[type="checkbox"]') as HTMLInputElement).click();
    expect(edits.at(-1)).not.toHaveProperty('background');
  });

  it('<qdp-light-editor> sends a typed background level and a pasted measured background in panel-edit', async () => {
    const { el, edits } = await mountEditor({ ...demoPanel(), background: { level: 0.1 } });
    const level = [...el.shadowRoot!.querySelectorAll('qdp-number-field')].find(
      (f) => (f as unknown as { label: string }).label === 'Background level',
    ) as Updating;
    await level.updateComplete;
    const input = level.shadowRoot!.querySelector('input')!;
    input.value = '0.4';
    input.dispatchEvent(new Event('input', { bubbles: true, composed: true }));
    expect(edits.at(-1)?.background).toEqual({ level: 0.4 });
    const spectrum = el.shadowRoot!.querySelector('qdp-spectrum-input') as Updating;
    await spectrum.updateComplete;
    paste(spectrum, '450,0.1\n500,1\n550,0.5\n600,0.1');
    expect(edits.at(-1)?.background).toEqual({
      level: 0.1,
      points: [
        [450, 0.1],
        [500, 1],
        [550, 0.5],
        [600, 0.1],
      ],
    });
  });

  it("<qdp-light-editor> shows a message about line 1's relative power under that line's power field", async () => {
    const el = document.createElement('qdp-light-editor');
    el.panel = demoPanel();
    el.errors = { 'excitation.0.powerRel': 'excitation[0].powerRel must be between 0 and 1000000' };
    document.body.appendChild(el);
    await el.updateComplete;
    const power = [...el.shadowRoot!.querySelectorAll('qdp-number-field')].find(
      (f) => (f as unknown as { label: string }).label === 'Relative power',
    ) as Updating;
    await power.updateComplete;
    expect(power.shadowRoot!.querySelector('[role="alert"]')!.textContent).toBe(
      'excitation[0].powerRel must be between 0 and 1000000',
    );
    expect(el.shadowRoot!.querySelectorAll('p[role="alert"]')).toHaveLength(0);
  });

  it('<qdp-light-editor> lists a message about the lines as a whole (17 lines) under the editor', async () => {
    const el = document.createElement('qdp-light-editor');
    el.panel = demoPanel();
    el.errors = { excitation: 'excitation has more than 16 lines', title: 'title must be at most 200 characters' };
    document.body.appendChild(el);
    await el.updateComplete;
    const alerts = [...el.shadowRoot!.querySelectorAll('p[role="alert"]')].map((p) => p.textContent);
    expect(alerts).toEqual(['excitation has more than 16 lines']);
  });

  it('<qdp-light-editor> adds a second excitation line and then offers to remove either', async () => {
    const { el, edits } = await mountEditor(demoPanel());
    const add = [...el.shadowRoot!.querySelectorAll('button')].find((b) =>
      b.textContent?.includes('Add excitation line'),
    )!;
    add.click();
    expect(edits.at(-1)?.excitation.map((l) => l.wavelengthNm)).toEqual([405, 488]);
    el.panel = edits.at(-1)!;
    await el.updateComplete;
    const removes = [...el.shadowRoot!.querySelectorAll('button')].filter((b) => b.textContent === 'Remove line');
    expect(removes).toHaveLength(2);
  });
});

describe('<qdp-light-editor> water Raman and the shared light path', () => {
  const fieldByLabel = (root: ShadowRoot, label: string) =>
    [...root.querySelectorAll('qdp-number-field')].find((f) => (f as unknown as { label: string }).label === label) as
      Updating | undefined;
  const typeInto = (field: Updating, text: string) => {
    const input = field.shadowRoot!.querySelector('input')!;
    input.value = text;
    input.dispatchEvent(new Event('input', { bubbles: true, composed: true }));
  };

  it('the Water Raman checkbox sets waterRaman {level: 0.1}, shows 488 → ≈ 585 nm, and takes a typed 0.3', async () => {
    // 1e7/488 − 3400 = 17091.8 cm⁻¹ → 585.1 nm by hand (docs/science.md, section 12).
    const panel = { ...demoPanel(), excitation: [{ wavelengthNm: 488 }] };
    const { el, edits } = await mountEditor(panel);
    const box = [...el.shadowRoot!.querySelectorAll('label')]
      .find((l) => l.textContent!.trim() === 'Water Raman')!
      .querySelector('input')!;
    box.click();
    expect(edits.at(-1)!.waterRaman).toEqual({ level: 0.1 });
    el.panel = edits.at(-1)!;
    await el.updateComplete;
    expect(el.shadowRoot!.textContent).toMatch(/Approximate: .*3400 cm⁻¹.*488\s→\s≈\s585\snm.*Lakowicz/s);
    const level = fieldByLabel(el.shadowRoot!, 'Water Raman level')!;
    await level.updateComplete;
    typeInto(level, '0.3');
    expect(edits.at(-1)!.waterRaman).toEqual({ level: 0.3 });
  });

  it('shows a waterRaman.level message under the level field and keeps the typed text', async () => {
    const el = document.createElement('qdp-light-editor');
    el.panel = { ...demoPanel(), waterRaman: { level: -1 } };
    el.errors = { 'waterRaman.level': 'waterRaman.level must be between 0 and 1000000' };
    document.body.appendChild(el);
    await el.updateComplete;
    const level = fieldByLabel(el.shadowRoot!, 'Water Raman level')!;
    await level.updateComplete;
    expect(level.shadowRoot!.querySelector('[role="alert"]')!.textContent).toBe(
      'waterRaman.level must be between 0 and 1000000',
    );
    expect(level.shadowRoot!.querySelector('input')!.value).toBe('-1');
    expect(el.shadowRoot!.querySelectorAll('p[role="alert"]')).toHaveLength(0);
  });

  it('adds a shared dichroic above the reddest line, edits its edge, and removing it drops lightPath', async () => {
    const { lightPath: _lp, ...start } = { ...demoPanel(), excitation: [{ wavelengthNm: 405 }, { wavelengthNm: 488 }] };
    const { el, edits } = await mountEditor(start);
    const pathEditor = el.shadowRoot!.querySelector('qdp-light-path-editor') as Updating;
    await pathEditor.updateComplete;
    const button = (text: string) =>
      [...pathEditor.shadowRoot!.querySelectorAll('button')].find((b) => b.textContent!.trim() === text)!;
    button('Add a shared emission filter').click();
    expect(edits.at(-1)!.lightPath).toEqual({
      emissionFilters: [{ type: 'dichroic', edgeNm: 498, passes: 'above' }],
    });
    el.panel = edits.at(-1)!;
    await el.updateComplete;
    await pathEditor.updateComplete;
    const edge = pathEditor.shadowRoot!.querySelector(
      'qdp-number-field[data-field="lightPath.emissionFilters.0.edgeNm"]',
    ) as Updating;
    await edge.updateComplete;
    typeInto(edge, '505');
    expect(edits.at(-1)!.lightPath!.emissionFilters).toEqual([{ type: 'dichroic', edgeNm: 505, passes: 'above' }]);
    button('Remove filter').click();
    expect(edits.at(-1)).not.toHaveProperty('lightPath');
  });

  it("shows a shared filter's error under its edge field and a message about the whole path below it", async () => {
    const el = document.createElement('qdp-light-editor');
    el.panel = { ...demoPanel(), lightPath: { excitationFilters: [{ type: 'longpass', edgeNm: 150 }] } };
    el.errors = {
      'lightPath.excitationFilters.0.edgeNm': 'lightPath.excitationFilters[0].edgeNm must be at least 200 nm',
      'lightPath.emissionFilters': 'lightPath.emissionFilters has more than 8 filters',
    };
    document.body.appendChild(el);
    await el.updateComplete;
    const pathEditor = el.shadowRoot!.querySelector('qdp-light-path-editor') as Updating;
    await pathEditor.updateComplete;
    const edge = pathEditor.shadowRoot!.querySelector(
      'qdp-number-field[data-field="lightPath.excitationFilters.0.edgeNm"]',
    ) as Updating;
    await edge.updateComplete;
    expect(edge.shadowRoot!.querySelector('[role="alert"]')!.textContent).toContain('must be at least 200 nm');
    const listed = [...pathEditor.shadowRoot!.querySelectorAll('p[role="alert"]')].map((p) => p.textContent);
    expect(listed).toEqual(['lightPath.emissionFilters has more than 8 filters']);
    expect(el.shadowRoot!.querySelectorAll('p[role="alert"]')).toHaveLength(0);
  });
});

describe('<qdp-spectrum-input>', () => {
  async function mountInput() {
    const el = document.createElement('qdp-spectrum-input');
    el.kind = 'transmission';
    document.body.appendChild(el);
    await el.updateComplete;
    const loaded: SpectrumPoints[] = [];
    el.addEventListener('spectrum-loaded', (e) =>
      loaded.push((e as CustomEvent<{ points: SpectrumPoints }>).detail.points),
    );
    return { el, loaded };
  }

  it('<qdp-spectrum-input> reads a pasted transmission table in percent as 0–1 and fires spectrum-loaded', async () => {
    const { el, loaded } = await mountInput();
    paste(el, 'nm,T %\n500,0\n600,90\n700,0');
    await el.updateComplete;
    expect(loaded).toEqual([
      [
        [500, 0],
        [600, 0.9],
        [700, 0],
      ],
    ]);
    expect(el.shadowRoot!.querySelector('[role="status"]')!.textContent).toContain('Loaded 3 points');
  });

  it('shows the parser message naming the line of a bad row, keeps the text and fires nothing', async () => {
    const { el, loaded } = await mountInput();
    paste(el, '500,0.1\n490,0.5');
    await el.updateComplete;
    expect(loaded).toEqual([]);
    expect(el.shadowRoot!.querySelector('[role="status"]')!.textContent).toMatch(/line 2/);
    const area = el.shadowRoot!.querySelector('textarea')!;
    expect(area.value).toBe('500,0.1\n490,0.5');
    expect(area.getAttribute('aria-invalid')).toBe('true');
  });
});
