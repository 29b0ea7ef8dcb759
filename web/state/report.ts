/**
 * What the printed report holds besides its pictures, as plain rows and text: the probe and channel tables, the
 * settings list, the hazard blocks with their cautions said once, and the link to the panel. No rendering here; the
 * words come from the ordering sheet, the light editor, the material notes and the filter descriptions.
 */
import {
  DEFAULT_DETECTOR_ID,
  DEFAULT_MIN_BLOCKING_OD,
  DEFAULT_SCATTER_LEVEL,
  listBackgroundPresets,
  listDyes,
  type FilterSpec,
  type PanelSpec,
  type ProbeEvaluation,
  type Toxicity,
} from '../../spectra/index';
import { shellText } from '../io/csv-export';
import { describeChannel, describeChannelExcitation, describeFilter } from '../io/filter-text';
import { SHARED_PATH_LABELS } from './compute';
import { GENERAL_CAUTION, LASER_CAUTION, notesEntries, type MaterialNotesInput } from './hazards';
import { LIGHT_WORDS } from './light-words';

/** The report's own words: section headings and the settings it names that no editor label names. */
export const REPORT_WORDS = {
  probes: 'Probes',
  channels: 'Detection channels',
  settings: 'Settings',
  hazards: 'Hazards and cautions',
  excitation: 'Excitation lines',
  background: 'Sample background',
  exclusions: 'Excluded materials',
  detector: 'Detector',
  instrument: 'Instrument profile',
  off: 'off',
  none: 'none',
  byDefault: '(default)',
} as const;

/** One row of the probe table. Numbers are null when the page has no evaluation of the panel. */
export interface ReportProbeRow {
  label: string;
  target: string;
  /** The core material's name (the dye's name for a dye probe) and its shell as ordered, e.g. "CdSe / ZnS 0.9 nm". */
  material: string;
  emissionPeakNm: number | null;
  fwhmNm: number | null;
  quantumYield: number | null;
  abundance: number;
}

/** One row of the channel table. */
export interface ReportChannelRow {
  label: string;
  filters: string;
  excitation: string;
}

/** One line of the settings list. */
export interface ReportSetting {
  term: string;
  value: string;
}

/** One hazard source of the panel: its name, hazard level (null: no notes), the probes using it, its notes. */
export interface ReportHazard {
  name: string;
  level: Toxicity['level'] | null;
  probes: string[];
  notes: string[];
}

const DYES = listDyes();
const PRESETS = listBackgroundPresets().presets;

const rounded = (v: number | null | undefined, digits: number) =>
  v === null || v === undefined || !Number.isFinite(v) ? null : Number(v.toFixed(digits));

/** "CdSe / ZnS 0.9 nm" (core, then its shell as the ordering sheet writes it); the dye's name for a dye probe. */
function materialText(probe: PanelSpec['probes'][number], materials: readonly MaterialNotesInput[]): string {
  const core =
    probe.material === 'dye'
      ? (DYES.find((d) => d.id === probe.dye)?.name ?? probe.dye ?? probe.material)
      : (materials.find((m) => m.id === probe.material)?.name ?? probe.material);
  const shell = shellText(probe);
  return shell ? `${core} / ${shell}` : core;
}

/**
 * The probe table: each probe's label (its id when empty), target, material and shell, and its emission peak, FWHM
 * (1 decimal) and quantum yield (2 decimals) as the page's evaluation resolved them (`resolved[i]` belongs to
 * `panel.probes[i]`; the probe's own fields without one), and its relative abundance (default 1).
 */
export function reportProbeRows(
  panel: PanelSpec,
  resolved: readonly (Pick<ProbeEvaluation, 'emissionPeakNm' | 'fwhmNm' | 'quantumYield'> | undefined)[],
  materials: readonly MaterialNotesInput[],
): ReportProbeRow[] {
  return panel.probes.map((p, i) => {
    const r = resolved[i];
    return {
      label: p.label || p.id,
      target: p.target ?? '',
      material: materialText(p, materials),
      emissionPeakNm: rounded(r?.emissionPeakNm ?? p.emissionPeakNm, 1),
      fwhmNm: rounded(r?.fwhmNm ?? p.fwhmNm, 1),
      quantumYield: rounded(r?.quantumYield ?? p.quantumYield, 2),
      abundance: p.abundance ?? 1,
    };
  });
}

/** The channel table: label (id when empty), filters as ordered ("bandpass 605/20"), the lines on while read. */
export function reportChannelRows(panel: PanelSpec): ReportChannelRow[] {
  return panel.channels.map((c) => ({
    label: c.label || c.id,
    filters: describeChannel(c),
    excitation: describeChannelExcitation(c),
  }));
}

/** "405 nm (relative power 1); 488 nm (relative power 0.5)". */
function linesText(panel: PanelSpec): string {
  const power = LIGHT_WORDS.relativePower.toLowerCase();
  return panel.excitation.map((l) => `${l.wavelengthNm} nm (${power} ${l.powerRel ?? 1})`).join('; ') || 'none';
}

/** The sample background: off, or its shape (sample type or measured spectrum) and its level. */
function backgroundText(panel: PanelSpec): string {
  const bg = panel.background;
  if (!bg) return REPORT_WORDS.off;
  const sampleType = PRESETS.find((p) => p.id === bg.preset)?.name ?? LIGHT_WORDS.genericBackground;
  const shape = bg.points
    ? `measured spectrum, ${bg.points.length} points`
    : `${LIGHT_WORDS.sampleType.toLowerCase()}: ${sampleType}`;
  return `${shape}; ${LIGHT_WORDS.backgroundLevel.toLowerCase()} ${bg.level}`;
}

/** A number as the editors take it; from 100 000 up in exponent form ("1e10"). */
const numberText = (v: number) => (Math.abs(v) >= 1e5 ? v.toExponential().replace('e+', 'e') : String(v));

/** A value the user left empty is shown as the documented default it stands for. */
const orDefault = (value: number | undefined, fallback: number) =>
  value === undefined ? `${numberText(fallback)} ${REPORT_WORDS.byDefault}` : numberText(value);

/** Each detector used, with the channels read by it when the channels differ: "Ideal detector (QE 1)". */
function detectorText(panel: PanelSpec, detectors: readonly { id: string; name: string }[]): string {
  const byDetector = new Map<string, string[]>();
  for (const c of panel.channels) {
    const id = c.detector ?? DEFAULT_DETECTOR_ID;
    byDetector.set(id, [...(byDetector.get(id) ?? []), c.label || c.id]);
  }
  const name = (id: string) => detectors.find((d) => d.id === id)?.name ?? id;
  if (byDetector.size <= 1) return [...byDetector.keys()].map(name).join('') || REPORT_WORDS.none;
  return [...byDetector].map(([id, channels]) => `${name(id)} (${channels.join(', ')})`).join('; ');
}

const filtersText = (filters: readonly FilterSpec[]) => filters.map(describeFilter).join(' + ');

/**
 * The settings list: excitation lines and powers, the sample background, water Raman, scattered light and the
 * blocking warning (defaults named), the shared light path when there is one, the excluded material classes, the
 * detector, and the instrument profile's name when the panel is on one.
 */
export function reportSettings(
  panel: PanelSpec,
  options: { detectors: readonly { id: string; name: string }[]; instrumentName?: string },
): ReportSetting[] {
  const path = panel.lightPath;
  const shared = [
    { term: SHARED_PATH_LABELS.emission, filters: path?.emissionFilters ?? [] },
    { term: SHARED_PATH_LABELS.excitation, filters: path?.excitationFilters ?? [] },
  ].filter((part) => part.filters.length > 0);
  return [
    ...(options.instrumentName ? [{ term: REPORT_WORDS.instrument, value: options.instrumentName }] : []),
    { term: REPORT_WORDS.excitation, value: linesText(panel) },
    { term: REPORT_WORDS.background, value: backgroundText(panel) },
    {
      term: LIGHT_WORDS.waterRaman,
      value: panel.waterRaman ? `level ${panel.waterRaman.level}` : REPORT_WORDS.off,
    },
    { term: LIGHT_WORDS.scatter, value: orDefault(panel.scatterLevel, DEFAULT_SCATTER_LEVEL) },
    { term: LIGHT_WORDS.minBlocking, value: `OD ${orDefault(panel.minBlockingOD, DEFAULT_MIN_BLOCKING_OD)}` },
    ...shared.map((part) => ({ term: part.term, value: filtersText(part.filters) })),
    {
      term: REPORT_WORDS.exclusions,
      value: panel.exclude?.length ? panel.exclude.map((w) => `${w}-free`).join(', ') : REPORT_WORDS.none,
    },
    { term: REPORT_WORDS.detector, value: detectorText(panel, options.detectors) },
  ];
}

/**
 * The panel's hazard sources with their notes, and every caution once (the materials share most of them), followed
 * by the laser caution and the general caution that defers to local rules.
 */
export function reportHazards(
  panel: PanelSpec,
  materials: readonly MaterialNotesInput[],
): { hazards: ReportHazard[]; cautions: string[] } {
  const entries = notesEntries(panel, materials);
  const cautions = new Set(entries.flatMap((e) => e.toxicity?.cautions ?? []));
  return {
    hazards: entries.map((e) => ({
      name: e.name,
      level: e.toxicity?.level ?? null,
      probes: e.probes,
      notes: e.toxicity?.notes ?? [],
    })),
    cautions: [...cautions, LASER_CAUTION, GENERAL_CAUTION],
  };
}

/** The link the report prints: the shared copy's /p/<id> when the panel is shared, else the page's own address. */
export function reportLink(location: Pick<Location, 'href' | 'origin'>, sharedId: string): string {
  return sharedId ? `${location.origin}/p/${sharedId}` : location.href;
}
