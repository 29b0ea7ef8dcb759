import { afterEach, describe, expect, it } from 'vitest';
import { listMaterials, TYPICAL_SHELLS, type ProbeSpec, type ShellLayer } from '../../spectra/index';
import '../../web/elements/shell-editor';
import '../../web/elements/probe-card';
import { addProbe, newPanel } from '../../web/state/panel-edit';

afterEach(() => document.body.replaceChildren());

type Updating = HTMLElement & { updateComplete: Promise<unknown> };

async function mountEditor(shell: ShellLayer[], errors: Record<string, string> = {}) {
  const el = document.createElement('qdp-shell-editor');
  el.shell = shell;
  el.typical = TYPICAL_SHELLS.inp.map((l) => ({ ...l }));
  el.errors = errors;
  document.body.appendChild(el);
  await el.updateComplete;
  const seen: ShellLayer[][] = [];
  el.addEventListener('shell-change', (e) => seen.push((e as CustomEvent<{ shell: ShellLayer[] }>).detail.shell));
  const button = (text: string) =>
    [...el.shadowRoot!.querySelectorAll('button')].find((b) => b.textContent!.trim() === text)!;
  return { el, seen, button };
}

describe('<qdp-shell-editor>', () => {
  it('shows one row per layer with its monolayer count (0.9 nm ZnS ≈ 2.9 monolayers of 0.31 nm)', async () => {
    const { el } = await mountEditor([{ material: 'zns', thicknessNm: 0.9 }]);
    expect(el.shadowRoot!.querySelectorAll('[role="group"]').length).toBe(1);
    expect(el.shadowRoot!.textContent).toContain('≈ 2.9 monolayers');
  });

  it('typing a thickness fires shell-change with that layer changed and the others kept', async () => {
    const { el, seen } = await mountEditor([
      { material: 'znse', thicknessNm: 1.5 },
      { material: 'zns', thicknessNm: 0.6 },
    ]);
    const field = el.shadowRoot!.querySelectorAll('qdp-number-field')[1] as Updating;
    await field.updateComplete;
    const input = field.shadowRoot!.querySelector('input')!;
    input.value = '1.2';
    input.dispatchEvent(new Event('input', { bubbles: true, composed: true }));
    expect(seen).toEqual([
      [
        { material: 'znse', thicknessNm: 1.5 },
        { material: 'zns', thicknessNm: 1.2 },
      ],
    ]);
  });

  it(
    '"Bare core" clears the shell, "Typical shell" restores the material’s usual one, "Add a layer" appends ' +
      'silica over ZnS',
    async () => {
      const { seen, button } = await mountEditor([{ material: 'zns', thicknessNm: 0.9 }]);
      button('Bare core').click();
      button('Typical shell').click();
      button('Add a layer').click();
      expect(seen[0]).toEqual([]);
      expect(seen[1]).toEqual(TYPICAL_SHELLS.inp);
      expect(seen[2]).toEqual([
        { material: 'zns', thicknessNm: 0.9 },
        { material: 'silica', thicknessNm: 5 },
      ]);
    },
  );

  it('shows no monolayer count for a thickness the material refuses (−1 nm ZnS)', async () => {
    const { el } = await mountEditor([{ material: 'zns', thicknessNm: -1 }]);
    expect(el.shadowRoot!.textContent).not.toContain('monolayers');
  });

  it('shows an error that names a layer’s thickness under that layer’s field', async () => {
    const { el } = await mountEditor([{ material: 'zns', thicknessNm: 0.9 }], {
      '0.thicknessNm': 'must be greater than 0 and at most 20 nm',
    });
    const field = el.shadowRoot!.querySelector('qdp-number-field') as Updating & { error: string };
    expect(field.error).toContain('at most 20 nm');
  });
});

describe('probes get their material’s typical shell', () => {
  it('a probe added to a panel is CdSe with CdSe’s typical ZnS shell', () => {
    const panel = addProbe(newPanel());
    expect(panel.probes[0].shell).toEqual(TYPICAL_SHELLS.cdse);
  });

  it(
    'choosing InP in a probe card gives the probe InP’s typical ' + 'ZnSe/ZnS shell; carbon dots get no shell',
    async () => {
      const el = document.createElement('qdp-probe-card');
      el.probe = { id: 'p1', material: 'cdse', emissionPeakNm: 620, shell: [{ material: 'zns', thicknessNm: 0.9 }] };
      el.materials = listMaterials();
      document.body.appendChild(el);
      await el.updateComplete;
      const changes: ProbeSpec[] = [];
      el.addEventListener('probe-change', (e) => changes.push((e as CustomEvent<{ probe: ProbeSpec }>).detail.probe));
      const select = el.shadowRoot!.querySelector('select')!;
      select.value = 'inp';
      select.dispatchEvent(new Event('change'));
      select.value = 'carbon';
      select.dispatchEvent(new Event('change'));
      expect(changes[0].shell).toEqual(TYPICAL_SHELLS.inp);
      expect(changes[1].shell).toBeUndefined();
    },
  );

  it('a probe card with a CdS shell shows the shell’s own hazard block, deferring to local rules', async () => {
    const el = document.createElement('qdp-probe-card');
    el.probe = { id: 'p1', material: 'inp', emissionPeakNm: 640, shell: [{ material: 'cds', thicknessNm: 1 }] };
    el.materials = listMaterials();
    document.body.appendChild(el);
    await el.updateComplete;
    const blocks = [...el.shadowRoot!.querySelectorAll('details.hazard summary')].map((s) => s.textContent);
    expect(blocks.some((t) => /Shell CdS: hazard high/.test(t!))).toBe(true);
    expect(el.shadowRoot!.textContent).toMatch(/local regulations/);
  });
});

describe('the sizing curve of a CdSe probe', () => {
  it(
    'a CdSe card offers the two published curves; choosing ' + 'Jasieniak sets sizingModel, the default removes it',
    async () => {
      const el = document.createElement('qdp-probe-card');
      el.probe = { id: 'p1', material: 'cdse', emissionPeakNm: 600 };
      el.materials = listMaterials();
      document.body.appendChild(el);
      await el.updateComplete;
      const changes: ProbeSpec[] = [];
      el.addEventListener('probe-change', (e) => changes.push((e as CustomEvent<{ probe: ProbeSpec }>).detail.probe));
      const label = [...el.shadowRoot!.querySelectorAll('label')].find((l) => l.textContent!.includes('Sizing curve'))!;
      const select = label.querySelector('select')!;
      expect([...select.options].map((o) => o.textContent)).toEqual([
        'Yu et al. 2003 (default)',
        'Jasieniak et al. 2009',
      ]);
      select.value = 'jasieniak2009';
      select.dispatchEvent(new Event('change'));
      select.value = 'yu2003';
      select.dispatchEvent(new Event('change'));
      expect(changes[0].sizingModel).toBe('jasieniak2009');
      expect('sizingModel' in changes[1]).toBe(false);
    },
  );

  it('an InP card has no sizing-curve choice (one published curve)', async () => {
    const el = document.createElement('qdp-probe-card');
    el.probe = { id: 'p1', material: 'inp', emissionPeakNm: 620 };
    el.materials = listMaterials();
    document.body.appendChild(el);
    await el.updateComplete;
    expect(el.shadowRoot!.textContent).not.toContain('Sizing curve');
  });
});
