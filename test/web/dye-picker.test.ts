import { afterEach, describe, expect, it } from 'vitest';
import { listDyes, listMaterials, type ProbeSpec } from '../../spectra/index';
import { matchDyes } from '../../web/elements/dye-picker';
import '../../web/elements/probe-card';

afterEach(() => document.body.replaceChildren());

describe('<qdp-dye-picker> search', () => {
  it('matchDyes("nuclear") finds exactly the nuclear counterstains of the library', () => {
    const expected = listDyes()
      .filter((d) => d.kind === 'nuclear-counterstain')
      .map((d) => d.id);
    expect(matchDyes('nuclear').map((d) => d.id)).toEqual(expected);
    expect(expected.length).toBeGreaterThanOrEqual(3);
  });

  it(
    'matchDyes("488") finds the dyes absorbing or emitting within 20 ' +
      'nm of 488 nm, fluorescein and EGFP among them',
    () => {
      const found = matchDyes('488');
      expect(found.map((d) => d.id)).toEqual(expect.arrayContaining(['fluorescein', 'egfp']));
      for (const d of found)
        expect(
          Math.min(Math.abs(d.absorptionPeakNm.value - 488), Math.abs(d.emissionPeakNm.value - 488)),
        ).toBeLessThanOrEqual(20);
      expect(found.map((d) => d.id)).not.toContain('dapi');
    },
  );

  it('an empty query lists every dye; a query nothing matches lists none', () => {
    expect(matchDyes('  ')).toHaveLength(listDyes().length);
    expect(matchDyes('xyzzy')).toEqual([]);
  });
});

describe('a dye probe in its card', () => {
  async function card(probe: ProbeSpec) {
    const el = document.createElement('qdp-probe-card');
    el.probe = probe;
    el.materials = listMaterials();
    document.body.appendChild(el);
    await el.updateComplete;
    const changes: ProbeSpec[] = [];
    el.addEventListener('probe-change', (e) => changes.push((e as CustomEvent<{ probe: ProbeSpec }>).detail.probe));
    return { el, changes };
  }

  it(
    'choosing the dye material gives the probe a dye and drops ' + 'the size fields and shell a dye does not take',
    async () => {
      const { el, changes } = await card({
        id: 'p1',
        material: 'cdse',
        emissionPeakNm: 605,
        sizeDispersionPct: 5,
        shell: [{ material: 'zns', thicknessNm: 0.9 }],
      });
      const select = el.shadowRoot!.querySelector('select')!;
      select.value = 'dye';
      select.dispatchEvent(new Event('change'));
      expect(changes[0]).toEqual({ id: 'p1', material: 'dye', dye: listDyes()[0].id });
    },
  );

  it('picking fluorescein from the searched list fires probe-change with dye "fluorescein"', async () => {
    const { el, changes } = await card({ id: 'p1', material: 'dye', dye: 'dapi' });
    const picker = el.shadowRoot!.querySelector('qdp-dye-picker')!;
    await picker.updateComplete;
    const search = picker.shadowRoot!.querySelector('input[type="search"]') as HTMLInputElement;
    search.value = 'fluor';
    search.dispatchEvent(new Event('input'));
    await picker.updateComplete;
    const name = listDyes().find((d) => d.id === 'fluorescein')!.name;
    const buttons = [...picker.shadowRoot!.querySelectorAll('li button')] as HTMLButtonElement[];
    expect(buttons.map((b) => b.textContent!.trim().split(' · ')[0])).toContain(name);
    buttons.find((b) => b.textContent!.trim().startsWith(`${name} ·`))!.click();
    expect(changes.at(-1)!.dye).toBe('fluorescein');
  });

  it(
    'a DAPI probe shows DAPI’s own hazard (a DNA-binding ' + 'mutagen), deferring to local rules, never "safe"',
    async () => {
      const { el } = await card({ id: 'p1', material: 'dye', dye: 'dapi' });
      const box = el.shadowRoot!.querySelector('details.hazard')!;
      expect(box.querySelector('summary')!.textContent).toMatch(/^DAPI.*: hazard high/);
      expect(box.textContent).toMatch(/mutagen/);
      expect(box.textContent).toMatch(/local regulations/);
      expect(box.textContent).not.toMatch(/\bsafe\b/i);
    },
  );
});

describe('<qdp-dye-picker> other names, colours and units', () => {
  it('"FITC" finds fluorescein, "GFP" finds EGFP, "488 nm" is read as 488', () => {
    expect(matchDyes('FITC').map((d) => d.id)).toContain('fluorescein');
    expect(matchDyes('GFP').map((d) => d.id)).toContain('egfp');
    expect(matchDyes('488 nm').map((d) => d.id)).toEqual(matchDyes('488').map((d) => d.id));
  });

  it('"488" no longer lists a dye that only emits 14 nm away (mTurquoise2 absorbs at 434 nm)', () => {
    expect(matchDyes('488').map((d) => d.id)).not.toContain('mturquoise2');
  });

  it('"red" finds the dyes emitting at 600–650 nm, mCherry among them, and no green emitter', () => {
    const found = matchDyes('red');
    expect(found.map((d) => d.id)).toContain('mcherry');
    expect(found.map((d) => d.id)).not.toContain('fluorescein');
  });
});
