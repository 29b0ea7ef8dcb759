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
  /**
   * Sample background with every line on (collected units per nm): autofluorescence plus water Raman; null without
   * either.
   */
  background: number[] | null;
  /** The water Raman part of `background`, or null without `waterRaman`. */
  waterRaman: number[] | null;
}

/** Σ over lines of powerRel × a per-line spectrum, or null without one. */
function allLinesOn(panel: PanelSpec, perLine: number[][] | null, count: number): number[] | null {
  if (!perLine) return null;
  const out = new Array<number>(count).fill(0);
  perLine.forEach((b, l) => {
    const power = panel.excitation[l].powerRel ?? 1;
    for (let i = 0; i < count; i++) out[i] += power * b[i];
  });
  return out;
}

/** The resolved emission spectra, channel transmissions and background of a panel, for charts. */
export function panelSpectra(input: PanelSpec, options: { grid?: WavelengthGrid } = {}): PanelSpectra {
  const panel = foldLightPath(input);
  // Channels include the shared light path; the chart draws each channel as its detector sees it.
  const model = buildPanelModel(panel, options.grid ?? DEFAULT_GRID);
  const { grid } = model;
  const autofluorescence = allLinesOn(panel, model.background, grid.count);
  const waterRaman = allLinesOn(panel, model.waterRaman, grid.count);
  const background =
    autofluorescence && waterRaman
      ? autofluorescence.map((v, i) => v + waterRaman[i])
      : (autofluorescence ?? waterRaman);
  return {
    startNm: grid.startNm,
    stepNm: grid.stepNm,
    count: grid.count,
    emission: model.dots.map((d, p) => ({ id: panel.probes[p].id, values: spectrumOnGrid(d.emission, grid) })),
    channels: model.transmissions.map((t, c) => ({ id: panel.channels[c].id, values: t })),
    background,
    waterRaman,
  };
}
