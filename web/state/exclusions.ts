/**
 * Material classes a user can exclude from a panel (cadmium-free, lead-free) and which probes break that choice.
 */
import type { PanelSpec } from '../../spectra/index';

/** The part of a material this check needs (the library's Material has these fields). */
export interface MaterialElements {
  id: string;
  name: string;
  elements: string[];
}

/** An excludable class and the chemical element that defines it. */
export const EXCLUDABLE = [
  { id: 'cadmium', element: 'Cd', label: 'cadmium-free' },
  { id: 'lead', element: 'Pb', label: 'lead-free' },
] as const;

export type ExcludableClass = (typeof EXCLUDABLE)[number]['id'];

/** Which classes (cadmium, lead) the panel's probes contain, by the materials' element lists. */
export function containedClasses(panel: PanelSpec, materials: readonly MaterialElements[]): ExcludableClass[] {
  const elements = new Set(panel.probes.flatMap((p) => materials.find((m) => m.id === p.material)?.elements ?? []));
  return EXCLUDABLE.filter((c) => elements.has(c.element)).map((c) => c.id);
}

/** Probe ids that contain an excluded class, each with the reason as text ("contains cadmium"). */
export function offendingProbes(
  panel: PanelSpec,
  materials: readonly MaterialElements[],
  exclude: readonly ExcludableClass[],
): Map<string, string> {
  const out = new Map<string, string>();
  for (const p of panel.probes) {
    const elements = materials.find((m) => m.id === p.material)?.elements ?? [];
    const hit = EXCLUDABLE.filter((c) => exclude.includes(c.id) && elements.includes(c.element));
    if (hit.length) out.set(p.id, `contains ${hit.map((c) => c.id).join(' and ')}, which this panel excludes`);
  }
  return out;
}
