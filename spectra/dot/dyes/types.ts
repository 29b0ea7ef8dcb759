/**
 * The shape of the dye library's records: dyes, counterstains and fluorescent proteins that share a slide with dots,
 * each number with its source and how sure it is (the status marks of docs/science.md).
 */
import type { Toxicity } from '../materials/types';

/** What kind of probe a dye record describes. */
export const DYE_KINDS = ['nuclear-counterstain', 'small-molecule-dye', 'fluorescent-protein'] as const;
export type DyeKind = (typeof DYE_KINDS)[number];

/**
 * How sure a number is: P seen in the paper or its abstract, T independent secondary copies agree (paper not read),
 * M from memory and unverified, C computed here, ours a convention or tuning of this tool.
 */
export const VALUE_STATUSES = ['P', 'T', 'M', 'C', 'ours'] as const;
export type ValueStatus = (typeof VALUE_STATUSES)[number];

/** One number of a record, with the published source (or handbook) it is cited from and its status. */
export interface SourcedValue {
  value: number;
  status: ValueStatus;
  source: string;
}

/** One dye, counterstain or fluorescent protein, as plain JSON data (GET /api/v1/dyes serves it as is). */
export interface Dye {
  /** The id a probe names in its `dye` field. */
  id: string;
  /** A generic chemical name or the protein's published name. */
  name: string;
  kind: DyeKind;
  /** What the numbers refer to (solvent, pH, bound or free). */
  conditions: string;
  absorptionPeakNm: SourcedValue;
  emissionPeakNm: SourcedValue;
  /** Molar extinction at the absorption peak, M⁻¹ cm⁻¹. */
  extinctionPeak: SourcedValue;
  /** 0–1. */
  quantumYield: SourcedValue;
  /** FWHM of the absorption band ε(λ), nm. */
  absorptionFwhmNm: SourcedValue;
  /** FWHM of the emission as photons per nm, nm. */
  emissionFwhmNm: SourcedValue;
  /** ρ of the log-normal absorption band (blue half-width over red, in wavenumber). */
  absorptionAsymmetry: SourcedValue;
  /** ρ of the log-normal emission band. */
  emissionAsymmetry: SourcedValue;
  toxicity: Toxicity;
  notes: string[];
}
