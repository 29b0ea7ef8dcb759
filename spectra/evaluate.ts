/**
 * Panel evaluation, one concept a file under spectra/evaluate/: the panel checks (panel-checks), the resolved-dot
 * cache (dot-cache), the panel model both entries share (panel-model), the figures (evaluate-panel), the JSON guard
 * (json-safe) and the chart spectra (panel-spectra). This module only re-exports their public names.
 */
export { evaluatePanel, type PanelEvaluation } from './evaluate/evaluate-panel';
export { panelSpectra, type PanelSpectra } from './evaluate/panel-spectra';
export { buildPanelModel, type PanelModel, type ProbeEvaluation } from './evaluate/panel-model';
export { clearResolvedDotCache } from './evaluate/dot-cache';
