/**
 * The light path every channel shares: emission-side filters in front of all detectors (the main dichroic as the
 * detectors see it, a shared blocking filter) and excitation-side filters every line passes on its way to the sample
 * (clean-up filters). Folding them into a panel gives the panel with the parts written out: each channel's filters
 * preceded by the shared ones, and each line's power scaled by the excitation filters' transmission at its wavelength.
 * Evaluating a panel with a light path is evaluating its folded form.
 */

import type { FilterSpec, PanelSpec } from '../core/panel';
import { filterTransmission } from './filters/filter';

/** Transmission of a list of filters in series at one wavelength; model errors name `path` and the filter index. */
export function seriesAtNm(filters: readonly FilterSpec[], wavelengthNm: number, path: (string | number)[]): number {
  const grid = { startNm: wavelengthNm, stepNm: 1, count: 1 };
  let t = 1;
  filters.forEach((filter, f) => (t *= filterTransmission(filter, grid, [...path, f])[0]));
  return t;
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
