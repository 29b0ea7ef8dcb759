import { describe, expect, it } from 'vitest';
import type { ChannelSpec, PanelSpec } from '../../spectra/index';
import { labelFromFilters, newPanel, setChannel, setFilter } from '../../web/state/panel-edit';
import { moveEdge } from '../../web/state/edge-drag';

const bp = (centerNm: number, widthNm: number) => ({ type: 'bandpass' as const, centerNm, widthNm });

/** A panel with one channel c1 on a 655/20 bandpass, labelled `label`. */
function panelWith(label: string | undefined): PanelSpec {
  const channel: ChannelSpec = { id: 'c1', filters: [bp(655, 20)], ...(label === undefined ? {} : { label }) };
  return { ...newPanel(), channels: [channel] };
}

describe('a channel label follows its filters unless the user named it', () => {
  it('labelFromFilters writes a longpass then a bandpass as "500 LP + 655/20"', () => {
    expect(labelFromFilters([{ type: 'longpass', edgeNm: 500 }, bp(655, 20)])).toBe('500 LP + 655/20');
  });

  it('a channel labelled "655/20" becomes "645/20" when its centre is retyped to 645', () => {
    expect(setFilter(panelWith('655/20'), 0, 0, bp(645, 20)).channels[0].label).toBe('645/20');
  });

  it('a channel with an empty label, or none, gets "645/20" from its retyped filter', () => {
    expect(setFilter(panelWith(''), 0, 0, bp(645, 20)).channels[0].label).toBe('645/20');
    expect(setFilter(panelWith(undefined), 0, 0, bp(645, 20)).channels[0].label).toBe('645/20');
  });

  it('a channel the user named "Red" keeps "Red" when its filter changes', () => {
    expect(setFilter(panelWith('Red'), 0, 0, bp(645, 20)).channels[0].label).toBe('Red');
  });

  it('an edit that changes the label and the filter together keeps the label it brings', () => {
    const edited = setChannel(panelWith('655/20'), 0, { id: 'c1', label: 'Cy5-like', filters: [bp(645, 20)] });
    expect(edited.channels[0].label).toBe('Cy5-like');
  });

  it('an added filter joins the label: "655/20" with a 500 nm longpass added reads "655/20 + 500 LP"', () => {
    const p = panelWith('655/20');
    const next = setChannel(p, 0, { ...p.channels[0], filters: [bp(655, 20), { type: 'longpass', edgeNm: 500 }] });
    expect(next.channels[0].label).toBe('655/20 + 500 LP');
  });

  it("dragging a 655/20 band's upper edge to 675 nm relabels it 660/30", () => {
    const dragged = moveEdge(panelWith('655/20'), { channelIndex: 0, filterIndex: 0, edge: 'high', wavelengthNm: 675 });
    expect(dragged.channels[0].label).toBe('660/30');
  });
});
