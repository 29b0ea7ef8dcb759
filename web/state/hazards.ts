/**
 * The hazard sources of a panel (each core material, each dye of a dye probe, each shell material, with the probes
 * that use it) and the panel's one-line summary ("This panel contains cadmium."). The material notes and the printed
 * report both read them from here. Never a finding that a probe is safe.
 */
import { SHELL_MATERIALS, listDyes, type Material, type PanelSpec, type Toxicity } from '../../spectra/index';
import { containedClasses, PANEL_EXCLUSIONS } from './exclusions';

/** What the notes need of each material. */
export type MaterialNotesInput = Pick<Material, 'id' | 'name' | 'elements' | 'toxicity'>;

/** One block of notes: a core material, a dye or a shell material, and the probes that use it. */
export interface NotesEntry {
  key: string;
  name: string;
  toxicity: Toxicity | null;
  probes: string[];
}

/** Shown under every panel: the tool summarises hazards, it does not assess them. */
export const GENERAL_CAUTION =
  'These notes summarise published hazards; they are not a safety assessment and no probe here is described as safe. ' +
  'Handle nanoparticles and their waste as your local regulations, institutional safety rules and licensed practice ' +
  'require.';

/** Excitation sources are usually lasers. */
export const LASER_CAUTION =
  "Excitation lasers: follow your institution's laser safety rules (laser class, eyewear, interlocks).";

/** The dye library, read once: a dye probe's notes are its dye's. */
const DYES = listDyes();

/** "cadmium", "cadmium and lead", "cadmium, lead and arsenic". */
export const wordList = (words: readonly string[]) =>
  words.length < 2 ? words.join('') : `${words.slice(0, -1).join(', ')} and ${words[words.length - 1]}`;

/** The summary when no probe is made with an excludable class. */
const NONE_CONTAINED =
  `No probe in this panel is made with ${PANEL_EXCLUSIONS.slice(0, -1).join(', ')} or ${PANEL_EXCLUSIONS.at(-1)}` +
  " (by the tool's material list).";

/** "This panel contains cadmium." or the sentence saying no probe is made with an excludable class. */
export function containsSentence(panel: PanelSpec, materials: readonly MaterialNotesInput[]): string {
  const contained = containedClasses(panel, materials);
  return contained.length ? `This panel contains ${wordList(contained)}.` : NONE_CONTAINED;
}

/** The hazard sources of a panel: each core material (each dye for dye probes) and each shell material used. */
export function notesEntries(panel: PanelSpec, materials: readonly MaterialNotesInput[]): NotesEntry[] {
  const entries = new Map<string, NotesEntry>();
  const add = (key: string, name: string, toxicity: Toxicity | null, probe: string) => {
    const entry = entries.get(key) ?? { key, name, toxicity, probes: [] };
    entry.probes.push(probe);
    entries.set(key, entry);
  };
  for (const p of panel.probes) {
    const label = p.label ?? p.id;
    const dye = p.material === 'dye' ? DYES.find((d) => d.id === p.dye) : undefined;
    const m = materials.find((x) => x.id === p.material);
    if (dye) add(`dye:${dye.id}`, dye.name, dye.toxicity, label);
    else add(p.material, m?.name ?? p.material, m?.toxicity ?? null, label);
    for (const id of new Set((p.shell ?? []).map((l) => l.material)))
      add(`shell:${id}`, `${SHELL_MATERIALS[id].name} shell`, SHELL_MATERIALS[id].toxicity, label);
  }
  return [...entries.values()];
}
