import { afterEach, describe, expect, it } from 'vitest';
import '../../web/elements/panel-app';
import { decodeFragment } from '../../web/state/fragment';

type Host = HTMLElement & { updateComplete: Promise<unknown> };

afterEach(() => {
  document.body.replaceChildren();
  history.replaceState(null, '', location.pathname + location.search);
});

async function settle(el: Host): Promise<void> {
  for (let i = 0; i < 5; i++) {
    await el.updateComplete;
    await new Promise((r) => setTimeout(r, 20));
  }
}

const inner = (root: Element, selector: string) => (root.shadowRoot ?? root).querySelector(selector) as Host;

describe('<qdp-panel-app>', () => {
  it('renders the demo panel: six curves, the crosstalk tables and the material summary', async () => {
    const app = document.createElement('qdp-panel-app') as Host;
    document.body.appendChild(app);
    await settle(app);
    const chart = inner(app, 'qdp-spectrum-chart');
    expect(chart.shadowRoot!.querySelectorAll('path.curve').length).toBe(6);
    expect(inner(app, 'qdp-crosstalk-table').shadowRoot!.querySelector('p.worst')!.textContent).toMatch(
      /Worst pair: .+ adds .+ %/,
    );
    expect(inner(app, 'qdp-material-notes').shadowRoot!.querySelector('p.summary')!.textContent).toContain('cadmium');
  });

  it('an out-of-range peak keeps the last good numbers, marks them stale and names the field; the fragment keeps the edit', async () => {
    const app = document.createElement('qdp-panel-app') as Host;
    document.body.appendChild(app);
    await settle(app);
    const table = inner(app, 'qdp-crosstalk-table');
    const before = table.shadowRoot!.querySelector('table')!.textContent;
    app.shadowRoot!.querySelector('.edit')!.dispatchEvent(
      new CustomEvent('probe-change', {
        detail: { index: 1, probe: { id: 'p2', label: 'Green dot', material: 'cdse', emissionPeakNm: 990 } },
        bubbles: true,
        composed: true,
      }),
    );
    await settle(app);
    expect(table.shadowRoot!.querySelector('.stale')).not.toBeNull();
    expect(table.shadowRoot!.querySelector('table')!.textContent).toBe(before);
    expect(app.shadowRoot!.querySelector('.error')!.textContent).toMatch(/990/);
    const state = decodeFragment(location.hash) as { panel: { probes: { emissionPeakNm?: number }[] } };
    expect(state.panel.probes[1].emissionPeakNm).toBe(990);
  });
});
