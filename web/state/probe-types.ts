/**
 * Plain data the probe editor shows: the material facts it needs and the model's prediction for one probe.
 */

/** The part of a material the probe editor needs (the library's Material has these fields). */
export interface ProbeCardMaterial {
  id: string;
  name: string;
  emissionRangeNm: [number, number] | null;
  diameterRangeNm: [number, number] | null;
  typicalQuantumYield: number;
  typicalSizeDispersionPct: number | null;
  typicalFwhmNm: number;
  toxicity: { level: 'high' | 'moderate' | 'low'; notes: string[]; cautions: string[] };
}

/** What the model predicts for one probe, for the read-out under its fields. */
export interface ProbePrediction {
  diameterNm: number | null;
  firstExcitonNm: number | null;
  emissionPeakNm: number | null;
  fwhmNm: number | null;
  /** Collected-light brightness at the excitation relative to the brightest probe of the panel, 0–1. */
  relativeBrightness: number;
  measured: boolean;
  warnings: string[];
}
