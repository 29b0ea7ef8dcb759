/**
 * Material classes a user can exclude from a panel or a design, named in words, each defined by the chemical element
 * that puts it under stricter rules: cadmium (Cd), lead (Pb), arsenic (As). Excluding a class is the user's choice
 * (an institutional rule, a lab policy); it is never a finding that the remaining probes are safe.
 */
import type { Material } from './types';
import type { ProbeSpec } from '../../core/panel';
import { SHELL_MATERIALS } from '../shells/materials';
import { getMaterial } from './catalog';

/** The excludable classes and their defining element. */
export const EXCLUSIONS = Object.freeze({ cadmium: 'Cd', lead: 'Pb', arsenic: 'As' } as const);

/** An excludable class, in words. */
export type Exclusion = keyof typeof EXCLUSIONS;

/** The excludable classes, in a fixed order (for forms and schemas). */
export const EXCLUSION_WORDS = Object.keys(EXCLUSIONS) as Exclusion[];

/** The excludable classes a material belongs to, by its element list. */
export function exclusionsOf(material: Pick<Material, 'elements'>): Exclusion[] {
  return EXCLUSION_WORDS.filter((word) => material.elements.includes(EXCLUSIONS[word]));
}

/**
 * The excludable classes a probe belongs to through its core material or any shell layer (a CdS shell puts an InP
 * probe in the cadmium class).
 */
export function probeExclusions(probe: Pick<ProbeSpec, 'material' | 'shell'>): Exclusion[] {
  const elements = [
    ...getMaterial(probe.material).elements,
    ...(probe.shell ?? []).flatMap((l) => SHELL_MATERIALS[l.material].elements),
  ];
  return exclusionsOf({ elements });
}
