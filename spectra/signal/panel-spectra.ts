/**
 * A panel's spectra for charts, as plain arrays on the grid: kept out of evaluatePanel so the API can omit them.
 */
import type { PanelSpec } from '../core/panel';
import { DEFAULT_GRID, spectrumOnGrid, type WavelengthGrid } from '../core/grid';
import { buildPanelModel } from './panel-model';
import { foldLightPath } from '../light/light-path';

/** Spectra for charting, as plain arrays on the grid (index i ↔ startNm + i × stepNm). */
export interface PanelSpectra {
  startNm: number;
  stepNm: number;
  count: number;
  /** Unit-area photon density per nm (carbon dots: their nominal emission, before the line-dependent shift). */
  emission: { id: string; values: number[] }[];
  /** Π filters × detector QE, 0–1. */
  channels: { id: string; values: number[] }[];
  /** Background emission with every line on (collected units per nm), or null without a background. */
  background: number[] | null;
}

/** The resolved emission spectra, channel transmissions and background of a panel, for charts. */
export function panelSpectra(input: PanelSpec, options: { grid?: WavelengthGrid } = {}): PanelSpectra {
  const panel = foldLightPath(input);
  // Channels include the shared light path; the chart draws each channel as its detector sees it.
  const model = buildPanelModel(panel, options.grid ?? DEFAULT_GRID);
  const { grid } = model;
  let background: number[] | null = null;
  if (model.background) {
    background = new Array<number>(grid.count).fill(0);
    model.background.forEach((b, l) => {
      const power = panel.excitation[l].powerRel ?? 1;
      for (let i = 0; i < grid.count; i++) background![i] += power * b[i];
    });
  }
  return {
    startNm: grid.startNm,
    stepNm: grid.stepNm,
    count: grid.count,
    emission: model.dots.map((d, p) => ({ id: panel.probes[p].id, values: spectrumOnGrid(d.emission, grid) })),
    channels: model.transmissions.map((t, c) => ({ id: panel.channels[c].id, values: t })),
    background,
  };
}
