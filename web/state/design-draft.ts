/**
 * The "Propose a panel" form's inputs as the user left them, kept in this browser under their own key (beside the
 * panel's `qdpanel.lastState`) so that a reload never loses them: targets with abundances and locks, the lines, what
 * the search proposes, the microscope choice, exclusions, materials, the window and the checks. Reading back only
 * restores the shape the form holds (texts stay as typed, a value of the wrong kind falls back to the form's own
 * default, unknown materials and words are dropped); the form then checks what it holds with the API's schema, as it
 * checks anything typed, so a refused value comes back with its message beside it.
 */
import { EXCLUSION_WORDS, listMaterials, type DesignLock, type Exclusion, type MaterialId } from '../../spectra/index';
import { CHECK_WORDS, type CheckKey } from './design-error';

/** Where this browser keeps the form's inputs. */
export const DRAFT_KEY = 'qdpanel.designForm';

/** One target as the form holds it: its name and abundance as typed, and its lock. */
export interface TargetRow {
  name: string;
  abundance: string;
  lock?: DesignLock;
}

/** The form's inputs, as the form holds them. */
export interface DesignDraft {
  targets: TargetRow[];
  excitationText: string;
  /** The search picks only among the current panel's probes and channels (when it has some). */
  useCandidates: boolean;
  /** Free design chooses among the microscope's channels (when the panel is on a profile). */
  useMicroscope: boolean;
  exclude: Exclusion[];
  allowed: MaterialId[];
  windowNm: [number, number];
  checks: Partial<Record<CheckKey, number>>;
}

const MATERIAL_IDS = new Set<string>(listMaterials().map((m) => m.id));

type Loose = Record<string, unknown>;
const isObject = (x: unknown): x is Loose => typeof x === 'object' && x !== null && !Array.isArray(x);
const isText = (x: unknown): x is string => typeof x === 'string';
const isNumber = (x: unknown): x is number => typeof x === 'number' && Number.isFinite(x);

/** A lock's ids as kept (the form marks an id its panel no longer holds); undefined when it names none. */
function lockOf(raw: unknown): DesignLock | undefined {
  if (!isObject(raw)) return undefined;
  const lock: DesignLock = {
    ...(isText(raw.probe) && raw.probe ? { probe: raw.probe } : {}),
    ...(isText(raw.channel) && raw.channel ? { channel: raw.channel } : {}),
  };
  return lock.probe || lock.channel ? lock : undefined;
}

/** A kept target: a name and an abundance as text (a number kept as a number is read as its text). */
function targetOf(raw: unknown): TargetRow | null {
  if (!isObject(raw) || !isText(raw.name)) return null;
  const abundance = isText(raw.abundance) ? raw.abundance : isNumber(raw.abundance) ? String(raw.abundance) : null;
  if (abundance === null) return null;
  const lock = lockOf(raw.lock);
  return { name: raw.name, abundance, ...(lock ? { lock } : {}) };
}

/** The kept targets, or undefined when any of them is not a target (the form then starts with its own). */
function targetsOf(raw: unknown): TargetRow[] | undefined {
  if (!Array.isArray(raw) || raw.length === 0) return undefined;
  const rows = raw.map(targetOf);
  return rows.every((r): r is TargetRow => r !== null) ? rows : undefined;
}

function checksOf(raw: unknown): DesignDraft['checks'] | undefined {
  if (!isObject(raw)) return undefined;
  const keys = Object.keys(CHECK_WORDS) as CheckKey[];
  return Object.fromEntries(keys.flatMap((k) => (isNumber(raw[k]) ? [[k, raw[k]]] : [])));
}

/**
 * The inputs kept in `raw` (parsed JSON), field by field: each field of the right kind is kept as it was, even a
 * value the API would refuse; the others are left out, and the form keeps its own default for them.
 */
export function readDraft(raw: unknown): Partial<DesignDraft> {
  if (!isObject(raw)) return {};
  const words = new Set<string>(EXCLUSION_WORDS);
  const window = raw.windowNm;
  return {
    ...(targetsOf(raw.targets) ? { targets: targetsOf(raw.targets) } : {}),
    ...(isText(raw.excitationText) ? { excitationText: raw.excitationText } : {}),
    ...(typeof raw.useCandidates === 'boolean' ? { useCandidates: raw.useCandidates } : {}),
    ...(typeof raw.useMicroscope === 'boolean' ? { useMicroscope: raw.useMicroscope } : {}),
    ...(Array.isArray(raw.exclude)
      ? { exclude: raw.exclude.filter((w): w is Exclusion => isText(w) && words.has(w)) }
      : {}),
    ...(Array.isArray(raw.allowed)
      ? { allowed: raw.allowed.filter((m): m is MaterialId => isText(m) && MATERIAL_IDS.has(m)) }
      : {}),
    ...(Array.isArray(window) && window.length === 2 && window.every(isNumber)
      ? { windowNm: [window[0], window[1]] as [number, number] }
      : {}),
    ...(checksOf(raw.checks) ? { checks: checksOf(raw.checks) } : {}),
  };
}

/** The inputs this browser kept, or nothing when there are none, they cannot be read, or storage is off. */
export function loadDraft(): Partial<DesignDraft> {
  try {
    const text = localStorage.getItem(DRAFT_KEY);
    return text === null ? {} : readDraft(JSON.parse(text));
  } catch {
    return {};
  }
}

/** Keeps the inputs in this browser. */
export function saveDraft(draft: DesignDraft): void {
  try {
    localStorage.setItem(DRAFT_KEY, JSON.stringify(draft));
  } catch {
    // Storage off or full: the inputs stay on the page until it is left.
  }
}
