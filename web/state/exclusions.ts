/**
 * Material classes a user can exclude from a panel (cadmium-free, lead-free, arsenic-free) and which probes break
 * that choice. The classes, their elements and the test of a material come from the spectral library (EXCLUSIONS,
 * exclusionsOf).
 */
import {
  SHELL_MATERIALS,
  exclusionsOf,
  type Exclusion,
  type Material,
  type PanelSpec,
  type ProbeSpec,
} from '../../spectra/index';

/** The classes the panel view offers to exclude (the design form offers every class of EXCLUSION_WORDS). */
export const PANEL_EXCLUSIONS = ['cadmium', 'lead', 'arsenic'] as const satisfies readonly Exclusion[];

/** A class the panel view can exclude. */
export type PanelExclusion = (typeof PANEL_EXCLUSIONS)[number];

/** The part of a material these checks need. */
export type MaterialElements = Pick<Material, 'id' | 'elements'>;

/** True for a word the panel view offers (what a link's view options may carry). */
export function isPanelExclusion(word: unknown): word is PanelExclusion {
  return PANEL_EXCLUSIONS.includes(word as PanelExclusion);
}

/**
 * The offered classes a probe belongs to through its core material or any shell layer (a CdS shell makes an InP
 * probe contain cadmium); none for a material the list does not know.
 */
function classesOf(probe: Pick<ProbeSpec, 'material' | 'shell'>, materials: readonly MaterialElements[]) {
  const m = materials.find((x) => x.id === probe.material);
  const elements = [
    ...(m?.elements ?? []),
    ...(probe.shell ?? []).flatMap((l) => SHELL_MATERIALS[l.material].elements),
  ];
  return exclusionsOf({ elements }).filter(isPanelExclusion);
}

/** Which offered classes (cadmium, lead) the panel's probes contain, by the element lists of cores and shells. */
export function containedClasses(panel: PanelSpec, materials: readonly MaterialElements[]): PanelExclusion[] {
  const found = new Set(panel.probes.flatMap((p) => classesOf(p, materials)));
  return PANEL_EXCLUSIONS.filter((word) => found.has(word));
}

/** Probe ids that contain an excluded class, each with the reason as text ("contains cadmium"). */
export function offendingProbes(
  panel: PanelSpec,
  materials: readonly MaterialElements[],
  exclude: readonly PanelExclusion[],
): Map<string, string> {
  const out = new Map<string, string>();
  for (const p of panel.probes) {
    const hit = classesOf(p, materials).filter((word) => exclude.includes(word));
    if (hit.length) out.set(p.id, `contains ${hit.join(' and ')}, which this panel excludes`);
  }
  return out;
}

/**
 * The panel with its exclusions written into it (`exclude`, absent when none), so that a shared link, a saved file
 * and the link fragment carry them with the panel.
 */
export function withExclusions(panel: PanelSpec, exclude: readonly PanelExclusion[]): PanelSpec {
  const { exclude: _old, ...rest } = panel;
  return exclude.length ? { ...rest, exclude: [...exclude] } : rest;
}
