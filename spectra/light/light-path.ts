/**
 * The light path every channel shares: emission-side filters in front of all detectors (the main dichroic as the
 * detectors see it, a shared blocking filter) and excitation-side filters every line passes on its way to the sample
 * (clean-up filters). Folding them into a panel gives the panel with the parts written out: each channel's filters
 * preceded by the shared ones, and each line's power scaled by the excitation filters' transmission at its wavelength.
 * Evaluating a panel with a light path is evaluating its folded form.
 */

import type { FilterSpec, PanelSpec } from '../core/panel';
import type { WavelengthGrid } from '../core/grid';
import { filterTransmission } from './filters/filter';

/**
 * Transmission (0–1) of a list of filters in series at each grid wavelength (1 everywhere for an empty list); model
 * errors name `path` and the filter index, e.g. ['lightPath', 'emissionFilters', 0].
 */
export function seriesTransmission(
  filters: readonly FilterSpec[],
  grid: WavelengthGrid,
  path: (string | number)[] = [],
): number[] {
  const out = new Array<number>(grid.count).fill(1);
  filters.forEach((filter, f) => {
    const t = filterTransmission(filter, grid, [...path, f]);
    for (let i = 0; i < out.length; i++) out[i] *= t[i];
  });
  return out;
}

/** Transmission of a list of filters in series at one wavelength; model errors name `path` and the filter index. */
export function seriesAtNm(filters: readonly FilterSpec[], wavelengthNm: number, path: (string | number)[]): number {
  return seriesTransmission(filters, { startNm: wavelengthNm, stepNm: 1, count: 1 }, path)[0];
}

/**
 * The panel with its light path written out (the panel itself when it has none). The shared filters are checked
 * first, so a model error in one names ['lightPath', 'emissionFilters' | 'excitationFilters', index, …].
 */
export function foldLightPath(panel: PanelSpec): PanelSpec {
  const path = panel.lightPath;
  if (!path) return panel;
  const shared = path.emissionFilters ?? [];
  const cleanup = path.excitationFilters ?? [];
  // Any wavelength serves to surface a model error in a shared filter with its own path.
  if (shared.length) seriesAtNm(shared, panel.excitation[0].wavelengthNm, ['lightPath', 'emissionFilters']);
  const { lightPath: _path, ...rest } = panel;
  return {
    ...rest,
    excitation: panel.excitation.map((line) => ({
      ...line,
      powerRel: (line.powerRel ?? 1) * seriesAtNm(cleanup, line.wavelengthNm, ['lightPath', 'excitationFilters']),
    })),
    channels: panel.channels.map((channel) => ({ ...channel, filters: [...shared, ...channel.filters] })),
  };
}
