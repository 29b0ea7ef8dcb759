// <qdp-design-form> in real Chromium with its real Web Worker running the design search.
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { page, userEvent } from 'vitest/browser';
import { EXAMPLE_INSTRUMENTS, type DesignRequest } from '../../spectra/index';
import '../../web/elements/design-form';
import type { DesignForm } from '../../web/elements/design-form';
import { demoPanel } from '../../web/state/demo-panel';
import { DRAFT_KEY, readDraft } from '../../web/state/design-draft';
import { designParts } from '../../web/state/design-request';

// Each test starts with the form's defaults: nothing kept in this browser from the one before.
beforeEach(() => localStorage.removeItem(DRAFT_KEY));
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

const summary = (el: DesignForm) => el.shadowRoot!.querySelector('qdp-proposal-summary');

const summaryButton = (el: DesignForm, label: string) =>
  [...summary(el)!.shadowRoot!.querySelectorAll('button')].find((b) => b.textContent!.trim() === label)!;

/** Waits until `check` holds, polling (the worker answers asynchronously). */
async function until(check: () => boolean, timeoutMs = 30_000): Promise<void> {
  const start = performance.now();
  while (!check()) {
    if (performance.now() - start > timeoutMs) throw new Error('timed out');
    await new Promise((r) => setTimeout(r, 20));
  }
}

describe('<qdp-design-form>', () => {
  it('offers the five checks with their defaults as placeholders and leaves CsPbBr3 and carbon unticked', async () => {
    const el = await mount();
    const fields = [...el.shadowRoot!.querySelectorAll('fieldset qdp-number-field')];
    // Defaults of the design options (docs/api.md): OD 6 (common practice), 0.3, 15 nm, S/N 5, interference 1.
    expect(fields.map((f) => f.getAttribute('placeholder'))).toEqual(['6', '0.3', '15', '5', '1']);
    const ticked = (name: string) =>
      [...el.shadowRoot!.querySelectorAll('label')]
        .find((l) => l.textContent!.trim().startsWith(name))!
        .querySelector('input')!.checked;
    expect(ticked('CsPbBr3')).toBe(false);
    expect(ticked('Carbon')).toBe(false);
    expect(ticked('CdSe')).toBe(true);
  });

  it('renders targets, excitation, exclusions, materials and the window', async () => {
    const el = await mount();
    const text = el.shadowRoot!.textContent!.replace(/\s+/g, ' ');
    expect(el.shadowRoot!.querySelectorAll('input[aria-label="target name"]')).toHaveLength(2);
    for (const label of ['cadmium-free', 'lead-free', 'arsenic-free', 'Window, nm', 'Excitation lines'])
      expect(text).toContain(label);
    expect(text).toContain('local regulations, institutional safety rules and licensed practice');
    expect(text).not.toMatch(/\bsafe\b/i);
  });

  it('Propose runs the search in a worker, shows progress, then the proposal; Load fires panel-proposed', async () => {
    const el = await mount({ nodeBudget: 3000 });
    const stages: string[] = [];
    const events: CustomEvent[] = [];
    document.body.addEventListener('panel-proposed', (e) => events.push(e as CustomEvent));
    const output = el.shadowRoot!.querySelector('output')!;
    const watch = setInterval(() => stages.push(output.textContent!), 5);
    button(el, 'Propose').click();
    await until(() => summary(el) !== null);
    clearInterval(watch);
    expect(stages.some((s) => /candidates|search|refine/.test(s))).toBe(true);
    await summary(el)!.updateComplete;
    expect(summary(el)!.shadowRoot!.querySelector('.objective')!.textContent).toContain('Worst interference');
    expect(summary(el)!.shadowRoot!.querySelectorAll('table.noise tr')).toHaveLength(3);
    expect(events).toHaveLength(0);
    summaryButton(el, 'Load this proposal').click();
    await until(() => events.length === 1);
    const { panel, evaluation, objective, exact, stats } = events[0].detail;
    expect(events[0].bubbles && events[0].composed).toBe(true);
    expect(panel.probes).toHaveLength(2);
    expect(evaluation.worst.interference).toBeCloseTo(objective.worstInterference, 12);
    expect(typeof exact).toBe('boolean');
    expect(stats.nodesVisited).toBeGreaterThan(0);
    await el.updateComplete;
    expect(summary(el)).toBeNull();
  });

  it('a finished search shows its summary and fires no panel-proposed until Load; Discard removes it', async () => {
    const el = await mount({ nodeBudget: 3000 });
    let proposed = 0;
    document.body.addEventListener('panel-proposed', () => proposed++);
    button(el, 'Propose').click();
    await until(() => summary(el) !== null && !button(el, 'Propose').disabled);
    await new Promise((r) => setTimeout(r, 300));
    expect(proposed).toBe(0);
    await summary(el)!.updateComplete;
    expect(summaryButton(el, 'Load this proposal')).toBeDefined();
    expect(summary(el)!.shadowRoot!.textContent).toContain("your browser's Back button brings it back");
    summaryButton(el, 'Discard').click();
    await el.updateComplete;
    expect(summary(el)).toBeNull();
    await new Promise((r) => setTimeout(r, 100));
    expect(proposed).toBe(0);
  });

  it("after a search the focus is on the proposal's heading, and after Discard on Propose", async () => {
    const el = await mount({ nodeBudget: 3000 });
    await userEvent.click(button(el, 'Propose'));
    await until(() => summary(el) !== null && summary(el)!.shadowRoot!.activeElement !== null);
    expect(summary(el)!.shadowRoot!.activeElement!.textContent).toBe('Proposal, not loaded: your panel is unchanged');
    await userEvent.click(summaryButton(el, 'Discard'));
    await until(() => el.shadowRoot!.activeElement !== null);
    expect(el.shadowRoot!.activeElement).toBe(button(el, 'Propose'));
  });

  it("Propose with 'plenty' as target 2's abundance moves the focus to that abundance field", async () => {
    const el = await mount();
    const abundance = el.shadowRoot!.querySelectorAll<HTMLInputElement>('input[aria-label="abundance"]')[1];
    await userEvent.fill(page.elementLocator(abundance), 'plenty');
    await userEvent.click(button(el, 'Propose'));
    await until(() => el.shadowRoot!.activeElement === abundance);
    expect(abundance.getAttribute('aria-invalid')).toBe('true');
  });

  it(
    'a catalog search over probes at 525 and 605 nm shows each target with its probe, shell and matching ' +
      'bandpass, the proof and the hazard warning',
    async () => {
      const el = await mount();
      el.candidates = {
        probes: [
          { id: 'a', material: 'cdse', emissionPeakNm: 605, shell: [{ material: 'zns', thicknessNm: 1 }] },
          { id: 'b', material: 'cdse', emissionPeakNm: 525 },
        ],
        channels: [
          { id: 'orange', filters: [{ type: 'bandpass', centerNm: 605, widthNm: 20 }] },
          { id: 'green', filters: [{ type: 'bandpass', centerNm: 525, widthNm: 30 }] },
        ],
      };
      await el.updateComplete;
      button(el, 'Propose').click();
      await until(() => summary(el) !== null);
      await summary(el)!.updateComplete;
      const root = summary(el)!.shadowRoot!;
      const rows = [...root.querySelectorAll('table.assignment tr')].slice(1).map((tr) => tr.textContent!);
      expect(rows).toHaveLength(2);
      const orange = rows.find((r) => r.includes('emission peak 605 nm'))!;
      const green = rows.find((r) => r.includes('emission peak 525 nm'))!;
      expect(orange).toMatch(/target [12]/);
      expect(orange).toContain('CdSe');
      expect(orange).toContain('shell ZnS 1 nm');
      expect(orange).toContain('bandpass 605/20');
      expect(green).toContain('bandpass 525/30');
      expect(green).not.toContain('shell');
      expect(root.querySelector('.objective')!.textContent).toContain(
        "proven best among the current panel's probes and channels",
      );
      const warnings = root.querySelector('ul.warnings')!.textContent!;
      expect(warnings).toContain('cadmium');
      expect(warnings).toContain('local regulations, institutional safety rules and licensed practice');
      expect(root.textContent).not.toMatch(/\bsafe\b/i);
    },
  );

  it('a second Propose while a proposal is shown removes it and shows the new search in its place', async () => {
    const el = await mount({ nodeBudget: 3000 });
    let proposed = 0;
    document.body.addEventListener('panel-proposed', () => proposed++);
    button(el, 'Propose').click();
    await until(() => summary(el) !== null && !button(el, 'Propose').disabled);
    button(el, 'Add target').click();
    await el.updateComplete;
    button(el, 'Propose').click();
    await el.updateComplete;
    expect(summary(el)).toBeNull();
    await until(() => summary(el) !== null);
    await summary(el)!.updateComplete;
    expect(summary(el)!.shadowRoot!.querySelectorAll('table.assignment tr')).toHaveLength(4);
    expect(proposed).toBe(0);
  });

  it('a sample (scatterLevel 1e8, waterRaman 0.2) goes with the request and stays in the loaded panel', async () => {
    const el = await mount({ nodeBudget: 3000 });
    el.sample = { scatterLevel: 1e8, waterRaman: { level: 0.2 } };
    const events: CustomEvent[] = [];
    document.body.addEventListener('panel-proposed', (e) => events.push(e as CustomEvent));
    button(el, 'Propose').click();
    await until(() => summary(el) !== null);
    await summary(el)!.updateComplete;
    summaryButton(el, 'Load this proposal').click();
    await until(() => events.length === 1);
    expect(events[0].detail.panel.scatterLevel).toBe(1e8);
    expect(events[0].detail.panel.waterRaman).toEqual({ level: 0.2 });
    expect(events[0].detail.evaluation.waterRamanCollected).toHaveLength(2);
  });

  it(
    'a window of 600–615 nm, too narrow for two passbands, shows the refusal beside "Window, nm" ' +
      'and proposes nothing',
    async () => {
      const el = await mount({ nodeBudget: 3000 });
      let proposed = 0;
      document.body.addEventListener('panel-proposed', () => proposed++);
      for (const [label, value] of [
        ['window start', '600'],
        ['window end', '615'],
      ]) {
        const field = el.shadowRoot!.querySelector<HTMLInputElement>(`input[aria-label="${label}"]`)!;
        field.value = value;
        field.dispatchEvent(new Event('change'));
      }
      button(el, 'Propose').click();
      await until(() => el.shadowRoot!.querySelector('.error') !== null);
      const error = el.shadowRoot!.querySelector('.error')!;
      expect(error.textContent).toBe('Window, nm: 2 passbands of at least 20 nm do not fit in 600–615 nm');
      expect(error.previousElementSibling?.textContent).toContain('Window, nm');
      expect(summary(el)).toBeNull();
      expect(el.shadowRoot!.querySelector('output')!.textContent).toContain('failed');
      expect(proposed).toBe(0);
    },
  );

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
      "shows the API's message for that field beside its row and starts nothing",
    async () => {
      const el = await mount();
      let proposed = 0;
      document.body.addEventListener('panel-proposed', () => proposed++);
      const abundance = page.elementLocator(el).getByLabelText('abundance').first();
      await userEvent.clear(abundance);
      await userEvent.type(abundance, 'plenty');
      await userEvent.click(button(el, 'Propose'));
      await until(() => el.shadowRoot!.querySelector('.error') !== null);
      const error = el.shadowRoot!.querySelector('.error')!;
      expect(error.textContent).toBe('Abundance: must be a number greater than 0 or one of high, medium, low');
      // Beside the first target's row.
      expect(error.previousElementSibling).toBe(el.shadowRoot!.querySelector('fieldset .row'));
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
    await until(() => el.shadowRoot!.querySelector('.error') !== null);
    expect(el.shadowRoot!.querySelector('.error')!.textContent).toBe(
      'Excitation lines, nm: must be numbers in nm, e.g. 405, 488',
    );
    expect(button(el, 'Cancel').disabled).toBe(true);
  });
});

/** Stands in for the search's Web Worker: records what the form posts to it and answers nothing. */
class RecordingWorker {
  static posted: { type: string; request?: DesignRequest }[] = [];
  onmessage: unknown = null;
  onerror: unknown = null;
  postMessage(message: { type: string; request?: DesignRequest }): void {
    RecordingWorker.posted.push(message);
  }
  terminate(): void {}
}

describe('<qdp-design-form> locks and the microscope', () => {
  const RealWorker = globalThis.Worker;
  beforeEach(() => {
    RecordingWorker.posted = [];
    globalThis.Worker = RecordingWorker as unknown as typeof Worker;
  });
  afterEach(() => {
    globalThis.Worker = RealWorker;
  });

  /** The form in free mode with the demo panel's probes and channels as the user's own. */
  async function mountOwning(): Promise<DesignForm> {
    const el = await mount({ nodeBudget: 500 });
    el.owned = designParts(demoPanel());
    await el.updateComplete;
    return el;
  }

  const posted = () => RecordingWorker.posted.find((m) => m.type === 'run')?.request;

  it(
    "choosing Use my probe 'Orange dot' for target 1 and Use my channel 'Green' for target 2 posts p4 and c2 " +
      'as owned and their ids as the locks',
    async () => {
      const el = await mountOwning();
      const form = page.elementLocator(el);
      await userEvent.selectOptions(form.getByLabelText('Use my probe for target 1'), 'p4');
      await userEvent.selectOptions(form.getByLabelText('Use my channel for target 2'), 'c2');
      await userEvent.click(button(el, 'Propose'));
      await until(() => posted() !== undefined);
      const request = posted()!;
      expect(request.targets.map((t) => t.lock)).toEqual([{ probe: 'p4' }, { channel: 'c2' }]);
      expect(request.owned?.probes?.map((p) => p.id)).toEqual(['p4']);
      expect(request.owned?.channels).toEqual([demoPanel().channels[1]]);
      expect(el.shadowRoot!.querySelector('.error')).toBeNull();
    },
  );

  it(
    'a probe lock whose probe left the panel is marked in its choice, and Propose shows the refusal beside ' +
      'that target and starts no search',
    async () => {
      const el = await mountOwning();
      const form = page.elementLocator(el);
      await userEvent.selectOptions(form.getByLabelText('Use my probe for target 2'), 'p4');
      const panel = demoPanel();
      el.owned = designParts({ ...panel, probes: panel.probes.filter((p) => p.id !== 'p4') });
      await el.updateComplete;
      expect(form.getByLabelText('Use my probe for target 2').element().textContent).toContain(
        'p4 (no longer in this panel)',
      );
      await userEvent.click(button(el, 'Propose'));
      await until(() => el.shadowRoot!.querySelector('.error') !== null);
      const error = el.shadowRoot!.querySelector('.error')!;
      expect(error.textContent).toBe(
        "Use my probe: names probe 'p4', which is not among the owned probes " +
          '(in free mode a lock names an owned probe)',
      );
      const rows = el.shadowRoot!.querySelectorAll('fieldset .row');
      expect(error.previousElementSibling).toBe(rows[1]);
      expect(posted()).toBeUndefined();
    },
  );

  it(
    'locking a probe whose peak the panel holds at 5000 nm shows "Use my probe \'p4\': emissionPeakNm must be …" ' +
      'beside that target',
    async () => {
      const el = await mountOwning();
      const panel = demoPanel();
      el.owned = designParts({
        ...panel,
        probes: panel.probes.map((p) => (p.id === 'p4' ? { ...p, emissionPeakNm: 5000 } : p)),
      });
      await el.updateComplete;
      await userEvent.selectOptions(page.elementLocator(el).getByLabelText('Use my probe for target 1'), 'p4');
      await userEvent.click(button(el, 'Propose'));
      await until(() => el.shadowRoot!.querySelector('.error') !== null);
      const error = el.shadowRoot!.querySelector('.error')!;
      expect(error.textContent).toBe("Use my probe 'p4': emissionPeakNm must be between 200 and 2000 nm");
      expect(error.previousElementSibling).toBe(el.shadowRoot!.querySelector('fieldset .row'));
      expect(posted()).toBeUndefined();
    },
  );

  it('offers the microscope choice only for a panel on a profile', async () => {
    const el = await mountOwning();
    const text = () => el.shadowRoot!.textContent!;
    expect(text()).not.toContain("microscope's filters");
    el.microscope = { id: 'A'.repeat(24), spec: EXAMPLE_INSTRUMENTS[0] };
    await el.updateComplete;
    expect(text()).toContain(
      "Choose among my microscope's filters (Histology widefield, violet LED) instead of stock bandpass sizes",
    );
  });

  it(
    "ticking the microscope's filters with the lines field emptied posts its six channels behind its dichroic " +
      'and its 405 nm line to the search',
    async () => {
      const el = await mountOwning();
      el.microscope = { id: 'A'.repeat(24), spec: EXAMPLE_INSTRUMENTS[0] };
      await el.updateComplete;
      const form = page.elementLocator(el);
      await userEvent.click(form.getByText("Choose among my microscope's filters"));
      await userEvent.clear(form.getByLabelText('excitation lines'));
      await userEvent.click(button(el, 'Propose'));
      await until(() => posted() !== undefined);
      const request = posted()!;
      expect(request.excitation.map((l) => l.wavelengthNm)).toEqual([405]);
      expect(request.channelChoices?.map((c) => c.id)).toEqual(['blue', 'green', 'yellow', 'orange', 'red', 'far-red']);
      for (const c of request.channelChoices!)
        expect(c.filters[0]).toEqual({ type: 'dichroic', edgeNm: 425, passes: 'above' });
    },
  );

  it("on the microscope a typed 488 nm line is refused beside the lines, naming the microscope's 405 nm", async () => {
    const el = await mountOwning();
    el.microscope = { id: 'A'.repeat(24), spec: EXAMPLE_INSTRUMENTS[0] };
    await el.updateComplete;
    const form = page.elementLocator(el);
    await userEvent.click(form.getByText("Choose among my microscope's filters"));
    await userEvent.fill(form.getByLabelText('excitation lines'), '488');
    await userEvent.click(button(el, 'Propose'));
    await until(() => el.shadowRoot!.querySelector('.error') !== null);
    const error = el.shadowRoot!.querySelector('.error')!;
    expect(error.textContent).toBe(
      "Excitation lines, nm: 488 nm is not a line of the instrument 'Histology widefield, violet LED' (it has 405 nm)",
    );
    expect(error.previousElementSibling?.textContent).toContain('Excitation lines, nm');
    expect(posted()).toBeUndefined();
  });
});

describe('<qdp-design-form> kept in this browser', () => {
  it(
    "a kept Share-of-light check of 5 comes back in its field with the schema's 0–1 range under it " +
      'and the abundance "plenty" marked beside its row',
    async () => {
      localStorage.setItem(
        DRAFT_KEY,
        JSON.stringify({
          targets: [
            { name: 'CD3', abundance: 'plenty' },
            { name: 'CD8', abundance: 'low' },
          ],
          checks: { minChannelShare: 5 },
        }),
      );
      const el = await mount();
      const share = el.shadowRoot!.querySelector('qdp-number-field[data-check="minChannelShare"]')!;
      const abundance = el.shadowRoot!.querySelector<HTMLInputElement>('input[aria-label="abundance"]')!;
      expect(share.shadowRoot!.querySelector('input')!.value).toBe('5');
      expect(abundance.value).toBe('plenty');
      // The schema answers with the first refused field: the target's abundance, beside its row.
      await until(() => el.shadowRoot!.querySelector('.error') !== null);
      expect(el.shadowRoot!.querySelector('.error')!.textContent).toBe(
        'Abundance: must be a number greater than 0 or one of high, medium, low',
      );
      expect(abundance.getAttribute('aria-invalid')).toBe('true');
      // Once the abundance is fixed, the check's own refusal shows under it.
      await userEvent.fill(page.elementLocator(abundance), 'high');
      await until(() => share.shadowRoot!.querySelector('.msg') !== null);
      expect(share.shadowRoot!.querySelector('.msg')!.textContent).toBe(
        "Share of a probe's light its channel passes, at least (0–1): must be between 0 and 1",
      );
      expect(el.shadowRoot!.querySelector('.error')).toBeNull();
    },
  );

  it('reading kept inputs drops a non-list of targets, a window of text, unknown materials and unknown words', () => {
    const kept = readDraft({
      targets: 'CD3',
      windowNm: ['blue', 800],
      allowed: ['cdse', 'unobtainium'],
      exclude: ['cadmium', 'mercury'],
      excitationText: 405,
      useCandidates: false,
    });
    expect(kept).toEqual({ allowed: ['cdse'], exclude: ['cadmium'], useCandidates: false });
  });
});
