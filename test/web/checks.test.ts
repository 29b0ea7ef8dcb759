// The page's one place for checks: the API's own schemas and messages, applied to panels, links and design requests.
import { describe, expect, it } from 'vitest';
import type { PanelSpec } from '../../spectra/index';
import { checkDesignRequest, checkPanel, readPageState, readPanel } from '../../web/state/checks';
import { demoPanel } from '../../web/state/demo-panel';

/** The demo panel with probe `index`'s emission peak set to `nm`. */
function withPeak(index: number, nm: number): PanelSpec {
  const panel = demoPanel();
  panel.probes[index] = { ...panel.probes[index], emissionPeakNm: nm };
  return panel;
}

describe('the page checks (state/checks.ts)', () => {
  it('checkPanel(demo panel) finds nothing: the bundled demo is a panel the API takes', () => {
    expect(checkPanel(demoPanel())).toBeUndefined();
  });

  it("checkPanel(a 2500 nm peak) gives the API's out_of_range error naming probes[1].emissionPeakNm", () => {
    expect(checkPanel(withPeak(1, 2500))).toEqual({
      code: 'out_of_range',
      message: 'probes[1].emissionPeakNm must be between 200 and 2000 nm',
      path: ['probes', 1, 'emissionPeakNm'],
    });
  });

  it('checkPanel(a 990 nm CdSe peak) finds nothing: only the size law refuses it, when the panel is computed', () => {
    expect(checkPanel(withPeak(1, 990))).toBeUndefined();
  });

  it("checkPanel(a channel read under 488 nm in a 405 nm panel) names that channel's excitationNm", () => {
    const panel = demoPanel();
    panel.channels[0] = { ...panel.channels[0], excitationNm: 488 };
    expect(checkPanel(panel)).toEqual({
      code: 'invalid_input',
      message: "channels[0].excitationNm 488 nm is not one of the panel's excitation lines",
      path: ['channels', 0, 'excitationNm'],
    });
  });

  it("readPanel(a panel without probes) refuses it with the API's message 'probes needs at least one probe'", () => {
    expect(readPanel({ ...demoPanel(), probes: [] })).toEqual({
      ok: false,
      message: 'probes needs at least one probe',
    });
  });

  it('readPanel(demo panel as JSON text parsed back) gives back the same panel', () => {
    expect(readPanel(JSON.parse(JSON.stringify(demoPanel())))).toEqual({ ok: true, panel: demoPanel() });
  });

  it("readPageState keeps the view's cadmium, lead and arsenic exclusions and drops words it does not offer", () => {
    const r = readPageState({ panel: demoPanel(), view: { exclude: ['lead', 'arsenic', 'tin', 'cadmium'] } });
    expect(r.ok && r.state.view.exclude).toEqual(['lead', 'arsenic', 'cadmium']);
  });

  it('readPageState keeps view.snapStock true and leaves it out when it is "yes" or missing', () => {
    const on = readPageState({ panel: demoPanel(), view: { exclude: [], snapStock: true } });
    expect(on.ok && on.state.view).toEqual({ exclude: [], snapStock: true });
    const odd = readPageState({ panel: demoPanel(), view: { exclude: [], snapStock: 'yes' } });
    expect(odd.ok && odd.state.view).toEqual({ exclude: [] });
    const none = readPageState({ panel: demoPanel() });
    expect(none.ok && none.state.view).toEqual({ exclude: [] });
  });

  it("checkDesignRequest(an abundance of 'plenty') gives the API's message naming targets[0].abundance", () => {
    const problem = checkDesignRequest({
      targets: [{ name: 'target 1', abundance: Number('plenty') }],
      excitation: [{ wavelengthNm: 405 }],
    });
    expect(problem?.message).toBe('targets[0].abundance must be a number greater than 0 or one of high, medium, low');
    expect(problem?.path).toEqual(['targets', 0, 'abundance']);
  });
});
