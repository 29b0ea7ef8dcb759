import type { MaterialId, ShellLayer } from '../../core/panel';

/** Broad chemical family of a probe material. */
export type MaterialFamily = 'II-VI' | 'III-V' | 'perovskite' | 'carbon' | 'other';

/**
 * Hazard summary of a material: a coarse level plus notes (what is known, with sources) and cautions (what to do).
 * Cautions always defer to local regulations, institutional safety rules and licensed practice; no level means "safe".
 */
export interface Toxicity {
  level: 'high' | 'moderate' | 'low';
  notes: string[];
  cautions: string[];
}

/**
 * Everything the library knows about one probe material, as plain JSON-serialisable data (the API serves it as is).
 * Numbers are nominal values with their sources listed in `sources`; null where the material has no such quantity.
 */
export interface Material {
  id: MaterialId;
  name: string;
  family: MaterialFamily;
  elements: string[];
  /** What `diameterNm` means for this material (sphere diameter, equivalent-sphere diameter, cube edge). */
  sizeMeaning: string;
  /** Core sizes the size law covers, nm; null for materials without one (carbon, custom). */
  diameterRangeNm: [number, number] | null;
  /** Emission peaks the size law reaches (computed), or the accepted range for carbon dots; null for custom. */
  emissionRangeNm: [number, number] | null;
  bulkBandGapEv: number | null;
  electronMassRel: number | null;
  holeMassRel: number | null;
  dielectricConstant: number | null;
  bohrRadiusNm: number | null;
  typicalFwhmNm: number;
  /** 0–1, for water-soluble conjugates where known. */
  typicalQuantumYield: number;
  /** σ/d in percent. */
  typicalSizeDispersionPct: number | null;
  /** Of a water-soluble bio-conjugate, nm. */
  typicalHydrodynamicDiameterNm: number | null;
  /** Which model turns size into spectrum. */
  sizingModel: string;
  /** Sizing curves a probe may choose with `sizingModel` (the first is the default); [] without a choice. */
  sizingModels: string[];
  /** True where no published size law backs the numbers: results say so and automatic design skips it. */
  illustrative: boolean;
  /** The shell probes of this material usually carry (innermost first); null for materials without a size law. */
  typicalShell: ShellLayer[] | null;
  /** Emission peaks reached under the typical shell, nm; null without a size law. */
  typicalShellEmissionRangeNm: [number, number] | null;
  toxicity: Toxicity;
  warnings: string[];
  /** "Author et al., Journal Year" for every number above. */
  sources: string[];
}
