/**
 * Empirical sizing curve of InP quantum dots: Almeida et al., Nano Lett. 2023, 23, 8697 (status T: secondary copies
 * agree; paper not read here). E₁S (eV) = 1.33 + 9.128 (L/Å)^−0.684, L = edge length of the tetrahedral particles.
 * The tool's diameter for InP is the equivalent-sphere diameter d of the same volume: V = L³/(6√2) = πd³/6, so
 * d = L (1/(π√2))^(1/3) ≈ 0.608 L (C).
 */
export const INP_ALMEIDA_2023 = {
  offsetEv: 1.33,
  prefactorEv: 9.128,
  exponent: -0.684,
  /** Equivalent-sphere diameter over tetrahedron edge, (1/(π√2))^(1/3) (C, exact geometry). */
  sphereDiameterPerEdge: Math.cbrt(1 / (Math.PI * Math.SQRT2)),
  /**
   * Equivalent-sphere diameters used (edges ≈ 2.0–6.6 nm, first exciton ≈ 495–670 nm). The span of sizes the
   * paper fitted is from memory, unverified: treat the ends as soft.
   */
  diameterRangeNm: [1.2, 4.0] as const,
} as const;

/** First-exciton energy (eV) of an InP dot of equivalent-sphere diameter `diameterNm` (Almeida et al. 2023). */
export function inpFirstExcitonEv(diameterNm: number): number {
  const edgeAngstrom = (10 * diameterNm) / INP_ALMEIDA_2023.sphereDiameterPerEdge;
  return INP_ALMEIDA_2023.offsetEv + INP_ALMEIDA_2023.prefactorEv * Math.pow(edgeAngstrom, INP_ALMEIDA_2023.exponent);
}

/** Inverse of {@link inpFirstExcitonEv}: equivalent-sphere diameter (nm) for a first-exciton energy (eV). */
export function inpDiameterNm(firstExcitonEv: number): number {
  const edgeAngstrom = Math.pow(
    (firstExcitonEv - INP_ALMEIDA_2023.offsetEv) / INP_ALMEIDA_2023.prefactorEv,
    1 / INP_ALMEIDA_2023.exponent,
  );
  return (edgeAngstrom / 10) * INP_ALMEIDA_2023.sphereDiameterPerEdge;
}
