/**
 * The unmixing matrix of a reference (spillover) matrix: its Moore–Penrose pseudo-inverse (Penrose, Proc. Cambridge
 * Philos. Soc. 1955, 51, 406; from memory), channels × probes → probes × channels, so that abundances ≈ U · signal
 * is the ordinary least-squares unmixing.
 */
import { SpectraError } from '../core/errors';
import { pseudoInverse } from '../signal/linalg/pinv';

/** The pseudo-inverse [p][c] of reference[c][p]; a null or non-finite entry or an all-zero matrix throws. */
export function unmixingMatrix(reference: readonly (readonly (number | null)[])[]): number[][] {
  const m = reference.map((row, c) =>
    row.map((v, p) => {
      if (v === null || !Number.isFinite(v)) {
        throw new SpectraError('invalid_input', 'the reference has an undefined entry: no unmixing matrix', [c, p]);
      }
      return v;
    }),
  );
  const inverse = m.length > 0 && m[0].length > 0 ? pseudoInverse(m) : null;
  if (inverse === null) throw new SpectraError('invalid_input', 'the reference is all zeros: nothing to unmix', []);
  return inverse;
}
