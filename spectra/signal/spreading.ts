/**
 * Spillover spreading for unmixed data, in the spirit of Nguyen, Perfetto, Mahnke, Chattopadhyay & Roederer,
 * Cytometry A 2013, 83A, 306: SS(j→i) = √(σ²i,pos − σ²i,neg) / √(Fj,pos − Fj,neg), the extra spread in detector i
 * per square root of stain j's brightness. Here "detector i" is the unmixed estimate of target i, both put in photons
 * of the target's own primary channel so that the figure has the same unit as theirs (√photons):
 *   SS[i][j] = M[prim(i)][i] · √( Σ_c (M⁺)²_ic · F_c · M[c][j] / M[prim(j)][j] ).
 * Adding target j at S_j photons (in its primary channel) adds SS[i][j]² · S_j to the variance of target i's estimate
 * (in its primary-channel photons²), so the extra SD is SS[i][j] · √S_j. The diagonal is the target's own shot-noise
 * gain (1 for an ideal detector and a perfectly separated probe). Like theirs, the values depend on the detector
 * (through F) and do not transfer between instruments.
 */

/**
 * The spreading matrix [i][j] of a mixing matrix m (photons) with its pseudo-inverse, each channel's excess noise
 * factor and each probe's primary channel; nulls where a probe has no primary light or m cannot be unmixed.
 */
export function spreadingMatrix(
  m: number[][],
  pinv: number[][] | null,
  excess: number[],
  primary: number[],
): (number | null)[][] {
  const cols = m[0].length;
  const out: (number | null)[][] = [];
  for (let i = 0; i < cols; i++) {
    const row: (number | null)[] = [];
    for (let j = 0; j < cols; j++) {
      const own = m[primary[j]][j];
      if (!pinv || !(own > 0)) {
        row.push(null);
        continue;
      }
      let sum = 0;
      for (let c = 0; c < m.length; c++) sum += pinv[i][c] * pinv[i][c] * excess[c] * m[c][j];
      row.push(m[primary[i]][i] * Math.sqrt(sum / own));
    }
    out.push(row);
  }
  return out;
}
